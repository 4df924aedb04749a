package org.dockgate.core.sampling;

import java.util.Arrays;
import java.util.stream.Collectors;

/**
 * Inspection level of ISO 2859-1:1999 (Table 1, the columns of the code-letter table): the special levels S-1 … S-4 for small
 * samples where large sampling risks can be tolerated, and the general levels I, II and III.
 * Level II is the default general level.
 */
public enum InspectionLevel {
    /** Special inspection level S-1. */
    S1,
    /** Special inspection level S-2. */
    S2,
    /** Special inspection level S-3. */
    S3,
    /** Special inspection level S-4. */
    S4,
    /** General inspection level I. */
    I,
    /** General inspection level II, the default. */
    II,
    /** General inspection level III. */
    III;

    /**
     * Parses a level name as used by the JSON API ({@code S1 S2 S3 S4 I II III}); the printed
     * spellings {@code S-1 … S-4} are accepted too. Case-insensitive, surrounding blanks ignored.
     *
     * @param text the level name
     * @return the level
     * @throws IllegalArgumentException when {@code text} is null, blank or not a level; the message
     *     lists the valid names
     */
    public static InspectionLevel parse(String text) {
        if (text != null) {
            String key = text.trim().toUpperCase(java.util.Locale.ROOT).replace("-", "");
            for (InspectionLevel level : values()) {
                if (level.name().equals(key)) {
                    return level;
                }
            }
        }
        throw new IllegalArgumentException("Unknown inspection level '" + text + "'; valid levels are "
                + Arrays.stream(values()).map(Enum::name).collect(Collectors.joining(", ")) + ".");
    }
}
