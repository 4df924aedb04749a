package org.dockgate.web;

import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.LinkedHashMap;
import java.util.Map;
import org.springframework.http.HttpStatus;
import org.springframework.stereotype.Component;
import tools.jackson.databind.json.JsonMapper;

/**
 * Writes an RFC 9457 problem document where no controller advice can (security filters, the error
 * dispatch of an unknown API path).
 */
@Component
public class ProblemWriter {

    public static final String PROBLEM_JSON = "application/problem+json";

    private final JsonMapper json;

    ProblemWriter(JsonMapper json) {
        this.json = json;
    }

    public void write(HttpServletResponse response, int status, String title, String detail) throws IOException {
        if (response.isCommitted()) {
            return;
        }
        Map<String, Object> body = new LinkedHashMap<>();
        body.put("type", "about:blank");
        body.put("title", title == null ? reason(status) : title);
        body.put("status", status);
        body.put("detail", detail);
        response.setStatus(status);
        response.setContentType(PROBLEM_JSON);
        response.setCharacterEncoding("UTF-8");
        response.getWriter().write(json.writeValueAsString(body));
    }

    static String reason(int status) {
        HttpStatus known = HttpStatus.resolve(status);
        return known == null ? "Error" : known.getReasonPhrase();
    }
}
