package org.dockgate.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.InputStream;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.Base64;
import java.util.Collections;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * Request size limits through a real server (the multipart limit is enforced by the container's request
 * reading, which a mock does not do): an import above the upload limit, a JSON body above its limit, and
 * the signing API's refusals, all as problem documents naming what went wrong.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class RequestLimitsTest {

    static final long MB = 1024L * 1024;

    @LocalServerPort int port;

    private final HttpClient http = HttpClient.newBuilder().followRedirects(HttpClient.Redirect.NEVER).build();

    private HttpRequest.Builder request(String path, String user, String password) {
        return HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .header("Authorization", "Basic " + Base64.getEncoder()
                        .encodeToString((user + ":" + password).getBytes(StandardCharsets.UTF_8)));
    }

    /** A multipart body with one CSV file part of the given size (a header, then data rows). */
    private static HttpRequest.BodyPublisher multipart(String boundary, long fileBytes) {
        byte[] head = ("--" + boundary + "\r\nContent-Disposition: form-data; name=\"instrument\"\r\n\r\nRI-X\r\n--"
                + boundary + "\r\nContent-Disposition: form-data; name=\"file\"; filename=\"daq.csv\"\r\n"
                + "Content-Type: text/csv\r\n\r\nserial,test,point,direction,cycle,value,unit\n")
                .getBytes(StandardCharsets.US_ASCII);
        byte[] tail = ("\r\n--" + boundary + "--\r\n").getBytes(StandardCharsets.US_ASCII);
        byte[] chunk = "SN-0001,NOISE,0,,,-0.0012,mV\n".repeat(36_000).getBytes(StandardCharsets.US_ASCII);
        long chunks = fileBytes / chunk.length + 1;
        List<byte[]> parts = new java.util.ArrayList<>();
        parts.add(head);
        parts.addAll(Collections.nCopies((int) chunks, chunk));
        parts.add(tail);
        long length = head.length + tail.length + chunks * chunk.length;
        return HttpRequest.BodyPublishers.fromPublisher(HttpRequest.BodyPublishers.ofByteArrays(parts), length);
    }

    @Test
    void anImportAboveTheLimitIsA413ProblemNamingTheLimit() throws Exception {
        String boundary = "dockgate-test-boundary";
        HttpResponse<String> response = http.send(request("/api/v1/lots/1/readings:import", "operator", "operator-demo")
                .header("Content-Type", "multipart/form-data; boundary=" + boundary)
                .POST(multipart(boundary, 129 * MB)).build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).isEqualTo(413);
        assertThat(response.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        assertThat(response.body()).contains("128 MB").contains("Nothing was saved");
    }

    @Test
    void aJsonBodyAboveTwoMegabytesIsRefusedWith413() throws Exception {
        // Well-formed JSON that a parser reads to its end: the limit, not the content, must refuse it.
        String big = "{" + " ".repeat((int) (3 * MB)) + "}";
        assertThat(big.length()).isGreaterThan((int) (2 * MB));
        HttpResponse<String> declared = http.send(request("/api/v1/analysis/static", "engineer", "engineer-demo")
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(big)).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(declared.statusCode()).isEqualTo(413);
        assertThat(declared.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        assertThat(declared.body()).contains("2 MB");
        // Without a declared length (chunked), counted while read.
        HttpResponse<String> chunked = http.send(request("/api/v1/analysis/static", "engineer", "engineer-demo")
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofInputStream(
                        () -> InputStream.class.cast(new java.io.ByteArrayInputStream(big.getBytes(StandardCharsets.UTF_8)))))
                .build(), HttpResponse.BodyHandlers.ofString());
        assertThat(chunked.statusCode()).as(chunked.body()).isEqualTo(413);
        assertThat(chunked.body()).contains("2 MB");
        // A body under the limit still reaches the controller (and gets its own answer).
        HttpResponse<String> small = http.send(request("/api/v1/analysis/static", "engineer", "engineer-demo")
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString("{}")).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(small.statusCode()).isNotEqualTo(413);
    }

    @Test
    void theSigningApiAnswersErrorsAsProblemDocuments() throws Exception {
        HttpResponse<String> response = http.send(request("/api/v1/lots/987654321/certificates", "engineer",
                        "engineer-demo").header("Content-Type", "application/json").header("Accept", "*/*")
                        .POST(HttpRequest.BodyPublishers.ofString("{\"password\": \"engineer-demo\"}")).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).isBetween(400, 499);
        assertThat(response.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        assertThat(response.body()).contains("\"detail\"").doesNotContain("<html");
    }
}
