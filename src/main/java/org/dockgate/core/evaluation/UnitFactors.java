package org.dockgate.core.evaluation;

import java.math.BigDecimal;
import java.math.MathContext;
import org.dockgate.core.quantity.Units;

/** Unit factors for differences and uncertainties, and number formatting for budget lines and notes. */
final class UnitFactors {

    private UnitFactors() {
    }

    /**
     * The factor that turns a difference (an error, an uncertainty, a slope) in one unit into another:
     * convert(1) − convert(0), which drops the offset of an affine temperature scale (1 °C of difference is
     * 1 K). Quotients with a temperature (Ω/°C) cannot be converted by the units library; a difference in
     * °C equals one in K, so such quotients are converted with K in place of °C.
     *
     * @throws IllegalArgumentException when the units are unknown or not compatible
     */
    static double factor(String from, String to) {
        String a = Units.toUcum(from);
        String b = Units.toUcum(to);
        if (a.equals(b)) {
            return 1.0;
        }
        try {
            return difference(a, b);
        } catch (UnsupportedOperationException e) {
            try {
                return difference(asKelvin(a), asKelvin(b));
            } catch (UnsupportedOperationException again) {
                throw new IllegalArgumentException("Unit '" + from + "' cannot be converted to '" + to + "'", again);
            }
        }
    }

    /** Parentheses around each unit so that quotients like (mV/V)/(kN) keep their meaning. */
    static String quotient(String numerator, String denominator) {
        return "(" + numerator + ")/(" + denominator + ")";
    }

    private static double difference(String from, String to) {
        return Units.convert(1.0, from, to) - Units.convert(0.0, from, to);
    }

    private static String asKelvin(String ucum) {
        return ucum.replaceAll("(?<![A-Za-z\\[])Cel(?![A-Za-z\\]])", "K").replace("[degF]", "[degR]");
    }

    /** Four significant digits, no trailing zeros, plain notation: for people reading a budget. */
    static String fmt(double value) {
        if (!Double.isFinite(value)) {
            return value == Double.POSITIVE_INFINITY ? "∞" : String.valueOf(value);
        }
        if (value == Math.rint(value) && Math.abs(value) < 1e9) {
            return String.valueOf((long) value);
        }
        return new BigDecimal(value).round(new MathContext(4)).stripTrailingZeros().toPlainString();
    }
}
