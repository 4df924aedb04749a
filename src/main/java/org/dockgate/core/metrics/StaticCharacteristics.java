package org.dockgate.core.metrics;

import java.util.Map;
import java.util.NavigableMap;
import java.util.OptionalDouble;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.fit.LineFit;
import org.dockgate.core.series.CalibrationSeries;
import org.dockgate.core.series.Direction;
import org.dockgate.core.series.ReadingGroup;

/**
 * Static characteristics of a sensor from one calibration series over its rated range.
 *
 * <p>Definitions (the trade has several; Dockgate fixes these, see the reference sheet's
 * conventions, and ANSI/ISA-51.1 / ISA-37.1 for the terms):
 * <ul>
 *   <li><b>sensitivity</b> and <b>offset</b>: slope and intercept of the ordinary least-squares
 *       line through all readings ({@link LineFit});</li>
 *   <li><b>full-scale output</b> FSO = |sensitivity| × (rangeMax − rangeMin), the denominator of
 *       every %FSO figure;</li>
 *   <li><b>best-fit nonlinearity</b> = maxₓ |ȳ(x) − (b₀ + b₁x)| / FSO × 100, with ȳ(x) the mean of
 *       all readings at input x (both directions, all cycles);</li>
 *   <li><b>terminal nonlinearity</b> = maxₓ |ȳ(x) − T(x)| / FSO × 100, with T the straight line
 *       through (x_lo, ȳ(x_lo)) and (x_hi, ȳ(x_hi)) at the lowest and highest input;</li>
 *   <li><b>hysteresis</b> = maxₓ |ȳ_up(x) − ȳ_dn(x)| / FSO × 100 over the inputs approached from
 *       both directions;</li>
 *   <li><b>repeatability</b> s_p = √(Σ(nᵢ − 1)sᵢ² / Σ(nᵢ − 1)), the pooled standard deviation of
 *       the groups of nᵢ ≥ 2 readings at the same input and direction (pooled estimate of variance,
 *       JCGM 100:2008 4.2.8, clause from memory; repeatability conditions, VIM 2.21), with Σ(nᵢ − 1) degrees of freedom, and
 *       s_p / FSO × 100.</li>
 * </ul>
 *
 * @param rangeMin                        lower range value (input units)
 * @param rangeMax                        upper range value (input units)
 * @param fit                             the least-squares line through all readings
 * @param fullScaleOutput                 FSO (output units), greater than 0
 * @param nonlinearityBestFitPercentFso   best-fit (least-squares) nonlinearity, %FSO
 * @param nonlinearityTerminalPercentFso  terminal-based nonlinearity, %FSO
 * @param hysteresisPercentFso            hysteresis, %FSO; absent without an input read in both
 *                                        directions
 * @param repeatabilityStdDev             pooled standard deviation (output units); absent when no
 *                                        input and direction was read twice
 * @param repeatabilityDegreesOfFreedom   Σ(nᵢ − 1) of the pooled groups; 0 when absent
 * @param repeatabilityPercentFso         repeatabilityStdDev / FSO × 100; absent with it
 */
public record StaticCharacteristics(
        double rangeMin,
        double rangeMax,
        LineFit fit,
        double fullScaleOutput,
        double nonlinearityBestFitPercentFso,
        double nonlinearityTerminalPercentFso,
        OptionalDouble hysteresisPercentFso,
        OptionalDouble repeatabilityStdDev,
        int repeatabilityDegreesOfFreedom,
        OptionalDouble repeatabilityPercentFso) {

    /**
     * Checks that the optional values are given (possibly empty).
     *
     * @throws IllegalArgumentException when the fit or an optional is null
     */
    public StaticCharacteristics {
        if (fit == null || hysteresisPercentFso == null || repeatabilityStdDev == null
                || repeatabilityPercentFso == null) {
            throw new IllegalArgumentException("Static characteristics need a fit and (possibly empty) optionals");
        }
    }

    /**
     * Evaluates a calibration series over the rated range [rangeMin, rangeMax] (definitions in the
     * class description).
     *
     * <p>Edge cases: with two distinct inputs both nonlinearities are 0 (both lines pass through
     * the two means); hysteresis is absent when no input was approached from both directions
     * (in particular without DOWN readings); repeatability is absent when no input and direction
     * holds two readings. Readings outside the range are used as given.
     *
     * @param series   the readings
     * @param rangeMin lower range value, finite
     * @param rangeMax upper range value, finite, not below rangeMin
     * @return the characteristics
     * @throws IllegalArgumentException when the series is null, a range value is not finite, or
     *                                  rangeMax &lt; rangeMin
     * @throws UnevaluableException     when the span is zero, the series has fewer than two distinct
     *                                  inputs, or the fitted sensitivity is zero (FSO = 0)
     */
    public static StaticCharacteristics of(CalibrationSeries series, double rangeMin, double rangeMax) {
        if (series == null) {
            throw new IllegalArgumentException("Static characteristics need a calibration series");
        }
        if (!Double.isFinite(rangeMin) || !Double.isFinite(rangeMax)) {
            throw new IllegalArgumentException("The range limits must be finite numbers, got " + rangeMin + " … "
                    + rangeMax);
        }
        if (rangeMax < rangeMin) {
            throw new IllegalArgumentException("The range maximum " + rangeMax + " is below the range minimum "
                    + rangeMin);
        }
        if (rangeMax == rangeMin) {
            throw new UnevaluableException("The range has zero span (" + rangeMin + " … " + rangeMax
                    + "); %FSO figures cannot be evaluated");
        }
        LineFit fit = LineFit.fit(series);
        double fso = Math.abs(fit.slope()) * (rangeMax - rangeMin);
        if (!(fso > 0) || !Double.isFinite(fso)) {
            throw new UnevaluableException("The fitted sensitivity is " + fit.slope()
                    + ", so the full-scale output is " + fso + " and %FSO figures cannot be evaluated");
        }
        NavigableMap<Double, Double> curve = series.meanOutputByInput();

        double bestFit = 0;
        for (Map.Entry<Double, Double> e : curve.entrySet()) {
            bestFit = Math.max(bestFit, Math.abs(e.getValue() - fit.valueAt(e.getKey())));
        }

        double xLo = curve.firstKey();
        double xHi = curve.lastKey();
        double yLo = curve.firstEntry().getValue();
        double yHi = curve.lastEntry().getValue();
        double terminal = 0;
        for (Map.Entry<Double, Double> e : curve.entrySet()) {
            // Interpolating from the lower end keeps T(x_lo) = ȳ(x_lo) and T(x_hi) = ȳ(x_hi) exact.
            double t = yLo + (yHi - yLo) * ((e.getKey() - xLo) / (xHi - xLo));
            terminal = Math.max(terminal, Math.abs(e.getValue() - t));
        }

        OptionalDouble hysteresis = OptionalDouble.empty();
        NavigableMap<Double, Double> up = series.meanOutputByInput(Direction.UP);
        NavigableMap<Double, Double> down = series.meanOutputByInput(Direction.DOWN);
        for (Map.Entry<Double, Double> e : up.entrySet()) {
            Double d = down.get(e.getKey());
            if (d != null) {
                double h = Math.abs(e.getValue() - d);
                hysteresis = OptionalDouble.of(Math.max(h, hysteresis.orElse(0)));
            }
        }

        double weightedVariance = 0;
        int dof = 0;
        for (ReadingGroup g : series.groupsByInputAndDirection()) {
            if (g.count() >= 2) {
                weightedVariance += (g.count() - 1) * g.variance();
                dof += g.count() - 1;
            }
        }
        OptionalDouble repeatability = dof > 0 ? OptionalDouble.of(Math.sqrt(weightedVariance / dof))
                : OptionalDouble.empty();

        return new StaticCharacteristics(rangeMin, rangeMax, fit, fso,
                percent(bestFit, fso), percent(terminal, fso),
                hysteresis.isPresent() ? OptionalDouble.of(percent(hysteresis.getAsDouble(), fso))
                        : OptionalDouble.empty(),
                repeatability, dof,
                repeatability.isPresent() ? OptionalDouble.of(percent(repeatability.getAsDouble(), fso))
                        : OptionalDouble.empty());
    }

    /**
     * Least-squares sensitivity b₁.
     *
     * @return the slope (output units per input unit)
     */
    public double sensitivity() {
        return fit.slope();
    }

    /**
     * Least-squares offset b₀ (fitted output at zero input).
     *
     * @return the intercept (output units)
     */
    public double offset() {
        return fit.intercept();
    }

    /**
     * Standard uncertainty of the sensitivity, u(b₁) = s/√S_xx.
     *
     * @return u(b₁); absent with only two readings
     */
    public OptionalDouble sensitivityStdUncertainty() {
        return fit.slopeStdUncertainty();
    }

    /**
     * Standard uncertainty of the offset, u(b₀) = s·√(1/n + x̄²/S_xx).
     *
     * @return u(b₀); absent with only two readings
     */
    public OptionalDouble offsetStdUncertainty() {
        return fit.interceptStdUncertainty();
    }

    /**
     * Residual standard deviation of the fit, s = √(SSE/(n − 2)).
     *
     * @return s; absent with only two readings
     */
    public OptionalDouble residualStdDev() {
        return fit.residualStdDev();
    }

    /**
     * Coefficient of determination R² = 1 − SSE/S_yy of the fit.
     *
     * @return R²; absent when every output is equal
     */
    public OptionalDouble rSquared() {
        return fit.rSquared();
    }

    private static double percent(double value, double fso) {
        return value / fso * 100.0;
    }
}
