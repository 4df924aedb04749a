package org.dockgate.core.procedure;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.procedure.ProcedureProposal.MetricAcceptance;
import org.dockgate.core.procedure.SensorSpecification.Bandwidth;
import org.dockgate.core.procedure.SensorSpecification.NoiseFloor;
import org.dockgate.core.procedure.SensorSpecification.Referred;
import org.dockgate.core.procedure.SensorSpecification.RtdClass;
import org.dockgate.core.procedure.SensorSpecification.Sensitivity;
import org.dockgate.core.procedure.SensorSpecification.ToleranceMode;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.CodeLetter;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.core.series.Direction;
import org.junit.jupiter.api.Test;

class ProcedureDerivationTest {

    static final DerivationOptions OPTIONS = new DerivationOptions(Aql.of(1.0), InspectionLevel.II,
            DecisionPolicy.guardBanded(1.0), null);

    static SensorSpecification pressure(Double hysteresis, Double repeatability) {
        return new SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "bar", 0, 10, "mV",
                new Sensitivity(10, "mV/bar", 1, ToleranceMode.PERCENT), null, 0.5, 0.25, null, hysteresis,
                repeatability, null, null, null, null);
    }

    /** A reference with U a fixed percentage of reading (k = 2), covering 0 … 20. */
    static ReferenceCandidate percentOfReading(String id, TestKind test, double percent, double max) {
        return new ReferenceCandidate(id, test, 0, max, x -> Math.abs(x) * percent / 100.0, 2.0);
    }

    @Test
    void hysteresisGivesDescendingPointsAndRepeatabilityThreeCycles() {
        var proposal = ProcedureDerivation.derive(pressure(0.1, 0.05), OPTIONS, List.of());
        assertThat(proposal.staticCalibration().directions()).containsExactly(Direction.UP, Direction.DOWN);
        assertThat(proposal.staticCalibration().cycles()).isEqualTo(3);
        // common practice: 0, 20, 40, 60, 80, 100 % of span
        assertThat(proposal.staticCalibration().pointsInput()).containsExactly(0.0, 2.0, 4.0, 6.0, 8.0, 10.0);
        assertThat(proposal.staticCalibration().readingsPerUnit()).isEqualTo(36);

        var plain = ProcedureDerivation.derive(pressure(null, null), OPTIONS, List.of());
        assertThat(plain.staticCalibration().directions()).containsExactly(Direction.UP);
        assertThat(plain.staticCalibration().cycles()).isEqualTo(1);
    }

    @Test
    void restatingRecomputesTheTextsThatDependOnEditedValuesAndNothingElse() {
        var spec = new SensorSpecification(SensorKind.ACCELEROMETER, "g", -50, 50, "mV",
                new Sensitivity(100, "mV/g", 5, ToleranceMode.PERCENT), null, null, null, null, null, null,
                new NoiseFloor(0.0005, "g", Referred.INPUT), null, new Bandwidth(5000.0, null, null, 100.0), null);
        var derived = ProcedureDerivation.derive(spec, OPTIONS, List.of());
        // The derivation and the restatement share their sentences: an unedited proposal restates to itself.
        assertThat(ProcedureDerivation.restate(derived, spec, java.util.OptionalInt.empty())).isEqualTo(derived);

        var n = derived.noiseCapture();
        var s = derived.staticCalibration();
        var f = derived.frequencySweep();
        // twice the samples at the same rate: twice the duration
        var noise = new ProcedureProposal.NoiseCapture(2 * n.samples(), n.sampleRateHz(), 2 * n.samples() / n.sampleRateHz(),
                n.reasoning());
        var sweep = new ProcedureProposal.FrequencySweep(f.referenceHz(), List.of(100.0, 1000.0, 5000.0, 10000.0),
                f.amplitude(), f.amplitudeUnit(), f.referenceInstrument(), f.reasoning());
        var edited = new ProcedureProposal(s, noise, sweep, derived.acceptance(), derived.sampling(), derived.environment(),
                derived.cautions(), derived.estimatedBenchMinutes(), derived.reasoning(), derived.environmentalLimits());
        var restated = ProcedureDerivation.restate(edited, spec, java.util.OptionalInt.empty());
        assertThat(restated.noiseCapture().reasoning().get(1)).startsWith("Duration " + ProcedureDerivation.fmt(
                noise.durationSeconds()) + " s (" + noise.samples() + " samples");
        assertThat(restated.frequencySweep().reasoning().get(0))
                .isEqualTo("Four frequencies set by the engineer, 100 … 10000 Hz, beyond the limit of 5000 Hz.");
        // 10 min set-up + readings × (settle + 15 s) + (noise duration + 60 s) + 20 s per sweep point, rounded up
        int seconds = 600 + s.readingsPerUnit() * (s.settleSeconds() + 15) + (int) Math.ceil(noise.durationSeconds()) + 60
                + 4 * 20;
        assertThat(restated.estimatedBenchMinutes()).isEqualTo((int) Math.ceil(seconds / 60.0));
        assertThat(restated.reasoning()).filteredOn(r -> r.startsWith("Bench time: ")).singleElement()
                .satisfies(r -> assertThat(r).contains("4 sweep points × 20 s"));
        assertThat(restated.acceptance()).isEqualTo(derived.acceptance());
    }

    @Test
    void aFivekHzBandwidthGetsAFastEnoughSampleRateAndSweepPointsBeyondIt() {
        var spec = new SensorSpecification(SensorKind.ACCELEROMETER, "g", -50, 50, "mV",
                new Sensitivity(100, "mV/g", 5, ToleranceMode.PERCENT), null, null, null, null, null, null,
                new NoiseFloor(0.0005, "g", Referred.INPUT), null, new Bandwidth(5000.0, null, null, 100.0), null);
        var proposal = ProcedureDerivation.derive(spec, OPTIONS, List.of());
        assertThat(proposal.noiseCapture().sampleRateHz()).isGreaterThanOrEqualTo(12_500.0);
        assertThat(proposal.frequencySweep().frequenciesHz()).contains(5000.0).anyMatch(f -> f > 5000.0);
        assertThat(proposal.frequencySweep().frequenciesHz().get(0)).isEqualTo(100.0);
        // denser near the limit: more points per decade between 2.5 kHz and 10 kHz than below
        long near = proposal.frequencySweep().frequenciesHz().stream().filter(f -> f >= 2500 && f <= 10000).count();
        long far = proposal.frequencySweep().frequenciesHz().stream().filter(f -> f >= 100 && f < 1000).count();
        assertThat(near).isGreaterThan(far);
    }

    @Test
    void aQuarterPercentReferenceAgainstAOnePercentToleranceGivesTurFourToOne() {
        // The check: U = 0.25 % of reading against ±1 % sensitivity tolerance -> TUR = 2 % / (2 × 0.25 %) = 4
        var proposal = ProcedureDerivation.derive(pressure(null, null), OPTIONS,
                List.of(percentOfReading("REF-025", TestKind.STATIC_CALIBRATION, 0.25, 20)));
        MetricAcceptance sensitivity = proposal.acceptance().stream()
                .filter(a -> a.metric() == Metric.SENSITIVITY).findFirst().orElseThrow();
        assertThat(sensitivity.testUncertaintyRatio().getAsDouble()).isCloseTo(4.0, within(1e-9));
        assertThat(sensitivity.turAdequate()).isTrue();
        assertThat(sensitivity.plannedExpandedUncertainty().getAsDouble()).isCloseTo(0.025, within(1e-12));
        // guard band w = U: acceptance limits 9.9 + 0.025 … 10.1 − 0.025 (ILAC G8:2019, w = r·U with r = 1)
        assertThat(sensitivity.acceptanceLower().getAsDouble()).isCloseTo(9.925, within(1e-9));
        assertThat(sensitivity.acceptanceUpper().getAsDouble()).isCloseTo(10.075, within(1e-9));
        assertThat(sensitivity.referenceInstrument()).isEqualTo("REF-025");
    }

    @Test
    void aTooCoarseReferenceIsFlaggedAndNeedsJustification() {
        var proposal = ProcedureDerivation.derive(pressure(null, null), OPTIONS,
                List.of(percentOfReading("REF-05", TestKind.STATIC_CALIBRATION, 0.5, 20)));
        assertThat(proposal.allTestUncertaintyRatiosAdequate()).isFalse();
        assertThat(proposal.reasoning()).anyMatch(r -> r.contains("justification"));
    }

    @Test
    void theBestCoveringReferenceIsChosenAndANarrowOneIgnored() {
        var proposal = ProcedureDerivation.derive(pressure(null, null), OPTIONS,
                List.of(percentOfReading("TOO-NARROW", TestKind.STATIC_CALIBRATION, 0.001, 5),
                        percentOfReading("COARSE", TestKind.STATIC_CALIBRATION, 0.05, 20),
                        percentOfReading("FINE", TestKind.STATIC_CALIBRATION, 0.01, 20)));
        assertThat(proposal.staticCalibration().referenceInstrument()).isEqualTo("FINE");
    }

    @Test
    void samplingPlansAreTabulatedForTypicalLotSizes() {
        var proposal = ProcedureDerivation.derive(pressure(null, null), OPTIONS, List.of());
        var row = proposal.sampling().stream().filter(r -> r.lotSize() == 1200).findFirst().orElseThrow();
        // ISO 2859-1:1999 Table 1, lot 501–1200, level II -> J; Table 2-A, J at AQL 1.0 -> n 80, Ac 2, Re 3
        assertThat(row.normal().codeLetter()).isEqualTo(CodeLetter.J);
        assertThat(row.normal().sampleSize()).isEqualTo(80);
        assertThat(row.normal().acceptNumber()).isEqualTo(2);
        assertThat(row.normal().rejectNumber()).isEqualTo(3);
    }

    @Test
    void everyProcedureCarriesTheSafetyStatementAndKindCautions() {
        var proposal = ProcedureDerivation.derive(pressure(null, null), OPTIONS, List.of());
        assertThat(proposal.cautions()).anyMatch(c -> c.contains("Pressurised fittings store energy"))
                .anyMatch(c -> c.contains("does not qualify a part for a safety function"));
        assertThat(proposal.estimatedBenchMinutes()).isPositive();
    }

    @Test
    void anRtdIsJudgedAgainstItsClassAtTheTightestPoint() {
        var spec = new SensorSpecification(SensorKind.RTD, "°C", -50, 250, "Ω", null, null, null, null, null, null,
                null, null, null, null, new RtdClass(100, "A"));
        var proposal = ProcedureDerivation.derive(spec, OPTIONS,
                List.of(new ReferenceCandidate("DRY", TestKind.STATIC_CALIBRATION, -60, 300, x -> 0.03, 2)));
        MetricAcceptance rtd = proposal.acceptance().get(0);
        assertThat(rtd.metric()).isEqualTo(Metric.RTD_TOLERANCE);
        // IEC 60751 class A: ±(0.15 + 0.002|t|) °C; the tightest point of -50, 10, 70, ... is 10 °C -> 0.17 °C
        assertThat(rtd.toleranceUpper().getAsDouble()).isCloseTo(0.17, within(1e-9));
        assertThat(rtd.testUncertaintyRatio().getAsDouble()).isCloseTo(0.34 / 0.06, within(1e-9));
    }

    @Test
    void aUnitMismatchIsRefusedWithAClearMessage() {
        assertThatThrownBy(() -> new SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "bar", 0, 10, "mV",
                new Sensitivity(100, "mV/g", 1, ToleranceMode.PERCENT), null, null, null, null, null, null, null,
                null, null, null)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("sensitivity unit 'mV/g' does not fit a pressure transducer");
        assertThatThrownBy(() -> new SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "g", 0, 10, "mV",
                null, null, 0.5, null, null, null, null, null, null, null, null))
                .hasMessageContaining("measures pressure");
        assertThatThrownBy(() -> new SensorSpecification(SensorKind.ACCELEROMETER, "g", 0, 10, "mV",
                null, null, null, null, null, null, null, null, null, null, null))
                .hasMessageContaining("needs its sensitivity");
        // psi is a pressure and mV/psi a fine sensitivity for it
        new SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "psi", 0, 150, "mV",
                new Sensitivity(0.667, "mV/psi", 1, ToleranceMode.PERCENT), null, null, null, null, null, null, null,
                null, null, null);
    }

    /** U(x) = max(floor, b·|x|) over a calibrated range [min, max], k = 2: a register band as the core sees it. */
    static ReferenceCandidate banded(String id, double min, double max, double percent, double floor) {
        return new ReferenceCandidate(id, TestKind.STATIC_CALIBRATION, min, max,
                x -> Math.max(floor, Math.abs(x) * percent / 100.0), 2.0);
    }

    static MetricAcceptance acceptance(ProcedureProposal proposal, Metric metric) {
        return proposal.acceptance().stream().filter(m -> m.metric() == metric).findFirst().orElseThrow();
    }

    @Test
    void anInstrumentCalibratedAboveAPointIsNotPlannedForIt() {
        // Points 0 … 10 bar; the finer instrument is calibrated over 0.2 … 20 bar only, the other over 0 … 20.
        ReferenceCandidate fine = banded("RI-FINE", 0.2, 20, 0.005, 0.00001);
        ReferenceCandidate coarse = banded("RI-COARSE", 0, 20, 0.02, 0.0004);
        var proposal = ProcedureDerivation.derive(pressure(0.1, 0.05), OPTIONS, List.of(fine, coarse));
        assertThat(proposal.staticCalibration().referenceInstrument()).isEqualTo("RI-COARSE");
        assertThat(acceptance(proposal, Metric.SENSITIVITY).referenceInstrument()).isEqualTo("RI-COARSE");

        var none = ProcedureDerivation.derive(pressure(0.1, 0.05), OPTIONS, List.of(fine));
        assertThat(none.staticCalibration().referenceInstrument()).isNull();
        assertThat(none.staticCalibration().reasoning()).anyMatch(r -> r.equals("No reference instrument in"
                + " calibration covers 0 … 10 bar. RI-FINE is calibrated over 0.2 … 20 bar only: 0 bar lies outside."));
        assertThat(acceptance(none, Metric.SENSITIVITY).plannedExpandedUncertainty()).isEmpty();
    }

    @Test
    void theDemoPressureTransducerIsPlannedWithTheFloorAndNoInfiniteRatio() {
        // The demo's QP-250 (seed-data/sensor-models.json): 0 … 10 bar, 10 mV/bar ± 1 %, zero 0 ± 0.5 mV,
        // accuracy ± 0.5 %FSO, nonlinearity ≤ 0.25, hysteresis ≤ 0.1, repeatability ≤ 0.05 %FSO; its reference
        // RI-PRS-01 (seed-data/reference-instruments.csv): 0.01 % of reading, floor 0.0004 bar, 0 … 20 bar, k = 2.
        var spec = new SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "bar", 0, 10, "mV",
                new Sensitivity(10, "mV/bar", 1, ToleranceMode.PERCENT),
                new SensorSpecification.ZeroOffset(0, 0.5, "mV"), 0.5, 0.25, null, 0.1, 0.05, null, null, null, null);
        var proposal = ProcedureDerivation.derive(spec, OPTIONS, List.of(banded("RI-PRS-01", 0, 20, 0.01, 0.0004)));
        // U at the points 0, 2, 4, 6, 8, 10 bar: 0.0004 (floor), 0.0004, 0.0004, 0.0006, 0.0008, 0.001 bar.
        // Sensitivity, a scale error: U = 10 mV/bar × 0.001/10 = 0.001 mV/bar; TUR = 0.2 / (2 × 0.001) = 100.
        MetricAcceptance sensitivity = acceptance(proposal, Metric.SENSITIVITY);
        assertThat(sensitivity.plannedExpandedUncertainty().getAsDouble()).isCloseTo(0.001, within(1e-12));
        assertThat(sensitivity.testUncertaintyRatio().getAsDouble()).isCloseTo(100, within(1e-6));
        // Zero offset, a point error at 0 bar: U = 0.0004 bar × 10 mV/bar = 0.004 mV; TUR = 1 / (2 × 0.004) = 125.
        MetricAcceptance zero = acceptance(proposal, Metric.ZERO_OFFSET);
        assertThat(zero.plannedExpandedUncertainty().getAsDouble()).isCloseTo(0.004, within(1e-12));
        assertThat(zero.testUncertaintyRatio().getAsDouble()).isCloseTo(125, within(1e-6));
        // Accuracy, a point error, the largest U over the points: 0.001 bar / 10 bar × 100 = 0.01 %FSO;
        // TUR = 1 / (2 × 0.01) = 50. Nonlinearity, the same U; one-sided from 0: TUR = 0.25 / (2 × 0.01) = 12.5.
        assertThat(acceptance(proposal, Metric.ACCURACY).plannedExpandedUncertainty().getAsDouble())
                .isCloseTo(0.01, within(1e-12));
        assertThat(acceptance(proposal, Metric.ACCURACY).testUncertaintyRatio().getAsDouble())
                .isCloseTo(50, within(1e-6));
        assertThat(acceptance(proposal, Metric.NONLINEARITY).testUncertaintyRatio().getAsDouble())
                .isCloseTo(12.5, within(1e-6));
        // Hysteresis and repeatability: the common error at a set point cancels, so no reference U and no TUR.
        for (Metric m : List.of(Metric.HYSTERESIS, Metric.REPEATABILITY)) {
            assertThat(acceptance(proposal, m).plannedExpandedUncertainty()).as(m.name()).isEmpty();
            assertThat(acceptance(proposal, m).testUncertaintyRatio()).as(m.name()).isEmpty();
            assertThat(acceptance(proposal, m).reasoning()).contains("cancels");
        }
        assertThat(proposal.acceptance()).allSatisfy(a -> {
            a.plannedExpandedUncertainty().ifPresent(u -> assertThat(u).as(a.metric().name()).isPositive());
            a.testUncertaintyRatio().ifPresent(t -> assertThat(t).as(a.metric().name()).isFinite());
        });
        assertThat(proposal.reasoning()).noneMatch(r -> r.contains("TUR 4:1"));
    }
}
