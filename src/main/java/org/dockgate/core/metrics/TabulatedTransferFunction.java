package org.dockgate.core.metrics;

import java.util.Arrays;
import java.util.Comparator;
import java.util.stream.IntStream;
import org.dockgate.core.UnevaluableException;

/**
 * A tabulated reference curve (for example a thermometer's table of resistance against
 * temperature), interpolated linearly between neighbouring points in both directions.
 *
 * <p>The local sensitivity is the slope of the segment holding the input; at an interior table
 * point it is the slope of the parabola through that point and its two neighbours (the
 * three-point central difference for unequal spacing, exact for quadratic curves); at the first
 * and last points it is the slope of the end segment.
 */
public final class TabulatedTransferFunction implements TransferFunction {

    private final double[] xs;
    private final double[] ys;

    private TabulatedTransferFunction(double[] xs, double[] ys) {
        this.xs = xs;
        this.ys = ys;
    }

    /**
     * Builds the curve from a table.
     *
     * @param inputs  table inputs, at least two, distinct, finite (any order)
     * @param outputs table outputs, finite, strictly increasing or strictly decreasing with input
     * @return the curve
     * @throws IllegalArgumentException for a short, repeated, non-monotonic or non-finite table
     */
    public static TabulatedTransferFunction of(double[] inputs, double[] outputs) {
        if (inputs == null || outputs == null || inputs.length != outputs.length) {
            throw new IllegalArgumentException("A tabulated curve needs as many outputs as inputs");
        }
        if (inputs.length < 2) {
            throw new IllegalArgumentException("A tabulated curve needs at least two points, got " + inputs.length);
        }
        for (int i = 0; i < inputs.length; i++) {
            if (!Double.isFinite(inputs[i]) || !Double.isFinite(outputs[i])) {
                throw new IllegalArgumentException("A tabulated curve holds only finite numbers; point " + (i + 1)
                        + " is (" + inputs[i] + ", " + outputs[i] + ")");
            }
        }
        Integer[] order = IntStream.range(0, inputs.length).boxed().toArray(Integer[]::new);
        Arrays.sort(order, Comparator.comparingDouble(i -> inputs[i]));
        double[] xs = new double[inputs.length];
        double[] ys = new double[inputs.length];
        for (int k = 0; k < order.length; k++) {
            xs[k] = inputs[order[k]];
            ys[k] = outputs[order[k]];
        }
        double firstStep = Math.signum(ys[1] - ys[0]);
        for (int k = 1; k < xs.length; k++) {
            if (xs[k] == xs[k - 1]) {
                throw new IllegalArgumentException("A tabulated curve has input " + xs[k] + " twice");
            }
            if (Math.signum(ys[k] - ys[k - 1]) != firstStep || firstStep == 0) {
                throw new IllegalArgumentException(
                        "A tabulated curve must be strictly monotonic so it can be inverted; it is not near input "
                                + xs[k]);
            }
        }
        return new TabulatedTransferFunction(xs, ys);
    }

    /**
     * Linear interpolation y = yᵢ + (yᵢ₊₁ − yᵢ)(x − xᵢ)/(xᵢ₊₁ − xᵢ) in the segment holding x.
     *
     * @param input x, within the table
     * @return y
     * @throws UnevaluableException when x lies outside the table (no extrapolation)
     */
    @Override
    public double output(double input) {
        return interpolate(xs, ys, input, "input");
    }

    /**
     * The inverse of the piecewise-linear curve (linear interpolation of x against y).
     *
     * @param output y, within the table's outputs
     * @return x
     * @throws UnevaluableException when y lies outside the table (no extrapolation)
     */
    @Override
    public double input(double output) {
        boolean increasing = ys[ys.length - 1] > ys[0];
        double[] keys = increasing ? ys : reversed(ys);
        double[] values = increasing ? xs : reversed(xs);
        return interpolate(keys, values, output, "output");
    }

    /**
     * The local slope (see the class description).
     *
     * @param input x, within the table
     * @return dy/dx
     * @throws UnevaluableException when x lies outside the table
     */
    @Override
    public double sensitivityAt(double input) {
        requireInside(xs, input, "input");
        int exact = Arrays.binarySearch(xs, input);
        if (exact >= 0) {
            if (exact == 0) {
                return (ys[1] - ys[0]) / (xs[1] - xs[0]);
            }
            if (exact == xs.length - 1) {
                return (ys[exact] - ys[exact - 1]) / (xs[exact] - xs[exact - 1]);
            }
            return LocalSensitivity.threePointSlope(xs[exact - 1], ys[exact - 1], xs[exact], ys[exact],
                    xs[exact + 1], ys[exact + 1], input);
        }
        int upper = -exact - 1;
        return (ys[upper] - ys[upper - 1]) / (xs[upper] - xs[upper - 1]);
    }

    private static double interpolate(double[] keys, double[] values, double key, String what) {
        requireInside(keys, key, what);
        int exact = Arrays.binarySearch(keys, key);
        if (exact >= 0) {
            return values[exact];
        }
        int upper = -exact - 1;
        int lower = upper - 1;
        double fraction = (key - keys[lower]) / (keys[upper] - keys[lower]);
        return values[lower] + fraction * (values[upper] - values[lower]);
    }

    private static void requireInside(double[] keys, double key, String what) {
        if (!Double.isFinite(key)) {
            throw new IllegalArgumentException("The " + what + " must be a finite number, got " + key);
        }
        if (key < keys[0] || key > keys[keys.length - 1]) {
            throw new UnevaluableException("The " + what + " " + key + " lies outside the tabulated curve ("
                    + keys[0] + " … " + keys[keys.length - 1] + "); the curve is not extrapolated");
        }
    }

    private static double[] reversed(double[] values) {
        double[] copy = new double[values.length];
        for (int i = 0; i < values.length; i++) {
            copy[i] = values[values.length - 1 - i];
        }
        return copy;
    }
}
