package org.dockgate.core.series;

/**
 * One reading of a calibration: the reference stimulus applied, the sensor output read,
 * the traverse direction, the cycle number and the nominal set point it was taken at.
 *
 * <p>The input is the value the reference actually applied (its gauge's or reference thermometer's
 * reading), which fits, errors and tolerances use; the nominal set point only groups readings taken "at
 * the same point" (hysteresis, repeatability, the mean curve). When the bench recorded no applied value,
 * both are the set point.
 *
 * @param input     reference stimulus applied (input units, e.g. bar); finite
 * @param output    sensor output (output units, e.g. mV); finite
 * @param direction traverse direction; not null
 * @param cycle     cycle number, 0 or more (only used to tell readings apart; repeats are
 *                  readings at the same input and direction)
 * @param nominal   the set point the reading belongs to (input units); finite
 */
public record CalibrationPoint(double input, double output, Direction direction, int cycle, double nominal) {

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
        if (!Double.isFinite(nominal)) {
            throw new IllegalArgumentException("Calibration set point must be a finite number, got " + nominal);
        }
        // Adding 0.0 turns -0.0 into 0.0; otherwise the two would form separate input groups.
        input = input + 0.0;
        nominal = nominal + 0.0;
    }

    /**
     * A reading taken exactly at its set point (applied = nominal).
     *
     * @param input     the set point and the stimulus applied
     * @param output    sensor output
     * @param direction traverse direction
     * @param cycle     cycle number
     */
    public CalibrationPoint(double input, double output, Direction direction, int cycle) {
        this(input, output, direction, cycle, input);
    }

    /** @return whether the applied input differs from the nominal set point */
    public boolean offNominal() {
        return input != nominal;
    }

    /**
     * This reading referred to its set point along a slope: output y − b₁·(x_applied − x_nominal), input the set
     * point. Readings at one set point whose applied values differ a little are compared this way (the usual
     * reduction of a reading to its nominal point, common practice).
     *
     * @param slope b₁ in output per input unit
     * @return the reduced reading, this one when it was taken at its set point
     */
    public CalibrationPoint reducedToNominal(double slope) {
        if (!offNominal()) {
            return this;
        }
        return new CalibrationPoint(nominal, output - slope * (input - nominal), direction, cycle, nominal);
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
