package org.dockgate.instruments;

/**
 * The expanded uncertainty stated for one segment of an instrument's range: it applies to values above
 * the previous band's {@code upTo} (or from the range minimum, for the first band) up to and including
 * this band's {@code upTo}. Values are compared signed, in the range unit. An instrument with one
 * uncertainty for its whole range has one band whose {@code upTo} is the range maximum.
 *
 * @param upTo                the upper end of the segment, in the range unit, finite
 * @param expandedUncertainty U: in the range unit ({@link UncertaintyMode#ABSOLUTE}) or in percent; finite, &gt; 0
 * @param mode                how U is stated
 */
public record UncertaintyBand(double upTo, double expandedUncertainty, UncertaintyMode mode) {

    /**
     * Validates the band on its own; how bands fit a range is checked by {@link InstrumentService}.
     *
     * @throws IllegalArgumentException when a number is not finite, U is not positive, or the mode is missing
     */
    public UncertaintyBand {
        if (!Double.isFinite(upTo)) {
            throw new IllegalArgumentException("The upper end of an uncertainty band must be a finite number.");
        }
        if (!Double.isFinite(expandedUncertainty) || expandedUncertainty <= 0) {
            throw new IllegalArgumentException(
                    "The expanded uncertainty U must be a number greater than zero, was " + expandedUncertainty + ".");
        }
        if (mode == null) {
            throw new IllegalArgumentException(
                    "Say how U is stated: ABSOLUTE, PERCENT_OF_READING or PERCENT_OF_FULL_SCALE.");
        }
    }

    /**
     * U of this band at a value, in the range unit: U (absolute), U/100 × |value| (percent of reading) or
     * U/100 × fullScale (percent of full scale). See {@link UncertaintyMode}.
     *
     * @param value     the value, in the range unit
     * @param fullScale max(|range min|, |range max|), in the range unit
     * @return U in the range unit, ≥ 0 (0 at a zero reading for percent of reading)
     */
    public double expandedUncertaintyAt(double value, double fullScale) {
        return switch (mode) {
            case ABSOLUTE -> expandedUncertainty;
            case PERCENT_OF_READING -> expandedUncertainty / 100.0 * Math.abs(value);
            case PERCENT_OF_FULL_SCALE -> expandedUncertainty / 100.0 * fullScale;
        };
    }

    /**
     * This band in words, e.g. "U = 0.01 % of reading up to 20 bar".
     *
     * @param unit the range unit
     * @return the description
     */
    public String describe(String unit) {
        String figure = switch (mode) {
            case ABSOLUTE -> Numbers.plain(expandedUncertainty) + " " + unit;
            case PERCENT_OF_READING -> Numbers.plain(expandedUncertainty) + " % of reading";
            case PERCENT_OF_FULL_SCALE -> Numbers.plain(expandedUncertainty) + " % of full scale";
        };
        return "U = " + figure + " up to " + Numbers.plain(upTo) + " " + unit;
    }
}
