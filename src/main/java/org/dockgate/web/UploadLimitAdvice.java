package org.dockgate.web;

import jakarta.servlet.http.HttpServletRequest;
import java.util.Locale;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.http.HttpStatus;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.util.unit.DataSize;
import org.springframework.web.bind.annotation.ControllerAdvice;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.multipart.MaxUploadSizeExceededException;
import org.springframework.web.servlet.ModelAndView;

/**
 * An upload above the limit is refused before any controller is chosen (the multipart request is read
 * by the dispatcher), so the annotation-filtered advices never see it. This one applies everywhere:
 * a problem document for the API and for script calls, a page for a form post, each naming the limit.
 */
@ControllerAdvice
@Order(Ordered.HIGHEST_PRECEDENCE)
class UploadLimitAdvice {

    private final DataSize limit;

    UploadLimitAdvice(@Value("${spring.servlet.multipart.max-request-size:1MB}") DataSize limit) {
        this.limit = limit;
    }

    /** "The file is larger than the 128 MB Dockgate accepts in one upload. Nothing was saved." */
    String message() {
        return "The upload is larger than the " + inWords(limit) + " Dockgate accepts in one upload"
                + " (a data-acquisition file of 1,000,000 readings is about 37 MB). Nothing was saved;"
                + " split the file and import the parts.";
    }

    static String inWords(DataSize size) {
        long bytes = size.toBytes();
        if (bytes % (1024L * 1024) == 0) {
            return String.format(Locale.ROOT, "%d MB", bytes / (1024L * 1024));
        }
        if (bytes % 1024 == 0) {
            return String.format(Locale.ROOT, "%d KB", bytes / 1024);
        }
        return bytes + " bytes";
    }

    @ExceptionHandler(MaxUploadSizeExceededException.class)
    Object tooLarge(MaxUploadSizeExceededException e, HttpServletRequest request) {
        String path = request.getRequestURI().substring(request.getContextPath().length());
        String accept = request.getHeader("Accept");
        boolean wantsPage = accept != null && accept.contains("text/html") && !path.startsWith("/api/");
        if (!wantsPage) {
            return ApiExceptionHandler.problem(HttpStatus.CONTENT_TOO_LARGE, message());
        }
        ModelAndView page = new ModelAndView("error/400");
        page.setStatus(HttpStatus.CONTENT_TOO_LARGE);
        page.addObject("status", 413);
        page.addObject("message", message());
        return page;
    }
}
