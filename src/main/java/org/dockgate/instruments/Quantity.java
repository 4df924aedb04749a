package org.dockgate.instruments;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;
import org.dockgate.core.quantity.Units;

/**
 * What a reference instrument measures or generates, with a unit of that kind used to check the
 * dimension of any unit given for it ({@link Units#requireCompatible}). The {@link #label()} is the
 * spelling used in the API, the seed files and {@link InstrumentService#qualifying}.
 */
public enum Quantity {
    PRESSURE("pressure", "Pa"),
    ACCELERATION("acceleration", "m/s2"),
    TEMPERATURE("temperature", "K"),
    VOLTAGE("voltage", "V"),
    CURRENT("current", "A"),
    RESISTANCE("resistance", "Ohm"),
    FORCE("force", "N"),
    ILLUMINANCE("illuminance", "lx"),
    FREQUENCY("frequency", "Hz"),
    CHARGE("charge", "C"),
    TIME("time", "s"),
    LENGTH("length", "m"),
    MASS("mass", "kg"),
    TORQUE("torque", "N.m"),
    /** A bridge output or other ratio, e.g. mV/V. */
    RATIO("ratio", "1");

    private final String label;
    private final String referenceUnit;

    Quantity(String label, String referenceUnit) {
        this.label = label;
        this.referenceUnit = referenceUnit;
    }

    /** @return the lower-case name, e.g. "pressure" */
    public String label() {
        return label;
    }

    /** @return a unit of this kind, in UCUM (e.g. "Pa" for pressure) */
    public String referenceUnit() {
        return referenceUnit;
    }

    /**
     * The quantity named by its label, its constant name or its {@link #dimensionName()} (so a caller may
     * pass {@code Units.dimensionName(unit)}), ignoring case and surrounding blanks.
     *
     * @param name e.g. "pressure", "PRESSURE", "electric current"
     * @return the quantity
     * @throws IllegalArgumentException when the name is empty or not one of the known quantities
     */
    public static Quantity of(String name) {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("Choose what the instrument measures or generates (" + known() + ").");
        }
        String wanted = name.strip().toLowerCase(Locale.ROOT);
        return Arrays.stream(values()).filter(q -> q.label.equals(wanted) || q.name().equalsIgnoreCase(wanted)
                        || q.dimensionName().equals(wanted)).findFirst()
                .orElseThrow(() -> new IllegalArgumentException(
                        "Unknown quantity '" + name.strip() + "': use one of " + known() + "."));
    }

    /** @return the name {@link Units#dimensionName} gives this quantity's dimension, e.g. "electric current" */
    public String dimensionName() {
        return Units.dimensionName(referenceUnit);
    }

    /**
     * Requires a unit to fit this quantity, e.g. refuses "V" for a pressure.
     *
     * @param unit a unit symbol (engineer's spelling or UCUM)
     * @throws IllegalArgumentException when the unit is unknown or of another kind; the message names both
     */
    public void requireUnit(String unit) {
        Units.parse(unit);
        if (!Units.isCompatible(unit, referenceUnit)) {
            throw new IllegalArgumentException("The unit '" + unit.strip() + "' does not fit a " + label + ": '"
                    + unit.strip() + "' is a unit of " + Units.dimensionName(unit) + ", a " + label
                    + " needs a unit such as " + example() + ".");
        }
    }

    private String example() {
        return switch (this) {
            case PRESSURE -> "Pa, kPa, bar or psi";
            case ACCELERATION -> "m/s² or g";
            case TEMPERATURE -> "°C or K";
            case VOLTAGE -> "V or mV";
            case CURRENT -> "A or mA";
            case RESISTANCE -> "Ω or kΩ";
            case FORCE -> "N or kN";
            case ILLUMINANCE -> "lx";
            case FREQUENCY -> "Hz or kHz";
            case CHARGE -> "C or pC";
            case TIME -> "s or ms";
            case LENGTH -> "m or mm";
            case MASS -> "kg or gram";
            case TORQUE -> "N.m";
            case RATIO -> "mV/V or %";
        };
    }

    private static String known() {
        return Arrays.stream(values()).map(Quantity::label).collect(Collectors.joining(", "));
    }
}
