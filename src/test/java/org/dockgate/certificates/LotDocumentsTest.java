package org.dockgate.certificates;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.UUID;
import java.util.regex.Pattern;
import org.dockgate.accounts.AccountService;
import org.dockgate.accounts.Person;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.ExpectedReading;
import org.dockgate.bench.NewReading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.evaluation.MetricResult;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.report.MetricWording;
import org.dockgate.core.report.ResultFormat;
import org.dockgate.core.series.Direction;
import org.dockgate.evaluation.DispositionAction;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.evaluation.LotEvaluationView;
import org.dockgate.evaluation.UnitEvaluationView;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.NewLot;
import org.dockgate.receiving.NewReceipt;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.test.web.servlet.MockMvc;

/**
 * Issue 12 items 1–4 and 7 on real lots (real services, real H2, PDFs read back with PDFBox): the document
 * by outcome (accepted, released under concession, rejected), the ISO/IEC 17025:2017 7.8.2.1 items c, e, l
 * and n, the full serial list with the seed, the rounding, the conformity wording, the register search by
 * an unsampled serial, and the lot pages' buttons. Every lot is new (unique serials).
 */
@SpringBootTest
@AutoConfigureMockMvc
class LotDocumentsTest {

    static final String ENGINEER2_PASSWORD = "engineer2-demo"; // seed-data/accounts.csv
    /** The word a rejected lot's document must never use (a whole word: "Nonconformance" is a different word). */
    static final Pattern CONFORMANCE = Pattern.compile("(?i)\\bconformance\\b");

    @Autowired LotCertificateService certificates;
    @Autowired LotCertificateRenderer renderer;
    @Autowired CertificateRegister register;
    @Autowired EvaluationService evaluation;
    @Autowired ReceivingService receiving;
    @Autowired CatalogueService catalogue;
    @Autowired BenchService bench;
    @Autowired AccountService accounts;
    @Autowired MockMvc mvc;

    /**
     * A QP-250 lot of 20 from QSL: ISO 2859-1:1999 Table 1, lot 16–25 at level II → C; Table 2-A at AQL 1.0
     * follows the arrow to E: n = 13, Ac 0, Re 1, so 7 units stay unsampled. {@code faulty} sampled units
     * read 10.5 mV/bar instead of 10 (sensitivity tolerance ±1 %, seed-data/sensor-models.json).
     */
    LotView measuredLot(int faulty) {
        var model = catalogue.modelByPartNumber("QP-250").orElseThrow();
        var supplier = catalogue.supplierByCode("QSL").orElseThrow();
        String tag = UUID.randomUUID().toString().substring(0, 6);
        List<String> serials = new ArrayList<>();
        for (int i = 1; i <= 20; i++) {
            serials.add("D" + tag + "-" + i);
        }
        var receipt = LotFixtures.as("operator", () -> receiving.receive(new NewReceipt("PO-D-" + tag, "DN-D-" + tag,
                LocalDate.now(), supplier.id(), List.of(new NewLot(model.id(), 20, serials)), "token-d-" + tag)));
        LotView lot = receiving.lots(LotState.AWAITING_MEASUREMENT).stream().filter(l -> l.receiptId() == receipt.id())
                .findFirst().orElseThrow();
        var plan = bench.planFor(bench.lot(lot.id()).orElseThrow());
        int index = 0;
        for (String serial : lot.sampledSerials()) {
            double sensitivity = index++ < faulty ? 10.5 : 10.0;
            List<NewReading> readings = new ArrayList<>();
            for (ExpectedReading slot : plan.keyed()) {
                double cycleScatter = 0.0002 * slot.cycle().orElse(1);
                double value = Math.round((sensitivity * slot.point() + cycleScatter) * 10000) / 10000.0;
                readings.add(new NewReading(serial, ReadingTest.STATIC, slot.point(), slot.direction().orElse(Direction.UP),
                        slot.cycle().orElse(1), value, "mV", plan.suggestedInstrument(), null));
            }
            LotFixtures.as("operator", () -> {
                bench.recordConditions(lot.id(), serial, 23.1, 45.0);
                return bench.recordMany(lot.id(), readings);
            });
        }
        return receiving.lot(lot.id()).orElseThrow();
    }

    LotView accepted() {
        LotView lot = measuredLot(0);
        LotFixtures.as("engineer", () -> evaluation.disposition(lot.id(), null, "", false, null, lot.version()));
        return receiving.lot(lot.id()).orElseThrow();
    }

    LotView rejected(DispositionAction action) {
        LotView lot = measuredLot(1);
        LotFixtures.as("engineer", () -> evaluation.disposition(lot.id(), action, "Sensitivity out of tolerance",
                false, null, lot.version()));
        if (action == DispositionAction.USE_AS_IS_CONCESSION) {
            LotFixtures.as("supervisor", () -> evaluation.approveConcession(lot.id(),
                    "Used only in the test rig where 5 % sensitivity is calibrated out"));
        }
        return receiving.lot(lot.id()).orElseThrow();
    }

    String signedText(LotView lot) throws Exception {
        IssuedCertificate issued = LotFixtures.as("engineer2", () -> certificates.approveAndSign(lot.id(), ENGINEER2_PASSWORD));
        return LotCertificateTest.flat(IndependentSignatureCheck.textWithFields(register.pdf(issued.certificateNumber()).orElseThrow()));
    }

    /** ISO/IEC 17025:2017 7.8.2.1 c), e), l), n), the full serial list, the seed and the sampling statement. */
    void assertCommonItems(String text, LotView lot) {
        // 7.8.2.1 c) where the tests were performed (application.properties dockgate.lab.*, seed-data/lab.json).
        assertThat(text).contains("Tests performed at Northbank Sensor Receiving Laboratory, Unit 4, Quayside Works, Harbour Road, Northbank");
        // 7.8.2.1 e) who the work was for: the receiving organisation (dockgate.lab.receiving-organisation).
        assertThat(text).contains("Performed for Northbank Motion Systems, goods-in and production planning");
        // 7.8.2.1 l) the results relate only to the items tested; ISO 2859-1: sampling does not certify each unit.
        assertThat(text).contains("The results in section 5 relate only to the units tested.")
                .contains("does not certify each of the 7 unsampled units");
        // 7.8.2.1 n) deviations from the procedure, said even when there are none.
        assertThat(text).contains("6 Deviations from the procedure None recorded.");
        // The full serial list, sampled units marked, and the seed that re-draws the sample.
        String compact = LotCertificateTest.compact(text);
        assertThat(compact).contains(LotCertificateTest.compact("Serials in the lot " + LotCertificateRenderer.serialList(lot)));
        for (String serial : lot.serials()) {
            assertThat(compact).contains(LotCertificateTest.compact(lot.sampled(serial) ? serial + " (sampled)" : serial));
        }
        assertThat(lot.serials()).hasSize(20);
        assertThat(lot.sampledSerials()).hasSize(13);
        assertThat(text).contains("seed " + lot.sampleSeed()).contains("n = 13, Ac = 0, Re = 1");
        // Issue 12 item 7: no recalled-source marks in what users read.
        assertThat(text).doesNotContainIgnoringCase("from memory");
    }

    @Test
    void anAcceptedLotGetsACertificateOfConformanceWithEveryItemAndTheRounding() throws Exception {
        LotView lot = accepted();
        String text = signedText(lot);
        assertThat(text).contains("Certificate of conformance").contains("ACCEPTED (d ≤ Ac)")
                .contains("The lot conforms to the specification revision");
        assertCommonItems(text, lot);
        // JCGM 100:2008 7.2.6, issue 12: the sensitivity with its trailing zeros and U with its unit.
        LotEvaluationView ev = evaluation.lotEvaluation(lot.id());
        MetricResult sensitivity = ev.units().get(0).result().metrics().stream()
                .filter(m -> m.metric() == Metric.SENSITIVITY).findFirst().orElseThrow();
        String measured = ResultFormat.value(sensitivity.measured(), sensitivity.uncertainty().value());
        assertThat(measured).matches("10\\.0+|9\\.9+\\d*"); // 10 mV/bar nominal, to U's decimal place
        assertThat(measured.length()).isGreaterThan("10.0".length() - 1);
        String compact = LotCertificateTest.compact(text);
        assertThat(compact).contains(LotCertificateTest.compact("sensitivity " + measured + " mV/bar "
                + ResultFormat.uncertainty(sensitivity.uncertainty().value()) + " mV/bar (k = "));
        // One-sided limits read "≤ 0.25 %FSO" and the reference line is named (seed-data: nonlinearityBestFit 0.25).
        assertThat(compact).contains(LotCertificateTest.compact("nonlinearity (best-fit straight line)"))
                .contains(LotCertificateTest.compact("≤ 0.25 %FSO"))
                .doesNotContain("−∞").doesNotContain("+∞");
        // Accuracy is judged point by point: the deciding point is named.
        assertThat(text).containsPattern("accuracy\\s+at\\s+\\d+(\\.\\d+)?\\s+bar,\\s+(up|down),\\s+cycle\\s+\\d");
    }

    @Test
    void aLotReleasedUnderConcessionSaysSoAndCitesTheConcession() throws Exception {
        LotView lot = rejected(DispositionAction.USE_AS_IS_CONCESSION);
        String ncr = evaluation.nonconformance(lot.id()).orElseThrow().number();
        String supervisor = accounts.byUsername("supervisor").map(Person::displayName).orElseThrow();
        String text = signedText(lot);
        assertThat(text).contains("Certificate of release under concession")
                .doesNotContain("Certificate of conformance")
                .contains("released for use as is under concession")
                .contains("Nonconformance report " + ncr)
                .contains("Concession approved by " + supervisor)
                .contains("Used only in the test rig where 5 % sensitivity is calibrated out")
                .contains("Disposition use as is concession");
        assertCommonItems(text, lot);
    }

    @Test
    void aRejectedLotGetsAnInspectionReportOfTheNonconformityNeverAConformanceCertificate() throws Exception {
        LotView lot = rejected(DispositionAction.RETURN_TO_SUPPLIER);
        String ncr = evaluation.nonconformance(lot.id()).orElseThrow().number();
        String failing = lot.sampledSerials().get(0);
        String text = signedText(lot);
        assertThat(text).contains("Inspection report").contains("REJECTED (d ≥ Re)")
                .contains("Nonconformity: the lot does not meet the specification revision")
                .contains("Nonconformance report " + ncr)
                .contains("Disposition return to supplier")
                .containsPattern("Failing units and metrics " + Pattern.quote(failing) + ": [^;]*sensitivity [0-9.]+ mV/bar FAIL");
        assertThat(CONFORMANCE.matcher(text).find()).as("the word 'conformance' in a rejected lot's report").isFalse();
        assertCommonItems(text, lot);
    }

    @Test
    void theRegisterFindsTheCertificateByAnUnsampledSerial() throws Exception {
        LotView lot = accepted();
        IssuedCertificate issued = LotFixtures.as("engineer2", () -> certificates.approveAndSign(lot.id(), ENGINEER2_PASSWORD));
        String unsampled = lot.serials().stream().filter(s -> !lot.sampled(s)).findFirst().orElseThrow();
        assertThat(register.search(new CertificateQuery(null, null, null, unsampled, null, null, null)))
                .extracting(IssuedCertificate::certificateNumber).containsExactly(issued.certificateNumber());
        assertThat(issued.serials()).containsExactlyInAnyOrderElementsOf(lot.serials());
        // The register page too.
        mvc.perform(get("/certificates").param("serial", unsampled).with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk())
                .andExpect(org.springframework.test.web.servlet.result.MockMvcResultMatchers.content()
                        .string(org.hamcrest.Matchers.containsString(issued.certificateNumber())))
                // Times in the lab's zone (application.properties: UTC) to the second, never an ISO instant.
                .andExpect(org.springframework.test.web.servlet.result.MockMvcResultMatchers.content()
                        .string(org.hamcrest.Matchers.containsString(ResultFormat.dateTime(issued.signedAt(), java.time.ZoneId.of("UTC")))));
    }

    @Test
    void anEmptyAcceptanceZoneIsSaidInWordsOnTheDocument() throws Exception {
        // A guard band at least as wide as the tolerance leaves no acceptance zone; the rule then gives no
        // limits (AcceptanceLimits.empty). The lot's real result with its zone emptied that way, rendered by
        // the real renderer, must say so rather than print an unbounded range.
        LotView lot = accepted();
        LotEvaluationView ev = evaluation.lotEvaluation(lot.id());
        List<UnitEvaluationView> units = new ArrayList<>();
        for (UnitEvaluationView u : ev.units()) {
            List<MetricResult> metrics = u.result().metrics().stream().map(m -> m.metric() != Metric.NONLINEARITY ? m
                    : new MetricResult(m.metric(), m.unit(), m.measured(), m.uncertainty(), m.budget(), m.tolerance(),
                    OptionalDouble.empty(), OptionalDouble.empty(), m.verdict(), m.probabilityOfConformance(), m.note(),
                    m.testUncertaintyRatio(), m.points())).toList();
            units.add(new UnitEvaluationView(u.serial(), new org.dockgate.core.evaluation.UnitResult(metrics,
                    u.result().unitVerdict(), u.result().complete(), u.result().missing()), u.readings(), u.operators(),
                    u.instruments(), u.ambientC(), u.humidityPercent(), u.staticPoints(), u.sweepPoints(),
                    u.calibrations(), u.frozen(), u.conditionsDeviation()));
        }
        LotEvaluationView emptied = new LotEvaluationView(ev.lot(), ev.procedure(), units, ev.complete(), ev.nonconforming(),
                ev.wouldAccept(), ev.nonconformance());
        byte[] pdf = renderer.render(CertificateHeading.first("DG-TEST-EMPTY-" + lot.id()), emptied, "engineer2");
        String compact = LotCertificateTest.compact(IndependentSignatureCheck.text(pdf));
        assertThat(compact).contains(LotCertificateTest.compact("≤ 0.25 %FSO " + ResultFormat.EMPTY_ZONE))
                .doesNotContain("−∞").doesNotContain("+∞");
    }

    @Test
    void theLotPagesNameTheDocumentByOutcome() throws Exception {
        LotView accepted = accepted();
        LotView rejected = rejected(DispositionAction.SCRAP);
        var engineer2 = user("engineer2").roles("ENGINEER");
        String acceptedPage = page("/evaluation/lots/" + accepted.id(), engineer2);
        assertThat(acceptedPage).contains("Certificate of conformance (approve, sign, download)");
        String rejectedPage = page("/evaluation/lots/" + rejected.id(), engineer2);
        assertThat(rejectedPage).contains("Inspection report of the nonconformity").doesNotContain("Certificate of conformance");
        String signPage = page("/certificates/lots/" + rejected.id(), engineer2);
        assertThat(signPage).contains("Inspection report for lot " + rejected.id()).contains("Sign the inspection report")
                .doesNotContain("Certificate of conformance");
        assertThat(page("/certificates/lots/" + accepted.id(), engineer2)).contains("Sign the certificate of conformance")
                .contains("id=\"localhost-base-url\""); // application.properties keeps the localhost default
        // Issue 12 items 1 and 7: the unit page shows U with its unit, no unbounded ranges and no recalled-source marks.
        String serial = accepted.sampledSerials().get(0);
        String unitPage = page("/evaluation/lots/" + accepted.id() + "/units/" + serial, engineer2);
        assertThat(unitPage).doesNotContainIgnoringCase("from memory").contains("(best-fit straight line)")
                .contains("≤ 0.25 %FSO").doesNotContain("−∞").contains(" mV/bar (k = ");
    }

    private String page(String path, org.springframework.test.web.servlet.request.RequestPostProcessor who) throws Exception {
        return mvc.perform(get(path).with(who)).andExpect(status().isOk()).andReturn().getResponse().getContentAsString();
    }
}
