package org.dockgate.web;

import jakarta.servlet.http.HttpServletRequest;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.http.HttpStatus;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.web.HttpMediaTypeNotAcceptableException;
import org.springframework.web.HttpMediaTypeNotSupportedException;
import org.springframework.web.bind.annotation.ControllerAdvice;
import org.springframework.web.bind.annotation.ExceptionHandler;

/**
 * A request whose content type or Accept header no API mapping takes is refused before a controller is
 * chosen, so the annotation-filtered {@link ApiExceptionHandler} never sees it and the answer would have
 * no body. Under {@code /api/} it is a problem document like every other API refusal, whatever the
 * client asked for; elsewhere the exception goes on to the usual handling.
 */
@ControllerAdvice
@Order(Ordered.HIGHEST_PRECEDENCE)
class ApiNegotiationAdvice {

    @ExceptionHandler(HttpMediaTypeNotAcceptableException.class)
    ResponseEntity<ProblemDetail> notAcceptable(HttpMediaTypeNotAcceptableException e, HttpServletRequest request)
            throws HttpMediaTypeNotAcceptableException {
        if (!api(request)) {
            throw e;
        }
        return ApiExceptionHandler.problem(HttpStatus.NOT_ACCEPTABLE, "This address answers "
                + (e.getSupportedMediaTypes().isEmpty() ? "JSON" : e.getSupportedMediaTypes().toString())
                + "; send an Accept header that allows it.");
    }

    @ExceptionHandler(HttpMediaTypeNotSupportedException.class)
    ResponseEntity<ProblemDetail> notSupported(HttpMediaTypeNotSupportedException e, HttpServletRequest request)
            throws HttpMediaTypeNotSupportedException {
        if (!api(request)) {
            throw e;
        }
        return ApiExceptionHandler.problem(HttpStatus.UNSUPPORTED_MEDIA_TYPE,
                "Send the request body as " + e.getSupportedMediaTypes() + ".");
    }

    private static boolean api(HttpServletRequest request) {
        return request.getRequestURI().substring(request.getContextPath().length()).startsWith("/api/");
    }
}
