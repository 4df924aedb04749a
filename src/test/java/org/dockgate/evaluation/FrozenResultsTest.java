package org.dockgate.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.function.Supplier;
import javax.sql.DataSource;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.dockgate.DatabaseAdmin;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.ExpectedReading;
import org.dockgate.bench.NewReading;
import org.dockgate.bench.Reading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.certificates.CertificateRegister;
import org.dockgate.certificates.IssuedCertificate;
import org.dockgate.certificates.LotCertificateService;
import org.dockgate.core.evaluation.MetricResult;
import org.dockgate.core.series.Direction;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.instruments.NewCalibration;
import org.dockgate.instruments.NewInstrument;
import org.dockgate.instruments.UncertaintyMode;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.NewLot;
import org.dockgate.receiving.NewReceipt;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.AuthorityUtils;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.test.web.servlet.MockMvc;

/**
 * The calibration in force and the frozen record, through the real modules: QP-250 lots of 8 (ISO 2859-1:1999
 * Table 1, lot 2–8, level II → A; Table 2-A at AQL 1.0 → E, n 13 ≥ 8: 100 % inspection, Ac 0, Re 1) measured
 * on the nominal 10 mV/bar line with a fresh pressure reference of this test (0–1000 bar, so it never
 * becomes the narrowest qualifying instrument of other tests), first calibrated with U = 0.01 % of reading
 * (k = 2, like the demo's RI-PRS-01) and then recalibrated with U = 1 % of reading, the assessor's case.
 * Every lot and instrument is new, so a shared database is fine; the tampered reading is restored.
 */
@SpringBootTest
@AutoConfigureMockMvc
class FrozenResultsTest {

    static final String ENGINEER2_PASSWORD = "engineer2-demo"; // seed-data/accounts.csv

    @Autowired EvaluationService evaluation;
    @Autowired ReceivingService receiving;
    @Autowired CatalogueService catalogue;
    @Autowired BenchService bench;
    @Autowired InstrumentService instruments;
    @Autowired LotCertificateService certificates;
    @Autowired CertificateRegister register;
    @Autowired DataSource dataSource;
    @Autowired MockMvc mvc;

    static <T> T as(String user, String role, Supplier<T> work) {
        var previous = SecurityContextHolder.getContext().getAuthentication();
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(user, null,
                AuthorityUtils.createAuthorityList("ROLE_" + role)));
        try {
            return work.get();
        } finally {
            SecurityContextHolder.getContext().setAuthentication(previous);
        }
    }

    static String tag() {
        return UUID.randomUUID().toString().substring(0, 6).toUpperCase();
    }

    /** A fresh pressure reference, calibrated 30 days ago with U = 0.01 % of reading, k = 2. */
    String freshInstrument(String certificate) {
        String id = "RI-T" + tag();
        LocalDate today = instruments.today();
        as("admin", "ADMIN", () -> instruments.create(new NewInstrument(id, "Test pressure reference", "pressure", 0, 1000,
                "bar", NewCalibration.uniform(certificate, today.minusDays(30), today.plusDays(300), 0.01,
                        UncertaintyMode.PERCENT_OF_READING, 2.0, 1000))));
        return id;
    }

    /** Records a new calibration dated today (entered now) with U = {@code percent} % of reading, k = 2. */
    void recalibrate(String id, String certificate, double percent) {
        LocalDate today = instruments.today();
        long version = instruments.find(id).orElseThrow().version();
        as("admin", "ADMIN", () -> instruments.recordCalibration(id, NewCalibration.uniform(certificate, today,
                today.plusDays(365), percent, UncertaintyMode.PERCENT_OF_READING, 2.0, 1000), version));
    }

    LotView receiveLot() {
        var model = catalogue.modelByPartNumber("QP-250").orElseThrow();
        var supplier = catalogue.supplierByCode("QSL").orElseThrow();
        String tag = tag();
        List<String> serials = new ArrayList<>();
        for (int i = 1; i <= 8; i++) {
            serials.add("F" + tag + "-" + i);
        }
        var receipt = as("operator", "OPERATOR", () -> receiving.receive(new NewReceipt("PO-F-" + tag, "DN-F-" + tag,
                LocalDate.now(), supplier.id(), List.of(new NewLot(model.id(), 8, serials)), "token-f-" + tag)));
        return receiving.lots(LotState.AWAITING_MEASUREMENT).stream().filter(l -> l.receiptId() == receipt.id())
                .findFirst().orElseThrow();
    }

    void measure(LotView lot, String serial, String instrument) {
        var plan = bench.planFor(bench.lot(lot.id()).orElseThrow());
        List<NewReading> readings = new ArrayList<>();
        for (ExpectedReading slot : plan.keyed()) {
            double cycleScatter = 0.0002 * slot.cycle().orElse(1);
            double value = Math.round((10.0 * slot.point() + cycleScatter) * 10000) / 10000.0;
            readings.add(new NewReading(serial, ReadingTest.STATIC, slot.point(), slot.direction().orElse(Direction.UP),
                    slot.cycle().orElse(1), value, "mV", instrument, null));
        }
        as("operator", "OPERATOR", () -> {
            bench.recordConditions(lot.id(), serial, 23.1, 45.0);
            return bench.recordMany(lot.id(), readings);
        });
    }

    LotView measuredLot(String instrument) {
        LotView lot = receiveLot();
        for (String serial : lot.sampledSerials()) {
            measure(lot, serial, instrument);
        }
        return lot;
    }

    LotEvaluationView disposition(LotView lot) {
        long version = receiving.lot(lot.id()).orElseThrow().version();
        return as("engineer", "ENGINEER", () -> evaluation.disposition(lot.id(), DispositionAction.RETURN_TO_SUPPLIER, "",
                false, null, version));
    }

    Map<String, String> results(LotEvaluationView ev) {
        Map<String, String> out = new LinkedHashMap<>();
        ev.units().forEach(u -> out.put(u.serial(), evaluation.canonical(u.result())));
        return out;
    }

    /** The certificate's text in reading order, one line per text line, without the running header and footer. */
    static List<String> text(byte[] pdf) throws Exception {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            PDFTextStripper stripper = new PDFTextStripper();
            stripper.setSortByPosition(true);
            List<String> lines = new ArrayList<>();
            for (String line : stripper.getText(document).split("\\R")) {
                String l = line.strip().replaceAll("\\s+", " ");
                // Page furniture: the lab's name and address, the certificate number and revision, "Page x of y".
                if (l.isEmpty() || l.contains("Northbank Sensor Receiving Laboratory") || l.startsWith("Unit 4, Quayside")
                        || l.matches(".*Certificate (No\\. )?DG-\\d{4}-\\d{6}.*") || l.matches("(?i)revision \\d+")
                        || l.matches("Page \\d+ of \\d+")) {
                    continue;
                }
                lines.add(l);
            }
            return lines;
        }
    }

    /** Sections 3 (lot decision), 4 (reference instruments) and 5 (results per unit) of a certificate's text. */
    static List<String> results(List<String> certificateText) {
        int from = certificateText.indexOf("3 Lot decision");
        int to = certificateText.indexOf("7 Approval");
        assertThat(from).as(String.join("\n", certificateText)).isNotNegative();
        assertThat(to).isGreaterThan(from);
        // A table split over two pages repeats its header row, and text positions can split a word ("U nit"):
        // compare the content without spaces and without the header rows, which depend on where pages break.
        return certificateText.subList(from, to).stream().filter(l -> !l.startsWith("Metric Measured"))
                .map(l -> l.replace(" ", "")).toList();
    }

    @Test
    void aNewCalibrationAfterDispositionChangesNeitherTheEvaluationNorTheCertificateNorItsReissue() throws Exception {
        String tag = tag();
        String instrument = freshInstrument("CAL-A-" + tag);
        LotView lot = measuredLot(instrument);
        LotEvaluationView decided = disposition(lot);
        assertThat(decided.lot().state()).isEqualTo(LotState.DISPOSITIONED_ACCEPTED);
        assertThat(decided.nonconforming()).isZero();
        assertThat(decided.units()).allMatch(UnitEvaluationView::frozen);
        Map<String, String> frozen = results(decided);
        IssuedCertificate first = as("engineer2", "ENGINEER", () -> certificates.approveAndSign(lot.id(), ENGINEER2_PASSWORD));
        List<String> firstText = text(register.pdf(first.certificateNumber()).orElseThrow());

        recalibrate(instrument, "CAL-B-" + tag, 1.0);

        // The same readings evaluated with the new record would not pass: a unit measured now, with it, shows it.
        LotView later = receiveLot();
        measure(later, later.sampledSerials().get(0), instrument);
        UnitEvaluationView withNewRecord = evaluation.unit(later.id(), later.sampledSerials().get(0));
        assertThat(withNewRecord.calibrations()).extracting(UnitEvaluationView.CalibrationUsed::certificateNumber)
                .containsExactly("CAL-B-" + tag);
        assertThat(withNewRecord.result().unitVerdict().orElseThrow().name()).isNotEqualTo("PASS");

        // The dispositioned lot: the evaluation, each unit, the API and the recheck keep what was decided.
        LotEvaluationView after = evaluation.lotEvaluation(lot.id());
        assertThat(results(after)).isEqualTo(frozen);
        assertThat(after.nonconforming()).isZero();
        for (String serial : lot.sampledSerials()) {
            UnitEvaluationView unit = evaluation.unit(lot.id(), serial);
            assertThat(evaluation.canonical(unit.result())).isEqualTo(frozen.get(serial));
            assertThat(unit.calibrations()).extracting(UnitEvaluationView.CalibrationUsed::certificateNumber)
                    .containsExactly("CAL-A-" + tag);
        }
        mvc.perform(get("/api/v1/lots/{id}/evaluation", lot.id()).with(httpBasic("auditor", "auditor-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.nonconforming").value(0))
                .andExpect(jsonPath("$.units[0].frozen").value(true))
                .andExpect(jsonPath("$.units[0].calibrations[0].certificateNumber").value("CAL-A-" + tag));
        assertThat(evaluation.recheck(lot.id()).identical()).isTrue();

        // The certificate and its reissue print the same results and cite the record in force, not the new one.
        IssuedCertificate second = as("engineer2", "ENGINEER", () -> certificates.reissue(first.certificateNumber(),
                "Reference instrument recalibrated", ENGINEER2_PASSWORD));
        List<String> secondText = text(register.pdf(second.certificateNumber()).orElseThrow());
        assertThat(results(secondText)).isEqualTo(results(firstText));
        String section = String.join("\n", results(secondText));
        assertThat(section).contains("Nonconformingunits0of8").contains("ACCEPTED")
                .contains("CAL-A-" + tag).doesNotContain("CAL-B-" + tag);
    }

    @Test
    void readingsTakenBeforeANewCalibrationWasEnteredKeepTheOldRecordEvenWhenDispositionedAfterIt() {
        String tag = tag();
        String instrument = freshInstrument("CAL-A-" + tag);
        LotView lot = measuredLot(instrument);
        // Entered after the readings, dated today (the day of the readings): it does not reach back.
        recalibrate(instrument, "CAL-B-" + tag, 1.0);
        LotView later = receiveLot();
        measure(later, later.sampledSerials().get(0), instrument);

        LotEvaluationView decided = disposition(lot);
        assertThat(decided.lot().state()).isEqualTo(LotState.DISPOSITIONED_ACCEPTED);
        assertThat(decided.nonconforming()).isZero();
        UnitEvaluationView unit = decided.units().get(0);
        assertThat(unit.calibrations()).extracting(UnitEvaluationView.CalibrationUsed::certificateNumber)
                .containsExactly("CAL-A-" + tag);
        MetricResult oldRecord = unit.result().metrics().get(0);
        assertThat(oldRecord.budget().contributions()).anyMatch(c -> c.name().contains(instrument + ", certificate CAL-A-" + tag));

        // A reading taken after the new record was entered is evaluated with it.
        UnitEvaluationView newer = evaluation.unit(later.id(), later.sampledSerials().get(0));
        assertThat(newer.calibrations()).extracting(UnitEvaluationView.CalibrationUsed::certificateNumber)
                .containsExactly("CAL-B-" + tag);
        MetricResult newRecord = newer.result().metric(oldRecord.metric()).orElseThrow();
        assertThat(newRecord.budget().contributions()).anyMatch(c -> c.name().contains(instrument + ", certificate CAL-B-" + tag));
        assertThat(newRecord.uncertainty().value()).isGreaterThan(oldRecord.uncertainty().value());
    }

    @Test
    void recheckIsIdenticalForEveryDispositionedLotAndNamesAReadingADatabaseAdministratorChanged() throws Exception {
        List<LotView> dispositioned = new ArrayList<>(receiving.lots(LotState.DISPOSITIONED_ACCEPTED));
        dispositioned.addAll(receiving.lots(LotState.DISPOSITIONED_REJECTED));
        assertThat(dispositioned).isNotEmpty();
        for (LotView lot : dispositioned) {
            assertThat(evaluation.recheck(lot.id()).differences()).as("lot %d", lot.id()).isEmpty();
        }

        String instrument = freshInstrument("CAL-A-" + tag());
        LotView lot = measuredLot(instrument);
        Map<String, String> frozen = results(disposition(lot));
        String serial = lot.sampledSerials().get(2);
        Reading top = bench.currentReadings(lot.id(), serial).stream().filter(r -> r.test() == ReadingTest.STATIC)
                .max((a, b) -> Double.compare(a.point(), b.point())).orElseThrow();
        DatabaseAdmin dba = new DatabaseAdmin(dataSource);
        dba.bypassing("bench_reading", "bench_reading_append_only", () -> dba.jdbc()
                .update("update bench_reading set reading_value = reading_value + 0.5 where id = ?", top.id()));
        try {
            Recheck recheck = evaluation.recheck(lot.id());
            assertThat(recheck.identical()).isFalse();
            assertThat(recheck.differences()).allMatch(d -> d.serial().equals(serial));
            assertThat(recheck.differences()).anyMatch(d -> d.field().equals("measured") && d.frozen() != null
                    && d.recomputed() != null && !d.frozen().equals(d.recomputed()));
            // The record itself is untouched: the evaluation still shows what was frozen.
            assertThat(results(evaluation.lotEvaluation(lot.id()))).isEqualTo(frozen);

            mvc.perform(get("/api/v1/lots/{id}/evaluation/recheck", lot.id()).with(httpBasic("auditor", "auditor-demo")))
                    .andExpect(status().isOk())
                    .andExpect(jsonPath("$.identical").value(false))
                    .andExpect(jsonPath("$.differences[0].serial").value(serial))
                    .andExpect(jsonPath("$.differences[0].metric").exists())
                    .andExpect(jsonPath("$.differences[0].field").exists())
                    .andExpect(jsonPath("$.differences[0].frozen").exists())
                    .andExpect(jsonPath("$.differences[0].recomputed").exists());
            mvc.perform(get("/api/v1/lots/{id}/evaluation/recheck", lot.id())).andExpect(status().isUnauthorized());
            mvc.perform(get("/evaluation/lots/{id}/recheck", lot.id()).with(user("operator").roles("OPERATOR")))
                    .andExpect(status().isOk())
                    .andExpect(content().string(org.hamcrest.Matchers.containsString("id=\"recheck-differences\"")))
                    .andExpect(content().string(org.hamcrest.Matchers.containsString(serial)));
        } finally {
            dba.bypassing("bench_reading", "bench_reading_append_only", () -> dba.jdbc()
                    .update("update bench_reading set reading_value = ? where id = ?", top.value(), top.id()));
        }
        assertThat(evaluation.recheck(lot.id()).identical()).isTrue();
        mvc.perform(get("/evaluation/lots/{id}/recheck", lot.id()).with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk())
                .andExpect(content().string(org.hamcrest.Matchers.containsString("id=\"recheck-result\"")))
                .andExpect(content().string(org.hamcrest.Matchers.not(org.hamcrest.Matchers.containsString("recheck-differences"))));
    }
}
