package org.dockgate.core.evaluation;

import java.util.ArrayList;
import java.util.List;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.procedure.DerivationOptions;
import org.dockgate.core.procedure.ProcedureDerivation;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.NoiseFloor;
import org.dockgate.core.procedure.SensorSpecification.NonlinearityReference;
import org.dockgate.core.procedure.SensorSpecification.Referred;
import org.dockgate.core.procedure.SensorSpecification.Sensitivity;
import org.dockgate.core.procedure.SensorSpecification.ToleranceMode;
import org.dockgate.core.procedure.SensorSpecification.ZeroOffset;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.Direction;

/**
 * A pressure transducer unit generated from known parts, so every metric has a value computed by hand:
 * y(x, direction, cycle) = OFFSET + SLOPE·x + bow(x) + (DOWN ? H : 0) + e(cycle), x = 0, 2, …, 10 bar, with
 * <ul>
 *   <li>a quadratic bow 4P·(x/10)(1 − x/10), peak P at mid-span, symmetric about 5 bar so it adds nothing to
 *       the least-squares slope;</li>
 *   <li>DOWN readings shifted by H at every point (hysteresis H), balanced so the slope is unchanged;</li>
 *   <li>a repeat scatter e = −D, 0, +D in cycles 1, 2, 3 (sample standard deviation D at every point and
 *       direction, mean 0);</li>
 *   <li>noise samples: the reference sheet's A3 record 1, −2, 3, −1, 0, 2, −3, 1, −1, 0 µV repeated to the
 *       planned count (mean 0, Σv² = 30 per repetition).</li>
 * </ul>
 */
final class PressureUnitFixture {

    static final double SLOPE = 10.0;      // mV/bar
    static final double OFFSET = 0.2;      // mV
    static final double P = 0.15;          // mV, bow peak
    static final double H = 0.05;          // mV, DOWN shift
    static final double D = 0.01;          // mV, repeat scatter
    static final double[] POINTS = {0, 2, 4, 6, 8, 10};
    static final double[] A3_RECORD_UV = {1, -2, 3, -1, 0, 2, -3, 1, -1, 0};

    static final DecisionPolicy POLICY = DecisionPolicy.guardBanded(1.0);

    /** 10 mV/bar ± 1 %, zero 0 ± 0.5 mV, accuracy 1 %FSO, nonlinearity 0.25, hysteresis 0.1, repeatability 0.05 %FSO, noise 5 µV. */
    static SensorSpecification spec(NonlinearityReference reference) {
        return new SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "bar", 0, 10, "mV",
                new Sensitivity(10, "mV/bar", 1, ToleranceMode.PERCENT), new ZeroOffset(0, 0.5, "mV"), 1.0, 0.25,
                reference, 0.1, 0.05, new NoiseFloor(5, "µV", Referred.OUTPUT), null, null, null);
    }

    static ProcedureProposal procedure(SensorSpecification spec) {
        return ProcedureDerivation.derive(spec,
                new DerivationOptions(Aql.of(1.0), InspectionLevel.II, POLICY, null), List.of());
    }

    /** U(x) = 0.0005 bar + 0.02 % of reading, k = 2. */
    static ReferenceUncertainty reference() {
        return new ReferenceUncertainty("PC-7", x -> 0.0005 + 0.0002 * Math.abs(x), 2.0);
    }

    static double bow(double x) {
        return 4 * P * (x / 10) * (1 - x / 10);
    }

    static List<CalibrationPoint> readings(double hysteresis) {
        List<CalibrationPoint> points = new ArrayList<>();
        double[] scatter = {-D, 0, D};
        for (int cycle = 1; cycle <= 3; cycle++) {
            for (double x : POINTS) {
                points.add(new CalibrationPoint(x, OFFSET + SLOPE * x + bow(x) + scatter[cycle - 1], Direction.UP,
                        cycle));
            }
            for (int i = POINTS.length - 1; i >= 0; i--) {
                double x = POINTS[i];
                points.add(new CalibrationPoint(x, OFFSET + SLOPE * x + bow(x) + hysteresis + scatter[cycle - 1],
                        Direction.DOWN, cycle));
            }
        }
        return points;
    }

    /** The A3 record in mV, repeated to n samples (n a multiple of 10). */
    static List<Double> noise(int n) {
        List<Double> samples = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            samples.add(A3_RECORD_UV[i % 10] / 1000.0);
        }
        return samples;
    }

    private PressureUnitFixture() {
    }
}
