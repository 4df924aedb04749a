package org.dockgate.web;

import org.dockgate.core.UnevaluableException;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.dao.OptimisticLockingFailureException;
import org.springframework.http.HttpStatus;
import org.springframework.stereotype.Controller;
import org.springframework.web.bind.annotation.ControllerAdvice;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.servlet.ModelAndView;

/**
 * Failures in page controllers that no form handled: the person sees what went wrong in plain words
 * and that nothing was saved; the details go to the log only.
 */
@ControllerAdvice(annotations = Controller.class)
class PageExceptionHandler {

    private static final Logger log = LoggerFactory.getLogger(PageExceptionHandler.class);

    @ExceptionHandler(OptimisticLockingFailureException.class)
    ModelAndView concurrent(OptimisticLockingFailureException e) {
        return page(HttpStatus.CONFLICT, "error/409", null);
    }

    @ExceptionHandler({IllegalArgumentException.class, UnevaluableException.class, IllegalStateException.class})
    ModelAndView refused(RuntimeException e) {
        return page(HttpStatus.BAD_REQUEST, "error/400", e.getMessage());
    }

    @ExceptionHandler(NotFoundException.class)
    ModelAndView notFound(NotFoundException e) {
        return page(HttpStatus.NOT_FOUND, "error/404", e.getMessage());
    }

    @ExceptionHandler(org.springframework.web.method.annotation.MethodArgumentTypeMismatchException.class)
    ModelAndView mismatch(Exception e) {
        return page(HttpStatus.NOT_FOUND, "error/404", null);
    }

    private static ModelAndView page(HttpStatus status, String view, String message) {
        ModelAndView page = new ModelAndView(view);
        page.setStatus(status);
        page.addObject("status", status.value());
        page.addObject("message", message);
        log.debug("Page request refused: {}", message);
        return page;
    }
}
