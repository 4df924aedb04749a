package org.dockgate.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.Base64;
import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * Error pages and problem documents through a real server (the servlet container's error dispatch does
 * not happen in a mock): friendly 404 and 403 pages without stack traces, problem+json for the API.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class ErrorPagesTest {

    @LocalServerPort int port;

    private final HttpClient http = HttpClient.newBuilder().followRedirects(HttpClient.Redirect.NEVER).build();

    private HttpResponse<String> get(String path, String user, String password, String accept) throws Exception {
        HttpRequest.Builder request = HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .header("Accept", accept);
        if (user != null) {
            request.header("Authorization", "Basic " + Base64.getEncoder()
                    .encodeToString((user + ":" + password).getBytes(StandardCharsets.UTF_8)));
        }
        return http.send(request.build(), HttpResponse.BodyHandlers.ofString());
    }

    /** Signs in through the login form and returns the session cookie. */
    private String signIn(String user, String password) throws Exception {
        HttpResponse<String> page = get("/login", null, null, "text/html");
        String cookie = page.headers().firstValue("Set-Cookie").orElseThrow().split(";")[0];
        String token = page.body().replaceAll("(?s).*name=\"_csrf\" value=\"([^\"]+)\".*", "$1");
        HttpResponse<String> login = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/login"))
                .header("Content-Type", "application/x-www-form-urlencoded").header("Cookie", cookie)
                .POST(HttpRequest.BodyPublishers.ofString("username=" + user + "&password=" + password
                        + "&_csrf=" + token)).build(), HttpResponse.BodyHandlers.ofString());
        assertThat(login.headers().firstValue("Location").orElse("")).endsWith("/");
        return login.headers().firstValue("Set-Cookie").map(c -> c.split(";")[0]).orElse(cookie);
    }

    private HttpResponse<String> page(String path, String cookie) throws Exception {
        return http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .header("Accept", "text/html").header("Cookie", cookie).build(), HttpResponse.BodyHandlers.ofString());
    }

    @Test
    void anUnknownPageIsRefusedByDefaultWithoutAStackTrace() throws Exception {
        // Deny by default: a path no access rule covers is refused before any handler looks at it, so an
        // unknown page answers 403, never a page or a stack trace.
        String session = signIn("engineer", "engineer-demo");
        HttpResponse<String> response = page("/no/such/page", session);
        assertThat(response.statusCode()).isEqualTo(403);
        assertThat(response.body()).doesNotContain("Exception").doesNotContain("at org.");
    }

    @Test
    void anUnknownSensorModelIsAFriendly404WithoutAStackTrace() throws Exception {
        String session = signIn("engineer", "engineer-demo");
        HttpResponse<String> response = page("/catalogue/987654321", session);
        assertThat(response.statusCode()).isEqualTo(404);
        assertThat(response.body()).contains("Page not found").doesNotContain("Exception").doesNotContain("at org.");
    }

    @Test
    void aRefusedPageNamesTheRoleNeeded() throws Exception {
        String session = signIn("operator", "operator-demo");
        HttpResponse<String> response = page("/admin/users", session);
        assertThat(response.statusCode()).isEqualTo(403);
        assertThat(response.body()).contains("This needs the role ADMIN");
    }

    @Test
    void apiErrorsAreProblemDocuments() throws Exception {
        HttpResponse<String> anonymous = get("/api/v1/audit/verify", null, null, "application/json");
        assertThat(anonymous.statusCode()).isEqualTo(401);
        assertThat(anonymous.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");

        HttpResponse<String> forbidden = get("/api/v1/audit/verify", "operator", "operator-demo", "application/json");
        assertThat(forbidden.statusCode()).isEqualTo(403);
        assertThat(forbidden.body()).contains("AUDITOR or ADMIN");

        // Deny by default: a path without an access rule is refused, as a problem document.
        HttpResponse<String> unknown = get("/api/v1/no-such-thing", "operator", "operator-demo", "application/json");
        assertThat(unknown.statusCode()).isEqualTo(403);
        assertThat(unknown.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        assertThat(unknown.body()).doesNotContain("Exception");

        HttpResponse<String> unknownLot = get("/api/v1/lots/987654321", "engineer", "engineer-demo", "application/json");
        assertThat(unknownLot.statusCode()).isEqualTo(404);
        assertThat(unknownLot.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        assertThat(unknownLot.body()).doesNotContain("Exception");

        HttpResponse<String> verify = get("/api/v1/audit/verify", "auditor", "auditor-demo", "application/json");
        assertThat(verify.statusCode()).isEqualTo(200);
        assertThat(verify.body()).contains("\"intact\":true").contains("\"firstBrokenEntry\":null");
    }
}
