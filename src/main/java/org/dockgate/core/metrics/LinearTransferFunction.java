package org.dockgate.core.metrics;

/**
 * A straight nominal line y = offset + sensitivity·x.
 *
 * @param sensitivity nominal sensitivity (output units per input unit), finite, not zero
 * @param offset      nominal output at zero input, finite
 */
public record LinearTransferFunction(double sensitivity, double offset) implements TransferFunction {

    /**
     * Validates the line.
     *
     * @throws IllegalArgumentException for a zero, NaN or infinite sensitivity or a non-finite offset
     */
    public LinearTransferFunction {
        if (!Double.isFinite(sensitivity) || sensitivity == 0) {
            throw new IllegalArgumentException("A nominal sensitivity must be a finite, non-zero number, got "
                    + sensitivity);
        }
        if (!Double.isFinite(offset)) {
            throw new IllegalArgumentException("A nominal offset must be a finite number, got " + offset);
        }
    }

    /**
     * y = offset + sensitivity·x.
     *
     * @param input x
     * @return y
     */
    @Override
    public double output(double input) {
        return offset + sensitivity * input;
    }

    /**
     * x = (y − offset) / sensitivity.
     *
     * @param output y
     * @return x
     */
    @Override
    public double input(double output) {
        return (output - offset) / sensitivity;
    }

    /**
     * The constant slope.
     *
     * @param input ignored
     * @return the sensitivity
     */
    @Override
    public double sensitivityAt(double input) {
        return sensitivity;
    }
}
