package org.dockgate.core.metrics;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.NavigableMap;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.series.CalibrationSeries;

/**
 * Local sensitivity dy/dx of a nonlinear sensor at an input (VIM 4.12: the quotient of the change
 * in indication and the change in the measured quantity, taken locally).
 */
public final class LocalSensitivity {

    private LocalSensitivity() {
    }

    /**
     * The slope of a reference curve at an input.
     *
     * @param curve the nominal curve
     * @param input the input
     * @return dy/dx from {@link TransferFunction#sensitivityAt(double)}
     * @throws IllegalArgumentException when the curve is null or the input is not finite
     */
    public static double ofCurve(TransferFunction curve, double input) {
        if (curve == null) {
            throw new IllegalArgumentException("A local sensitivity needs a reference curve");
        }
        if (!Double.isFinite(input)) {
            throw new IllegalArgumentException("The input must be a finite number, got " + input);
        }
        return curve.sensitivityAt(input);
    }

    /**
     * The slope of the measured calibration curve (mean output at each input) at one of the
     * series' inputs, from neighbouring points.
     *
     * <p>Formula: the derivative at xᵢ of the parabola through three neighbouring points
     * (xⱼ, ȳⱼ): the centred three-point difference
     * ȳ'(xᵢ) ≈ Σⱼ ȳⱼ·Lⱼ'(xᵢ) with the Lagrange basis Lⱼ, which for equal spacing h reduces to
     * (ȳᵢ₊₁ − ȳᵢ₋₁)/(2h). Interior inputs use their two neighbours; the first and last inputs use
     * the three end points (a one-sided second-order difference). Exact for a quadratic response.
     *
     * <p>Edge cases: with only two distinct inputs the slope of the line through them is returned.
     *
     * @param series the calibration readings
     * @param input  one of the series' inputs
     * @return dy/dx at that input
     * @throws UnevaluableException when the series has fewer than two distinct inputs or the
     *                              input is not one of its inputs
     */
    public static double ofSeries(CalibrationSeries series, double input) {
        if (series == null) {
            throw new IllegalArgumentException("A local sensitivity needs a calibration series");
        }
        if (!Double.isFinite(input)) {
            throw new IllegalArgumentException("The input must be a finite number, got " + input);
        }
        NavigableMap<Double, Double> curve = series.meanOutputByInput();
        if (curve.size() < 2) {
            throw new UnevaluableException("A local sensitivity needs at least two distinct inputs");
        }
        double key = input + 0.0;
        if (!curve.containsKey(key)) {
            throw new UnevaluableException("Input " + input + " is not one of the calibration inputs " + curve.keySet());
        }
        List<Map.Entry<Double, Double>> points = new ArrayList<>(curve.entrySet());
        if (points.size() == 2) {
            return (points.get(1).getValue() - points.get(0).getValue())
                    / (points.get(1).getKey() - points.get(0).getKey());
        }
        int i = new ArrayList<>(curve.keySet()).indexOf(key);
        int first = Math.max(0, Math.min(i - 1, points.size() - 3));
        Map.Entry<Double, Double> p0 = points.get(first);
        Map.Entry<Double, Double> p1 = points.get(first + 1);
        Map.Entry<Double, Double> p2 = points.get(first + 2);
        return threePointSlope(p0.getKey(), p0.getValue(), p1.getKey(), p1.getValue(), p2.getKey(), p2.getValue(),
                key);
    }

    /**
     * Derivative at t of the parabola through (x₀, y₀), (x₁, y₁), (x₂, y₂) (Lagrange form):
     * y₀[(t − x₁) + (t − x₂)]/[(x₀ − x₁)(x₀ − x₂)] + y₁[(t − x₀) + (t − x₂)]/[(x₁ − x₀)(x₁ − x₂)]
     * + y₂[(t − x₀) + (t − x₁)]/[(x₂ − x₀)(x₂ − x₁)].
     */
    static double threePointSlope(double x0, double y0, double x1, double y1, double x2, double y2, double t) {
        return y0 * ((t - x1) + (t - x2)) / ((x0 - x1) * (x0 - x2))
                + y1 * ((t - x0) + (t - x2)) / ((x1 - x0) * (x1 - x2))
                + y2 * ((t - x0) + (t - x1)) / ((x2 - x0) * (x2 - x1));
    }
}
