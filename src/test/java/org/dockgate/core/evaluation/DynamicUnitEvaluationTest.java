package org.dockgate.core.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.Verdict;
import org.dockgate.core.metrics.FrequencyPoint;
import org.dockgate.core.procedure.DerivationOptions;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.ProcedureDerivation;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.Bandwidth;
import org.dockgate.core.procedure.SensorSpecification.NoiseFloor;
import org.dockgate.core.procedure.SensorSpecification.Referred;
import org.dockgate.core.procedure.SensorSpecification.Sensitivity;
import org.dockgate.core.procedure.SensorSpecification.ToleranceMode;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.junit.jupiter.api.Test;

/**
 * An accelerometer whose amplitude response is first order, |H| = 1/√(1 + (f/f_c)²) with f_c = 8 kHz, so its
 * −3 dB frequency is f_c (reference sheet §1.2 and A4: f₋₃dB = 1/(2πτ) = f_c).
 */
class DynamicUnitEvaluationTest {

    static final DecisionPolicy POLICY = DecisionPolicy.guardBanded(1.0);
    static final double CORNER_HZ = 8000;
    /** Sweep reference: 1 % of the amplitude (k = 2), so u/a = 0.5 %. */
    static final ReferenceUncertainty SHAKER_REFERENCE = new ReferenceUncertainty("REF-ACC", a -> 0.01 * a, 2);

    static SensorSpecification accelerometer(Bandwidth bandwidth) {
        return new SensorSpecification(SensorKind.ACCELEROMETER, "g", -50, 50, "mV",
                new Sensitivity(100, "mV/g", 5, ToleranceMode.PERCENT), null, null, null, null, null, null,
                new NoiseFloor(0.0005, "g", Referred.INPUT), null, bandwidth, null);
    }

    static ProcedureProposal procedure(SensorSpecification spec) {
        return ProcedureDerivation.derive(spec, new DerivationOptions(Aql.of(1.0), InspectionLevel.II, POLICY, null),
                List.of());
    }

    static double firstOrder(double f) {
        return 100 / Math.sqrt(1 + (f / CORNER_HZ) * (f / CORNER_HZ));
    }

    static UnitMeasurements sweep(ProcedureProposal procedure, List<Double> noise) {
        List<FrequencyPoint> points = procedure.frequencySweep().frequenciesHz().stream()
                .map(f -> new FrequencyPoint(f, firstOrder(f))).toList();
        return new UnitMeasurements(List.of(), noise, points,
                MeasurementContext.empty().withSweepReference(SHAKER_REFERENCE).withReadoutResolution(0.001));
    }

    @Test
    void theBandwidthOfAFirstOrderSensorIsItsCornerFrequency() {
        SensorSpecification spec = accelerometer(new Bandwidth(5000.0, null, null, 100.0));
        ProcedureProposal procedure = procedure(spec);
        UnitResult result = UnitEvaluation.evaluate(spec, procedure, POLICY, sweep(procedure, List.of()));
        MetricResult bandwidth = result.metric(Metric.BANDWIDTH).orElseThrow();
        // Interpolated linearly in dB against log f between sweep points: within 1 % of f_c.
        assertThat(bandwidth.measured()).isCloseTo(CORNER_HZ, within(0.01 * CORNER_HZ));
        assertThat(bandwidth.verdict()).isEqualTo(Verdict.PASS);
        // u(f) = u(L)/|dL/df| with u(L) = √2·(20/ln 10)·u/a (two amplitudes, each with the reference's u/a = 0.5 %).
        // The level is taken linear in log f between sweep points (as the bandwidth itself is interpolated), so
        // dL/df is the chord of the bracketing segment over f·ln 10:
        List<Double> f = procedure.frequencySweep().frequenciesHz();
        int above = 0;
        while (f.get(above) < bandwidth.measured()) {
            above++;
        }
        double f1 = f.get(above - 1);
        double f2 = f.get(above);
        double chordDbPerDecade = 20 * Math.log10(firstOrder(f2) / firstOrder(f1)) / Math.log10(f2 / f1);
        double dLdf = chordDbPerDecade / (bandwidth.measured() * Math.log(10));
        double uL = Math.sqrt(2) * 20 / Math.log(10) * 0.005;
        assertThat(bandwidth.budget().combinedStandardUncertainty()).isCloseTo(uL / Math.abs(dLdf), within(1e-9));
        // Against the first-order curve's own slope at f_c, dL/df = −(20/ln 10)/(2 f_c), u(f) = √2·0.005·2·f_c:
        // the chord is a little steeper, within 10 %.
        double analytic = Math.sqrt(2) * 0.005 * 2 * CORNER_HZ;
        assertThat(bandwidth.budget().combinedStandardUncertainty()).isCloseTo(analytic, within(0.1 * analytic));
        // Static calibration and noise were not recorded: the result is partial and says so (6 points UP, 1 cycle).
        assertThat(result.complete()).isFalse();
        assertThat(result.missing()).contains("static calibration: no readings yet (6 planned)");
    }

    @Test
    void flatnessIsTheLargestDeviationUpToTheBandEdge() {
        SensorSpecification spec = accelerometer(new Bandwidth(null, 5.0, 1000.0, null));
        ProcedureProposal procedure = procedure(spec);
        UnitResult result = UnitEvaluation.evaluate(spec, procedure, POLICY, sweep(procedure, List.of()));
        MetricResult flatness = result.metric(Metric.FLATNESS).orElseThrow();
        // The response falls monotonically: the largest deviation is at the band edge, 1000 Hz, relative to the
        // reference frequency (the sweep's lowest).
        double ratio = firstOrder(1000) / firstOrder(procedure.frequencySweep().referenceHz());
        assertThat(flatness.measured()).isCloseTo(100 * (1 - ratio), within(1e-10));
        // Two reference amplitudes, u/a = 0.5 % each, c = A/A_ref: u_c = √2·0.5·ratio % (GUM 5.1.2).
        assertThat(flatness.budget().combinedStandardUncertainty()).isCloseTo(Math.sqrt(2) * 0.5 * ratio,
                within(1e-12));
        assertThat(flatness.verdict()).isEqualTo(Verdict.PASS);
    }

    @Test
    void inputReferredNoiseUsesTheNominalSensitivityBeforeAStaticCalibration() {
        SensorSpecification spec = accelerometer(new Bandwidth(5000.0, null, null, 100.0));
        ProcedureProposal procedure = procedure(spec);
        // Reference sheet A3: sample SD of 1, −2, 3, −1, 0, 2, −3, 1, −1, 0 µV is 1.8257419 µV; over 100 mV/g that is
        // 1.8257419e-5 g.
        List<Double> noiseMv = java.util.stream.DoubleStream.of(1, -2, 3, -1, 0, 2, -3, 1, -1, 0)
                .map(v -> v / 1000).boxed().toList();
        UnitResult result = UnitEvaluation.evaluate(spec, procedure, POLICY, sweep(procedure, noiseMv));
        MetricResult noise = result.metric(Metric.NOISE).orElseThrow();
        assertThat(noise.measured()).isCloseTo(1.8257419e-5, within(5e-13));
        assertThat(noise.budget().contributions()).anyMatch(c -> c.name().contains("the nominal sensitivity"));
        assertThat(result.missing()).anyMatch(s -> s.startsWith("noise capture: 10 of "));
    }
}
