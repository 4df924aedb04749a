package org.dockgate.core.evaluation;

import java.util.Objects;
import org.dockgate.core.decision.Verdict;

/**
 * How a procedure counts the conditional verdicts of the non-binary rule (ILAC G8:09/2019 §4.2.3) when a
 * lot's nonconforming units are tallied against Ac/Re. PASS never counts and FAIL always does.
 *
 * @param conditionalPassNonconforming whether CONDITIONAL_PASS (inside the tolerance, within U of a limit)
 *                                     counts as nonconforming
 * @param conditionalFailNonconforming whether CONDITIONAL_FAIL (outside the tolerance by no more than U)
 *                                     counts as nonconforming
 */
public record ConditionalCounting(boolean conditionalPassNonconforming, boolean conditionalFailNonconforming) {

    /**
     * The default: CONDITIONAL_FAIL counts, CONDITIONAL_PASS does not — the measured value decides which side
     * of the tolerance the unit is on (common practice; ILAC G8 calls a conditional pass a statement of
     * conformity with a caveat).
     */
    public static final ConditionalCounting DEFAULT = new ConditionalCounting(false, true);

    /** Conservative: both conditional verdicts count as nonconforming (nothing is accepted on a caveat). */
    public static final ConditionalCounting STRICT = new ConditionalCounting(true, true);

    /** Lenient: neither conditional verdict counts (only a clear FAIL is nonconforming). */
    public static final ConditionalCounting LENIENT = new ConditionalCounting(false, false);

    /**
     * Whether a unit with this verdict counts as nonconforming.
     *
     * @param verdict the unit's verdict
     * @return true for FAIL, and for a conditional verdict the rule counts
     * @throws NullPointerException when the verdict is null
     */
    public boolean isNonconforming(Verdict verdict) {
        return switch (Objects.requireNonNull(verdict, "verdict")) {
            case PASS -> false;
            case CONDITIONAL_PASS -> conditionalPassNonconforming;
            case CONDITIONAL_FAIL -> conditionalFailNonconforming;
            case FAIL -> true;
        };
    }
}
