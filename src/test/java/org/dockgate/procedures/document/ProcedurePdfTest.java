package org.dockgate.procedures.document;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.regex.Pattern;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.font.PDFont;
import org.apache.pdfbox.text.PDFTextStripper;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.procedure.DerivationOptions;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.ProcedureDerivation;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.ProcedureProposal.MetricAcceptance;
import org.dockgate.core.procedure.ProcedureProposal.SamplingRow;
import org.dockgate.core.procedure.ReferenceCandidate;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.RtdClass;
import org.dockgate.core.procedure.SensorSpecification.Sensitivity;
import org.dockgate.core.procedure.SensorSpecification.ToleranceMode;
import org.dockgate.core.procedure.TestKind;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.procedures.document.ProcedureDocument.Approval;
import org.dockgate.procedures.document.ProcedureDocument.ReferenceInstrument;
import org.dockgate.procedures.document.ProcedureDocument.RevisionEntry;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Renders procedures derived by the core and reads them back with PDFBox, an independent PDF reader:
 * what the technician and the auditor need must be in the text, on every page where it belongs.
 */
class ProcedurePdfTest {

    static final String GUARD_BANDED = "Guard-banded acceptance: a result passes only inside the tolerance narrowed"
            + " by w = 1 × U on each side (ILAC G8:2019)";
    static final DerivationOptions OPTIONS = new DerivationOptions(Aql.of(1.0), InspectionLevel.II,
            DecisionPolicy.guardBanded(1.0), null);

    /** A 0–10 bar, 10 mV/bar ± 1 % transducer, as a datasheet of that class states it. */
    static final SensorSpecification PRESSURE = new SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "bar", 0, 10,
            "mV", new Sensitivity(10, "mV/bar", 1, ToleranceMode.PERCENT), null, 0.5, 0.25, null, 0.1, 0.05, null, null,
            null, null);
    /** A pressure controller with U = 0.02 % of reading (k = 2) up to 20 bar. */
    static final ReferenceCandidate CONTROLLER = new ReferenceCandidate("PC-20", TestKind.STATIC_CALIBRATION, 0, 20,
            x -> Math.abs(x) * 0.0002, 2.0);

    /** A Pt100 class A probe, −50 … 250 °C; a dry block with U = 0.03 °C (k = 2). */
    static final SensorSpecification PT100 = new SensorSpecification(SensorKind.RTD, "°C", -50, 250, "Ω", null, null,
            null, null, null, null, null, null, null, null, new RtdClass(100, "A"));
    static final ReferenceCandidate DRY_BLOCK = new ReferenceCandidate("DB-650", TestKind.STATIC_CALIBRATION, -60, 300,
            x -> 0.03, 2.0);

    static ProcedureProposal pressureProposal;
    static ProcedureDocument pressureDocument;
    static byte[] pressurePdf;
    static List<String> pressurePages;

    @BeforeAll
    static void renderThePressureProcedure() throws IOException {
        pressureProposal = ProcedureDerivation.derive(PRESSURE, OPTIONS, List.of(CONTROLLER));
        pressureDocument = document("QP-250", 2, "APPROVED", "PT-10B-420", "Pressure transducer 0–10 bar",
                "Pressure transducer", pressureProposal,
                List.of(new ReferenceInstrument("PC-20", "Pressure controller 0–20 bar", "CAL-2026-0412",
                        LocalDate.of(2027, 3, 31))),
                Optional.of("Hysteresis and repeatability are limited by the controller's stability; the lab's best"
                        + " instrument gives TUR 2.5:1 and 1.25:1, accepted for incoming inspection with the guard band."),
                Optional.of(new Approval("R. Okafor", Instant.parse("2026-02-10T14:30:00Z"))));
        pressurePdf = new ProcedurePdf().render(pressureDocument);
        pressurePages = pages(pressurePdf);
        Files.createDirectories(Path.of("target"));
        Files.write(Path.of("target", "procedure-QP-250.pdf"), pressurePdf);
    }

    static ProcedureDocument document(String number, int revision, String status, String part, String name,
                                      String kind, ProcedureProposal proposal, List<ReferenceInstrument> instruments,
                                      Optional<String> justification, Optional<Approval> approval) {
        List<RevisionEntry> history = new ArrayList<>();
        history.add(new RevisionEntry(1, "SUPERSEDED", Instant.parse("2025-09-01T09:00:00Z"), "M. Lindqvist",
                "First issue"));
        if (revision > 1) {
            history.add(new RevisionEntry(2, status, Instant.parse("2026-02-10T14:30:00Z"), "M. Lindqvist",
                    "Specification rev 3: hysteresis limit tightened to 0.1 %FSO"));
        }
        return new ProcedureDocument("Northbank Sensor Receiving Laboratory",
                "Unit 4, Quayside Works, Harbour Road, Northbank", number, revision, status, part, name, kind,
                "specification rev 3", "1.0", "II", GUARD_BANDED, proposal, instruments, justification,
                "M. Lindqvist", approval, history);
    }

    static List<String> pages(byte[] pdf) throws IOException {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            PDFTextStripper stripper = new PDFTextStripper();
            stripper.setSortByPosition(true);
            List<String> pages = new ArrayList<>();
            for (int page = 1; page <= document.getNumberOfPages(); page++) {
                stripper.setStartPage(page);
                stripper.setEndPage(page);
                pages.add(stripper.getText(document));
            }
            return pages;
        }
    }

    static String all(List<String> pages) {
        return String.join("\n", pages);
    }

    /** The text with runs of white space made one space, so table rows read as one line. */
    static String flat(List<String> pages) {
        return all(pages).replaceAll("\\s+", " ");
    }

    @Test
    void everySectionIsThereInOrder() {
        String text = flat(pressurePages);
        List<String> sections = List.of("1 Scope and identification", "2 Safety", "3 Reference instruments",
                "4 Test steps", "5 Acceptance limits", "6 Sampling plans", "7 Conditions to record",
                "8 Revision history", "9 Approval");
        int previous = -1;
        for (String section : sections) {
            int at = text.indexOf(section);
            assertThat(at).as(section).isGreaterThan(previous);
            previous = at;
        }
    }

    @Test
    void identificationAndRuleAreStated() {
        String text = flat(pressurePages);
        assertThat(text).contains("Northbank Sensor Receiving Laboratory")
                .contains("Unit 4, Quayside Works, Harbour Road, Northbank")
                .contains("QP-250, revision 2").contains("APPROVED")
                .contains("PT-10B-420 — Pressure transducer 0–10 bar")
                .contains("specification rev 3")
                .contains("AQL 1.0 % nonconforming, inspection level II")
                .contains(GUARD_BANDED)
                .contains("about " + pressureProposal.estimatedBenchMinutes() + " min");
    }

    @Test
    void everyPageHasTheHeaderAndPageXOfY() {
        int n = pressurePages.size();
        assertThat(n).as("a procedure with 36 static steps runs over several pages").isGreaterThan(1);
        for (int i = 0; i < n; i++) {
            String page = pressurePages.get(i).replaceAll("\\s+", " ");
            assertThat(page).as("page %d", i + 1).containsPattern("Page " + (i + 1) + " ?of ?" + n + "\\b");
            assertThat(page).as("page %d", i + 1).contains("QP-250 rev 2 · APPROVED");
        }
    }

    @Test
    void theSafetySectionCarriesTheCautionsAndTheStatement() {
        String text = flat(pressurePages);
        String safety = text.substring(text.indexOf("2 Safety"), text.indexOf("3 Reference instruments"));
        assertThat(safety).contains("Pressurised fittings store energy")
                .contains("Local codes, licensed practice and the lab's own safety rules govern every test")
                .contains("does not qualify a part for a safety function");
        // printed once, not once from the derivation and once as the fixed statement
        assertThat(safety.split("does not qualify a part for a safety function", -1)).hasSize(2);
    }

    @Test
    void instrumentsAreListedWithCertificateDueDateAndUse() {
        assertThat(flat(pressurePages)).contains("PC-20 Pressure controller 0–20 bar CAL-2026-0412 2027-03-31 static"
                + " calibration, sensitivity");
    }

    @Test
    void staticStepsAreListedInVisitingOrder() {
        String text = flat(pressurePages);
        // six points ascending then descending, three cycles (hysteresis and repeatability specified)
        assertThat(text).contains("Step Cycle Direction Point (% of span) Input value (bar)");
        assertThat(text).contains("1 1 ascending 0 0 2 1 ascending 20 2");
        assertThat(text).contains("6 1 ascending 100 10 7 1 descending 100 10 8 1 descending 80 8");
        assertThat(text).contains("36 3 descending 0 0");
        assertThat(text).contains("settle 30 s").contains("36 readings per unit");
    }

    @Test
    void acceptanceLimitsArePrintedForEveryMetric() {
        String text = flat(pressurePages);
        // ILAC G8:2019 guard band w = U, U = 0.02 % of 10 mV/bar = 0.002 mV/bar: 9.9 + 0.002 … 10.1 − 0.002
        assertThat(text).contains("Sensitivity mV/bar 9.9 … 10.1 0.002 (k = 2) 9.902 … 10.098 50.0:1 PC-20");
        // accuracy ± 0.5 %FSO with U = 0.02 %FSO at the top point: −0.48 … 0.48, TUR 1 / 0.04 = 25
        assertThat(text).contains("Accuracy %FSO −0.5 … 0.5 0.02 (k = 2) −0.48 … 0.48 25.0:1");
        for (MetricAcceptance m : pressureProposal.acceptance()) {
            assertThat(text).as(m.metric().name())
                    .contains(ProcedurePdf.metricName(m.metric()) + " " + m.unit() + " "
                            + ProcedurePdf.interval(m.toleranceLower(), m.toleranceUpper()))
                    .contains(ProcedurePdf.interval(m.acceptanceLower(), m.acceptanceUpper()));
        }
        // hysteresis ≤ 0.1 %FSO: the reference's common error at a set point cancels in the UP − DOWN difference,
        // so no reference U and no TUR are planned (was U = 0.02 %FSO, TUR 2.5:1 "below 4:1" before the model
        // was stated); the recorded justification still prints.
        assertThat(text).contains("Hysteresis %FSO ≤ 0.1 not planned ≤ 0.1 n/a PC-20")
                .doesNotContain("below 4:1")
                .contains("TUR justification: Hysteresis and repeatability are limited");
    }

    @Test
    void samplingPlansArePrintedRowByRow() {
        String text = flat(pressurePages);
        // ISO 2859-1:1999 Table 1, lot 501–1200, level II -> J; Table 2-A, J at AQL 1.0 -> n 80, Ac 2, Re 3
        assertThat(text).containsPattern("1200 J 80 2 3 ");
        for (SamplingRow row : pressureProposal.sampling()) {
            String expected = row.lotSize() + " " + row.normal().codeLetter() + " "
                    + plan(row.normal()) + " " + plan(row.tightened()) + " " + plan(row.reduced());
            assertThat(text).as("lot " + row.lotSize()).contains(expected);
        }
    }

    static String plan(org.dockgate.core.sampling.SamplingPlan plan) {
        return plan.sampleSize() + (plan.fullInspection() ? "*" : "") + " " + plan.acceptNumber() + " "
                + plan.rejectNumber();
    }

    @Test
    void conditionsHistoryAndApprovalAreThere() {
        String text = flat(pressurePages);
        // The procedure states its environmental limits (common practice: 23 ± 5 °C, 20 … 80 % RH).
        assertThat(text).contains("Ambient temperature in °C, within 18 … 28 °C")
                .contains("Relative humidity in %, within 20 … 80 % RH")
                .contains("Environmental limits: Ambient temperature 18 … 28 °C, relative humidity 20 … 80 % RH");
        assertThat(text).contains("1 SUPERSEDED 2025-09-01 M. Lindqvist First issue")
                .contains("2 APPROVED 2026-02-10 M. Lindqvist Specification rev 3: hysteresis limit tightened");
        assertThat(text).contains("Author M. Lindqvist").contains("Approved by R. Okafor")
                .contains("Approved at 2026-02-10 14:30 UTC");
    }

    @Test
    void specialCharactersPrintWithTheEmbeddedUnicodeFont() throws IOException {
        assumeTrue(Files.isReadable(ProcedurePdf.LIBERATION_SANS), "Liberation Sans is installed");
        var proposal = ProcedureDerivation.derive(PT100, OPTIONS, List.of(DRY_BLOCK));
        byte[] pdf = new ProcedurePdf().render(document("QP-310", 1, "DRAFT", "RT-100A", "Pt100 probe class A",
                "RTD", proposal, List.of(new ReferenceInstrument("DB-650", "Dry block −60 … 300 °C", "CAL-2026-0077",
                        LocalDate.of(2026, 12, 1))), Optional.empty(), Optional.empty()));
        String text = flat(pages(pdf));
        // IEC 60751 class A at 10 °C: ± (0.15 + 0.002 × 10) = ± 0.17 °C
        assertThat(text).contains("°C −0.17 … 0.17 0.03 (k = 2) −0.14 … 0.14 5.7:1 DB-650");
        assertThat(text).contains("R0 = 100 Ω").contains("±").contains("°C").contains("−").contains("…");
        assertThat(flat(pressurePages)).contains("≤ 0.25").contains("±");
        assertThat(text).contains("Dry block −60 … 300 °C");
        assertThat(text).contains("Not approved: this is not a controlled copy");
        assertThat(text).contains("QP-310 rev 1 · DRAFT");
        assertThat(fontNames(pdf)).anyMatch(name -> name.contains("LiberationSans"));
    }

    @Test
    void withoutTheUnicodeFontCharactersAreSpelledOutNotDropped() throws IOException {
        var proposal = ProcedureDerivation.derive(PT100, OPTIONS, List.of(DRY_BLOCK));
        byte[] pdf = new ProcedurePdf(Path.of("/nonexistent/NoSuchFont-Regular.ttf")).render(document("QP-310", 1,
                "DRAFT", "RT-100A", "Pt100 probe class A", "RTD", proposal, List.of(), Optional.empty(),
                Optional.empty()));
        String text = flat(pages(pdf));
        assertThat(fontNames(pdf)).allMatch(name -> name.startsWith("Helvetica"));
        // ± and ° are in WinAnsi; Ω and − are not and are spelled out
        assertThat(text).contains("R0 = 100 Ohm").contains("-0.17 … 0.17").contains("±").contains("°C")
                .doesNotContain("Ω").doesNotContain("−");
        assertThat(text).contains("No reference instrument is listed").contains("Named by the procedure but not"
                + " listed above: DB-650");
    }

    @Test
    void noiseCaptureAndSweepGetTheirOwnSteps() throws IOException {
        // A ±50 g, 100 mV/g ± 5 % accelerometer with a 5 kHz −3 dB bandwidth and 0.5 mg rms noise
        var spec = new SensorSpecification(SensorKind.ACCELEROMETER, "g", -50, 50, "mV",
                new Sensitivity(100, "mV/g", 5, ToleranceMode.PERCENT), null, null, null, null, null, null,
                new SensorSpecification.NoiseFloor(0.0005, "g", SensorSpecification.Referred.INPUT), null,
                new SensorSpecification.Bandwidth(5000.0, null, null, 100.0), null);
        var proposal = ProcedureDerivation.derive(spec, OPTIONS, List.of());
        String text = flat(pages(new ProcedurePdf().render(document("QP-120", 1, "DRAFT", "AC-50", "Accelerometer",
                "Accelerometer", proposal, List.of(), Optional.empty(), Optional.empty()))));
        assertThat(text).contains("4.1 Static calibration").contains("4.2 Noise capture")
                .contains("4.3 Frequency-response sweep")
                .contains("Sample rate " + ProcedurePdf.number(proposal.noiseCapture().sampleRateHz()) + " Hz")
                .contains("Samples " + proposal.noiseCapture().samples())
                .contains("1 100 " + ProcedurePdf.number(proposal.frequencySweep().amplitude()) + " reference")
                .contains(" 5000 ")
                .contains("Mount on the shaker")
                .contains("Bandwidth Hz ≥ 5000");
    }

    @Test
    void aLowTurWithoutJustificationIsFlagged() throws IOException {
        // Nonlinearity ≤ 0.05 %FSO against U = 0.02 %FSO (0.02 % of 10 bar over the 10 bar span): TUR 0.05 / 0.04 = 1.25.
        var tight = new SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "bar", 0, 10, "mV",
                new Sensitivity(10, "mV/bar", 1, ToleranceMode.PERCENT), null, 0.5, 0.05, null, 0.1, 0.05, null, null,
                null, null);
        byte[] pdf = new ProcedurePdf().render(document("QP-250", 3, "DRAFT", "PT-10B-420", "Pressure transducer",
                "Pressure transducer", ProcedureDerivation.derive(tight, OPTIONS, List.of(CONTROLLER)), List.of(),
                Optional.of("   "), Optional.empty()));
        assertThat(flat(pages(pdf))).contains("No justification is recorded: this revision cannot be approved.");
    }

    @Test
    void aDocumentMissingItsIdentificationIsRefused() {
        assertThatThrownBy(() -> new ProcedureDocument(" ", "addr", "", 1, "DRAFT", "P", "N", "K", "spec", "1.0",
                "II", "rule", pressureProposal, List.of(), Optional.empty(), "me", Optional.empty(), List.of()))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessage("A procedure document needs its lab name, procedure number.");
        assertThatThrownBy(() -> new ProcedureDocument("Lab", "addr", "QP-1", 0, "DRAFT", "P", "N", "K", "spec",
                "1.0", "II", "rule", pressureProposal, null, null, "me", null, null))
                .hasMessageContaining("numbered from 1");
        assertThatThrownBy(() -> new ReferenceInstrument("X", "d", "", null))
                .hasMessage("A reference instrument needs its certificate number, due date.");
    }

    @Test
    void numbersPrintWithoutNoise() {
        assertThat(ProcedurePdf.number(9.9 + 0.002)).isEqualTo("9.902");
        assertThat(ProcedurePdf.number(-0.48000000000000004)).isEqualTo("−0.48");
        assertThat(ProcedurePdf.number(5000)).isEqualTo("5000");
        assertThat(ProcedurePdf.number(0.0005)).isEqualTo("0.0005");
        assertThat(ProcedurePdf.ratio(Double.POSITIVE_INFINITY)).isEqualTo("∞:1");
        assertThat(Metric.values()).allSatisfy(m -> assertThat(ProcedurePdf.metricName(m)).isNotBlank());
    }

    static List<String> fontNames(byte[] pdf) throws IOException {
        List<String> names = new ArrayList<>();
        try (PDDocument document = Loader.loadPDF(pdf)) {
            for (PDPage page : document.getPages()) {
                for (var name : page.getResources().getFontNames()) {
                    PDFont font = page.getResources().getFont(name);
                    names.add(font.getName());
                }
            }
        }
        return names;
    }

    @Test
    void theFooterTotalIsTheRealPageCount() throws IOException {
        try (PDDocument document = Loader.loadPDF(pressurePdf)) {
            assertThat(pressurePages).hasSize(document.getNumberOfPages());
        }
        assertThat(Pattern.compile("Page \\d+ ?of ?" + pressurePages.size() + "\\b").matcher(flat(pressurePages))
                .results().count()).isEqualTo(pressurePages.size());
    }
}
