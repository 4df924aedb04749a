package org.dockgate.core;

/**
 * Argument checks for core factory methods and compact constructors. Each throws {@link IllegalArgumentException}
 * with a message that names the offending field, so that the web layer can show it as it is.
 */
public final class InputChecks {

    private InputChecks() {
    }

    /** @return the value, when it is finite (not NaN, not infinite) */
    public static double finite(String field, double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException(field + " must be a finite number, was " + value);
        }
        return value;
    }

    /** @return the value, when it is finite and not negative */
    public static double nonNegative(String field, double value) {
        finite(field, value);
        if (value < 0) {
            throw new IllegalArgumentException(field + " must not be negative, was " + value);
        }
        return value;
    }

    /** @return the value, when it is finite and greater than zero */
    public static double positive(String field, double value) {
        finite(field, value);
        if (value <= 0) {
            throw new IllegalArgumentException(field + " must be greater than zero, was " + value);
        }
        return value;
    }

    /** @return the value, when it is a number of degrees of freedom: at least 1, or +∞ for an exactly known quantity */
    public static double degreesOfFreedom(String field, double value) {
        if (Double.isNaN(value) || value < 1) {
            throw new IllegalArgumentException(field + " must be at least 1 (or infinite), was " + value);
        }
        return value;
    }

    /** @return the value, when it lies strictly between 0 and 1 */
    public static double probability(String field, double value) {
        if (!(value > 0 && value < 1)) {
            throw new IllegalArgumentException(field + " must lie strictly between 0 and 1, was " + value);
        }
        return value;
    }
}
