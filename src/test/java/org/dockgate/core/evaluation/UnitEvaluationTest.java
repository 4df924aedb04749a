package org.dockgate.core.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.dockgate.core.evaluation.PressureUnitFixture.D;
import static org.dockgate.core.evaluation.PressureUnitFixture.H;
import static org.dockgate.core.evaluation.PressureUnitFixture.OFFSET;
import static org.dockgate.core.evaluation.PressureUnitFixture.P;
import static org.dockgate.core.evaluation.PressureUnitFixture.POLICY;

import java.util.List;
import org.apache.commons.math3.distribution.TDistribution;
import org.dockgate.core.decision.Verdict;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.NonlinearityReference;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.Direction;
import org.dockgate.core.uncertainty.UncertaintyContribution;
import org.junit.jupiter.api.Test;

/**
 * A whole pressure-transducer unit evaluated end to end against values computed by hand from the known parts of
 * {@link PressureUnitFixture} (formulas of the reference sheet §1.2 and GUM 5.1.2 / G.4.1).
 */
class UnitEvaluationTest {

    static final SensorSpecification SPEC = PressureUnitFixture.spec(NonlinearityReference.BEST_FIT);
    static final ProcedureProposal PROCEDURE = PressureUnitFixture.procedure(SPEC);
    static final double DIGIT_MV = 0.001;
    static final Environment ENVIRONMENT = Environment.fromAmbient(25, 23).withGainCoefficient(0.01);

    /** Σ over the six set points of the bow's deviation from its mean, squared: (64 + 2.56 + 40.96)·2/225 · P². */
    static final double SUM_BOW_DEVIATIONS_SQUARED = (64 + 2.56 + 40.96) * 2 / 225 * P * P;
    /** SSE of the 36-reading fit = 6·Σ bow deviation² + 36·(H/2)² + 12·2·D² (cross terms cancel by balance). */
    static final double SSE = 6 * SUM_BOW_DEVIATIONS_SQUARED + 9 * H * H + 24 * D * D;
    /** S_xx over 36 readings: 6 readings at each of 0 … 10 bar, 6·Σ(x − 5)² = 6·70. */
    static final double SXX = 420;
    static final double RESIDUAL_SD = Math.sqrt(SSE / 34);

    static UnitMeasurements complete(double hysteresis) {
        return new UnitMeasurements(PressureUnitFixture.readings(hysteresis),
                PressureUnitFixture.noise(PROCEDURE.noiseCapture().samples()), List.of(),
                MeasurementContext.of(PressureUnitFixture.reference(), DIGIT_MV).withEnvironment(ENVIRONMENT));
    }

    static MetricResult metric(UnitResult result, Metric metric) {
        return result.metric(metric).orElseThrow(() -> new AssertionError(metric + " missing: " + result.missing()));
    }

    @Test
    void theProcedurePlansWhatTheFixtureRecords() {
        // ProcedureDerivation: hysteresis and repeatability specified -> UP and DOWN, 3 cycles, 0, 2, ..., 10 bar
        assertThat(PROCEDURE.staticCalibration().pointsInput()).containsExactly(0.0, 2.0, 4.0, 6.0, 8.0, 10.0);
        assertThat(PROCEDURE.staticCalibration().cycles()).isEqualTo(3);
        assertThat(PROCEDURE.noiseCapture().samples() % 10).isZero();
    }

    @Test
    void aWholeUnitMatchesTheHandComputedValues() {
        UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, complete(H));
        assertThat(result.missing()).isEmpty();
        assertThat(result.complete()).isTrue();

        // Sensitivity: the bow is symmetric and the DOWN shift and scatter balanced, so b1 = 10 mV/bar exactly.
        assertThat(metric(result, Metric.SENSITIVITY).measured()).isCloseTo(10.0, within(1e-12));
        // Offset: b0 = OFFSET + mean bow (8/15 P) + H/2.
        assertThat(metric(result, Metric.ZERO_OFFSET).measured()).isCloseTo(OFFSET + 8.0 / 15 * P + H / 2,
                within(1e-12));
        // FSO = 10 mV/bar x 10 bar = 100 mV, so mV and %FSO coincide.
        // Best-fit nonlinearity: largest |bow - mean bow| = 8/15 P = 0.08 mV at the ends -> 0.08 %FSO.
        assertThat(metric(result, Metric.NONLINEARITY).measured()).isCloseTo(8.0 / 15 * P, within(1e-12));
        // Hysteresis: mean DOWN - mean UP = H at every point -> 0.05 %FSO.
        assertThat(metric(result, Metric.HYSTERESIS).measured()).isCloseTo(H, within(1e-12));
        // Repeatability: the sample SD of -D, 0, +D is D at each of 12 point/direction groups -> 0.01 %FSO.
        assertThat(metric(result, Metric.REPEATABILITY).measured()).isCloseTo(D, within(1e-12));
        // Noise: the A3 record repeated N/10 times has mean 0 and Σv² = 3N µV², so s = sqrt(3N/(N - 1)) µV.
        int n = PROCEDURE.noiseCapture().samples();
        assertThat(metric(result, Metric.NOISE).measured()).isCloseTo(Math.sqrt(3.0 * n / (n - 1)), within(1e-9));
        assertThat(metric(result, Metric.NOISE).unit()).isEqualTo("µV rms");
        // Accuracy against 10 mV/bar, zero 0: worst reading 4 or 6 bar DOWN cycle 3,
        // OFFSET + 0.96 P + H + D = 0.404 mV = 0.0404 bar = 0.404 % of the 10 bar span.
        MetricResult accuracy = metric(result, Metric.ACCURACY);
        assertThat(accuracy.measured()).isCloseTo(OFFSET + 0.96 * P + H + D, within(1e-9));
        assertThat(accuracy.points()).hasSize(36);
        assertThat(accuracy.points()).allSatisfy(p -> assertThat(p.verdict()).isEqualTo(Verdict.PASS));

        assertThat(result.metrics()).extracting(MetricResult::verdict).containsOnly(Verdict.PASS);
        assertThat(result.unitVerdict()).contains(Verdict.PASS);
    }

    @Test
    void terminalNonlinearityIsTheBowPeakAtTheInteriorPoints() {
        SensorSpecification terminal = PressureUnitFixture.spec(NonlinearityReference.TERMINAL);
        UnitResult result = UnitEvaluation.evaluate(terminal, PressureUnitFixture.procedure(terminal),
                POLICY, complete(H));
        // The end-point line passes through the ends where the bow is 0: deviation = bow, largest 0.96 P at 4 and 6 bar.
        assertThat(metric(result, Metric.NONLINEARITY).measured()).isCloseTo(0.96 * P, within(1e-12));
    }

    @Test
    void theSensitivityBudgetCombinesAsGum512Says() {
        UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, complete(H));
        MetricResult sensitivity = metric(result, Metric.SENSITIVITY);
        // Type A: u(b1) = s / sqrt(Sxx), s from SSE over 36 - 2 degrees of freedom.
        double uA = RESIDUAL_SD / Math.sqrt(SXX);
        // Reference: U(10 bar) = 0.0005 + 0.0002 x 10 = 0.0025 bar, k = 2 -> 0.00125 bar; c = S/x = 10/10 mV/bar per bar.
        double uRef = 0.0025 / 2 * (10.0 / 10.0);
        // Resolution: 0.001 mV digit, half-width 0.0005 mV, rectangular (GUM F.2.2.1); c = 1/sqrt(Sxx).
        double uRes = 0.0005 / Math.sqrt(3) / Math.sqrt(SXX);
        // Environment: 0.01 %/°C x 2 K on 10 mV/bar = 0.002 mV/bar half-width, rectangular.
        double uEnv = 0.0001 * 2 * 10 / Math.sqrt(3);
        // GUM 5.1.2: u_c = sqrt(sum of squares); G.4.1: nu_eff = u_c^4 / (uA^4 / 34), the Type B terms having nu = inf.
        double uc = Math.sqrt(uA * uA + uRef * uRef + uRes * uRes + uEnv * uEnv);
        double nuEff = Math.pow(uc, 4) / (Math.pow(uA, 4) / 34);
        // GUM G.6.4: k = t_p(floor nu_eff) at p = 95.45 %; Commons Math's t distribution as the oracle.
        double k = new TDistribution(Math.floor(nuEff)).inverseCumulativeProbability((1 + 0.9544997361036416) / 2);

        assertThat(sensitivity.budget().contributions()).hasSize(4);
        assertThat(sensitivity.budget().combinedStandardUncertainty()).isCloseTo(uc, within(1e-15));
        assertThat(sensitivity.budget().effectiveDegreesOfFreedom()).isCloseTo(nuEff, within(1e-9 * nuEff));
        assertThat(sensitivity.uncertainty().coverageFactor()).isCloseTo(k, within(1e-9));
        assertThat(sensitivity.uncertainty().value()).isCloseTo(k * uc, within(1e-12));
        List<Double> lines = sensitivity.budget().contributions().stream()
                .map(UncertaintyContribution::contribution).toList();
        double[] expected = {uA, uRef, uRes, uEnv};
        for (int i = 0; i < expected.length; i++) {
            assertThat(lines.get(i)).as("budget line %d", i + 1).isCloseTo(expected[i], within(1e-15));
        }

        // The verdict is the rule applied to these numbers: 10 inside 9.9 + U ... 10.1 - U (ILAC G8 w = U).
        assertThat(sensitivity.acceptanceLower().getAsDouble()).isCloseTo(9.9 + k * uc, within(1e-12));
        assertThat(sensitivity.acceptanceUpper().getAsDouble()).isCloseTo(10.1 - k * uc, within(1e-12));
        assertThat(sensitivity.verdict()).isEqualTo(Verdict.PASS);
        // TUR = (T_U - T_L) / (2U) (ANSI/NCSL Z540.3)
        assertThat(sensitivity.testUncertaintyRatio().getAsDouble()).isCloseTo(0.2 / (2 * k * uc), within(1e-9));
    }

    @Test
    void theHysteresisBudgetIsTheDifferenceOfTwoMeansPlusResolutionTheReferenceCancels() {
        UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, complete(H));
        MetricResult hysteresis = metric(result, Metric.HYSTERESIS);
        // FSO = 100 mV -> c = 100/FSO = 1 %FSO per mV; the first largest difference is at 0 bar.
        double uA = D * Math.sqrt(1.0 / 3 + 1.0 / 3);       // pooled s_p = D, 3 UP and 3 DOWN readings
        // The reference's error at 0 bar is common to the UP and DOWN readings there: it cancels (line of zero).
        double uRes = 0.0005 / Math.sqrt(3) * Math.sqrt(2);  // two readings differenced
        double uc = Math.sqrt(uA * uA + uRes * uRes);
        assertThat(hysteresis.budget().contributions()).anyMatch(c -> c.name().startsWith("reference certificate:")
                && c.name().contains("cancels in their difference") && c.contribution() == 0.0);
        // s_p is computed from the readings: equal to D up to rounding in the last digits
        assertThat(hysteresis.budget().combinedStandardUncertainty()).isCloseTo(uc, within(1e-13));
        // Only the Type A term has finite nu (24 = 12 groups x 2): nu_eff = u_c^4 / (uA^4 / 24).
        assertThat(hysteresis.budget().effectiveDegreesOfFreedom())
                .isCloseTo(Math.pow(uc, 4) / (Math.pow(uA, 4) / 24), within(1e-6));
        // The environment is recorded but a gain shift alike at every point does not change hysteresis.
        assertThat(hysteresis.budget().contributions()).anyMatch(c -> c.name().contains("does not change")
                && c.contribution() == 0.0);
        // TUR for an upper limit on a non-negative figure: L / (2U), as the procedure derivation plans it.
        assertThat(hysteresis.testUncertaintyRatio().getAsDouble())
                .isCloseTo(0.1 / (2 * hysteresis.uncertainty().value()), within(1e-12));
    }

    @Test
    void theHysteresisUncertaintyDoesNotDependOnWhereTheLargestDifferenceLies() {
        // Case 1: DOWN readings shifted by H everywhere, the first largest difference is at 0 bar.
        MetricResult atZero = metric(UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, complete(H)), Metric.HYSTERESIS);
        // Case 2: the DOWN readings at 4 and 6 bar shifted by 0.01 mV more (symmetric about x̄ = 5 bar, so the
        // slope and FSO stay the same), so the first largest difference is at 4 bar, where the reference's U
        // (0.0005 + 0.0002·4 = 0.0013 bar) is 2.6 times U(0 bar) = 0.0005 bar.
        UnitMeasurements base = complete(H);
        List<CalibrationPoint> shifted = base.staticPoints().stream()
                .map(p -> (p.input() == 4.0 || p.input() == 6.0) && p.direction() == Direction.DOWN
                        ? new CalibrationPoint(p.input(), p.output() + 0.01, p.direction(), p.cycle()) : p)
                .toList();
        UnitMeasurements atFour = new UnitMeasurements(shifted, base.noiseSamples(), base.sweepPoints(), base.context());
        MetricResult atFourBar = metric(UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, atFour), Metric.HYSTERESIS);
        assertThat(atFourBar.note()).contains("at 4 bar");
        assertThat(atZero.note()).contains("at 0 bar");
        // The measured hysteresis differs (0.06 against 0.05 mV over FSO), its U does not: the reference
        // cancels, and the Type A (3 + 3 readings) and resolution lines are alike at both points.
        assertThat(atFourBar.measured()).isGreaterThan(atZero.measured());
        assertThat(atFourBar.uncertainty().value()).isCloseTo(atZero.uncertainty().value(),
                within(1e-12 * atZero.uncertainty().value()));
        double uA = D * Math.sqrt(1.0 / 3 + 1.0 / 3);
        double uRes = 0.0005 / Math.sqrt(3) * Math.sqrt(2);
        assertThat(atFourBar.budget().combinedStandardUncertainty())
                .isCloseTo(Math.sqrt(uA * uA + uRes * uRes), within(1e-13));
    }

    @Test
    void theNonlinearityTakesTheLargestReferenceUncertaintyOverTheSetPoints() {
        MetricResult nonlinearity = metric(UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, complete(H)),
                Metric.NONLINEARITY);
        // U(x) = 0.0005 + 0.0002·|x| bar is largest at 10 bar: 0.0025 bar, k = 2; c = 100/span = 10 %FSO/bar,
        // whichever set point the largest deviation falls on.
        assertThat(nonlinearity.budget().contributions())
                .filteredOn(c -> c.name().startsWith("reference PC-7"))
                .singleElement()
                .satisfies(c -> {
                    assertThat(c.name()).contains("at 10 bar").contains("point error");
                    assertThat(c.contribution()).isCloseTo(0.0025 / 2 * 10, within(1e-15));
                });
    }

    @Test
    void withoutAnEnvironmentTheBudgetSaysSo() {
        UnitMeasurements m = complete(H);
        UnitMeasurements noEnvironment = new UnitMeasurements(m.staticPoints(), m.noiseSamples(), m.sweepPoints(),
                MeasurementContext.of(PressureUnitFixture.reference(), DIGIT_MV));
        UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, noEnvironment);
        // The environment is optional: the result stays complete.
        assertThat(result.complete()).isTrue();
        assertThat(metric(result, Metric.SENSITIVITY).budget().contributions())
                .anyMatch(c -> c.name().equals("environment: not recorded, no contribution") && c.contribution() == 0);
    }

    @Test
    void theUnitVerdictIsTheWorstMetric() {
        // Hysteresis 0.2 mV = 0.2 %FSO against at most 0.1 %FSO: fails; everything else still passes.
        UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, complete(0.2));
        assertThat(metric(result, Metric.HYSTERESIS).verdict()).isEqualTo(Verdict.FAIL);
        assertThat(metric(result, Metric.SENSITIVITY).verdict()).isEqualTo(Verdict.PASS);
        assertThat(metric(result, Metric.REPEATABILITY).verdict()).isEqualTo(Verdict.PASS);
        assertThat(result.unitVerdict()).contains(Verdict.FAIL);
        assertThat(result.unitVerdict()).contains(
                Verdict.worst(result.metrics().stream().map(MetricResult::verdict).toList()));
    }

    @Test
    void aNonBinaryRuleGivesAConditionalUnitVerdict() {
        // Hysteresis 0.095 %FSO: inside the 0.1 limit but within U of it -> CONDITIONAL_PASS (ILAC G8 4.2.3).
        UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE,
                org.dockgate.core.decision.DecisionPolicy.nonBinary(), complete(0.095));
        assertThat(metric(result, Metric.HYSTERESIS).verdict()).isEqualTo(Verdict.CONDITIONAL_PASS);
        assertThat(result.unitVerdict()).contains(Verdict.CONDITIONAL_PASS);
    }

    @Test
    void partialMeasurementsGivePartialResultsAndNameWhatIsMissing() {
        // Only the first upscale traverse has been read, no noise, and no reference chosen yet.
        List<CalibrationPoint> firstTraverse = PressureUnitFixture.readings(H).stream()
                .filter(p -> p.cycle() == 1 && p.direction() == Direction.UP).toList();
        UnitMeasurements partial = new UnitMeasurements(firstTraverse, List.of(), List.of(),
                MeasurementContext.empty().withReadoutResolution(DIGIT_MV));
        UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, partial);

        assertThat(result.complete()).isFalse();
        assertThat(result.missing())
                .contains("static reading at 10 bar, DOWN, cycle 1", "static reading at 0 bar, UP, cycle 2",
                        "noise capture: no samples yet (" + PROCEDURE.noiseCapture().samples() + " planned)",
                        "the static calibration's reference instrument and its certificate (U, k)")
                .anyMatch(s -> s.startsWith("… and ") && s.contains("(30 of 36 missing)"))
                .anyMatch(s -> s.startsWith("Hysteresis not evaluated yet: ") && s.contains("DOWN readings missing"))
                .anyMatch(s -> s.startsWith("Repeatability not evaluated yet: "))
                .anyMatch(s -> s.startsWith("Noise not evaluated yet: "));
        // Six points of one traverse still give a slope: 10 mV/bar (the bow is symmetric), with a budget that says
        // the reference is not recorded.
        MetricResult sensitivity = metric(result, Metric.SENSITIVITY);
        assertThat(sensitivity.measured()).isCloseTo(10.0, within(1e-12));
        assertThat(sensitivity.budget().contributions()).anyMatch(c -> c.name().startsWith("reference certificate: not"));
        assertThat(result.unitVerdict()).isPresent();
    }

    @Test
    void everyPrefixOfTheReadingsEvaluatesAndOnlyTheLastIsComplete() {
        // Live verdicts: readings arrive one at a time in the procedure's order; each partial set must evaluate
        // (missing items named, never an exception) and only the full set is complete.
        UnitMeasurements all = complete(H);
        List<CalibrationPoint> readings = all.staticPoints();
        for (int n = 0; n <= readings.size(); n++) {
            UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, new UnitMeasurements(
                    readings.subList(0, n), all.noiseSamples(), List.of(), all.context()));
            assertThat(result.complete()).as("complete after %d readings", n).isEqualTo(n == readings.size());
            assertThat(result.missing().isEmpty()).isEqualTo(result.complete());
            if (n >= 2) {
                assertThat(result.metric(Metric.SENSITIVITY)).as("sensitivity after %d readings", n).isPresent();
            }
        }
    }

    @Test
    void nothingMeasuredGivesNoVerdict() {
        UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY,
                UnitMeasurements.builder().build());
        assertThat(result.metrics()).isEmpty();
        assertThat(result.unitVerdict()).isEmpty();
        assertThat(result.missing()).contains("static calibration: no readings yet (36 planned)");
    }

    @Test
    void readingsConvertedFromAnotherUnitCountForTheirSetPoint() {
        // 2 bar written as 29.00755 psi arrives as 2.0000000x bar: within 1e-6 of the span it is the set point.
        List<CalibrationPoint> points = new java.util.ArrayList<>(PressureUnitFixture.readings(H));
        CalibrationPoint first = points.get(1);
        points.set(1, new CalibrationPoint(first.input() * (1 + 1e-9), first.output(), first.direction(),
                first.cycle()));
        UnitMeasurements m = complete(H);
        UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY,
                new UnitMeasurements(points, m.noiseSamples(), m.sweepPoints(), m.context()));
        assertThat(result.complete()).isTrue();
        assertThat(metric(result, Metric.REPEATABILITY).measured()).isCloseTo(D, within(1e-12));
    }
}
