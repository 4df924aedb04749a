package org.dockgate.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Base64;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * Broken uploads through a real server (MockMvc does not parse multipart bodies): a POST that is not
 * multipart, multipart without its boundary, and a part whose file name holds a NUL character. Each
 * upload endpoint refuses them in its own kind (a page for a form post, a problem document for the API
 * and for the page's script), never with a 500.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class UploadRefusalsTest {

    private static final String CSV = "serial,test,point,direction,cycle,value,unit\nSN-0001,STATIC,0,UP,1,0.05,mV\n";
    private static final String BOUNDARY = "----dockgate-fuzz-7d1f";

    @LocalServerPort int port;

    private final HttpClient http = HttpClient.newBuilder().followRedirects(HttpClient.Redirect.NEVER).build();

    /** One broken body: its content type and bytes. */
    record Broken(String what, String contentType, byte[] body) {
    }

    static List<Broken> brokenUploads() {
        return List.of(
                new Broken("a plain CSV body", "text/csv", CSV.getBytes(StandardCharsets.UTF_8)),
                new Broken("a form without a file", "application/x-www-form-urlencoded",
                        "instrument=&preview=true".getBytes(StandardCharsets.UTF_8)),
                new Broken("multipart without a boundary", "multipart/form-data", multipart("readings.csv")),
                new Broken("a file name with NUL", "multipart/form-data; boundary=" + BOUNDARY, multipart("read\u0000ings.csv")));
    }

    static byte[] multipart(String fileName) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        String head = "--" + BOUNDARY + "\r\nContent-Disposition: form-data; name=\"file\"; filename=\"" + fileName
                + "\"\r\nContent-Type: text/csv\r\n\r\n";
        out.writeBytes(head.getBytes(StandardCharsets.UTF_8));
        out.writeBytes(CSV.getBytes(StandardCharsets.UTF_8));
        out.writeBytes(("\r\n--" + BOUNDARY + "--\r\n").getBytes(StandardCharsets.UTF_8));
        return out.toByteArray();
    }

    private HttpResponse<String> send(String path, Broken broken, String accept, String basicUser, String cookie,
                                      String csrf) throws Exception {
        HttpRequest.Builder request = HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .header("Content-Type", broken.contentType()).header("Accept", accept)
                .POST(HttpRequest.BodyPublishers.ofByteArray(broken.body()));
        if (basicUser != null) {
            request.header("Authorization", "Basic " + Base64.getEncoder()
                    .encodeToString((basicUser + ":" + basicUser + "-demo").getBytes(StandardCharsets.UTF_8)));
        }
        if (cookie != null) {
            request.header("Cookie", cookie).header("X-CSRF-TOKEN", csrf);
        }
        return http.send(request.build(), HttpResponse.BodyHandlers.ofString());
    }

    /** Signs in through the login form; returns the session cookie and the CSRF token of the signed-in page. */
    private String[] signIn(String user) throws Exception {
        HttpResponse<String> page = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/login"))
                .header("Accept", "text/html").build(), HttpResponse.BodyHandlers.ofString());
        String cookie = page.headers().firstValue("Set-Cookie").orElseThrow().split(";")[0];
        String token = page.body().replaceAll("(?s).*name=\"_csrf\" value=\"([^\"]+)\".*", "$1");
        HttpResponse<String> login = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/login"))
                .header("Content-Type", "application/x-www-form-urlencoded").header("Cookie", cookie)
                .POST(HttpRequest.BodyPublishers.ofString("username=" + user + "&password=" + user + "-demo&_csrf=" + token))
                .build(), HttpResponse.BodyHandlers.ofString());
        String session = login.headers().firstValue("Set-Cookie").map(c -> c.split(";")[0]).orElse(cookie);
        HttpResponse<String> home = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/bench"))
                .header("Accept", "text/html").header("Cookie", session).build(), HttpResponse.BodyHandlers.ofString());
        String csrf = home.body().replaceAll("(?s).*<meta name=\"_csrf\" content=\"([^\"]+)\".*", "$1");
        assertThat(csrf).doesNotContain("<");
        return new String[] {session, csrf};
    }

    @Test
    void brokenUploadsAreRefusedInTheEndpointsOwnKind() throws Exception {
        String[] operator = signIn("operator");
        List<String> failures = new ArrayList<>();
        for (Broken broken : brokenUploads()) {
            // The unit page's form post without script: a page that says what to send.
            check(failures, "page import", broken,
                    send("/bench/lots/987654321/units/SN-0001/import", broken, "text/html", null, operator[0], operator[1]),
                    "text/html");
            // The unit page's script: a problem document.
            check(failures, "page import job", broken,
                    send("/bench/lots/987654321/import-jobs", broken, "application/json", null, operator[0], operator[1]),
                    "application/problem+json");
            for (String api : List.of("/api/v1/lots/987654321/readings:import", "/api/v1/lots/987654321/import-jobs",
                    "/api/v1/certificates/verify")) {
                check(failures, api, broken, send(api, broken, "application/json", "operator", null, null),
                        "application/problem+json");
                check(failures, api + " from a browser", broken, send(api, broken, "text/html", "operator", null, null),
                        "application/problem+json");
            }
        }
        assertThat(failures).isEmpty();
    }

    private static void check(List<String> failures, String endpoint, Broken broken, HttpResponse<String> response,
                              String expectedType) {
        String type = response.headers().firstValue("Content-Type").orElse("");
        String body = response.body();
        String problem = null;
        if (response.statusCode() < 400 || response.statusCode() >= 500) {
            problem = "status " + response.statusCode();
        } else if (!type.startsWith(expectedType)) {
            problem = "content type " + type;
        } else if (!body.contains("multipart/form-data") && response.statusCode() == 400) {
            problem = "does not say what to send";
        } else {
            List<String> forbidden = expectedType.equals("text/html")
                    ? List.of("java.", "tools.jackson", "Exception", "at org.") : MalformedJsonBodiesTest.FORBIDDEN;
            for (String word : forbidden) {
                if (body.contains(word)) {
                    problem = "quotes '" + word + "'";
                }
            }
        }
        if (problem != null) {
            failures.add(endpoint + " with " + broken.what() + ": " + problem + " — "
                    + body.substring(0, Math.min(300, body.length())));
        }
    }
}
