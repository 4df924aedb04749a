package org.dockgate.core.acquisition;

import java.util.OptionalDouble;

/**
 * The environmental conditions at the bench while a unit was measured, checked only for physical sense:
 * what any procedure's limits are then compared with (see {@code core.procedure.EnvironmentalLimits}).
 *
 * @param ambientC                ambient air temperature, °C: finite and not below absolute zero (−273.15 °C,
 *                                the definition of the kelvin, SI Brochure 9th ed. 2.3.1)
 * @param relativeHumidityPercent relative humidity, % RH: finite, 0 to 100 (by its definition as a ratio of
 *                                vapour pressures)
 * @param pressureKPa             barometric pressure, kPa, when recorded: finite and not negative
 */
public record AmbientConditions(double ambientC, double relativeHumidityPercent, OptionalDouble pressureKPa) {

    /** Absolute zero in °C. */
    public static final double ABSOLUTE_ZERO_C = -273.15;

    /**
     * Refuses physically impossible values, whatever a procedure allows.
     *
     * @throws IllegalArgumentException naming the field ({@code ambientC}, {@code relativeHumidityPercent},
     *                                  {@code pressureKPa}) and the value
     */
    public AmbientConditions {
        if (!Double.isFinite(ambientC)) {
            throw new IllegalArgumentException("'ambientC' must be a finite number of °C, got " + ambientC + ".");
        }
        if (ambientC < ABSOLUTE_ZERO_C) {
            throw new IllegalArgumentException("'ambientC' " + plain(ambientC) + " °C lies below absolute zero ("
                    + plain(ABSOLUTE_ZERO_C) + " °C).");
        }
        if (!Double.isFinite(relativeHumidityPercent)) {
            throw new IllegalArgumentException("'relativeHumidityPercent' must be a finite number, got "
                    + relativeHumidityPercent + ".");
        }
        if (relativeHumidityPercent < 0 || relativeHumidityPercent > 100) {
            throw new IllegalArgumentException("'relativeHumidityPercent' " + plain(relativeHumidityPercent)
                    + " % lies outside 0 … 100 %: relative humidity is a ratio.");
        }
        if (pressureKPa == null) {
            pressureKPa = OptionalDouble.empty();
        }
        if (pressureKPa.isPresent()) {
            double p = pressureKPa.getAsDouble();
            if (!Double.isFinite(p)) {
                throw new IllegalArgumentException("'pressureKPa' must be a finite number of kPa, got " + p + ".");
            }
            if (p < 0) {
                throw new IllegalArgumentException("'pressureKPa' " + plain(p) + " kPa is negative; an absolute"
                        + " pressure cannot be.");
            }
        }
    }

    /** Ambient and humidity, without pressure. */
    public static AmbientConditions of(double ambientC, double relativeHumidityPercent) {
        return new AmbientConditions(ambientC, relativeHumidityPercent, OptionalDouble.empty());
    }

    /** A number as people write it: no trailing zeros, no exponent for lab-sized values. */
    static String plain(double v) {
        return new java.math.BigDecimal(Double.toString(v)).stripTrailingZeros().toPlainString();
    }
}
