package org.dockgate.core.decision;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The acceptance zone of a decision rule: the tolerance moved inward by the guard band, w = T_L − A_L at an upper
 * limit (ILAC G8:09/2019 §4.1), together with the test uncertainty ratio of the measurement. Limits are inclusive.
 *
 * <p>When the guard band swallows the whole zone (two-sided tolerance with 2w &gt; T_U − T_L, or a risk-based
 * rule whose largest p_c, at the tolerance centre, stays below 1 − α), {@code empty} is true, both limits are
 * absent and no measured value can PASS.
 *
 * @param lower                  A_L, absent when the tolerance has no lower limit or the zone is empty
 * @param upper                  A_U, absent when the tolerance has no upper limit or the zone is empty
 * @param empty                  whether no value is accepted
 * @param testUncertaintyRatio   TUR = (T_U − T_L)/(2U); +∞ when U = 0; absent for a one-sided tolerance
 * @param turAdequate            whether TUR ≥ 4 (false when TUR is absent)
 */
public record AcceptanceLimits(OptionalDouble lower, OptionalDouble upper, boolean empty,
        OptionalDouble testUncertaintyRatio, boolean turAdequate) {

    /** Checks that an empty zone carries no limits. */
    public AcceptanceLimits {
        Objects.requireNonNull(lower, "lower");
        Objects.requireNonNull(upper, "upper");
        Objects.requireNonNull(testUncertaintyRatio, "testUncertaintyRatio");
        if (empty && (lower.isPresent() || upper.isPresent())) {
            throw new IllegalArgumentException("an empty acceptance zone has no limits");
        }
    }

    /** @return whether A_L ≤ y ≤ A_U (inclusive); always false for an empty zone */
    public boolean contains(double value) {
        return !empty && (lower.isEmpty() || value >= lower.getAsDouble())
                && (upper.isEmpty() || value <= upper.getAsDouble());
    }
}
