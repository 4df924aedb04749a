package org.dockgate.core.rtd;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * How a platinum resistance thermometer's sensing element is built. IEC 60751:2008 gives each tolerance
 * class a validity range per construction (Table 3): thin-film elements are specified over narrower
 * ranges than wire-wound ones ({@link ToleranceClass#minTemperatureC(RtdConstruction)}).
 */
public enum RtdConstruction {
    /** A platinum wire coil (wound or in a ceramic bore). */
    WIRE_WOUND,
    /** A platinum film deposited on a ceramic substrate. */
    THIN_FILM;

    /**
     * Parses a construction name, ignoring case, surrounding blanks and '-' or ' ' for '_' ("thin-film").
     *
     * @param name the name
     * @return the construction
     * @throws IllegalArgumentException for an unknown name, listing the known ones
     */
    public static RtdConstruction parse(String name) {
        if (name != null) {
            String key = name.strip().toUpperCase(Locale.ROOT).replace('-', '_').replace(' ', '_');
            for (RtdConstruction c : values()) {
                if (c.name().equals(key)) {
                    return c;
                }
            }
        }
        throw new IllegalArgumentException("Unknown RTD construction '" + name + "'; expected one of "
                + Arrays.stream(values()).map(Enum::name).collect(Collectors.joining(", ")));
    }

    /**
     * Plain words for documents: "wire-wound", "thin-film".
     *
     * @return the label
     */
    public String label() {
        return this == WIRE_WOUND ? "wire-wound" : "thin-film";
    }
}
