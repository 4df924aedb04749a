package org.dockgate.core.series;

/**
 * One reading of a calibration: the reference stimulus applied, the sensor output read,
 * the traverse direction and the cycle number.
 *
 * @param input     reference stimulus (input units, e.g. bar); finite
 * @param output    sensor output (output units, e.g. mV); finite
 * @param direction traverse direction; not null
 * @param cycle     cycle number, 0 or more (only used to tell readings apart; repeats are
 *                  readings at the same input and direction)
 */
public record CalibrationPoint(double input, double output, Direction direction, int cycle) {

    /**
     * Validates the reading.
     *
     * <p>{@code -0.0} is normalised to {@code 0.0} so that both group as the same input.
     *
     * @throws IllegalArgumentException when a value is NaN or infinite, the direction is null
     *                                  or the cycle is negative
     */
    public CalibrationPoint {
        if (!Double.isFinite(input)) {
            throw new IllegalArgumentException("Calibration input must be a finite number, got " + input);
        }
        if (!Double.isFinite(output)) {
            throw new IllegalArgumentException("Calibration output must be a finite number, got " + output);
        }
        if (direction == null) {
            throw new IllegalArgumentException("Calibration direction must be UP or DOWN");
        }
        if (cycle < 0) {
            throw new IllegalArgumentException("Calibration cycle must be 0 or more, got " + cycle);
        }
        // Adding 0.0 turns -0.0 into 0.0; otherwise the two would form separate input groups.
        input = input + 0.0;
    }

    /**
     * An upscale reading in cycle 1.
     *
     * @param input  reference stimulus
     * @param output sensor output
     * @return the point
     */
    public static CalibrationPoint up(double input, double output) {
        return new CalibrationPoint(input, output, Direction.UP, 1);
    }

    /**
     * A downscale reading in cycle 1.
     *
     * @param input  reference stimulus
     * @param output sensor output
     * @return the point
     */
    public static CalibrationPoint down(double input, double output) {
        return new CalibrationPoint(input, output, Direction.DOWN, 1);
    }
}
