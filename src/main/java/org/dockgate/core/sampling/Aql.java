package org.dockgate.core.sampling;

import java.util.Arrays;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * Acceptance quality limit, the preferred series of ISO 2859-1:1999 Tables 2-A/2-B/2-C for percent
 * nonconforming items: 0.010 … 10. The columns above 10 (15 … 1000, nonconformities per 100 units
 * only) are out of Dockgate's scope: incoming sensor lots are judged as percent nonconforming units.
 */
public enum Aql {
    /** AQL 0.010 %. */ AQL_0_010("0.010", 0.010),
    /** AQL 0.015 %. */ AQL_0_015("0.015", 0.015),
    /** AQL 0.025 %. */ AQL_0_025("0.025", 0.025),
    /** AQL 0.040 %. */ AQL_0_040("0.040", 0.040),
    /** AQL 0.065 %. */ AQL_0_065("0.065", 0.065),
    /** AQL 0.10 %. */ AQL_0_10("0.10", 0.10),
    /** AQL 0.15 %. */ AQL_0_15("0.15", 0.15),
    /** AQL 0.25 %. */ AQL_0_25("0.25", 0.25),
    /** AQL 0.40 %. */ AQL_0_40("0.40", 0.40),
    /** AQL 0.65 %. */ AQL_0_65("0.65", 0.65),
    /** AQL 1.0 %. */ AQL_1_0("1.0", 1.0),
    /** AQL 1.5 %. */ AQL_1_5("1.5", 1.5),
    /** AQL 2.5 %. */ AQL_2_5("2.5", 2.5),
    /** AQL 4.0 %. */ AQL_4_0("4.0", 4.0),
    /** AQL 6.5 %. */ AQL_6_5("6.5", 6.5),
    /** AQL 10 %. */ AQL_10("10", 10.0);

    private final String label;
    private final double percentNonconforming;

    Aql(String label, double percentNonconforming) {
        this.label = label;
        this.percentNonconforming = percentNonconforming;
    }

    /**
     * The column heading as printed in the tables, e.g. {@code "0.010"}, {@code "1.0"}, {@code "10"}.
     *
     * @return the printed label
     */
    public String label() {
        return label;
    }

    /**
     * The AQL value in percent nonconforming.
     *
     * @return the value, e.g. 0.65 for AQL 0.65
     */
    public double percentNonconforming() {
        return percentNonconforming;
    }

    /**
     * The next tighter (smaller) AQL of the series, used by the switching score of ISO 2859-1:1999
     * clause 9.3.3.2 ("would have been accepted if the AQL had been one step tighter").
     *
     * @return the tighter AQL, empty for 0.010, the tightest value of the series
     */
    public Optional<Aql> tighter() {
        return ordinal() == 0 ? Optional.empty() : Optional.of(values()[ordinal() - 1]);
    }

    /**
     * Finds the AQL of the series equal to {@code percent}. Values are compared with a relative
     * tolerance of 1e-9 so that 0.65 and 0.6500000001 parsed from text are the same column.
     *
     * @param percent AQL in percent nonconforming
     * @return the series member
     * @throws IllegalArgumentException when {@code percent} is NaN, infinite or not in the series; the
     *     message lists the valid values
     */
    public static Aql of(double percent) {
        if (Double.isFinite(percent)) {
            for (Aql aql : values()) {
                if (Math.abs(aql.percentNonconforming - percent) <= 1e-9 * aql.percentNonconforming) {
                    return aql;
                }
            }
        }
        throw new IllegalArgumentException("AQL " + percent + " is not in the ISO 2859-1 series; valid values are "
                + validList() + " (percent nonconforming).");
    }

    /**
     * Parses an AQL written as a decimal number ({@code "1"}, {@code "1.0"}, {@code "0.65"}) and
     * finds it in the series.
     *
     * @param text the AQL in percent nonconforming, plain decimal notation
     * @return the series member
     * @throws IllegalArgumentException when {@code text} is null, blank, not a decimal number (including
     *     {@code NaN} and {@code Infinity}) or not in the series
     */
    public static Aql parse(String text) {
        if (text == null || text.isBlank()) {
            throw new IllegalArgumentException("AQL is missing; valid values are " + validList() + ".");
        }
        double value;
        try {
            // BigDecimal accepts plain decimal notation only (no NaN, Infinity, hex or type suffixes)
            value = new java.math.BigDecimal(text.trim()).doubleValue();
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("AQL '" + text + "' is not a number; valid values are "
                    + validList() + ".");
        }
        return of(value);
    }

    /**
     * The valid AQL values as printed, comma separated, for error messages.
     *
     * @return e.g. {@code "0.010, 0.015, …, 10"}
     */
    public static String validList() {
        return Arrays.stream(values()).map(Aql::label).collect(Collectors.joining(", "));
    }
}
