package org.dockgate.core.rtd;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * IEC 60751 tolerance classes of platinum resistance thermometers: tolerance ±(c₀ + c₁·|t|) °C,
 * each valid over a temperature range that depends on the element's construction.
 *
 * <p>Formulas and wire-wound validity ranges: IEC 60751:2008 (reference sheet §6.1 and check case A8,
 * confirmed through copies quoting the standard's class table). Validity ranges per construction,
 * IEC 60751:2008 Table 3: wire-wound AA −50 … 250 °C, A −100 … 450 °C, B −196 … 600 °C, C −196 … 600 °C;
 * thin-film AA 0 … 150 °C, A −30 … 300 °C, B −50 … 500 °C, C −50 … 600 °C. The wire-wound ranges agree
 * with the copies of the class table quoted above; the thin-film ranges, and the table's number, are
 * from memory: no copy of the printed standard was at hand to check them, so they must be checked
 * against IEC 60751:2008 Table 3 before release. The tolerance applies to the complete thermometer.
 * Class AA was formerly called "1/3 DIN".
 */
public enum ToleranceClass {
    /** ±(0.10 + 0.0017|t|) °C; wire-wound −50 … 250 °C, thin-film 0 … 150 °C. */
    AA(0.10, 0.0017, -50, 250, 0, 150),
    /** ±(0.15 + 0.002|t|) °C; wire-wound −100 … 450 °C, thin-film −30 … 300 °C. */
    A(0.15, 0.002, -100, 450, -30, 300),
    /** ±(0.30 + 0.005|t|) °C; wire-wound −196 … 600 °C, thin-film −50 … 500 °C. */
    B(0.30, 0.005, -196, 600, -50, 500),
    /** ±(0.60 + 0.01|t|) °C; wire-wound −196 … 600 °C, thin-film −50 … 600 °C. */
    C(0.60, 0.01, -196, 600, -50, 600);

    private final double constantC;
    private final double proportional;
    private final double minTemperatureC;
    private final double maxTemperatureC;
    private final double filmMinTemperatureC;
    private final double filmMaxTemperatureC;

    ToleranceClass(double constantC, double proportional, double minTemperatureC, double maxTemperatureC,
                   double filmMinTemperatureC, double filmMaxTemperatureC) {
        this.constantC = constantC;
        this.proportional = proportional;
        this.minTemperatureC = minTemperatureC;
        this.maxTemperatureC = maxTemperatureC;
        this.filmMinTemperatureC = filmMinTemperatureC;
        this.filmMaxTemperatureC = filmMaxTemperatureC;
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
     * Whether the class is defined at a temperature for a wire-wound element (limits inclusive); same as
     * {@code isValidAt(t, RtdConstruction.WIRE_WOUND)}.
     *
     * @param temperatureC t in °C
     * @return true inside the range
     */
    public boolean isValidAt(double temperatureC) {
        return isValidAt(temperatureC, RtdConstruction.WIRE_WOUND);
    }

    /**
     * Whether the class is defined at a temperature for the construction (IEC 60751:2008 Table 3,
     * limits inclusive).
     *
     * @param temperatureC t in °C
     * @param construction the element's construction
     * @return true inside the range
     * @throws NullPointerException when the construction is null
     */
    public boolean isValidAt(double temperatureC, RtdConstruction construction) {
        return temperatureC >= minTemperatureC(construction) && temperatureC <= maxTemperatureC(construction);
    }

    /**
     * Lowest temperature of the wire-wound validity range.
     *
     * @return °C
     */
    public double minTemperatureC() {
        return minTemperatureC;
    }

    /**
     * Highest temperature of the wire-wound validity range.
     *
     * @return °C
     */
    public double maxTemperatureC() {
        return maxTemperatureC;
    }

    /**
     * Lowest temperature of the validity range for the construction (IEC 60751:2008 Table 3).
     *
     * @param construction the element's construction
     * @return °C
     * @throws NullPointerException when the construction is null
     */
    public double minTemperatureC(RtdConstruction construction) {
        return java.util.Objects.requireNonNull(construction, "construction") == RtdConstruction.THIN_FILM
                ? filmMinTemperatureC : minTemperatureC;
    }

    /**
     * Highest temperature of the validity range for the construction (IEC 60751:2008 Table 3).
     *
     * @param construction the element's construction
     * @return °C
     * @throws NullPointerException when the construction is null
     */
    public double maxTemperatureC(RtdConstruction construction) {
        return java.util.Objects.requireNonNull(construction, "construction") == RtdConstruction.THIN_FILM
                ? filmMaxTemperatureC : maxTemperatureC;
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
