package org.dockgate.certificates;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.security.cert.X509Certificate;
import java.util.List;
import org.dockgate.accounts.AccountService;
import org.dockgate.platform.DataDirectory;
import org.dockgate.platform.Role;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.dao.DataAccessException;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * Signing, checked by code that did not make the signature: PDFBox 3 + BouncyCastle CMS, and poppler's
 * pdfsig; tampering; revocation; the register's append-only tables. Each test makes its own signer, so
 * a shared PostgreSQL database with other rows is fine.
 */
@SpringBootTest
class CertificateSigningTest {

    @Autowired AccountService accounts;
    @Autowired SigningIdentityService identities;
    @Autowired SigningService signing;
    @Autowired CertificatePdfWriter writer;
    @Autowired CertificateRegister register;
    @Autowired CertificateVerifier verifier;
    @Autowired DataDirectory data;
    @Autowired JdbcTemplate jdbc;

    String signer;
    X509Certificate root;

    @BeforeEach
    void setUp() throws Exception {
        signer = SigningFixtures.newSigner(accounts, identities, Role.ENGINEER);
        root = SigningFixtures.labRoot(data);
    }

    @Test
    void aSignedPdfVerifiesIndependentlyWithPdfBoxAndBouncyCastle() throws Exception {
        byte[] unsigned = SigningFixtures.render(writer, CertificateHeading.first("TEST-SIGN-1"), 0);
        SignedDocument signed = signing.sign(unsigned, signer, "approved for release");

        IndependentSignatureCheck.Report report = IndependentSignatureCheck.check(signed.pdf(), root);
        assertThat(report.problems()).isEmpty();
        assertThat(report.subFilter()).isEqualTo("ETSI.CAdES.detached");
        assertThat(report.signerSubject()).contains("CN=Test Signer");
        assertThat(signed.sha256()).isEqualTo(X509s.sha256Hex(signed.pdf()));
        assertThat(signed.signerUsername()).isEqualTo(signer);
    }

    @Test
    void popplerReportsTheSignatureValid() throws Exception {
        SignedDocument signed = signing.sign(SigningFixtures.render(writer, CertificateHeading.first("TEST-POPPLER"), 0),
                signer, "approved for release");
        String output = IndependentSignatureCheck.pdfsig(signed.pdf());
        assertThat(output).contains("Signature is Valid.").contains("Total document signed")
                .contains("ETSI.CAdES.detached").contains("SHA-256");
    }

    @Test
    void theVisibleBlockAndTheCommonPartsAreInTheText() throws Exception {
        byte[] unsigned = SigningFixtures.render(writer, CertificateHeading.first("TEST-TEXT-1"), 50);
        SignedDocument signed = signing.sign(unsigned, signer, "approved for release");
        String text = IndependentSignatureCheck.text(signed.pdf());
        int pages = IndependentSignatureCheck.pages(signed.pdf());
        assertThat(pages).as("the filler runs over more than one page").isGreaterThan(1);
        for (int page = 1; page <= pages; page++) {
            assertThat(text).contains("Page " + page + " of " + pages);
        }
        assertThat(text).contains("Northbank Sensor Receiving Laboratory")
                .contains("Unit 4, Quayside Works, Harbour Road, Northbank")
                .contains("Certificate No. TEST-TEXT-1, revision 1")
                .contains("Northbank Sensor Receiving Laboratory · Certificate TEST-TEXT-1, revision 1")
                .contains("100.02 Ω ± 0.05 Ω")
                .contains(CertificatePdfWriter.SAFETY_CAUTION.substring(0, 60))
                .contains("http://localhost:8080/verify/TEST-TEXT-1");
        // The signature block: printed name, meaning, date and time with its zone.
        String name = identities.activeIdentity(signer).orElseThrow().displayName();
        assertThat(IndependentSignatureCheck.textWithFields(signed.pdf())).contains("Digitally signed by").contains(name).contains("Meaning: approved for release")
                .containsPattern("Date: \\d{4}-\\d{2}-\\d{2} \\d{2}:\\d{2}:\\d{2} UTC \\(UTC\\+00:00\\)");
    }

    @Test
    void theQrCodeScansToTheVerificationPage() throws Exception {
        byte[] signed = signing.sign(SigningFixtures.render(writer, CertificateHeading.first("DG-2026-000777"), 0),
                signer, "approved for release").pdf();
        // Render the page with PDFBox and decode it with ZXing's reader: the code must scan as printed.
        java.awt.image.BufferedImage image;
        try (var document = org.apache.pdfbox.Loader.loadPDF(signed)) {
            image = new org.apache.pdfbox.rendering.PDFRenderer(document).renderImageWithDPI(0, 200);
        }
        int[] pixels = image.getRGB(0, 0, image.getWidth(), image.getHeight(), null, 0, image.getWidth());
        var bitmap = new com.google.zxing.BinaryBitmap(new com.google.zxing.common.HybridBinarizer(
                new com.google.zxing.RGBLuminanceSource(image.getWidth(), image.getHeight(), pixels)));
        var decoded = new com.google.zxing.MultiFormatReader().decode(bitmap,
                java.util.Map.of(com.google.zxing.DecodeHintType.POSSIBLE_FORMATS,
                        List.of(com.google.zxing.BarcodeFormat.QR_CODE), com.google.zxing.DecodeHintType.TRY_HARDER, true));
        assertThat(decoded.getText()).isEqualTo("http://localhost:8080/verify/DG-2026-000777");
    }

    @Test
    void oneFlippedByteFailsBothTheIndependentAndTheProjectVerification() throws Exception {
        IssuedCertificate issued = SigningFixtures.as(signer, () -> register.issue(SigningFixtures.subject("SN-FLIP"),
                signer, "approved for release", h -> SigningFixtures.render(writer, h, 0)));
        byte[] good = register.pdf(issued.certificateNumber()).orElseThrow();
        IndependentSignatureCheck.Report before = IndependentSignatureCheck.check(good, root);
        assertThat(before.valid()).isTrue();
        assertThat(verifier.verify(good).valid()).isTrue();

        byte[] tampered = SigningFixtures.flipByteOf(good, "Certificate of conformance", before.byteRange());
        assertThat(IndependentSignatureCheck.check(tampered, root).problems())
                .anyMatch(p -> p.contains("message digest does not match"));
        VerificationResult result = verifier.verify(tampered);
        assertThat(result.valid()).isFalse();
        assertThat(result.reasons()).anyMatch(r -> r.contains("changed after it was signed"))
                .anyMatch(r -> r.contains("SHA-256"));
        String poppler = IndependentSignatureCheck.pdfsig(tampered);
        assertThat(poppler).doesNotContain("Signature is Valid.");
    }

    @Test
    void contentAppendedAfterSigningIsNotCovered() throws Exception {
        IssuedCertificate issued = SigningFixtures.as(signer, () -> register.issue(SigningFixtures.subject("SN-APPEND"),
                signer, "approved for release", h -> SigningFixtures.render(writer, h, 0)));
        byte[] good = register.pdf(issued.certificateNumber()).orElseThrow();
        byte[] longer = java.util.Arrays.copyOf(good, good.length + 12);
        System.arraycopy("\n% appended".getBytes(), 0, longer, good.length, 11);
        VerificationResult result = verifier.verify(longer);
        assertThat(result.valid()).isFalse();
        assertThat(result.reasons()).anyMatch(r -> r.contains("does not cover the whole document"));
        assertThat(IndependentSignatureCheck.check(longer, root).problems())
                .anyMatch(p -> p.contains("does not reach both ends"));
    }

    @Test
    void revocationStopsNewSignaturesButOldOnesStillVerify() throws Exception {
        IssuedCertificate issued = SigningFixtures.as(signer, () -> register.issue(SigningFixtures.subject("SN-REVOKE"),
                signer, "approved for release", h -> SigningFixtures.render(writer, h, 0)));
        byte[] old = register.pdf(issued.certificateNumber()).orElseThrow();
        SigningIdentity identity = identities.activeIdentity(signer).orElseThrow();

        SigningIdentity revoked = identities.revoke(identity.id(), identity.version(), "left the lab", "admin");
        assertThat(revoked.revokedAt()).isNotNull();
        assertThat(revoked.active()).isFalse();

        assertThatThrownBy(() -> signing.sign(SigningFixtures.render(writer, CertificateHeading.first("TEST-AFTER"), 0),
                signer, "approved for release")).isInstanceOf(IllegalStateException.class)
                .hasMessageContaining("no signing rights");
        VerificationResult result = verifier.verify(old);
        assertThat(result.valid()).as(String.join("; ", result.reasons())).isTrue();
        assertThat(result.checks()).anyMatch(c -> c.name().equals("Signing rights") && c.passed()
                && c.detail().contains("before the signer's signing rights were revoked"));
        assertThat(IndependentSignatureCheck.check(old, root).valid()).isTrue();
        // A stale version is refused.
        assertThatThrownBy(() -> identities.revoke(identity.id(), identity.version(), "again", "admin"))
                .isInstanceOf(org.springframework.dao.OptimisticLockingFailureException.class);
    }

    @Test
    void theRegisterRefusesUpdatesAndDeletesAtDatabaseLevel() {
        IssuedCertificate first = SigningFixtures.as(signer, () -> register.issue(SigningFixtures.subject("SN-IMMUT"),
                signer, "approved for release", h -> SigningFixtures.render(writer, h, 0)));
        IssuedCertificate second = SigningFixtures.as(signer, () -> register.reissue(first.certificateNumber(),
                "typing error in the supplier name", SigningFixtures.subject("SN-IMMUT"), signer,
                "approved for release", h -> SigningFixtures.render(writer, h, 0)));
        String number = first.certificateNumber();
        List<String> refused = List.of(
                "update issued_certificate set meaning = 'changed' where certificate_number = '" + number + "'",
                "delete from issued_certificate where certificate_number = '" + second.certificateNumber() + "'",
                "update issued_certificate_serial set serial = 'X' where certificate_number = '" + number + "'",
                "delete from issued_certificate_serial where certificate_number = '" + number + "'",
                "update certificate_supersession set reason = 'other' where superseded_number = '" + number + "'",
                "delete from certificate_supersession where superseded_number = '" + number + "'");
        for (String sql : refused) {
            assertThatThrownBy(() -> jdbc.update(sql)).as(sql).isInstanceOf(DataAccessException.class)
                    .hasMessageContaining("append-only");
        }
        assertThat(register.find(number).orElseThrow().meaning()).isEqualTo("approved for release");
        assertThat(register.find(number).orElseThrow().superseded()).isTrue();
    }

    @Test
    void aReissueSupersedesTheOldCertificateWhichThenFailsVerification() {
        IssuedCertificate first = SigningFixtures.as(signer, () -> register.issue(SigningFixtures.subject("SN-REISSUE"),
                signer, "approved for release", h -> SigningFixtures.render(writer, h, 0)));
        IssuedCertificate second = SigningFixtures.as(signer, () -> register.reissue(first.certificateNumber(),
                "wrong delivery note number", SigningFixtures.subject("SN-REISSUE"), signer, "approved for release",
                h -> SigningFixtures.render(writer, h, 0)));
        assertThat(second.revision()).isEqualTo(first.revision() + 1);
        assertThat(second.replacesNumber()).isEqualTo(first.certificateNumber());
        assertThat(second.reissueReason()).isEqualTo("wrong delivery note number");
        IssuedCertificate old = register.find(first.certificateNumber()).orElseThrow();
        assertThat(old.status()).isEqualTo(IssuedCertificate.Status.SUPERSEDED);
        assertThat(old.supersededBy()).isEqualTo(second.certificateNumber());

        VerificationResult oldResult = verifier.verify(register.pdf(first.certificateNumber()).orElseThrow());
        assertThat(oldResult.valid()).isFalse();
        assertThat(oldResult.superseded()).isTrue();
        assertThat(oldResult.reasons()).anyMatch(r -> r.contains("superseded by " + second.certificateNumber()));
        assertThat(verifier.verify(register.pdf(second.certificateNumber()).orElseThrow()).valid()).isTrue();
        assertThatThrownBy(() -> SigningFixtures.as(signer, () -> register.reissue(first.certificateNumber(), "again",
                SigningFixtures.subject("SN-REISSUE"), signer, "approved for release",
                h -> SigningFixtures.render(writer, h, 0)))).isInstanceOf(IllegalStateException.class)
                .hasMessageContaining("already superseded");
    }

    @Test
    void searchFindsByNumberLotSupplierSerialAndDate() {
        // A serial of this test's own (the shared PostgreSQL database keeps earlier runs' certificates).
        String serial = "SN-SEARCH-" + signer;
        IssuedCertificate issued = SigningFixtures.as(signer, () -> register.issue(SigningFixtures.subject(serial),
                signer, "approved for release", h -> SigningFixtures.render(writer, h, 0)));
        var today = issued.signedAt().atOffset(java.time.ZoneOffset.UTC).toLocalDate();
        assertThat(register.search(new CertificateQuery(issued.certificateNumber(), null, null, null, null, null, null)))
                .extracting(IssuedCertificate::certificateNumber).containsExactly(issued.certificateNumber());
        assertThat(register.search(new CertificateQuery(null, ("lot-test-" + serial).toLowerCase(), null, null, null,
                null, null))).extracting(IssuedCertificate::certificateNumber).containsExactly(issued.certificateNumber());
        assertThat(register.search(new CertificateQuery(null, null, null, (serial + "-b").toLowerCase(), today, today,
                null))).extracting(IssuedCertificate::certificateNumber).containsExactly(issued.certificateNumber());
        assertThat(register.search(new CertificateQuery(null, null, "invented sensors", serial, null, null, null)))
                .hasSize(1);
        assertThat(register.search(new CertificateQuery(issued.certificateNumber(), null, null, null,
                today.plusDays(1), null, null))).isEmpty();
        assertThat(register.search(new CertificateQuery(null, null, null, "50%_off", null, null, null))).isEmpty();
        assertThat(issued.certificateNumber()).matches("DG-\\d{4}-\\d{6}");
        assertThat(issued.serials()).containsExactly(serial, serial + "-B");
    }

    @Test
    void onlyTheSignedInPersonSignsACertificate() {
        assertThatThrownBy(() -> register.issue(SigningFixtures.subject("SN-NOBODY"), signer, "approved for release",
                h -> SigningFixtures.render(writer, h, 0))).isInstanceOf(IllegalStateException.class)
                .hasMessageContaining("signed by the person who is signed in");
        assertThatThrownBy(() -> SigningFixtures.as("someone-else", () -> register.issue(
                SigningFixtures.subject("SN-OTHER"), signer, "approved for release",
                h -> SigningFixtures.render(writer, h, 0)))).isInstanceOf(IllegalStateException.class);
    }

    @Test
    void aPdfWithoutTheNumberIsRefusedAndNothingIsRegistered() {
        long before = jdbc.queryForObject("select count(*) from issued_certificate", Long.class);
        assertThatThrownBy(() -> SigningFixtures.as(signer, () -> register.issue(SigningFixtures.subject("SN-NONUM"),
                signer, "approved for release", h -> SigningFixtures.render(writer,
                        CertificateHeading.first("OTHER-NUMBER"), 0))))
                .isInstanceOf(IllegalStateException.class).hasMessageContaining("does not carry the certificate number");
        assertThat(jdbc.queryForObject("select count(*) from issued_certificate", Long.class)).isEqualTo(before);
    }
}
