package org.dockgate.core.decision;

import java.util.Objects;
import java.util.OptionalDouble;

import org.dockgate.core.InputChecks;

/**
 * A specification zone (tolerance) with a lower limit T_L, an upper limit T_U, or both. Limits are inclusive:
 * a value equal to a limit conforms.
 *
 * @param lower T_L, absent for an upper-limit-only tolerance
 * @param upper T_U, absent for a lower-limit-only tolerance
 */
public record Tolerance(OptionalDouble lower, OptionalDouble upper) {

    /**
     * Validates the zone.
     *
     * @throws IllegalArgumentException when neither limit is given, a limit is NaN or infinite,
     *                                  T_L ≥ T_U (a zone of zero width cannot be tested against), or T_U − T_L
     *                                  overflows a double
     */
    public Tolerance {
        Objects.requireNonNull(lower, "lower");
        Objects.requireNonNull(upper, "upper");
        if (lower.isEmpty() && upper.isEmpty()) {
            throw new IllegalArgumentException("a tolerance needs a lower limit, an upper limit or both");
        }
        lower.ifPresent(value -> InputChecks.finite("lowerLimit", value));
        upper.ifPresent(value -> InputChecks.finite("upperLimit", value));
        if (lower.isPresent() && upper.isPresent()) {
            if (!(lower.getAsDouble() < upper.getAsDouble())) {
                throw new IllegalArgumentException("lowerLimit " + lower.getAsDouble()
                        + " must be below upperLimit " + upper.getAsDouble());
            }
            if (!Double.isFinite(upper.getAsDouble() - lower.getAsDouble())) {
                throw new IllegalArgumentException("the tolerance from " + lower.getAsDouble() + " to "
                        + upper.getAsDouble() + " is too wide to compute with");
            }
        }
    }

    /** @return the two-sided tolerance T_L … T_U */
    public static Tolerance between(double lower, double upper) {
        return new Tolerance(OptionalDouble.of(lower), OptionalDouble.of(upper));
    }

    /** @return the one-sided tolerance y ≥ T_L */
    public static Tolerance atLeast(double lower) {
        return new Tolerance(OptionalDouble.of(lower), OptionalDouble.empty());
    }

    /** @return the one-sided tolerance y ≤ T_U */
    public static Tolerance atMost(double upper) {
        return new Tolerance(OptionalDouble.empty(), OptionalDouble.of(upper));
    }

    /** @return a tolerance from nullable limits (null = no such limit), e.g. from a request */
    public static Tolerance of(Double lower, Double upper) {
        return new Tolerance(lower == null ? OptionalDouble.empty() : OptionalDouble.of(lower),
                upper == null ? OptionalDouble.empty() : OptionalDouble.of(upper));
    }

    /** @return whether both limits are given */
    public boolean isTwoSided() {
        return lower.isPresent() && upper.isPresent();
    }

    /** @return whether T_L ≤ y ≤ T_U for the limits that are given (inclusive) */
    public boolean contains(double value) {
        return (lower.isEmpty() || value >= lower.getAsDouble()) && (upper.isEmpty() || value <= upper.getAsDouble());
    }

    /** @return T_U − T_L for a two-sided tolerance, else absent */
    public OptionalDouble width() {
        return isTwoSided() ? OptionalDouble.of(upper.getAsDouble() - lower.getAsDouble()) : OptionalDouble.empty();
    }

    /** @return (T_L + T_U)/2 for a two-sided tolerance, else absent */
    public OptionalDouble centre() {
        return isTwoSided() ? OptionalDouble.of(lower.getAsDouble() + width().getAsDouble() / 2.0)
                : OptionalDouble.empty();
    }
}
