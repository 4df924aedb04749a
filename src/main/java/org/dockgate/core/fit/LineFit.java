package org.dockgate.core.fit;

import java.util.Arrays;
import java.util.OptionalDouble;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.series.CalibrationSeries;

/**
 * An ordinary least-squares straight line y = b₀ + b₁·x and its statistics.
 *
 * <p>Model and formulas (any regression text; the same as NIST StRD's certified values for the
 * Norris dataset): with x̄, ȳ the means, S_xx = Σ(x − x̄)², S_xy = Σ(x − x̄)(y − ȳ) and
 * S_yy = Σ(y − ȳ)²,
 * <ul>
 *   <li>slope b₁ = S_xy / S_xx, intercept b₀ = ȳ − b₁·x̄;</li>
 *   <li>residuals eᵢ = (yᵢ − ȳ) − b₁(xᵢ − x̄), SSE = Σeᵢ², ν = n − 2;</li>
 *   <li>residual standard deviation s = √(SSE/ν);</li>
 *   <li>u(b₁) = s / √S_xx, u(b₀) = s·√(1/n + x̄²/S_xx);</li>
 *   <li>R² = 1 − SSE/S_yy.</li>
 * </ul>
 *
 * @param slope                    b₁ (output units per input unit)
 * @param intercept                b₀ (output units)
 * @param slopeStdUncertainty      u(b₁); absent when n = 2 (no residual degrees of freedom)
 * @param interceptStdUncertainty  u(b₀); absent when n = 2
 * @param residualStdDev           s; absent when n = 2
 * @param rSquared                 R²; absent when all outputs are equal (S_yy = 0, R² = 0/0)
 * @param sumOfSquaredResiduals    SSE (0 or more)
 * @param n                        number of points, 2 or more
 */
public record LineFit(
        double slope,
        double intercept,
        OptionalDouble slopeStdUncertainty,
        OptionalDouble interceptStdUncertainty,
        OptionalDouble residualStdDev,
        OptionalDouble rSquared,
        double sumOfSquaredResiduals,
        int n) {

    /**
     * Checks the values are finite and present.
     *
     * @throws IllegalArgumentException when a value is NaN or infinite, an optional is null or n &lt; 2
     */
    public LineFit {
        requireFinite("slope", slope);
        requireFinite("intercept", intercept);
        requireFinite("sum of squared residuals", sumOfSquaredResiduals);
        requireFinite("slope standard uncertainty", slopeStdUncertainty);
        requireFinite("intercept standard uncertainty", interceptStdUncertainty);
        requireFinite("residual standard deviation", residualStdDev);
        requireFinite("R squared", rSquared);
        if (n < 2) {
            throw new IllegalArgumentException("A line fit has at least two points, got n = " + n);
        }
    }

    /**
     * Fits the least-squares line to all readings of a series (every reading counts once, so
     * with a balanced design this equals the fit to the mean outputs at each input).
     *
     * @param series the readings
     * @return the fit
     * @throws UnevaluableException when the series has fewer than two points or fewer than two
     *                              distinct inputs
     */
    public static LineFit fit(CalibrationSeries series) {
        if (series == null) {
            throw new IllegalArgumentException("A line fit needs a calibration series");
        }
        return fit(series.inputs(), series.outputs());
    }

    /**
     * Fits y = b₀ + b₁·x by ordinary least squares (formulas in the class description).
     *
     * <p>Numerics: the means carry a second-pass correction, and all sums are taken about the
     * means (the centred two-pass formula), which avoids the cancellation of the textbook
     * Σxy − n·x̄·ȳ form; this reproduces the NIST StRD Norris certified values to about 13
     * significant digits.
     *
     * <p>Edge cases: n = 2 gives an exact line with no residual degrees of freedom, so the
     * residual standard deviation and the standard uncertainties are absent (empty), not 0 or NaN;
     * R² is absent when every output is equal (S_yy = 0); R² is floored at 0 against rounding.
     *
     * @param inputs  x values, finite
     * @param outputs y values, finite, same length
     * @return the fit
     * @throws IllegalArgumentException when an array is null or empty, the lengths differ, or a
     *                                  value is NaN or infinite
     * @throws UnevaluableException     when there are fewer than two points or fewer than two
     *                                  distinct inputs, or the sums overflow double precision
     */
    public static LineFit fit(double[] inputs, double[] outputs) {
        if (inputs == null || outputs == null || inputs.length == 0 || outputs.length == 0) {
            throw new IllegalArgumentException("A line fit needs points; none were given");
        }
        if (inputs.length != outputs.length) {
            throw new IllegalArgumentException("A line fit needs as many outputs as inputs, got "
                    + inputs.length + " inputs and " + outputs.length + " outputs");
        }
        for (int i = 0; i < inputs.length; i++) {
            if (!Double.isFinite(inputs[i]) || !Double.isFinite(outputs[i])) {
                throw new IllegalArgumentException("Point " + (i + 1) + " is not a pair of finite numbers: ("
                        + inputs[i] + ", " + outputs[i] + ")");
            }
        }
        int n = inputs.length;
        if (n < 2) {
            throw new UnevaluableException("A straight line needs at least two points, got 1");
        }
        if (Arrays.stream(inputs).map(x -> x + 0.0).distinct().count() < 2) {
            throw new UnevaluableException(
                    "A straight line needs at least two distinct inputs; all points are at input " + inputs[0]);
        }
        double xMean = mean(inputs);
        double yMean = mean(outputs);
        double sxx = 0;
        double sxy = 0;
        double syy = 0;
        for (int i = 0; i < n; i++) {
            double dx = inputs[i] - xMean;
            double dy = outputs[i] - yMean;
            sxx += dx * dx;
            sxy += dx * dy;
            syy += dy * dy;
        }
        if (!(sxx > 0) || !Double.isFinite(sxx) || !Double.isFinite(sxy) || !Double.isFinite(syy)) {
            throw new UnevaluableException("The points cannot be fitted in double precision (inputs too close "
                    + "together or values too large)");
        }
        double slope = sxy / sxx;
        double intercept = yMean - slope * xMean;
        double sse = 0;
        for (int i = 0; i < n; i++) {
            double e = (outputs[i] - yMean) - slope * (inputs[i] - xMean);
            sse += e * e;
        }
        if (!Double.isFinite(slope) || !Double.isFinite(intercept) || !Double.isFinite(sse)) {
            throw new UnevaluableException("The points cannot be fitted in double precision (values too large)");
        }
        int dof = n - 2;
        OptionalDouble s = OptionalDouble.empty();
        OptionalDouble uSlope = OptionalDouble.empty();
        OptionalDouble uIntercept = OptionalDouble.empty();
        if (dof > 0) {
            double sd = Math.sqrt(sse / dof);
            s = OptionalDouble.of(sd);
            uSlope = OptionalDouble.of(sd / Math.sqrt(sxx));
            uIntercept = OptionalDouble.of(sd * Math.sqrt(1.0 / n + xMean * xMean / sxx));
        }
        // SSE <= S_yy holds exactly; rounding can push 1 - SSE/S_yy a hair below 0 when the slope is ~0.
        OptionalDouble r2 = syy > 0 ? OptionalDouble.of(Math.max(0.0, 1.0 - sse / syy)) : OptionalDouble.empty();
        return new LineFit(slope, intercept, uSlope, uIntercept, s, r2, sse, n);
    }

    /**
     * The fitted line at an input, b₀ + b₁·x.
     *
     * @param input x
     * @return the fitted output
     */
    public double valueAt(double input) {
        return intercept + slope * input;
    }

    /**
     * Residual degrees of freedom ν = n − 2.
     *
     * @return ν, 0 or more
     */
    public int degreesOfFreedom() {
        return n - 2;
    }

    /** Arithmetic mean with the second-pass correction Σ(v − m)/n (exact mean for rounding). */
    private static double mean(double[] values) {
        double sum = 0;
        for (double v : values) {
            sum += v;
        }
        double m = sum / values.length;
        double correction = 0;
        for (double v : values) {
            correction += v - m;
        }
        return m + correction / values.length;
    }

    private static void requireFinite(String name, double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("The " + name + " of a line fit must be finite, got " + value);
        }
    }

    private static void requireFinite(String name, OptionalDouble value) {
        if (value == null) {
            throw new IllegalArgumentException("The " + name + " of a line fit must be given (possibly empty)");
        }
        if (value.isPresent()) {
            requireFinite(name, value.getAsDouble());
        }
    }
}
