package org.dockgate.core.sampling;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * Severity of inspection (ISO 2859-1:1999 clause 9): which of Tables 2-A (normal), 2-B (tightened)
 * and 2-C (reduced) supplies the single sampling plan.
 */
public enum Severity {
    /** Normal inspection, Table 2-A. Inspection starts here (clause 9.1). */
    NORMAL,
    /** Tightened inspection, Table 2-B. */
    TIGHTENED,
    /** Reduced inspection, Table 2-C. */
    REDUCED;

    /**
     * Parses a severity name ({@code NORMAL TIGHTENED REDUCED}), case-insensitive, surrounding blanks ignored.
     *
     * @param text the severity name
     * @return the severity
     * @throws IllegalArgumentException when {@code text} is null or unknown; the message lists the valid names
     */
    public static Severity parse(String text) {
        if (text != null) {
            String key = text.trim().toUpperCase(Locale.ROOT);
            for (Severity severity : values()) {
                if (severity.name().equals(key)) {
                    return severity;
                }
            }
        }
        throw new IllegalArgumentException("Unknown severity '" + text + "'; valid severities are "
                + Arrays.stream(values()).map(Enum::name).collect(Collectors.joining(", ")) + ".");
    }
}
