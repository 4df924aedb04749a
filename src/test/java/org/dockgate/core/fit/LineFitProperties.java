package org.dockgate.core.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Scale;
import org.apache.commons.math3.stat.regression.SimpleRegression;

/** The hand-written fit agrees with Commons Math's SimpleRegression (an independent implementation). */
class LineFitProperties {

    @Property(tries = 300)
    void agreesWithSimpleRegression(
            @ForAll @IntRange(min = 3, max = 60) int n,
            @ForAll @DoubleRange(min = -100, max = 100) double slope,
            @ForAll @DoubleRange(min = -1000, max = 1000) double intercept,
            @ForAll @DoubleRange(min = 0.001, max = 10) @Scale(4) double noise,
            @ForAll long seed) {
        Random random = new Random(seed);
        double[] x = new double[n];
        double[] y = new double[n];
        SimpleRegression oracle = new SimpleRegression(true);
        for (int i = 0; i < n; i++) {
            x[i] = i % 2 == 0 ? i : 100 * random.nextDouble(); // at least two distinct inputs
            y[i] = intercept + slope * x[i] + noise * random.nextGaussian();
            oracle.addData(x[i], y[i]);
        }
        LineFit fit = LineFit.fit(x, y);
        double scale = Math.abs(intercept) + Math.abs(slope) * 100 + noise;
        // Well-conditioned data: both implementations agree far inside 1e-9 of the data's scale.
        assertThat(fit.slope()).isCloseTo(oracle.getSlope(), within(1e-9 * scale / 100));
        assertThat(fit.intercept()).isCloseTo(oracle.getIntercept(), within(1e-9 * scale));
        assertThat(fit.residualStdDev().orElseThrow())
                .isCloseTo(Math.sqrt(oracle.getMeanSquareError()), within(1e-9 * scale));
        assertThat(fit.slopeStdUncertainty().orElseThrow())
                .isCloseTo(oracle.getSlopeStdErr(), within(1e-9 * scale / 100));
    }
}
