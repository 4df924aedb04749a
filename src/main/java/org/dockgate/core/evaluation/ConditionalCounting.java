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
     * The name a procedure stores: {@code DEFAULT}, {@code STRICT}, {@code LENIENT}, or
     * {@code CONDITIONAL_PASS_ONLY} for the remaining combination.
     *
     * @return the name
     */
    public String key() {
        if (conditionalPassNonconforming) {
            return conditionalFailNonconforming ? "STRICT" : "CONDITIONAL_PASS_ONLY";
        }
        return conditionalFailNonconforming ? "DEFAULT" : "LENIENT";
    }

    /**
     * The counting a stored name stands for ({@link #key()}); blank or null is {@link #DEFAULT}, the
     * counting every procedure used before it became a setting.
     *
     * @param key the stored name, any case
     * @return the counting
     * @throws IllegalArgumentException for an unknown name, listing the known ones
     */
    public static ConditionalCounting parse(String key) {
        if (key == null || key.isBlank()) {
            return DEFAULT;
        }
        return switch (key.strip().toUpperCase(java.util.Locale.ROOT)) {
            case "DEFAULT" -> DEFAULT;
            case "STRICT" -> STRICT;
            case "LENIENT" -> LENIENT;
            case "CONDITIONAL_PASS_ONLY" -> new ConditionalCounting(true, false);
            default -> throw new IllegalArgumentException("Unknown counting of conditional results '" + key
                    + "'; expected DEFAULT, STRICT or LENIENT.");
        };
    }

    /**
     * The counting in words, as procedures and certificates state it.
     *
     * @return one sentence
     */
    public String inWords() {
        return "Counting toward Ac/Re: a FAIL counts as nonconforming"
                + (conditionalFailNonconforming ? ", a CONDITIONAL FAIL counts" : ", a CONDITIONAL FAIL does not count")
                + (conditionalPassNonconforming ? ", a CONDITIONAL PASS counts" : ", a CONDITIONAL PASS does not count")
                + "; a PASS never counts.";
    }

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
