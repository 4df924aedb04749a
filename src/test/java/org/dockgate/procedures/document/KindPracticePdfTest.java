package org.dockgate.procedures.document;

import static org.assertj.core.api.Assertions.assertThat;
import static org.dockgate.procedures.document.ProcedurePdfTest.OPTIONS;
import static org.dockgate.procedures.document.ProcedurePdfTest.PRESSURE;
import static org.dockgate.procedures.document.ProcedurePdfTest.PT100;
import static org.dockgate.procedures.document.ProcedurePdfTest.flat;
import static org.dockgate.procedures.document.ProcedurePdfTest.pages;

import java.io.IOException;
import java.util.List;
import java.util.Optional;
import org.dockgate.core.procedure.KindPractice;
import org.dockgate.core.procedure.ProcedureDerivation;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.Sensitivity;
import org.dockgate.core.procedure.SensorSpecification.ToleranceMode;
import org.junit.jupiter.api.Test;

/**
 * Each kind's derived procedure prints its kind's preparation items and cautions, read back with PDFBox.
 * The excitation strings are those of the demo models (seed-data/sensor-models.json).
 */
class KindPracticePdfTest {

    /** A 0–5 kN, 2 mV/V ± 0.25 % load cell. */
    static final SensorSpecification LOAD_CELL = new SensorSpecification(SensorKind.LOAD_CELL, "kN", 0, 5, "mV/V",
            new Sensitivity(0.4, "mV/V/kN", 0.25, ToleranceMode.PERCENT), null, 0.1, null, null, null, null, null,
            null, null, null);
    /** A ±50 g, 100 mV/g accelerometer with a 5 kHz −3 dB bandwidth and 0.5 mg rms noise. */
    static final SensorSpecification ACCELEROMETER = new SensorSpecification(SensorKind.ACCELEROMETER, "g", -50, 50,
            "mV", new Sensitivity(100, "mV/g", 5, ToleranceMode.PERCENT), null, null, null, null, null, null,
            new SensorSpecification.NoiseFloor(0.0005, "g", SensorSpecification.Referred.INPUT), null,
            new SensorSpecification.Bandwidth(5000.0, null, null, 100.0), null);

    static String text(SensorSpecification spec, String excitation, String kindInWords) throws IOException {
        var proposal = ProcedureDerivation.derive(spec, OPTIONS, List.of());
        ProcedureDocument base = ProcedurePdfTest.document("QP-900", 1, "DRAFT", "X-1", kindInWords, kindInWords,
                proposal, List.of(), Optional.empty(), Optional.empty());
        ProcedureDocument doc = new ProcedureDocument(base.labName(), base.labAddress(), base.procedureNumber(),
                base.revision(), base.status(), base.partNumber(), base.modelName(), base.sensorKind(),
                base.specificationRevision(), base.aql(), base.inspectionLevel(), base.decisionRule(), proposal,
                base.referenceInstruments(), base.turJustification(), base.author(), base.approval(), base.history(),
                KindPractice.of(spec, excitation));
        return flat(pages(new ProcedurePdf().render(doc)));
    }

    static void commonTo(String text) {
        assertThat(text).contains("Cautions for this kind").contains("Preparation and practice for this kind")
                .contains("Warm-up:")
                .contains("Electrical excitation: Switch the excitation supply off")
                .contains(flatten(KindPractice.DEFERRAL));
    }

    static String flatten(String s) {
        return s.replaceAll("\\s+", " ");
    }

    @Test
    void anRtdProcedurePrintsIcePointImmersionStabilityFourWireCurrentAndSelfHeating() throws IOException {
        String text = text(PT100, "1 mA measuring current", "RTD");
        commonTo(text);
        assertThat(text).contains("Ice-point check: Read R0 at the ice point (0 °C")
                .contains("class A tolerance of ±0.15 °C at 0 °C") // IEC 60751:2008 Table 1, class A: ±(0.15 + 0.002|t|)
                .contains("(IEC 60751)")
                .contains("Immersion depth:")
                .contains("Stability criterion: Instead of a fixed wait")
                .contains("0.015 °C (a tenth of the class tolerance at 0 °C)")
                .contains("4-wire connection:")
                .contains("Measuring current: Read with 1 mA measuring current")
                .contains("Self-heating check:")
                .contains("Heat: Baths and dry blocks burn");
    }

    @Test
    void aPressureProcedurePrintsExerciseHeadHeightAndExcitation() throws IOException {
        String text = text(PRESSURE, "10 V DC", "Pressure transducer");
        commonTo(text);
        assertThat(text).contains("Exercise cycles: Before the first run, exercise the transducer three times")
                .contains("full range (10 bar)")
                .contains("Head-height correction:")
                .contains("Excitation: Set the excitation to 10 V DC; measure it at the sensor's connector")
                .contains("Mounting and orientation:")
                .contains("Pressure: Vent before connecting")
                .doesNotContain("Ice-point check");
    }

    @Test
    void aLoadCellProcedurePrintsExerciseAndAlignment() throws IOException {
        String text = text(LOAD_CELL, "10 V DC", "Load cell");
        commonTo(text);
        assertThat(text).contains("Exercise cycles: Before the first run, preload three times")
                .contains("(5 kN)")
                .contains("Alignment: Seat the cell")
                .contains("Excitation: Set the excitation to 10 V DC")
                .doesNotContain("Head-height correction");
    }

    @Test
    void anAccelerometerProcedurePrintsStudMountingNoiseIsolationAndBandwidth() throws IOException {
        String text = text(ACCELEROMETER, "IEPE constant current 4 mA, 24 V compliance", "Accelerometer");
        commonTo(text);
        assertThat(text).contains("Stud mounting and torque: Stud-mount back-to-back")
                .contains("mounting torque")
                .contains("(ISO 16063-21)")
                .contains("Noise isolation:")
                .contains("Noise bandwidth:").contains("up to 5000 Hz")
                .contains("Supply IEPE constant current 4 mA, 24 V compliance");
    }

    @Test
    void aDocumentWithoutPracticePrintsNoPracticeSection() throws IOException {
        var proposal = ProcedureDerivation.derive(PRESSURE, OPTIONS, List.of());
        String text = flat(pages(new ProcedurePdf().render(ProcedurePdfTest.document("QP-900", 1, "DRAFT", "X-1",
                "P", "Pressure transducer", proposal, List.of(), Optional.empty(), Optional.empty()))));
        assertThat(text).doesNotContain("Preparation and practice for this kind");
    }
}
