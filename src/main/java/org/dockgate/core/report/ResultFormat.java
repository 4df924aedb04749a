package org.dockgate.core.report;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;
import java.util.OptionalDouble;

/**
 * Measured values, uncertainties, limits, dates and times as results are reported (pages, certificates,
 * CSV exports). Only the text is rounded: every comparison (verdicts, acceptance limits, probabilities)
 * is made by the core on the unrounded values before anything is formatted.
 *
 * <p><b>Rounding of U</b> (JCGM 100:2008 7.2.6: U is given to at most two significant digits, and the
 * result is rounded to be consistent with it): U is rounded <em>up</em> to two significant digits —
 * 0.01049 → 0.011, 0.0095 → 0.0095 — so the stated interval never claims more than was measured (rounding
 * up is common practice in calibration reports; GUM 7.2.6 leaves the direction open). Before rounding up,
 * floating-point residue is removed by rounding to 12 significant digits (HALF_EVEN), so a computed
 * 0.013000000000000001 stays 0.013 rather than becoming 0.014.
 *
 * <p><b>The value</b> is rounded (HALF_UP) to the decimal place of the rounded U's last digit, and
 * trailing zeros are kept because they state that precision: 10.0 with U = 0.013 prints "10.000". A value
 * that rounds to zero prints "0" without a sign at that precision ("0.000", never "−0.000"). Negative
 * values carry a true minus sign (U+2212).
 *
 * <p><b>Stated values</b> (tolerances, nominal values, limits that are not results) print with at most
 * six significant digits and without trailing zeros, which carry no claim there.
 */
public final class ResultFormat {

    /** The true minus sign (U+2212), as typeset; ASCII "-" only in CSV ({@link #csvNumber}). */
    public static final String MINUS = "\u2212";
    /** Printed when a metric has tolerance limits but the guard band leaves no value acceptable. */
    public static final String EMPTY_ZONE = "no acceptance zone: the guard band leaves none";

    private static final MathContext NOISE = new MathContext(12, RoundingMode.HALF_EVEN);
    private static final MathContext TWO_UP = new MathContext(2, RoundingMode.UP);
    private static final MathContext STATED = new MathContext(6, RoundingMode.HALF_UP);
    private static final DateTimeFormatter DATE_TIME = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss zzz", Locale.ENGLISH);
    private static final DateTimeFormatter DATE_TIME_MINUTES = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm zzz", Locale.ENGLISH);

    private ResultFormat() {
    }

    /**
     * U rounded up to two significant digits (JCGM 100:2008 7.2.6; up: common practice), trailing zeros
     * kept ("0.10", "1.0"); "0" for a zero U and "—" for a missing or non-finite one.
     */
    public static String uncertainty(double u) {
        BigDecimal rounded = roundedUncertainty(u);
        if (rounded == null) {
            return Double.isFinite(u) && u == 0 ? "0" : "—";
        }
        return sign(rounded.toPlainString());
    }

    /**
     * The value rounded to the decimal place of U's second significant digit (after rounding U up),
     * trailing zeros kept. Without a positive finite U the value is a {@linkplain #stated stated} value.
     */
    public static String value(double value, double u) {
        if (!Double.isFinite(value)) {
            return "—";
        }
        BigDecimal rounded = roundedUncertainty(u);
        if (rounded == null) {
            return stated(value);
        }
        BigDecimal v = new BigDecimal(value).round(NOISE).setScale(rounded.scale(), RoundingMode.HALF_UP);
        if (v.signum() == 0) {
            v = v.abs();
        }
        return sign(v.toPlainString());
    }

    /** The number of decimal places the value is given to for this U (negative: tens, hundreds …). */
    public static int decimals(double u) {
        BigDecimal rounded = roundedUncertainty(u);
        if (rounded == null) {
            throw new IllegalArgumentException("U must be positive and finite to set a precision, was " + u);
        }
        return rounded.scale();
    }

    /** "10.000 mV/bar, U = 0.013 mV/bar (k = 2.00)": the unit on the value and on U. */
    public static String withUncertainty(double value, double u, double k, String unit) {
        String space = unit == null || unit.isBlank() ? "" : " " + unit;
        return value(value, u) + space + ", U = " + uncertainty(u) + space + " (k = " + coverageFactor(k) + ")";
    }

    /** "0.013 mV/bar (k = 2.00)". */
    public static String uncertaintyWithUnit(double u, double k, String unit) {
        String space = unit == null || unit.isBlank() ? "" : " " + unit;
        return uncertainty(u) + space + " (k = " + coverageFactor(k) + ")";
    }

    /** The coverage factor to two decimals ("2.00", "2.28"). */
    public static String coverageFactor(double k) {
        return Double.isFinite(k) ? String.format(Locale.ROOT, "%.2f", k) : "∞";
    }

    /** A stated value: at most six significant digits, no trailing zeros, plain notation, true minus. */
    public static String stated(double value) {
        if (!Double.isFinite(value)) {
            return value == Double.POSITIVE_INFINITY ? "∞" : value == Double.NEGATIVE_INFINITY ? MINUS + "∞" : "—";
        }
        if (value == 0) {
            return "0";
        }
        return sign(new BigDecimal(value).round(STATED).stripTrailingZeros().toPlainString());
    }

    /**
     * A tolerance or an acceptance zone in words: "9.9 … 10.1 mV/bar", "≤ 0.25 %FSO", "≥ 5000 Hz",
     * "no limit" when neither side is bounded.
     */
    public static String interval(OptionalDouble lower, OptionalDouble upper, String unit) {
        String space = unit == null || unit.isBlank() ? "" : " " + unit;
        if (lower.isPresent() && upper.isPresent()) {
            return stated(lower.getAsDouble()) + " … " + stated(upper.getAsDouble()) + space;
        }
        if (upper.isPresent()) {
            return "≤ " + stated(upper.getAsDouble()) + space;
        }
        if (lower.isPresent()) {
            return "≥ " + stated(lower.getAsDouble()) + space;
        }
        return "no limit";
    }

    /**
     * The acceptance zone the decision rule drew: like {@link #interval}, but when the tolerance is bounded
     * and the zone has no limit on a bounded side the guard band has consumed the zone, which is said in
     * words ({@link #EMPTY_ZONE}) instead of printing an unbounded range.
     */
    public static String acceptanceZone(OptionalDouble toleranceLower, OptionalDouble toleranceUpper,
                                        OptionalDouble acceptanceLower, OptionalDouble acceptanceUpper, String unit) {
        boolean lowerLost = toleranceLower.isPresent() && acceptanceLower.isEmpty();
        boolean upperLost = toleranceUpper.isPresent() && acceptanceUpper.isEmpty();
        if (lowerLost || upperLost) {
            return EMPTY_ZONE;
        }
        return interval(acceptanceLower, acceptanceUpper, unit);
    }

    /** A date and time in the lab's zone, to the second (no fractions), with the zone: "2026-03-04 09:15:02 UTC". */
    public static String dateTime(Instant instant, ZoneId zone) {
        return instant == null ? "—" : DATE_TIME.format(instant.atZone(zone));
    }

    /** A date and time in the lab's zone to the minute, with the zone. */
    public static String dateTimeMinutes(Instant instant, ZoneId zone) {
        return instant == null ? "—" : DATE_TIME_MINUTES.format(instant.atZone(zone));
    }

    /** The same rounding as {@link #value} with an ASCII minus, for CSV cells that spreadsheets read as numbers. */
    public static String csvNumber(double value, double u) {
        return value(value, u).replace(MINUS, "-");
    }

    /** U rounded up to two significant digits, or null when U is not positive and finite. */
    static BigDecimal roundedUncertainty(double u) {
        if (!(u > 0) || !Double.isFinite(u)) {
            return null;
        }
        BigDecimal rounded = new BigDecimal(u).round(NOISE).round(TWO_UP);
        // 1 or 0.5 have one significant digit as decimals; U always shows two (1.0, 0.50).
        return rounded.precision() < 2 ? rounded.setScale(rounded.scale() + 2 - rounded.precision()) : rounded;
    }

    private static String sign(String plain) {
        return plain.startsWith("-") ? MINUS + plain.substring(1) : plain;
    }
}
