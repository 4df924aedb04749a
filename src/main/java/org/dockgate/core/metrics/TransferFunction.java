package org.dockgate.core.metrics;

/**
 * A nominal (ideal) transfer function of a sensor: output as a function of input, its inverse
 * and its local slope.
 *
 * <p>Linear sensors use {@link #linear(double, double)}; nonlinear sensors use a functional
 * curve (an RTD's Callendar–Van Dusen equation) or a {@link #tabulated(double[], double[])
 * tabulated} curve. Implementations must be strictly monotonic so the inverse exists.
 */
public interface TransferFunction {

    /**
     * The nominal output at an input.
     *
     * @param input the input (input units)
     * @return the nominal output (output units)
     * @throws org.dockgate.core.UnevaluableException when the input lies outside the curve's domain
     */
    double output(double input);

    /**
     * The inverse: the input at which the nominal output equals the given output.
     *
     * @param output the output (output units)
     * @return the input (input units)
     * @throws org.dockgate.core.UnevaluableException when the output lies outside the curve's range
     */
    double input(double output);

    /**
     * The local nominal sensitivity dy/dx at an input (VIM 4.12: change in indication over change
     * in the measured quantity).
     *
     * <p>This default uses the central difference [y(x + h) − y(x − h)] / (2h) with
     * h = ∛ε·max(|x|, 1) ≈ 6.1e-6·max(|x|, 1), the step that balances truncation and rounding
     * error for a central difference (ε = 2.2e-16, double precision). Implementations that know
     * the derivative override it.
     *
     * @param input the input
     * @return the slope in output units per input unit
     * @throws org.dockgate.core.UnevaluableException when x ± h leaves the curve's domain
     */
    default double sensitivityAt(double input) {
        double h = Math.cbrt(Math.ulp(1.0)) * Math.max(Math.abs(input), 1.0);
        return (output(input + h) - output(input - h)) / (2 * h);
    }

    /**
     * A straight nominal line y = offset + sensitivity·x.
     *
     * @param sensitivity nominal sensitivity, finite and not zero
     * @param offset      nominal output at zero input, finite
     * @return the transfer function
     * @throws IllegalArgumentException for a zero, NaN or infinite sensitivity or offset
     */
    static TransferFunction linear(double sensitivity, double offset) {
        return new LinearTransferFunction(sensitivity, offset);
    }

    /**
     * A tabulated reference curve, interpolated linearly between the table's points.
     *
     * @param inputs  the table's inputs, at least two, distinct (any order)
     * @param outputs the outputs at those inputs, strictly monotonic in the input
     * @return the transfer function
     * @throws IllegalArgumentException when the table is too short, has repeated inputs, is not
     *                                  strictly monotonic or holds a non-finite value
     */
    static TransferFunction tabulated(double[] inputs, double[] outputs) {
        return TabulatedTransferFunction.of(inputs, outputs);
    }
}
