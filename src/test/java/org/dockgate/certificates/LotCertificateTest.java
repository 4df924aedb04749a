package org.dockgate.certificates;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.security.cert.X509Certificate;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.dockgate.accounts.AccountService;
import org.dockgate.accounts.Person;
import org.dockgate.bench.BenchService;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.evaluation.MetricResult;
import org.dockgate.core.report.MetricWording;
import org.dockgate.core.report.ResultFormat;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.evaluation.LotEvaluationView;
import org.dockgate.evaluation.UnitEvaluationView;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.platform.DataDirectory;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.dao.DataAccessException;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * The lot certificate of conformance end to end: made from a lot dispositioned through the real services,
 * read back with PDFBox (not the OpenPDF code that wrote it) and checked against what ISO/IEC 17025:2017
 * 7.8.2 (common requirements for reports) and 7.8.6 (statements of conformity) ask, as issue 6 lists it;
 * the signature checked independently (PDFBox + BouncyCastle, poppler's pdfsig); separation of duties,
 * re-authentication and immutability. Every lot here is new (unique serials), so a shared database is fine.
 */
@SpringBootTest
class LotCertificateTest {

    static final String ENGINEER2_PASSWORD = "engineer2-demo"; // seed-data/accounts.csv

    @Autowired LotCertificateService certificates;
    @Autowired CertificateRegister register;
    @Autowired CertificateVerifier verifier;
    @Autowired EvaluationService evaluation;
    @Autowired ReceivingService receiving;
    @Autowired CatalogueService catalogue;
    @Autowired BenchService bench;
    @Autowired InstrumentService instruments;
    @Autowired AccountService accounts;
    @Autowired DataDirectory data;
    @Autowired JdbcTemplate jdbc;

    LotView acceptedLot(String recorder) {
        return LotFixtures.acceptedLot(receiving, catalogue, bench, evaluation, recorder);
    }

    IssuedCertificate signAs(String user, String password, long lotId) {
        return LotFixtures.as(user, () -> certificates.approveAndSign(lotId, password));
    }

    @Test
    void theCertificateTextHasEveryItemIso17025AsksOfAReport() throws Exception {
        LotView lot = acceptedLot("operator");
        IssuedCertificate issued = signAs("engineer2", ENGINEER2_PASSWORD, lot.id());
        byte[] pdf = register.pdf(issued.certificateNumber()).orElseThrow();
        String text = flat(IndependentSignatureCheck.textWithFields(pdf));
        LotEvaluationView ev = evaluation.lotEvaluation(lot.id());

        // ISO/IEC 17025:2017 7.8.2.1 a) a title; b) the name and address of the laboratory.
        assertThat(text).contains("Certificate of conformance")
                .contains("Northbank Sensor Receiving Laboratory")
                .contains("Unit 4, Quayside Works, Harbour Road, Northbank");
        // 7.8.2.1 c) unique identification of the report on every page.
        assertThat(issued.certificateNumber()).matches("DG-\\d{4}-\\d{6}");
        assertThat(text).contains("Certificate No. " + issued.certificateNumber() + ", revision 1");
        // 7.8.2.1 d) the customer's side: supplier, purchase order, delivery note; e) the item, the date of receipt.
        var receipt = receiving.receipt(lot.receiptId()).orElseThrow();
        var supplier = catalogue.supplier(lot.supplierId()).orElseThrow();
        assertThat(text).contains(supplier.name()).contains(receipt.purchaseOrder()).contains(receipt.deliveryNote())
                .contains("Received " + receipt.receivedOn());
        // 7.8.2.1 e), f): the item (sensor model, specification revision) and the method (procedure revision).
        var model = catalogue.model(lot.modelId()).orElseThrow();
        assertThat(text).contains(model.partNumber()).contains(model.name())
                .contains(flat(catalogue.revision(lot.specificationRevisionId()).orElseThrow().label()))
                .contains(flat(ev.procedure().label()));
        // 7.8.2.1 g) the sampling plan: lot size, ISO 2859-1 code letter, n, Ac/Re, severity, serials tested.
        assertThat(text).contains(lot.quantity() + " units").contains("code letter " + lot.plan().codeLetter())
                .contains("n = 8, Ac = 0, Re = 1") // ISO 2859-1:1999 Table 2-A, E via the arrow at AQL 1.0 (n 13 > lot 8)
                .contains("normal inspection");
        // Table cells wrap where they like, so cell contents are compared with white space removed.
        String compact = compact(text);
        assertThat(compact).contains(compact("Units tested " + String.join(", ", lot.sampledSerials())));
        // 7.8.2.1 m), 7.8.6.1: per unit and metric, the result with its expanded uncertainty U and k, the
        // tolerance, the acceptance limits and the verdict.
        int metrics = 0;
        var spec = catalogue.revision(lot.specificationRevisionId()).orElseThrow().specification();
        for (UnitEvaluationView unit : ev.units()) {
            assertThat(text).contains("Unit " + unit.serial() + ": PASS");
            for (MetricResult m : unit.result().metrics()) {
                String metric = MetricWording.name(m, spec);
                String row = metric + " " + MetricWording.measured(m) + " " + MetricWording.uncertainty(m) + " "
                        + MetricWording.tolerance(m) + " " + MetricWording.acceptance(m) + " " + m.verdict().name();
                assertThat(compact).as("unit %s metric %s", unit.serial(), metric).contains(compact(row));
                metrics++;
            }
        }
        assertThat(metrics).isGreaterThanOrEqualTo(8);
        // 7.8.6.1 b): the decision rule applied, stated in words.
        assertThat(text).contains("2 Decision rule").contains(flat(ev.procedure().settings().ruleInWords()))
                .contains("coverage factor k");
        // 7.8.2.1 f) (and 6.5 traceability): the reference instruments with certificate numbers and due dates.
        Set<String> used = new LinkedHashSet<>();
        ev.units().forEach(u -> used.addAll(u.instruments()));
        assertThat(used).isNotEmpty();
        for (String identifier : used) {
            var instrument = instruments.find(identifier).orElseThrow();
            assertThat(text).contains(identifier).contains(instrument.current().certificateNumber())
                    .contains(instrument.current().dueOn().toString());
        }
        // 7.8.3.1 a): the environmental conditions (EvaluationServiceTest's 23.1 °C, 45 % RH).
        assertThat(text).contains("conditions 23.1 °C, 45 % RH");
        // 7.8.2.1 i) date of the tests, o) who authorised the report; 7.8.2.1 (who tested, 7.5 records).
        String operatorName = accounts.byUsername("operator").map(Person::displayName).orElseThrow();
        String approverName = accounts.byUsername("engineer2").map(Person::displayName).orElseThrow();
        assertThat(text).contains("Tested by " + operatorName + " on " + LocalDate.now(java.time.ZoneOffset.UTC))
                .contains("Approved by " + approverName)
                .contains("Digitally signed by").contains("Meaning: Approved for release");
        // 7.8.6.1 a): the statement of conformity, the lot decision.
        assertThat(text).contains("Nonconforming units 0 of 8").contains("ACCEPTED (d ≤ Ac)")
                .doesNotContain("Nonconformance report");
        // Issue 6 and common practice: the safety caution.
        assertThat(text).contains(flat(CertificatePdfWriter.SAFETY_CAUTION));
        // 7.8.2.1 c): "Page x of y" on every page, each page carrying its own number.
        assertPageNumbersOnEveryPage(pdf);
    }

    @Test
    void theRejectedDemoLotsCertificateNamesItsNonconformanceReport() throws Exception {
        // seed-data: the LC-500S lot is rejected and signed at load time by the supervisor.
        LotView rejected = receiving.lots(LotState.DISPOSITIONED_REJECTED).stream()
                .filter(l -> l.partNumber().equals("LC-500S"))
                .filter(l -> !certificates.forLot(l.id()).isEmpty()).findFirst().orElseThrow();
        IssuedCertificate issued = certificates.forLot(rejected.id()).get(0);
        assertThat(issued.signerUsername()).isEqualTo("supervisor");
        String ncr = evaluation.nonconformance(rejected.id()).orElseThrow().number();
        String text = flat(IndependentSignatureCheck.textWithFields(register.pdf(issued.certificateNumber()).orElseThrow()));
        // ISO/IEC 17025:2017 7.8.6.1 a) statement of conformity; issue 6: the nonconformance report number.
        assertThat(text).contains("REJECTED (d ≥ Re)").contains("Nonconformance report " + ncr)
                .contains("Meaning: " + issued.meaning()).contains("Meaning: Rejected");
        assertThat(ncr).startsWith("NCR-");
        assertPageNumbersOnEveryPage(register.pdf(issued.certificateNumber()).orElseThrow());
    }

    @Test
    void theSignatureVerifiesIndependentlyAndOneFlippedByteFailsEveryCheck() throws Exception {
        LotView lot = acceptedLot("operator");
        IssuedCertificate issued = signAs("engineer2", ENGINEER2_PASSWORD, lot.id());
        byte[] pdf = register.pdf(issued.certificateNumber()).orElseThrow();
        X509Certificate root = SigningFixtures.labRoot(data);

        // ISO 32000-1 12.8 / ETSI EN 319 142-1 (PAdES B-B): checked with PDFBox + BouncyCastle only.
        IndependentSignatureCheck.Report report = IndependentSignatureCheck.check(pdf, root);
        assertThat(report.problems()).isEmpty();
        assertThat(report.subFilter()).isEqualTo("ETSI.CAdES.detached");
        assertThat(report.byteRange()[0]).isZero();
        assertThat(report.byteRange()[2] + report.byteRange()[3]).isEqualTo(pdf.length);
        assertThat(report.signerSubject()).contains("CN=Tomasz Weber");
        assertThat(issued.pdfSha256()).isEqualTo(X509s.sha256Hex(pdf));
        assertThat(verifier.verify(pdf).valid()).isTrue();

        byte[] tampered = SigningFixtures.flipByteOf(pdf, "Certificate of conformance", report.byteRange());
        assertThat(IndependentSignatureCheck.check(tampered, root).problems())
                .anyMatch(p -> p.contains("message digest does not match"));
        assertThat(verifier.verify(tampered).valid()).isFalse();
    }

    @Test
    void popplerReportsTheLotCertificatesSignatureValidAndTheTamperedCopyNot() throws Exception {
        LotView lot = acceptedLot("operator");
        IssuedCertificate issued = signAs("engineer2", ENGINEER2_PASSWORD, lot.id());
        byte[] pdf = register.pdf(issued.certificateNumber()).orElseThrow();
        // poppler-utils pdfsig: a third implementation, none of Dockgate's or PDFBox's code.
        assertThat(IndependentSignatureCheck.pdfsig(pdf)).contains("Signature is Valid.")
                .contains("Total document signed").contains("ETSI.CAdES.detached").contains("Tomasz Weber");
        int[] range = IndependentSignatureCheck.check(pdf, SigningFixtures.labRoot(data)).byteRange();
        byte[] tampered = SigningFixtures.flipByteOf(pdf, "Certificate of conformance", range);
        assertThat(IndependentSignatureCheck.pdfsig(tampered)).doesNotContain("Signature is Valid.");
    }

    @Test
    void whoeverRecordedReadingsCannotSignTheLotAnotherEngineerCan() {
        // Issue 6 item 3 / ISO/IEC 17025:2017 7.8.1.2 review and authorisation by someone else: separation of duties.
        LotView lot = acceptedLot("engineer");
        assertThat(evaluation.lotEvaluation(lot.id()).units()).allMatch(u -> u.operators().equals(Set.of("engineer")));
        int before = issuedCount();
        assertThatThrownBy(() -> signAs("engineer", "engineer-demo", lot.id()))
                .isInstanceOf(IllegalStateException.class)
                .hasMessageContaining("You recorded readings of this lot").hasMessageContaining("separation of duties");
        assertThat(issuedCount()).isEqualTo(before);
        assertThat(certificates.forLot(lot.id())).isEmpty();

        IssuedCertificate issued = signAs("engineer2", ENGINEER2_PASSWORD, lot.id());
        assertThat(issued.signerUsername()).isEqualTo("engineer2");
        assertThat(issued.lotId()).isEqualTo(lot.id());
        assertThat(issued.meaning()).isEqualTo("Approved for release");
    }

    @Test
    void aWrongPasswordIsRefusedAndNothingIsIssued() {
        // Issue 6 item 3: re-authentication at the moment of signing (21 CFR 11.200(a) style, common practice).
        LotView lot = acceptedLot("operator");
        int before = issuedCount();
        assertThatThrownBy(() -> signAs("engineer2", "not-the-password", lot.id()))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("password is not correct");
        assertThatThrownBy(() -> signAs("engineer2", "", lot.id())).isInstanceOf(IllegalArgumentException.class);
        assertThat(issuedCount()).isEqualTo(before);
        assertThat(certificates.forLot(lot.id())).isEmpty();
    }

    @Test
    void aSignedCertificateNeverChangesACorrectionIsANewRevision() {
        // Issue 6 item 4; ISO/IEC 17025:2017 7.8.8.2/7.8.8.3: an amended report is identified as such and
        // references the one it replaces.
        LotView lot = acceptedLot("operator");
        IssuedCertificate first = signAs("engineer2", ENGINEER2_PASSWORD, lot.id());
        byte[] firstPdf = register.pdf(first.certificateNumber()).orElseThrow();

        int before = issuedCount();
        assertThatThrownBy(() -> signAs("engineer2", ENGINEER2_PASSWORD, lot.id()))
                .isInstanceOf(IllegalStateException.class).hasMessageContaining("already has a current certificate");
        assertThat(issuedCount()).isEqualTo(before);

        assertThatThrownBy(() -> LotFixtures.as("engineer2", () -> certificates.reissue(first.certificateNumber(),
                "Delivery note number corrected", "wrong"))).isInstanceOf(IllegalArgumentException.class);
        IssuedCertificate second = LotFixtures.as("engineer2", () -> certificates.reissue(first.certificateNumber(),
                "Delivery note number corrected", ENGINEER2_PASSWORD));
        assertThat(second.certificateNumber()).isNotEqualTo(first.certificateNumber());
        assertThat(second.revision()).isEqualTo(2);
        assertThat(second.replacesNumber()).isEqualTo(first.certificateNumber());
        assertThat(second.reissueReason()).isEqualTo("Delivery note number corrected");
        assertThat(second.status()).isEqualTo(IssuedCertificate.Status.ISSUED);

        IssuedCertificate old = register.find(first.certificateNumber()).orElseThrow();
        assertThat(old.status()).isEqualTo(IssuedCertificate.Status.SUPERSEDED);
        assertThat(old.supersededBy()).isEqualTo(second.certificateNumber());
        assertThat(old.pdfSha256()).isEqualTo(first.pdfSha256());
        assertThat(register.pdf(first.certificateNumber()).orElseThrow()).isEqualTo(firstPdf);
        assertThat(certificates.forLot(lot.id())).extracting(IssuedCertificate::certificateNumber)
                .containsExactlyInAnyOrder(first.certificateNumber(), second.certificateNumber());
        // The superseded one no longer verifies as current.
        assertThat(verifier.verify(firstPdf).valid()).isFalse();
        assertThat(verifier.verify(register.pdf(second.certificateNumber()).orElseThrow()).valid()).isTrue();

        // V9_3: the database itself refuses to change or remove a register row.
        assertThatThrownBy(() -> jdbc.update("update issued_certificate set meaning = 'changed' where certificate_number = ?",
                first.certificateNumber())).isInstanceOf(DataAccessException.class);
        assertThatThrownBy(() -> jdbc.update("delete from issued_certificate where certificate_number = ?",
                first.certificateNumber())).isInstanceOf(DataAccessException.class);
        assertThat(register.find(first.certificateNumber()).orElseThrow().meaning()).isEqualTo(first.meaning());
    }

    int issuedCount() {
        return jdbc.queryForObject("select count(*) from issued_certificate", Integer.class);
    }

    /** Each page's own text carries "Page i of n" (ISO/IEC 17025:2017 7.8.2.1 c). */
    static void assertPageNumbersOnEveryPage(byte[] pdf) throws IOException {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            int pages = document.getNumberOfPages();
            assertThat(pages).isGreaterThanOrEqualTo(1);
            List<String> missing = new ArrayList<>();
            for (int page = 1; page <= pages; page++) {
                PDFTextStripper stripper = new PDFTextStripper();
                stripper.setStartPage(page);
                stripper.setEndPage(page);
                if (!stripper.getText(document).contains("Page " + page + " of " + pages)) {
                    missing.add("page " + page);
                }
            }
            assertThat(missing).as("pages without 'Page x of %d'", pages).isEmpty();
        }
    }

    /** Text with every run of white space as one space, so that wrapped table cells compare as written. */
    static String flat(String text) {
        return text.replaceAll("\\s+", " ");
    }

    static String compact(String text) {
        return text.replaceAll("\\s+", "");
    }

    @Test
    void resultsAreRoundedToTheirUncertainty() {
        // JCGM 100:2008 7.2.6: U to (at most) two significant digits, the result to the same decimal place.
        // U rounded up (common practice); more cases in core.report.ResultFormatTest.
        assertThat(ResultFormat.uncertainty(0.0015432)).isEqualTo("0.0016");
        assertThat(ResultFormat.value(10.001234, 0.0015432)).isEqualTo("10.0012");
        assertThat(ResultFormat.value(9.3e-16, 0.00018)).isEqualTo("0.00000");
        assertThat(ResultFormat.value(-0.00001, 0.0018)).isEqualTo("0.0000");
        assertThat(ResultFormat.value(123.456, 2.3)).isEqualTo("123.5");
    }
}
