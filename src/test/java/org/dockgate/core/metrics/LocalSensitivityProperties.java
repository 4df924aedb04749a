package org.dockgate.core.metrics;

import static org.dockgate.core.PropertyCheck.forAll;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.TreeSet;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.CalibrationSeries;
import org.junit.jupiter.api.Test;

/** The three-point slope is exact for a quadratic response, whatever the spacing of the inputs. */
class LocalSensitivityProperties {

    @Test
    void exactForQuadraticResponses() {
        forAll(200, g -> {
            double c0 = g.doubles(-10, 10);
            double c1 = g.doubles(-10, 10);
            double c2 = g.doubles(-1, 1);
            int count = g.ints(3, 10);
            long seed = g.anyLong();
            Random random = new Random(seed);
            TreeSet<Double> inputs = new TreeSet<>();
            while (inputs.size() < count) {
                inputs.add(Math.rint(random.nextDouble() * 2000 - 1000) / 100); // distinct inputs in -10 … 10, 0.01 apart
            }
            List<CalibrationPoint> points = new ArrayList<>();
            for (double x : inputs) {
                points.add(CalibrationPoint.up(x, c0 + c1 * x + c2 * x * x));
            }
            CalibrationSeries series = CalibrationSeries.of(points);
            for (double x : inputs) {
                // d/dx (c0 + c1 x + c2 x^2) = c1 + 2 c2 x; rounding in the divided differences of inputs as close as 0.01
                // allows ~1e-8 absolute.
                assertThat(LocalSensitivity.ofSeries(series, x)).isCloseTo(c1 + 2 * c2 * x, within(1e-8));
            }
        });
    }
}
