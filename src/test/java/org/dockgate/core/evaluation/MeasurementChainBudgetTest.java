package org.dockgate.core.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.dockgate.core.evaluation.PressureUnitFixture.POLICY;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.NonlinearityReference;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.Direction;
import org.dockgate.core.uncertainty.UncertaintyContribution;
import org.junit.jupiter.api.Test;

/**
 * Every instrument of the measurement chain in the budget (issue 11, item 3): the readout's U at the reading and
 * its register resolution, the excitation supply's u(V)/V, each named with its certificate, worked by hand.
 *
 * <p>The unit: y = 0.2 mV + 10 mV/bar · x exactly at 0, 2, …, 10 bar, UP and DOWN, three cycles (36 readings,
 * S_xx = 6·Σ(x − 5)² = 6·70 = 420 bar²). The readout: U(y) = 0.002 mV + 0.01 % of |y| (k = 2), resolution
 * δ = 0.01 mV; the excitation: u(V)/V = 0.005 %.
 */
class MeasurementChainBudgetTest {

    static final SensorSpecification SPEC = PressureUnitFixture.spec(NonlinearityReference.BEST_FIT);
    static final ProcedureProposal PROCEDURE = PressureUnitFixture.procedure(SPEC);
    static final String READOUT = "RI-DMM-09, certificate C-DMM-1";
    static final String EXCITATION = "RI-PSU-09, certificate C-PSU-1";

    static List<CalibrationPoint> line() {
        List<CalibrationPoint> points = new ArrayList<>();
        for (int cycle = 1; cycle <= 3; cycle++) {
            for (Direction d : List.of(Direction.UP, Direction.DOWN)) {
                for (int i = 0; i <= 5; i++) {
                    double x = 2.0 * (d == Direction.UP ? i : 5 - i);
                    points.add(new CalibrationPoint(x, 0.2 + 10 * x, d, cycle));
                }
            }
        }
        return points;
    }

    static UnitResult evaluate(boolean ratiometric) {
        MeasurementContext context = MeasurementContext.of(PressureUnitFixture.reference(), 0.5)
                .withReadout(new ReadoutInstrument(READOUT, y -> 0.002 + 0.0001 * Math.abs(y), 2.0,
                        OptionalDouble.of(0.01)))
                .withExcitation(ratiometric
                        ? new ExcitationSupply(EXCITATION, 0, true, "ratiometric measurement (output in mV/V)")
                        : new ExcitationSupply(EXCITATION, 0.00005, false, "at the set voltage"));
        UnitMeasurements m = new UnitMeasurements(line(), PressureUnitFixture.noise(PROCEDURE.noiseCapture().samples()),
                List.of(), context);
        return UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, m);
    }

    static UncertaintyContribution line(MetricResult metric, String prefix) {
        return metric.budget().contributions().stream().filter(c -> c.name().startsWith(prefix)).findFirst()
                .orElseThrow(() -> new AssertionError("no line '" + prefix + "' in " + metric.budget().contributions()));
    }

    @Test
    void theSensitivityBudgetCarriesTheReadoutItsResolutionAndTheExcitation() {
        UnitResult result = evaluate(false);
        assertThat(result.missing()).isEmpty();
        MetricResult s = UnitEvaluationTest.metric(result, Metric.SENSITIVITY);
        assertThat(s.measured()).isCloseTo(10.0, within(1e-12));
        // Readout at the top reading y = 0.2 + 10·10 = 100.2 mV: U = 0.002 + 0.0001·100.2 = 0.01202 mV, k = 2,
        // u = 0.00601 mV; a scale error over the top input: c = 1/(10 bar) → 0.000601 mV/bar.
        UncertaintyContribution readout = line(s, "readout " + READOUT + ": U = ");
        assertThat(readout.standardUncertainty()).isCloseTo(0.00601, within(1e-12));
        assertThat(readout.sensitivityCoefficient()).isCloseTo(0.1, within(1e-12));
        assertThat(readout.name()).contains("at 100.2");
        // Register resolution δ = 0.01 mV (not the 0.5 mV digit the context was built with: the readout's
        // register figure wins): u = δ/(2√3) = 0.0028868 mV (JCGM 100:2008 F.2.2.1), c = 1/√S_xx = 1/√420.
        UncertaintyContribution resolution = line(s, "readout " + READOUT + " resolution");
        assertThat(resolution.standardUncertainty()).isCloseTo(0.01 / (2 * Math.sqrt(3)), within(1e-12));
        assertThat(resolution.standardUncertainty()).isCloseTo(0.0028868, within(1e-7));
        assertThat(resolution.sensitivityCoefficient()).isCloseTo(1 / Math.sqrt(420), within(1e-12));
        // Excitation: a scale error of every reading, u = 0.005 % · |b₁| = 0.00005 · 10 = 0.0005 mV/bar, c = 1.
        UncertaintyContribution excitation = line(s, "excitation " + EXCITATION);
        assertThat(excitation.standardUncertainty()).isCloseTo(0.0005, within(1e-12));
        assertThat(excitation.sensitivityCoefficient()).isEqualTo(1.0);
    }

    @Test
    void differencesCancelTheReadoutAndARatiometricMeasurementCancelsTheExcitation() {
        UnitResult result = evaluate(true);
        MetricResult hysteresis = UnitEvaluationTest.metric(result, Metric.HYSTERESIS);
        assertThat(line(hysteresis, "readout " + READOUT + ": its error at a set point").standardUncertainty())
                .isZero();
        MetricResult sensitivity = UnitEvaluationTest.metric(result, Metric.SENSITIVITY);
        UncertaintyContribution excitation = line(sensitivity, "excitation " + EXCITATION);
        assertThat(excitation.standardUncertainty()).isZero();
        assertThat(excitation.name()).contains("ratiometric").contains("cancels");
        // Accuracy at the top reading: readout point error u = 0.00601 mV, c = 100/(span·S_nominal) = 100/(10·10)
        // = 1 %FSO per mV.
        MetricResult accuracy = UnitEvaluationTest.metric(result, Metric.ACCURACY);
        PointCheck top = accuracy.points().stream().filter(p -> p.input() == 10).findFirst().orElseThrow();
        UncertaintyContribution atTop = top.budget().contributions().stream()
                .filter(c -> c.name().startsWith("readout " + READOUT + ": U = ")).findFirst().orElseThrow();
        assertThat(atTop.standardUncertainty() * atTop.sensitivityCoefficient()).isCloseTo(0.00601, within(1e-12));
    }

    @Test
    void readingsWithoutAReadoutAreEvaluatedAndSaySo() {
        MeasurementContext context = MeasurementContext.of(PressureUnitFixture.reference(), 0.5).withReadoutNotRecorded();
        UnitResult result = UnitEvaluation.evaluate(SPEC, PROCEDURE, POLICY, new UnitMeasurements(line(),
                PressureUnitFixture.noise(PROCEDURE.noiseCapture().samples()), List.of(), context));
        MetricResult s = UnitEvaluationTest.metric(result, Metric.SENSITIVITY);
        // No resolution is made up (the 0.5 mV digit is dropped) and the budget names what is missing.
        assertThat(line(s, "readout resolution: readout not recorded").standardUncertainty()).isZero();
        assertThat(line(s, "readout: not recorded").standardUncertainty()).isZero();
        assertThat(result.missing()).noneMatch(m -> m.contains("resolution"));
    }
}
