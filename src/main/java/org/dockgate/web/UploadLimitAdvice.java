package org.dockgate.web;

import jakarta.servlet.http.HttpServletRequest;
import java.util.Locale;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
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
import org.springframework.web.multipart.MultipartException;
import org.springframework.web.servlet.ModelAndView;

/**
 * An upload above the limit is refused before any controller is chosen (the multipart request is read
 * by the dispatcher), so the annotation-filtered advices never see it. This one applies everywhere:
 * a problem document for the API and for script calls, a page for a form post, each naming the limit.
 */
@ControllerAdvice
@Order(Ordered.HIGHEST_PRECEDENCE)
class UploadLimitAdvice {

    /** The answer to a POST that is not a readable file upload (the same words for pages and problem documents). */
    static final String NOT_AN_UPLOAD = "This address takes a file upload: send the file as multipart/form-data"
            + " (with its boundary) in a part named 'file', with a file name without control characters."
            + " Nothing was saved.";

    private static final Logger log = LoggerFactory.getLogger(UploadLimitAdvice.class);

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
        return answer(request, HttpStatus.CONTENT_TOO_LARGE, message());
    }

    /**
     * Not multipart at all, multipart without a boundary, or a part the container cannot parse (a file
     * name with a NUL character): the request is refused, never a 500.
     */
    @ExceptionHandler(MultipartException.class)
    Object notAnUpload(MultipartException e, HttpServletRequest request) {
        log.debug("Upload refused: {}", e.getMessage());
        return answer(request, HttpStatus.BAD_REQUEST, NOT_AN_UPLOAD);
    }

    /** A problem document for the API and for script calls, a page for a form post. */
    private static Object answer(HttpServletRequest request, HttpStatus status, String message) {
        String path = request.getRequestURI().substring(request.getContextPath().length());
        String accept = request.getHeader("Accept");
        boolean wantsPage = accept != null && accept.contains("text/html") && !path.startsWith("/api/");
        if (!wantsPage) {
            return ApiExceptionHandler.problem(status, message);
        }
        ModelAndView page = new ModelAndView("error/400");
        page.setStatus(status);
        page.addObject("status", status.value());
        page.addObject("message", message);
        return page;
    }
}
