package org.dockgate.core.metrics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.TreeSet;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.CalibrationSeries;

/** The three-point slope is exact for a quadratic response, whatever the spacing of the inputs. */
class LocalSensitivityProperties {

    @Property(tries = 200)
    void exactForQuadraticResponses(
            @ForAll @DoubleRange(min = -10, max = 10) double c0,
            @ForAll @DoubleRange(min = -10, max = 10) double c1,
            @ForAll @DoubleRange(min = -1, max = 1) double c2,
            @ForAll @IntRange(min = 3, max = 10) int count,
            @ForAll long seed) {
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
    }
}
