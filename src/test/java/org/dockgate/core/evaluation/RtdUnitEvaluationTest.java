package org.dockgate.core.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.Verdict;
import org.dockgate.core.procedure.DerivationOptions;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.ProcedureDerivation;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.ProcedureProposal.StaticCalibration;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.RtdClass;
import org.dockgate.core.rtd.CallendarVanDusen;
import org.dockgate.core.rtd.RtdConstruction;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.Direction;
import org.junit.jupiter.api.Test;

/** A Pt100 class A unit read at the IEC 60751 table resistances (reference sheet §6.1 and check case A8). */
class RtdUnitEvaluationTest {

    static final DecisionPolicy POLICY = DecisionPolicy.guardBanded(1.0);
    static final SensorSpecification SPEC = new SensorSpecification(SensorKind.RTD, "°C", -100, 400, "Ω", null, null,
            null, null, null, null, null, null, null, null, new RtdClass(100, "A"));
    /** The temperatures of A8's table, as the procedure's set points. */
    static final double[] TEMPERATURES_C = {-100, 0, 100, 200, 400};
    /** IEC 60751 table values, 2 decimals, confirmed in the reference sheet A8 [C: S12]. */
    static final double[] TABLE_OHM = {60.26, 100.00, 138.51, 175.86, 247.09};
    static final double A = 3.9083e-3;  // IEC 60751 (reference sheet §6.1)
    static final double B = -5.775e-7;

    static ProcedureProposal procedure() {
        ProcedureProposal derived = ProcedureDerivation.derive(SPEC,
                new DerivationOptions(Aql.of(1.0), InspectionLevel.II, POLICY, null), List.of());
        StaticCalibration s = derived.staticCalibration();
        List<Double> points = java.util.Arrays.stream(TEMPERATURES_C).boxed().toList();
        StaticCalibration a8Points = new StaticCalibration(List.of(0.0, 20.0, 40.0, 60.0, 100.0), points,
                s.inputUnit(), s.directions(), s.cycles(), s.settleSeconds(), "DRY-BLOCK-2", s.reasoning());
        return new ProcedureProposal(a8Points, derived.noiseCapture(), derived.frequencySweep(),
                derived.acceptance(), derived.sampling(), derived.environment(), derived.cautions(),
                derived.estimatedBenchMinutes(), derived.reasoning());
    }

    static UnitMeasurements unit(double[] ohm) {
        List<CalibrationPoint> points = new ArrayList<>();
        for (int i = 0; i < ohm.length; i++) {
            points.add(new CalibrationPoint(TEMPERATURES_C[i], ohm[i], Direction.UP, 1));
        }
        // Dry block U = 0.02 °C (k = 2); ohmmeter digit 0.001 Ω.
        return new UnitMeasurements(points, List.of(), List.of(),
                MeasurementContext.of(ReferenceUncertainty.constant("DRY-BLOCK-2", 0.02, 2), 0.001));
    }

    /** R(t) = R0(1 + A t + B t²) for t ≥ 0 (IEC 60751, reference sheet §6.1). */
    static double resistance(double t) {
        return 100 * (1 + A * t + B * t * t);
    }

    @Test
    void tableResistancesPassClassA() {
        UnitResult result = UnitEvaluation.evaluate(SPEC, procedure(), POLICY, unit(TABLE_OHM));
        assertThat(result.missing()).isEmpty();
        MetricResult rtd = result.metric(Metric.RTD_TOLERANCE).orElseThrow();
        assertThat(rtd.points()).hasSize(5).allSatisfy(p -> assertThat(p.verdict()).isEqualTo(Verdict.PASS));
        // A8: R = 175.86 Ω -> 200.010878 °C, so the 200 °C reading's error is +0.010878 °C.
        assertThat(rtd.points().get(3).error()).isCloseTo(0.010878, within(5e-7));
        // Each point is judged against class A at its own temperature: ±(0.15 + 0.002|t|), A8: 0.35 °C at 100 °C,
        // 0.95 °C at 400 °C, 0.35 °C at -100 °C.
        double[] expected = {0.35, 0.15, 0.35, 0.55, 0.95};
        for (int i = 0; i < expected.length; i++) {
            assertThat(rtd.points().get(i).tolerance().upper().getAsDouble()).isCloseTo(expected[i], within(1e-12));
        }
        assertThat(result.unitVerdict()).contains(Verdict.PASS);
    }

    @Test
    void aUnitReadingTwoTenthsHighAtZeroFailsClassA() {
        double[] shifted = TABLE_OHM.clone();
        shifted[1] = resistance(0.2); // reads like 0.2 °C when at 0 °C
        UnitResult result = UnitEvaluation.evaluate(SPEC, procedure(), POLICY, unit(shifted));
        MetricResult rtd = result.metric(Metric.RTD_TOLERANCE).orElseThrow();
        assertThat(rtd.verdict()).isEqualTo(Verdict.FAIL);
        // The deciding point is 0 °C, where class A allows ±0.15 °C (A8).
        assertThat(rtd.measured()).isCloseTo(0.2, within(1e-9));
        assertThat(rtd.tolerance().upper().getAsDouble()).isCloseTo(0.15, within(1e-12));
        assertThat(result.unitVerdict()).contains(Verdict.FAIL);
    }

    @Test
    void theSameErrorAtOneHundredDegreesPassesItsWiderTolerance() {
        double[] shifted = TABLE_OHM.clone();
        shifted[2] = resistance(100.2); // +0.2 °C at 100 °C, where class A allows ±0.35 °C
        UnitResult result = UnitEvaluation.evaluate(SPEC, procedure(), POLICY, unit(shifted));
        MetricResult rtd = result.metric(Metric.RTD_TOLERANCE).orElseThrow();
        assertThat(rtd.points().get(2).error()).isCloseTo(0.2, within(1e-9));
        assertThat(rtd.verdict()).isEqualTo(Verdict.PASS);
    }

    @Test
    void theBudgetOfAPointCarriesTheResolutionThroughTheSlope() {
        UnitResult result = UnitEvaluation.evaluate(SPEC, procedure(), POLICY, unit(TABLE_OHM));
        PointCheck at100 = result.metric(Metric.RTD_TOLERANCE).orElseThrow().points().get(2);
        // Reference 0.02/2 °C, c = 1; digit 0.001 Ω -> 0.0005/√3 Ω over dR/dt = R0(A + 2Bt) = 0.379280 Ω/K at
        // 100 °C (A8); single readings, no Type A. GUM 5.1.2: root sum of squares.
        double uRes = 0.0005 / Math.sqrt(3) / (100 * (A + 2 * B * 100));
        double uc = Math.sqrt(0.01 * 0.01 + uRes * uRes);
        assertThat(100 * (A + 2 * B * 100)).isCloseTo(0.379280, within(5e-7));
        assertThat(at100.budget().combinedStandardUncertainty()).isCloseTo(uc, within(1e-15));
        // All terms have nu = inf: k = 2 at 95.45 % (GUM G.6.6).
        assertThat(at100.uncertainty().coverageFactor()).isCloseTo(2.0, within(1e-9));
    }

    @Test
    void aClassAFilmElementIsNotJudgedAtMinusFifty() {
        // IEC 60751:2008 Table 3 (from memory, not checked against the printed table): class A thin-film
        // -30 … 300 °C, wire-wound -100 … 450 °C.
        double[] temperatures = {-50, 0, 100, 200};
        CallendarVanDusen curve = CallendarVanDusen.iec60751(100);
        List<CalibrationPoint> points = new ArrayList<>();
        for (double t : temperatures) {
            points.add(new CalibrationPoint(t, curve.resistanceOhm(t), Direction.UP, 1));
        }
        // Reads 0.2 °C high at -50 °C only: class A allows ±0.25 °C there, a wire-wound unit passes at that point.
        points.set(0, new CalibrationPoint(-50, curve.resistanceOhm(-49.8), Direction.UP, 1));
        UnitMeasurements unit = new UnitMeasurements(points, List.of(), List.of(),
                MeasurementContext.of(ReferenceUncertainty.constant("DRY-BLOCK-2", 0.02, 2), 0.001));
        for (RtdConstruction construction : RtdConstruction.values()) {
            SensorSpecification spec = new SensorSpecification(SensorKind.RTD, "°C", -50, 200, "Ω", null, null, null,
                    null, null, null, null, null, null, null, new RtdClass(100, "A", construction));
            ProcedureProposal derived = ProcedureDerivation.derive(spec,
                    new DerivationOptions(Aql.of(1.0), InspectionLevel.II, POLICY, null), List.of());
            StaticCalibration s = derived.staticCalibration();
            ProcedureProposal procedure = new ProcedureProposal(new StaticCalibration(List.of(0.0, 20.0, 60.0, 100.0),
                    java.util.Arrays.stream(temperatures).boxed().toList(), s.inputUnit(), s.directions(), s.cycles(),
                    s.settleSeconds(), "DRY-BLOCK-2", s.reasoning()), derived.noiseCapture(), derived.frequencySweep(),
                    derived.acceptance(), derived.sampling(), derived.environment(), derived.cautions(),
                    derived.estimatedBenchMinutes(), derived.reasoning());
            MetricResult rtd = UnitEvaluation.evaluate(spec, procedure, POLICY, unit).metric(Metric.RTD_TOLERANCE)
                    .orElseThrow();
            if (construction == RtdConstruction.WIRE_WOUND) {
                assertThat(rtd.points()).hasSize(4);
                assertThat(rtd.points().get(0).input()).isEqualTo(-50.0);
                assertThat(rtd.note()).doesNotContain("does not apply");
            } else {
                // The -50 °C reading gets no verdict; the note says the class does not apply there.
                assertThat(rtd.points()).hasSize(3).noneMatch(p -> p.input() == -50.0);
                assertThat(rtd.note()).contains("Class A does not apply at -50 °C: outside its validity range for a"
                        + " thin-film element, -30 … 300 °C (IEC 60751:2008 Table 3)");
                assertThat(derived.reasoning()).anyMatch(r -> r.startsWith("Outside the validity range of class A for"
                        + " a thin-film element (-30 … 300 °C, IEC 60751:2008 Table 3)"));
            }
            assertThat(rtd.verdict()).isEqualTo(Verdict.PASS);
        }
    }
}
