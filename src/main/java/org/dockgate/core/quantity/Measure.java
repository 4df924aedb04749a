package org.dockgate.core.quantity;

/**
 * A value with its unit symbol (engineer's spelling or UCUM, see {@link Units}).
 *
 * @param value the numeric value, finite
 * @param unit  the unit symbol, a known unit
 */
public record Measure(double value, String unit) {

    /**
     * Validates the value and the unit.
     *
     * @throws IllegalArgumentException when the value is not finite or the unit is unknown
     */
    public Measure {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("A measured value must be a finite number, got " + value);
        }
        Units.parse(unit);
        unit = unit.strip();
    }

    /**
     * A measure of a value in a unit.
     *
     * @param value the value
     * @param unit  the unit symbol
     * @return the measure
     * @throws IllegalArgumentException when the value is not finite or the unit is unknown
     */
    public static Measure of(double value, String unit) {
        return new Measure(value, unit);
    }

    /**
     * This measure expressed in another, compatible unit ({@link Units#convert}).
     *
     * @param targetUnit the wanted unit
     * @return the converted measure
     * @throws IllegalArgumentException when the unit is unknown or not compatible
     */
    public Measure to(String targetUnit) {
        return new Measure(Units.convert(value, unit, targetUnit), targetUnit);
    }

    /**
     * The value in another, compatible unit.
     *
     * @param targetUnit the wanted unit
     * @return the converted value
     * @throws IllegalArgumentException when the unit is unknown or not compatible
     */
    public double valueIn(String targetUnit) {
        return Units.convert(value, unit, targetUnit);
    }

    /**
     * Requires this measure to be of the same kind as a unit (e.g. a pressure).
     *
     * @param expectedUnit a unit of the expected kind
     * @return this measure
     * @throws IllegalArgumentException when the dimensions differ
     */
    public Measure requireCompatibleWith(String expectedUnit) {
        Units.requireCompatible(unit, expectedUnit);
        return this;
    }
}
