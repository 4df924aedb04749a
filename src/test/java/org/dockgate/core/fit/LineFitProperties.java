package org.dockgate.core.fit;

import static org.dockgate.core.PropertyCheck.forAll;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;

/** The hand-written fit agrees with Commons Math's SimpleRegression (an independent implementation). */
class LineFitProperties {

    @Test
    void agreesWithSimpleRegression() {
        forAll(300, g -> {
            int n = g.ints(3, 60);
            double slope = g.doubles(-100, 100);
            double intercept = g.doubles(-1000, 1000);
            double noise = g.doubles(0.001, 10, 4);
            long seed = g.anyLong();
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
            // SimpleRegression gets the residual sum of squares as Σy² − (Σxy)²/Σx² on running sums, which cancels
            // terms of the size of Σy²: its MSE is only good to a few ε·Σy²/(n − 2). With almost no noise that is
            // a large part of a tiny residual, so compare variances within that bound (the two-pass fit is the
            // more accurate of the two; NIST StRD Norris checks it to 1e-9 in LineFitTest).
            double sumYY = 0;
            double meanX = java.util.Arrays.stream(x).average().orElseThrow();
            double sxx = 0;
            for (int i = 0; i < n; i++) {
                sumYY += y[i] * y[i];
                sxx += (x[i] - meanX) * (x[i] - meanX);
            }
            double mseTolerance = 1e-12 * sumYY / (n - 2);
            double residual = fit.residualStdDev().orElseThrow();
            assertThat(residual * residual).isCloseTo(oracle.getMeanSquareError(), within(mseTolerance));
            double slopeU = fit.slopeStdUncertainty().orElseThrow();
            assertThat(slopeU * slopeU).isCloseTo(oracle.getSlopeStdErr() * oracle.getSlopeStdErr(),
                    within(mseTolerance / sxx));
        });
    }
}
