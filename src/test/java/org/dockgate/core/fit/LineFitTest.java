package org.dockgate.core.fit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;
import static org.assertj.core.api.Assertions.withinPercentage;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.dockgate.core.UnevaluableException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class LineFitTest {

    /** A certified straight-line dataset: data file (y x per line) and certified values with tolerances. */
    record Certified(String name, String resource, int n,
            double slope, double intercept, double sdSlope, double sdIntercept,
            double residualSd, double rSquared, double sse, double relativeTolerance) {
        @Override
        public String toString() {
            return name;
        }
    }

    static Stream<Arguments> certifiedDatasets() {
        return Stream.of(Arguments.of(new Certified(
                // NIST StRD Norris, certified values (file lines 31-46); relative tolerance 1e-10 on each,
                // as the reference sheet suggests (the centred two-pass sums agree to ~13 digits).
                "NIST StRD Norris", "norris.dat", 36,
                1.00211681802045, // NIST StRD Norris, certified B1
                -0.262323073774029, // NIST StRD Norris, certified B0
                0.429796848199937E-03, // NIST StRD Norris, certified standard deviation of B1
                0.232818234301152, // NIST StRD Norris, certified standard deviation of B0
                0.884796396144373, // NIST StRD Norris, certified residual standard deviation
                0.999993745883712, // NIST StRD Norris, certified R-squared
                26.6173985294224, // NIST StRD Norris, certified residual sum of squares (df 34)
                1e-10)));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("certifiedDatasets")
    void reproducesCertifiedValues(Certified c) throws IOException {
        double[][] xy = read(c.resource());
        LineFit fit = LineFit.fit(xy[0], xy[1]);

        assertThat(fit.n()).isEqualTo(c.n());
        assertRelative(fit.slope(), c.slope(), c.relativeTolerance());
        assertRelative(fit.intercept(), c.intercept(), c.relativeTolerance());
        assertRelative(fit.slopeStdUncertainty().orElseThrow(), c.sdSlope(), c.relativeTolerance());
        assertRelative(fit.interceptStdUncertainty().orElseThrow(), c.sdIntercept(), c.relativeTolerance());
        assertRelative(fit.residualStdDev().orElseThrow(), c.residualSd(), c.relativeTolerance());
        assertRelative(fit.rSquared().orElseThrow(), c.rSquared(), c.relativeTolerance());
        // The certified SSE carries 15 digits; two-pass SSE agrees to ~12 (reference sheet §2.1: 26.6173985294229).
        assertRelative(fit.sumOfSquaredResiduals(), c.sse(), 1e-10);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("certifiedDatasets")
    void agreesWithCommonsMathOracle(Certified c) throws IOException {
        double[][] xy = read(c.resource());
        SimpleRegression oracle = new SimpleRegression(true);
        for (int i = 0; i < xy[0].length; i++) {
            oracle.addData(xy[0][i], xy[1][i]);
        }
        LineFit fit = LineFit.fit(xy[0], xy[1]);
        // Commons Math SimpleRegression (independent implementation, updating formulas): relative 1e-9.
        assertRelative(fit.slope(), oracle.getSlope(), 1e-9);
        assertRelative(fit.intercept(), oracle.getIntercept(), 1e-9);
        assertRelative(fit.slopeStdUncertainty().orElseThrow(), oracle.getSlopeStdErr(), 1e-9);
        assertRelative(fit.interceptStdUncertainty().orElseThrow(), oracle.getInterceptStdErr(), 1e-9);
        assertRelative(fit.rSquared().orElseThrow(), oracle.getRSquare(), 1e-9);
    }

    @Test
    void twoPointsGiveAnExactLineWithoutResidualStatistics() {
        LineFit fit = LineFit.fit(new double[] {1, 3}, new double[] {2, 8});
        // Hand arithmetic: slope (8 - 2)/(3 - 1) = 3, intercept 2 - 3*1 = -1.
        assertThat(fit.slope()).isCloseTo(3.0, within(1e-15));
        assertThat(fit.intercept()).isCloseTo(-1.0, within(1e-15));
        assertThat(fit.residualStdDev()).isEmpty();
        assertThat(fit.slopeStdUncertainty()).isEmpty();
        assertThat(fit.interceptStdUncertainty()).isEmpty();
        assertThat(fit.rSquared().orElseThrow()).isCloseTo(1.0, within(1e-15));
        assertThat(fit.degreesOfFreedom()).isZero();
    }

    @Test
    void constantOutputsHaveNoRSquared() {
        LineFit fit = LineFit.fit(new double[] {0, 1, 2}, new double[] {5, 5, 5});
        assertThat(fit.slope()).isZero();
        assertThat(fit.intercept()).isEqualTo(5.0);
        assertThat(fit.rSquared()).isEmpty();
        assertThat(fit.residualStdDev().orElseThrow()).isZero();
    }

    @Test
    void exactLineHasZeroResiduals() {
        LineFit fit = LineFit.fit(new double[] {0, 1, 2, 3}, new double[] {1, 3, 5, 7});
        assertThat(fit.residualStdDev().orElseThrow()).isCloseTo(0.0, within(1e-15));
        assertThat(fit.valueAt(10)).isCloseTo(21.0, within(1e-12));
    }

    @Test
    void refusesTooFewPointsOrInputs() {
        assertThatThrownBy(() -> LineFit.fit(new double[] {1}, new double[] {2}))
                .isInstanceOf(UnevaluableException.class).hasMessageContaining("at least two points");
        assertThatThrownBy(() -> LineFit.fit(new double[] {1, 1, 1}, new double[] {2, 3, 4}))
                .isInstanceOf(UnevaluableException.class).hasMessageContaining("two distinct inputs");
        assertThatThrownBy(() -> LineFit.fit(new double[] {0.0, -0.0}, new double[] {2, 3}))
                .isInstanceOf(UnevaluableException.class);
    }

    @Test
    void refusesMalformedInput() {
        assertThatThrownBy(() -> LineFit.fit(new double[0], new double[0]))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("none");
        assertThatThrownBy(() -> LineFit.fit(new double[] {1, 2}, new double[] {1}))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("as many");
        assertThatThrownBy(() -> LineFit.fit(new double[] {1, Double.NaN}, new double[] {1, 2}))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("finite");
        assertThatThrownBy(() -> LineFit.fit(new double[] {1, 2}, new double[] {1, Double.POSITIVE_INFINITY}))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> LineFit.fit(null, new double[] {1}))
                .isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void hugeValuesAreUnevaluableNotInfinite() {
        assertThatThrownBy(() -> LineFit.fit(new double[] {-1e300, 1e300}, new double[] {1, 2}))
                .isInstanceOf(UnevaluableException.class);
    }

    private static void assertRelative(double actual, double expected, double relative) {
        assertThat(actual).isCloseTo(expected, within(Math.abs(expected) * relative));
    }

    /** Reads "y x" lines (NIST column order) into {x[], y[]}. */
    static double[][] read(String resource) throws IOException {
        List<double[]> rows = new ArrayList<>();
        try (InputStream in = LineFitTest.class.getResourceAsStream(resource)) {
            assertThat(in).as("test resource " + resource).isNotNull();
            BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            String line;
            while ((line = reader.readLine()) != null) {
                line = line.strip();
                if (line.isEmpty() || line.startsWith("#")) {
                    continue;
                }
                String[] parts = line.split("\\s+");
                rows.add(new double[] {Double.parseDouble(parts[1]), Double.parseDouble(parts[0])});
            }
        }
        double[][] xy = new double[2][rows.size()];
        for (int i = 0; i < rows.size(); i++) {
            xy[0][i] = rows.get(i)[0];
            xy[1][i] = rows.get(i)[1];
        }
        return xy;
    }
}
