package org.dockgate.certificates;

import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.hasItem;
import static org.hamcrest.Matchers.not;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.multipart;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.header;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.redirectedUrl;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import org.dockgate.accounts.AccountService;
import org.dockgate.platform.Role;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.mock.web.MockMultipartFile;
import org.springframework.test.web.servlet.MockMvc;

/** The verification API and pages, the register's pages and API, the signing-identities page, through the real filter chains. */
@SpringBootTest
@AutoConfigureMockMvc
class CertificatesWebTest {

    @Autowired MockMvc mvc;
    @Autowired AccountService accounts;
    @Autowired SigningIdentityService identities;
    @Autowired CertificatePdfWriter writer;
    @Autowired CertificateRegister register;

    String signer;
    IssuedCertificate issued;
    byte[] pdf;

    @BeforeEach
    void setUp() {
        signer = SigningFixtures.newSigner(accounts, identities, Role.SUPERVISOR);
        issued = SigningFixtures.as(signer, () -> register.issue(SigningFixtures.subject("SN-WEB-" + signer),
                signer, "approved for release", h -> SigningFixtures.render(writer, h, 0)));
        pdf = register.pdf(issued.certificateNumber()).orElseThrow();
    }

    private static MockMultipartFile file(byte[] bytes) {
        return new MockMultipartFile("file", "certificate.pdf", "application/pdf", bytes);
    }

    @Test
    void theVerifyApiSaysValidForTheIssuedFile() throws Exception {
        mvc.perform(multipart("/api/v1/certificates/verify").file(file(pdf)).with(httpBasic("auditor", "auditor-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.valid").value(true))
                .andExpect(jsonPath("$.reasons").isEmpty())
                .andExpect(jsonPath("$.certificateNumber").value(issued.certificateNumber()))
                .andExpect(jsonPath("$.signer").value(issued.signerName()))
                .andExpect(jsonPath("$.signedAt").value(issued.signedAt().toString()))
                .andExpect(jsonPath("$.superseded").value(false));
    }

    @Test
    void theVerifyApiSaysInvalidWithReasonsForATamperedFile() throws Exception {
        byte[] tampered = pdf.clone();
        int at = new String(pdf, java.nio.charset.StandardCharsets.ISO_8859_1).indexOf("Certificate of conformance");
        tampered[at] ^= 0x20;
        mvc.perform(multipart("/api/v1/certificates/verify").file(file(tampered)).with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.valid").value(false))
                .andExpect(jsonPath("$.reasons", hasItem(containsString("changed after it was signed"))))
                .andExpect(jsonPath("$.certificateNumber").value(issued.certificateNumber()));
    }

    @Test
    void notAPdfIsInvalidNeverAServerError() throws Exception {
        mvc.perform(multipart("/api/v1/certificates/verify")
                        .file(new MockMultipartFile("file", "notes.txt", "text/plain", "just text".getBytes()))
                        .with(httpBasic("engineer", "engineer-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.valid").value(false))
                .andExpect(jsonPath("$.reasons[0]").value("The file is not a PDF document."));
        // A PDF header on garbage: still an answer.
        mvc.perform(multipart("/api/v1/certificates/verify")
                        .file(file("%PDF-1.7\n garbage \u0000\u0001".getBytes()))
                        .with(httpBasic("engineer", "engineer-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.valid").value(false));
    }

    @Test
    void aMissingOrEmptyUploadIsAClearProblem() throws Exception {
        mvc.perform(multipart("/api/v1/certificates/verify").with(httpBasic("engineer", "engineer-demo")))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentType("application/problem+json"))
                .andExpect(jsonPath("$.detail").value("The upload part 'file' is required."));
        mvc.perform(multipart("/api/v1/certificates/verify").file(file(new byte[0]))
                        .with(httpBasic("engineer", "engineer-demo")))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.detail").value("The upload part 'file' is empty."));
    }

    @Test
    void theApiNeedsSigningIn() throws Exception {
        mvc.perform(multipart("/api/v1/certificates/verify").file(file(pdf))).andExpect(status().isUnauthorized());
        mvc.perform(get("/api/v1/certificates")).andExpect(status().isUnauthorized());
    }

    @Test
    void theRegisterApiListsFiltersAndServesThePdf() throws Exception {
        mvc.perform(get("/api/v1/certificates").param("serial", "SN-WEB-" + signer).with(httpBasic("auditor", "auditor-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$[0].certificateNumber").value(issued.certificateNumber()))
                .andExpect(jsonPath("$[0].status").value("ISSUED"))
                .andExpect(jsonPath("$[0].sha256").value(issued.pdfSha256()))
                .andExpect(jsonPath("$.length()").value(1));
        mvc.perform(get("/api/v1/certificates/{n}/pdf", issued.certificateNumber()).with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isOk())
                .andExpect(content().contentType("application/pdf"))
                .andExpect(content().bytes(pdf));
        mvc.perform(get("/api/v1/certificates/{n}/pdf", "DG-1999-999999").with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isNotFound())
                .andExpect(jsonPath("$.detail").value("There is no certificate DG-1999-999999 in the register."));
        mvc.perform(get("/api/v1/certificates").param("from", "yesterday").with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.detail").value(containsString("not a date")));
    }

    @Test
    void theVerifyPagesArePublic() throws Exception {
        mvc.perform(get("/verify")).andExpect(status().isOk())
                .andExpect(content().string(containsString("id=\"verify-form\"")));
        mvc.perform(multipart("/verify").file(file(pdf)).with(csrf()))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("Valid: a genuine, complete and current certificate")));
        mvc.perform(multipart("/verify").file(new MockMultipartFile("file", "x.txt", "text/plain", "x".getBytes()))
                        .with(csrf()))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("The file is not a PDF document.")));
        mvc.perform(get("/verify/{n}", issued.certificateNumber())).andExpect(status().isOk())
                .andExpect(content().string(containsString("Issued and current")))
                .andExpect(content().string(containsString(issued.pdfSha256())))
                .andExpect(content().string(not(containsString("Invented Sensors Ltd"))));
        mvc.perform(get("/verify/{n}", "DG-1999-999999")).andExpect(status().isNotFound())
                .andExpect(content().string(containsString("There is no certificate DG-1999-999999 in this lab&#39;s register")));
        mvc.perform(get("/verify/trust/ca.pem")).andExpect(status().isOk())
                .andExpect(content().string(containsString("BEGIN CERTIFICATE")));
    }

    @Test
    void theRegisterPagesAreForEveryRole() throws Exception {
        mvc.perform(get("/certificates").param("number", issued.certificateNumber()).with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("id=\"certificate-" + issued.certificateNumber() + "\"")));
        mvc.perform(get("/certificates/{n}", issued.certificateNumber()).with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString(issued.pdfSha256())));
        mvc.perform(get("/certificates/{n}/pdf", issued.certificateNumber()).with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk()).andExpect(content().bytes(pdf))
                .andExpect(header().string("Content-Disposition", containsString(issued.certificateNumber() + ".pdf")));
        mvc.perform(get("/certificates").with(user("operator").roles("OPERATOR")))
                .andExpect(content().string(containsString("href=\"/certificates\"")))
                .andExpect(content().string(not(containsString("href=\"/admin/signing\""))));
    }

    @Test
    void theSigningPageIsAdminsAndSaysWhenTheKeyIsADemoKey() throws Exception {
        mvc.perform(get("/admin/signing").with(user("engineer").roles("ENGINEER"))).andExpect(status().isForbidden());
        mvc.perform(get("/admin/signing").with(user("admin").roles("ADMIN")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("id=\"demo-key\"")))
                .andExpect(content().string(containsString("This is a demo key.")))
                .andExpect(content().string(containsString("Dockgate&#39;s own lab root, CN=")))
                .andExpect(content().string(containsString(signer)))
                .andExpect(content().string(containsString("href=\"/admin/signing\"")));
    }

    @Test
    void anAdminGrantsAndRevokesThroughThePage() throws Exception {
        String person = "page-signer-" + java.util.UUID.randomUUID().toString().substring(0, 6);
        accounts.create(person, "Page Signer", "page-signer-password", java.util.Set.of(Role.ENGINEER));
        mvc.perform(post("/admin/signing/grant").param("username", person).with(user("admin").roles("ADMIN")).with(csrf()))
                .andExpect(redirectedUrl("/admin/signing"));
        SigningIdentity granted = identities.activeIdentity(person).orElseThrow();
        org.assertj.core.api.Assertions.assertThat(granted.subject()).contains("CN=Page Signer");
        mvc.perform(post("/admin/signing/grant").param("username", person).with(user("admin").roles("ADMIN")).with(csrf()))
                .andExpect(redirectedUrl("/admin/signing"))
                .andExpect(org.springframework.test.web.servlet.result.MockMvcResultMatchers.flash()
                        .attribute("problem", containsString("already has active signing rights")));
        mvc.perform(post("/admin/signing/{id}/revoke", granted.id()).param("version", String.valueOf(granted.version()))
                        .param("reason", "test over").with(user("admin").roles("ADMIN")).with(csrf()))
                .andExpect(redirectedUrl("/admin/signing"));
        org.assertj.core.api.Assertions.assertThat(identities.activeIdentity(person)).isEmpty();
        mvc.perform(post("/admin/signing/grant").param("username", "operator").with(user("admin").roles("ADMIN")).with(csrf()))
                .andExpect(org.springframework.test.web.servlet.result.MockMvcResultMatchers.flash()
                        .attribute("problem", containsString("neither ENGINEER nor SUPERVISOR")));
    }

    @Test
    void theApiIsDocumented() throws Exception {
        mvc.perform(get("/v3/api-docs")).andExpect(status().isOk())
                .andExpect(content().string(containsString("/api/v1/certificates/verify")))
                .andExpect(content().string(containsString("/api/v1/certificates/{number}/pdf")));
    }
}
