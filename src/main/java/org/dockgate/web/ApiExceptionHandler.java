package org.dockgate.web;

import jakarta.validation.ConstraintViolationException;
import java.util.stream.Collectors;
import org.dockgate.core.UnevaluableException;
import org.dockgate.platform.RefusedField;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.dao.OptimisticLockingFailureException;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.http.converter.HttpMessageNotReadableException;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.web.HttpMediaTypeNotAcceptableException;
import org.springframework.web.HttpMediaTypeNotSupportedException;
import org.springframework.web.HttpRequestMethodNotSupportedException;
import org.springframework.web.bind.MethodArgumentNotValidException;
import org.springframework.web.bind.MissingServletRequestParameterException;
import org.springframework.web.bind.ServletRequestBindingException;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.bind.annotation.RestControllerAdvice;
import org.springframework.web.method.annotation.MethodArgumentTypeMismatchException;
import org.springframework.web.multipart.MaxUploadSizeExceededException;
import org.springframework.web.multipart.MultipartException;
import org.springframework.web.multipart.support.MissingServletRequestPartException;

/**
 * Turns every failure of a JSON API controller into {@code application/problem+json} (RFC 9457) with a
 * human-readable {@code detail}: 400 for malformed input, 422 for input that cannot be evaluated, 409
 * for a concurrent change, never a stack trace.
 */
@RestControllerAdvice(annotations = RestController.class)
@Order(Ordered.HIGHEST_PRECEDENCE)
public class ApiExceptionHandler {

    private static final Logger log = LoggerFactory.getLogger(ApiExceptionHandler.class);
    private static final MediaType PROBLEM = MediaType.APPLICATION_PROBLEM_JSON;

    @ExceptionHandler(UnevaluableException.class)
    ResponseEntity<ProblemDetail> unevaluable(UnevaluableException e) {
        return problem(HttpStatus.UNPROCESSABLE_CONTENT, e.getMessage());
    }

    @ExceptionHandler(NotFoundException.class)
    ResponseEntity<ProblemDetail> notFound(NotFoundException e) {
        return problem(HttpStatus.NOT_FOUND, e.getMessage());
    }

    @ExceptionHandler(IllegalArgumentException.class)
    ResponseEntity<ProblemDetail> malformed(IllegalArgumentException e) {
        ResponseEntity<ProblemDetail> answer = problem(HttpStatus.BAD_REQUEST, e.getMessage());
        if (e instanceof RefusedField refused && refused.field() != null) {
            answer.getBody().setProperty("field", refused.field());
        }
        return answer;
    }

    @ExceptionHandler(HttpMessageNotReadableException.class)
    ResponseEntity<ProblemDetail> unreadable(HttpMessageNotReadableException e) {
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof JsonBodyLimitFilter.BodyTooLargeException tooLarge) {
                return bodyTooLarge(tooLarge);
            }
        }
        JsonProblems.Refusal refusal = JsonProblems.describe(e);
        ResponseEntity<ProblemDetail> answer = problem(HttpStatus.BAD_REQUEST, refusal.detail());
        if (refusal.field() != null) {
            answer.getBody().setProperty("field", refusal.field());
            answer.getBody().setProperty("pointer", refusal.pointer());
        }
        return answer;
    }

    @ExceptionHandler(MethodArgumentTypeMismatchException.class)
    ResponseEntity<ProblemDetail> typeMismatch(MethodArgumentTypeMismatchException e) {
        String expected = e.getRequiredType() == null ? "another type" : JsonProblems.expected(e.getRequiredType());
        return problem(HttpStatus.BAD_REQUEST, "Parameter '" + e.getName() + "' has the value '" + e.getValue()
                + "', which is not " + expected + ".");
    }

    @ExceptionHandler(MissingServletRequestParameterException.class)
    ResponseEntity<ProblemDetail> missing(MissingServletRequestParameterException e) {
        return problem(HttpStatus.BAD_REQUEST, "Parameter '" + e.getParameterName() + "' is required.");
    }

    @ExceptionHandler(MissingServletRequestPartException.class)
    ResponseEntity<ProblemDetail> missingPart(MissingServletRequestPartException e) {
        return problem(HttpStatus.BAD_REQUEST, "The upload part '" + e.getRequestPartName() + "' is required.");
    }

    /** Not a multipart request, a multipart request without a boundary, or a part that cannot be read. */
    @ExceptionHandler(MultipartException.class)
    ResponseEntity<ProblemDetail> notMultipart(MultipartException e) {
        return problem(HttpStatus.BAD_REQUEST, UploadLimitAdvice.NOT_AN_UPLOAD);
    }

    @ExceptionHandler(ServletRequestBindingException.class)
    ResponseEntity<ProblemDetail> binding(ServletRequestBindingException e) {
        return problem(HttpStatus.BAD_REQUEST, "The request is incomplete: a required header or path part is missing.");
    }

    @ExceptionHandler(MethodArgumentNotValidException.class)
    ResponseEntity<ProblemDetail> invalid(MethodArgumentNotValidException e) {
        String detail = e.getBindingResult().getFieldErrors().stream()
                .map(f -> "'" + f.getField() + "' " + f.getDefaultMessage())
                .collect(Collectors.joining("; "));
        return problem(HttpStatus.BAD_REQUEST, detail.isEmpty() ? "The request is not valid." : detail);
    }

    @ExceptionHandler(ConstraintViolationException.class)
    ResponseEntity<ProblemDetail> violated(ConstraintViolationException e) {
        return problem(HttpStatus.BAD_REQUEST, e.getConstraintViolations().stream()
                .map(v -> v.getPropertyPath() + " " + v.getMessage()).collect(Collectors.joining("; ")));
    }

    @ExceptionHandler(OptimisticLockingFailureException.class)
    ResponseEntity<ProblemDetail> concurrent(OptimisticLockingFailureException e) {
        return problem(HttpStatus.CONFLICT,
                "This record changed while you were editing it. Reload it and apply your change again.");
    }

    @ExceptionHandler(IllegalStateException.class)
    ResponseEntity<ProblemDetail> conflict(IllegalStateException e) {
        return problem(HttpStatus.CONFLICT, e.getMessage());
    }

    @ExceptionHandler(HttpRequestMethodNotSupportedException.class)
    ResponseEntity<ProblemDetail> method(HttpRequestMethodNotSupportedException e) {
        return problem(HttpStatus.METHOD_NOT_ALLOWED, "This path does not accept " + e.getMethod() + ".");
    }

    @ExceptionHandler(HttpMediaTypeNotSupportedException.class)
    ResponseEntity<ProblemDetail> mediaType(HttpMediaTypeNotSupportedException e) {
        return problem(HttpStatus.UNSUPPORTED_MEDIA_TYPE,
                "Send the request body as " + e.getSupportedMediaTypes() + ".");
    }

    @ExceptionHandler(HttpMediaTypeNotAcceptableException.class)
    ResponseEntity<ProblemDetail> notAcceptable(HttpMediaTypeNotAcceptableException e) {
        return problem(HttpStatus.NOT_ACCEPTABLE, "This address answers JSON; send an Accept header that allows"
                + " application/json.");
    }

    @ExceptionHandler(MaxUploadSizeExceededException.class)
    ResponseEntity<ProblemDetail> tooLarge(MaxUploadSizeExceededException e) {
        return problem(HttpStatus.CONTENT_TOO_LARGE, "The upload is larger than the server accepts.");
    }

    @ExceptionHandler(JsonBodyLimitFilter.BodyTooLargeException.class)
    ResponseEntity<ProblemDetail> bodyTooLarge(JsonBodyLimitFilter.BodyTooLargeException e) {
        return problem(HttpStatus.CONTENT_TOO_LARGE, e.getMessage());
    }

    @ExceptionHandler(AccessDeniedException.class)
    ResponseEntity<ProblemDetail> denied(AccessDeniedException e) {
        return problem(HttpStatus.FORBIDDEN, "Your roles do not allow this request.");
    }

    @ExceptionHandler(Exception.class)
    ResponseEntity<ProblemDetail> unexpected(Exception e) {
        String reference = Long.toHexString(System.nanoTime());
        log.error("Unexpected API failure, reference {}", reference, e);
        return problem(HttpStatus.INTERNAL_SERVER_ERROR,
                "Dockgate could not complete the request (reference " + reference + "); nothing was saved by it.");
    }

    static ResponseEntity<ProblemDetail> problem(HttpStatus status, String detail) {
        if (JsonProblems.technical(detail)) {
            // A message written for programmers (a Java type or package) never reaches the client.
            log.warn("Technical refusal message replaced in a {} answer: {}", status.value(), detail);
            detail = "The request has a value Dockgate cannot accept; check the fields against the API documentation.";
        }
        ProblemDetail body = ProblemDetail.forStatusAndDetail(status, detail);
        return ResponseEntity.status(status).contentType(PROBLEM).body(body);
    }
}
