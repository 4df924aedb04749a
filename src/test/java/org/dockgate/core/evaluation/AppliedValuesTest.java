package org.dockgate.core.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.dockgate.core.evaluation.PressureUnitFixture.POLICY;

import java.util.ArrayList;
import java.util.List;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.NonlinearityReference;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.Direction;
import org.junit.jupiter.api.Test;

/**
 * A unit measured at applied values off the nominal set points (issue 11, item 4): fits, errors and tolerances use
 * the applied value, the set point only groups the readings.
 *
 * <p>The unit: a perfectly linear transducer y = 0.2 mV + 10 mV/bar · x_applied, read at the procedure's 0, 2, …,
 * 10 bar, UP and DOWN, three cycles (36 readings), except that the reference applied 10.02 bar at the 10 bar set
 * point every time (6 readings) and the UP reading of cycle 1 at 2 bar is 0.06 mV high.
 */
class AppliedValuesTest {

    static final SensorSpecification SPEC = PressureUnitFixture.spec(NonlinearityReference.BEST_FIT);
    static final ProcedureProposal PROCEDURE = PressureUnitFixture.procedure(SPEC);
    static final double[] SET_POINTS = {0, 2, 4, 6, 8, 10};

    static double applied(double setPoint) {
        return setPoint == 10 ? 10.02 : setPoint;
    }

    static List<CalibrationPoint> readings() {
        List<CalibrationPoint> points = new ArrayList<>();
        for (int cycle = 1; cycle <= 3; cycle++) {
            for (Direction d : List.of(Direction.UP, Direction.DOWN)) {
                for (int i = 0; i < SET_POINTS.length; i++) {
                    double x = d == Direction.UP ? SET_POINTS[i] : SET_POINTS[SET_POINTS.length - 1 - i];
                    double y = 0.2 + 10 * applied(x) + (x == 2 && d == Direction.UP && cycle == 1 ? 0.06 : 0);
                    points.add(new CalibrationPoint(applied(x), y, d, cycle, x));
                }
            }
        }
        return points;
    }

    static UnitResult evaluate() {
        UnitMeasurements m = new UnitMeasurements(readings(), PressureUnitFixture.noise(PROCEDURE.noiseCapture().samples()),
                List.of(), MeasurementContext.of(PressureUnitFixture.reference(), 0.001));
        return UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, m);
    }

    @Test
    void theSlopeIsFittedThroughTheAppliedPoints() {
        UnitResult result = evaluate();
        assertThat(result.missing()).as("applied values off nominal still fill their set points").isEmpty();
        // By hand, least squares through the applied points (36 readings, 6 at each set point):
        //   Σx = 6·(0 + 2 + 4 + 6 + 8) + 6·10.02 = 120 + 60.12 = 180.12, x̄ = 180.12/36 = 5.003333…
        //   S_xx = Σx² − (Σx)²/n = 6·(0 + 4 + 16 + 36 + 64) + 6·10.02² − 180.12²/36
        //        = 720 + 602.4024 − 901.2004 = 421.202
        //   the line 0.2 + 10·x fits every reading exactly but one, which is 0.06 mV high at x = 2, so
        //   b₁ = 10 + 0.06·(2 − x̄)/S_xx = 10 − 0.06·3.003333/421.202 = 10 − 0.0004278 = 9.9995722 mV/bar.
        // Fitting the set points instead would give 10 + (0.2·6·(10 − 5) + 0.06·(2 − 5))/420 = 10.013857 mV/bar.
        double xBar = 180.12 / 36;
        double sxx = 720 + 6 * 10.02 * 10.02 - 180.12 * 180.12 / 36;
        assertThat(sxx).isCloseTo(421.202, within(1e-9));
        double slope = 10 + 0.06 * (2 - xBar) / sxx;
        assertThat(slope).isCloseTo(9.9995722, within(1e-7));
        assertThat(UnitEvaluationTest.metric(result, Metric.SENSITIVITY).measured()).isCloseTo(slope, within(1e-12));
        // b₀ = ȳ − b₁·x̄ with ȳ = 0.2 + 10·x̄ + 0.06/36
        double offset = 0.2 + 10 * xBar + 0.06 / 36 - slope * xBar;
        assertThat(UnitEvaluationTest.metric(result, Metric.ZERO_OFFSET).measured()).isCloseTo(offset, within(1e-12));
    }

    @Test
    void errorsAreTakenAtTheAppliedValueAndReadingsAreGroupedByTheSetPoint() {
        UnitResult result = evaluate();
        MetricResult accuracy = UnitEvaluationTest.metric(result, Metric.ACCURACY);
        // At the top: y = 0.2 + 10·10.02 = 100.4 mV; the nominal line 10 mV/bar (offset 0) gives x = 10.04 bar,
        // error (10.04 − 10.02)/10 bar span · 100 = 0.2 %FSO (against the set point it would read 0.4 %FSO).
        PointCheck top = accuracy.points().stream().filter(p -> p.input() > 10).findFirst().orElseThrow();
        assertThat(top.input()).isEqualTo(10.02);
        assertThat(top.error()).isCloseTo(0.2, within(1e-9));
        // Referred to their set points along the slope, the six readings at 10 bar fall into one group per
        // direction (10.02 bar is the 10 bar point). Hysteresis: the UP mean at 2 bar is 0.06/3 = 0.02 mV above
        // the DOWN mean, over FSO ≈ 10 mV/bar · 10 bar = 100 mV: 0.02 %FSO.
        assertThat(UnitEvaluationTest.metric(result, Metric.HYSTERESIS).measured()).isCloseTo(0.02, within(1e-5));
        // Repeatability: the 2 bar UP group holds 0.06, 0, 0 above the line (mean 0.02, Σd² = 0.0024), every other
        // group nothing; pooled over 12 groups of 3 (24 degrees of freedom): s_p = √(0.0024/24) = 0.01 mV = 0.01 %FSO.
        assertThat(UnitEvaluationTest.metric(result, Metric.REPEATABILITY).measured()).isCloseTo(0.01, within(1e-5));
    }
}
