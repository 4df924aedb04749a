package org.dockgate.certificates;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.Base64;
import java.util.UUID;
import org.dockgate.accounts.AccountService;
import org.dockgate.platform.Role;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * The public upload form through a real server, without signing in: the CSRF token travels inside the
 * multipart body, which the security filter must read before the dispatcher does (a mock request would
 * not show that). And the API upload with HTTP Basic.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class VerifyUploadServerTest {

    @LocalServerPort int port;
    @Autowired AccountService accounts;
    @Autowired SigningIdentityService identities;
    @Autowired CertificatePdfWriter writer;
    @Autowired CertificateRegister register;

    private final HttpClient http = HttpClient.newBuilder().followRedirects(HttpClient.Redirect.NEVER).build();

    private static byte[] multipart(String boundary, String csrf, byte[] pdf) {
        ByteArrayOutputStream body = new ByteArrayOutputStream();
        StringBuilder head = new StringBuilder();
        if (csrf != null) {
            head.append("--").append(boundary).append("\r\nContent-Disposition: form-data; name=\"_csrf\"\r\n\r\n")
                    .append(csrf).append("\r\n");
        }
        head.append("--").append(boundary)
                .append("\r\nContent-Disposition: form-data; name=\"file\"; filename=\"certificate.pdf\"\r\n")
                .append("Content-Type: application/pdf\r\n\r\n");
        body.writeBytes(head.toString().getBytes(StandardCharsets.UTF_8));
        body.writeBytes(pdf);
        body.writeBytes(("\r\n--" + boundary + "--\r\n").getBytes(StandardCharsets.UTF_8));
        return body.toByteArray();
    }

    @Test
    void anyoneCanUploadACertificateOnTheVerifyPage() throws Exception {
        String signer = SigningFixtures.newSigner(accounts, identities, Role.ENGINEER);
        IssuedCertificate issued = SigningFixtures.as(signer, () -> register.issue(SigningFixtures.subject("SN-HTTP-" + signer),
                signer, "approved for release", h -> SigningFixtures.render(writer, h, 0)));
        byte[] pdf = register.pdf(issued.certificateNumber()).orElseThrow();

        HttpResponse<String> form = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/verify"))
                .header("Accept", "text/html").build(), HttpResponse.BodyHandlers.ofString());
        assertThat(form.statusCode()).isEqualTo(200);
        String cookie = form.headers().firstValue("Set-Cookie").orElseThrow().split(";")[0];
        String token = form.body().replaceAll("(?s).*name=\"_csrf\" value=\"([^\"]+)\".*", "$1");
        String boundary = "----dockgate" + UUID.randomUUID();

        HttpResponse<String> checked = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/verify"))
                .header("Content-Type", "multipart/form-data; boundary=" + boundary).header("Cookie", cookie)
                .POST(HttpRequest.BodyPublishers.ofByteArray(multipart(boundary, token, pdf))).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(checked.statusCode()).isEqualTo(200);
        assertThat(checked.body()).contains("Valid: a genuine, complete and current certificate")
                .contains(issued.certificateNumber());

        HttpResponse<String> withoutToken = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/verify"))
                .header("Content-Type", "multipart/form-data; boundary=" + boundary).header("Cookie", cookie)
                .POST(HttpRequest.BodyPublishers.ofByteArray(multipart(boundary, null, pdf))).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(withoutToken.statusCode()).isEqualTo(403);

        HttpResponse<String> api = http.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port
                        + "/api/v1/certificates/verify"))
                .header("Content-Type", "multipart/form-data; boundary=" + boundary)
                .header("Authorization", "Basic " + Base64.getEncoder().encodeToString(
                        "auditor:auditor-demo".getBytes(StandardCharsets.UTF_8)))
                .POST(HttpRequest.BodyPublishers.ofByteArray(multipart(boundary, null, pdf))).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(api.statusCode()).isEqualTo(200);
        assertThat(api.body()).contains("\"valid\":true").contains(issued.certificateNumber());
    }
}
