package org.dockgate.web;

import jakarta.servlet.RequestDispatcher;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import org.dockgate.platform.AccessRules;
import org.springframework.boot.webmvc.error.ErrorController;
import org.springframework.http.HttpStatus;
import org.springframework.stereotype.Controller;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.servlet.ModelAndView;

/**
 * Every error that reaches the servlet container ends here: a friendly page for people, a problem
 * document for {@code /api/**}, and never a stack trace.
 */
@Controller
class ErrorPagesController implements ErrorController {

    private final ProblemWriter problems;
    private final AccessRules rules;

    ErrorPagesController(ProblemWriter problems, AccessRules rules) {
        this.problems = problems;
        this.rules = rules;
    }

    @RequestMapping("/error")
    ModelAndView error(HttpServletRequest request, HttpServletResponse response) throws IOException {
        Object code = request.getAttribute(RequestDispatcher.ERROR_STATUS_CODE);
        int status = code instanceof Integer i ? i : 500;
        String uri = (String) request.getAttribute(RequestDispatcher.ERROR_REQUEST_URI);
        String path = uri == null ? "" : uri.substring(request.getContextPath().length());
        if (path.startsWith("/api/")) {
            problems.write(response, status, null, apiDetail(status, path, request.getMethod()));
            return null;
        }
        ModelAndView page = new ModelAndView(switch (status) {
            case 400, 403, 404, 409 -> "error/" + status;
            default -> "error/500";
        });
        page.setStatus(HttpStatus.valueOf(status));
        page.addObject("status", status);
        page.addObject("path", path);
        if (status == 403) {
            rules.ruleFor(path, request.getMethod())
                    .ifPresent(rule -> page.addObject("requiredRoles", AccessRules.describe(rule.roles())));
        }
        return page;
    }

    private String apiDetail(int status, String path, String method) {
        return switch (status) {
            case 404 -> "There is no API resource at " + path + ".";
            case 405 -> "The path " + path + " does not accept " + method + ".";
            case 403 -> "Your roles do not allow this request.";
            case 401 -> "Sign in with HTTP Basic authentication.";
            default -> "Dockgate could not complete the request; nothing was saved by it.";
        };
    }
}
