package org.dockgate.certificates;

import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.hasItem;
import static org.hamcrest.Matchers.not;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.multipart;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.time.Instant;
import java.time.ZoneOffset;
import java.util.stream.Stream;
import javax.sql.DataSource;
import org.dockgate.DatabaseAdmin;
import org.dockgate.accounts.AccountService;
import org.dockgate.platform.DataDirectory;
import org.dockgate.platform.Role;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.mock.web.MockMultipartFile;
import org.springframework.test.web.servlet.MockMvc;

/**
 * A register entry changed behind the application's back (a DBA switching the append-only trigger off)
 * while the signed PDF stays untouched: verification must answer from the signature, name the field the
 * register contradicts and say not valid, in the service, the API and the public page. Every altered row is
 * restored, so a shared PostgreSQL database is left as it was.
 */
@SpringBootTest
@AutoConfigureMockMvc
class RegisterTamperVerificationTest {

    private static final String TABLE = "issued_certificate";
    private static final String TRIGGER = "issued_certificate_append_only";

    @Autowired MockMvc mvc;
    @Autowired AccountService accounts;
    @Autowired SigningIdentityService identities;
    @Autowired CertificatePdfWriter writer;
    @Autowired CertificateRegister register;
    @Autowired CertificateVerifier verifier;
    @Autowired DataDirectory data;
    @Autowired DataSource dataSource;

    DatabaseAdmin admin;
    IssuedCertificate issued;
    byte[] pdf;

    @BeforeEach
    void setUp() {
        admin = new DatabaseAdmin(dataSource);
        String signer = SigningFixtures.newSigner(accounts, identities, Role.ENGINEER);
        issued = SigningFixtures.as(signer, () -> register.issue(SigningFixtures.subject("SN-TAMPER-" + signer),
                signer, "approved for release", h -> SigningFixtures.render(writer, h, 0)));
        pdf = register.pdf(issued.certificateNumber()).orElseThrow();
        VerificationResult before = verifier.verify(pdf);
        assertThat(before.valid()).as(String.join("; ", before.reasons())).isTrue();
        assertThat(before.disagreements()).isEmpty();
    }

    /** Sets one column of this test's register row with the trigger off, runs the checks, restores the row. */
    private void withRegisterColumn(String column, Object value, Runnable checks) {
        Object original = admin.jdbc().queryForObject("select " + column + " from " + TABLE
                + " where certificate_number = ?", Object.class, issued.certificateNumber());
        admin.bypassing(TABLE, TRIGGER, () -> assertThat(admin.jdbc().update("update " + TABLE + " set " + column
                + " = ? where certificate_number = ?", value, issued.certificateNumber())).isEqualTo(1));
        try {
            checks.run();
        } finally {
            admin.bypassing(TABLE, TRIGGER, () -> admin.jdbc().update("update " + TABLE + " set " + column
                    + " = ? where certificate_number = ?", original, issued.certificateNumber()));
        }
        assertThat(verifier.verify(pdf).valid()).as("valid again once the row is restored").isTrue();
    }

    private static MockMultipartFile file(byte[] bytes) {
        return new MockMultipartFile("file", "certificate.pdf", "application/pdf", bytes);
    }

    @Test
    void aSignerNameChangedInTheDatabaseIsNamedAndTheSignatureSaysWhoSigned() throws Exception {
        String signedBy = issued.signerName();
        // What the signing certificate itself says, read by PDFBox + BouncyCastle rather than by our verifier.
        String subject = IndependentSignatureCheck.check(pdf, SigningFixtures.labRoot(data)).signerSubject();
        assertThat(subject).contains("CN=" + signedBy);

        withRegisterColumn("signer_name", "Someone Else", () -> {
            assertThat(register.find(issued.certificateNumber()).orElseThrow().signerName()).isEqualTo("Someone Else");

            VerificationResult result = verifier.verify(pdf);
            assertThat(result.valid()).isFalse();
            assertThat(result.signer()).isEqualTo(signedBy);
            assertThat(result.certificateNumber()).isEqualTo(issued.certificateNumber());
            assertThat(result.disagreements()).singleElement().satisfies(d -> {
                assertThat(d.field()).isEqualTo("signer");
                assertThat(d.document()).isEqualTo(signedBy);
                assertThat(d.register()).isEqualTo("Someone Else");
            });
            assertThat(result.reasons()).anyMatch(r -> r.contains("disagrees with the document about the signer")
                    && r.contains(signedBy) && r.contains("Someone Else"));
            // Everything about the signature itself still holds: only the register is wrong.
            assertThat(result.checks()).anyMatch(c -> c.name().equals("Integrity") && c.passed());

            try {
                mvc.perform(multipart("/api/v1/certificates/verify").file(file(pdf))
                                .with(httpBasic("auditor", "auditor-demo")))
                        .andExpect(status().isOk())
                        .andExpect(jsonPath("$.valid").value(false))
                        .andExpect(jsonPath("$.signer").value(signedBy))
                        .andExpect(jsonPath("$.disagreements[0].field").value("signer"))
                        .andExpect(jsonPath("$.disagreements[0].document").value(signedBy))
                        .andExpect(jsonPath("$.disagreements[0].register").value("Someone Else"))
                        .andExpect(jsonPath("$.reasons", hasItem(containsString("about the signer"))));
                mvc.perform(multipart("/verify").file(file(pdf)).with(csrf()))
                        .andExpect(status().isOk())
                        .andExpect(content().string(containsString("Not valid.")))
                        .andExpect(content().string(not(containsString("Valid: a genuine"))))
                        .andExpect(content().string(containsString("Signed by " + signedBy + " at")))
                        .andExpect(content().string(not(containsString("Signed by Someone Else"))))
                        .andExpect(content().string(containsString("id=\"register-disagreements\"")))
                        .andExpect(content().string(containsString("data-field=\"signer\"")))
                        .andExpect(content().string(containsString("the register says &quot;Someone Else&quot;")));
                // The QR code's page checks the register's stored copy against the entry in the same way.
                mvc.perform(get("/verify/{n}", issued.certificateNumber()))
                        .andExpect(status().isOk())
                        .andExpect(content().string(not(containsString("Issued and current"))))
                        .andExpect(content().string(containsString("id=\"register-disagreements\"")))
                        .andExpect(content().string(containsString("data-field=\"signer\"")))
                        .andExpect(content().string(containsString("<dd>" + signedBy + "</dd>")))
                        .andExpect(content().string(containsString("the register says &quot;Someone Else&quot;")));
            } catch (Exception e) {
                throw new AssertionError(e);
            }
        });
    }

    static Stream<Arguments> alteredColumns() {
        return Stream.of(
                Arguments.of("meaning", "rejected", "meaning"),
                Arguments.of("signed_at", Instant.parse("2001-02-03T04:05:06Z").atOffset(ZoneOffset.UTC), "signedAt"),
                Arguments.of("pdf_size", 1234L, "size"),
                Arguments.of("signer_certificate_sha256", "00".repeat(32), "signerCertificate"),
                // The recorded hash no longer matches, though the stored copy is still this very file.
                Arguments.of("pdf_sha256", "ab".repeat(32), "sha256"),
                // The stored copy swapped for other bytes; the recorded hash is still this file's.
                Arguments.of("pdf", "%PDF-1.4 not the certificate".getBytes(), "storedCopy"));
    }

    @ParameterizedTest(name = "{0} altered in the register")
    @MethodSource("alteredColumns")
    void anyRegisterFieldThatContradictsTheDocumentIsNamedAndMakesItNotValid(String column, Object value,
                                                                             String field) {
        withRegisterColumn(column, value, () -> {
            VerificationResult result = verifier.verify(pdf);
            assertThat(result.valid()).isFalse();
            assertThat(result.signer()).isEqualTo(issued.signerName());
            assertThat(result.certificateNumber()).isEqualTo(issued.certificateNumber());
            assertThat(result.disagreements()).extracting(VerificationResult.Disagreement::field).containsExactly(field);
            assertThat(result.reasons()).anyMatch(r -> r.contains("The register disagrees with the document about the "
                    + result.disagreements().get(0).label()));
            assertThat(result.checks()).anyMatch(c -> c.name().equals("Integrity") && c.passed());
        });
    }
}
