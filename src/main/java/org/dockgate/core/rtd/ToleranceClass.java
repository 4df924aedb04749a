package org.dockgate.core.rtd;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * IEC 60751 tolerance classes of platinum resistance thermometers: tolerance ±(c₀ + c₁·|t|) °C,
 * each valid over a temperature range.
 *
 * <p>Formulas and wire-wound validity ranges: IEC 60751:2008 (reference sheet §6.1 and check case A8,
 * confirmed through copies quoting the standard's class table). Thin-film elements have narrower
 * ranges (AA 0 … 150 °C, A −30 … 300 °C, B −50 … 500 °C, C −50 … 600 °C, from memory, not yet
 * checked against the standard) and are not modelled here; the tolerance applies to the complete
 * thermometer. Class AA was formerly called "1/3 DIN".
 */
public enum ToleranceClass {
    /** ±(0.10 + 0.0017|t|) °C, −50 … 250 °C. */
    AA(0.10, 0.0017, -50, 250),
    /** ±(0.15 + 0.002|t|) °C, −100 … 450 °C. */
    A(0.15, 0.002, -100, 450),
    /** ±(0.30 + 0.005|t|) °C, −196 … 600 °C. */
    B(0.30, 0.005, -196, 600),
    /** ±(0.60 + 0.01|t|) °C, −196 … 600 °C. */
    C(0.60, 0.01, -196, 600);

    private final double constantC;
    private final double proportional;
    private final double minTemperatureC;
    private final double maxTemperatureC;

    ToleranceClass(double constantC, double proportional, double minTemperatureC, double maxTemperatureC) {
        this.constantC = constantC;
        this.proportional = proportional;
        this.minTemperatureC = minTemperatureC;
        this.maxTemperatureC = maxTemperatureC;
    }

    /**
     * The class tolerance at a temperature, c₀ + c₁·|t| in °C (a ± half-width).
     *
     * <p>The formula is evaluated even outside the class's validity range; check
     * {@link #isValidAt(double)} before relying on it.
     *
     * @param temperatureC t in °C, finite
     * @return the tolerance in °C
     * @throws IllegalArgumentException when t is not finite
     */
    public double toleranceC(double temperatureC) {
        if (!Double.isFinite(temperatureC)) {
            throw new IllegalArgumentException("A temperature must be a finite number of °C, got " + temperatureC);
        }
        return constantC + proportional * Math.abs(temperatureC);
    }

    /**
     * The class tolerance in ohms, ΔR ≈ tolerance(t) × dR/dt (first-order conversion, as in the
     * IEC 60751 tables of tolerances in ohms).
     *
     * @param temperatureC t in °C, −200 … 850
     * @param curve        the sensor's equation (gives dR/dt)
     * @return the tolerance in ohms
     * @throws IllegalArgumentException when t is not finite or the curve is null
     */
    public double toleranceOhm(double temperatureC, CallendarVanDusen curve) {
        if (curve == null) {
            throw new IllegalArgumentException("A tolerance in ohms needs the sensor's Callendar–Van Dusen equation");
        }
        return toleranceC(temperatureC) * curve.sensitivityOhmPerC(temperatureC);
    }

    /**
     * Whether the class is defined at a temperature (wire-wound validity range, limits inclusive).
     *
     * @param temperatureC t in °C
     * @return true inside the range
     */
    public boolean isValidAt(double temperatureC) {
        return temperatureC >= minTemperatureC && temperatureC <= maxTemperatureC;
    }

    /**
     * Lowest temperature of the validity range.
     *
     * @return °C
     */
    public double minTemperatureC() {
        return minTemperatureC;
    }

    /**
     * Highest temperature of the validity range.
     *
     * @return °C
     */
    public double maxTemperatureC() {
        return maxTemperatureC;
    }

    /**
     * Parses a class name, ignoring case and surrounding blanks ("aa", " A ").
     *
     * @param name the class name
     * @return the class
     * @throws IllegalArgumentException for an unknown name, listing the known ones
     */
    public static ToleranceClass parse(String name) {
        if (name != null) {
            String key = name.strip().toUpperCase(Locale.ROOT);
            for (ToleranceClass c : values()) {
                if (c.name().equals(key)) {
                    return c;
                }
            }
        }
        throw new IllegalArgumentException("Unknown IEC 60751 tolerance class '" + name + "'; expected one of "
                + Arrays.stream(values()).map(Enum::name).collect(Collectors.joining(", ")));
    }
}
