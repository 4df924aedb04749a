package org.dockgate.core.metrics;

import java.util.ArrayList;
import java.util.List;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.CalibrationSeries;
import org.dockgate.core.series.Direction;

/**
 * Reference sheet check case A2: a 0–10 bar pressure transducer, ideal 10 mV/bar, two cycles
 * up and down at 0, 2, 4, 6, 8, 10 bar (outputs in mV).
 */
final class PressureTransducerA2 {

    static final double[] INPUTS_BAR = {0, 2, 4, 6, 8, 10};
    static final double[] CYCLE1_UP = {0.05, 20.10, 40.18, 60.20, 80.16, 100.05};
    static final double[] CYCLE1_DOWN = {0.09, 20.20, 40.30, 60.32, 80.25, 100.05};
    static final double[] CYCLE2_UP = {0.04, 20.12, 40.16, 60.22, 80.15, 100.07};
    static final double[] CYCLE2_DOWN = {0.10, 20.22, 40.28, 60.31, 80.27, 100.07};

    private PressureTransducerA2() {
    }

    static CalibrationSeries series() {
        List<CalibrationPoint> points = new ArrayList<>();
        add(points, CYCLE1_UP, Direction.UP, 1, false);
        add(points, CYCLE1_DOWN, Direction.DOWN, 1, true);
        add(points, CYCLE2_UP, Direction.UP, 2, false);
        add(points, CYCLE2_DOWN, Direction.DOWN, 2, true);
        return CalibrationSeries.of(points);
    }

    private static void add(List<CalibrationPoint> points, double[] outputs, Direction d, int cycle,
            boolean reverse) {
        for (int k = 0; k < INPUTS_BAR.length; k++) {
            int i = reverse ? INPUTS_BAR.length - 1 - k : k;
            points.add(new CalibrationPoint(INPUTS_BAR[i], outputs[i], d, cycle));
        }
    }
}
