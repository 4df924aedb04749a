package org.dockgate.core.decision;

import java.util.Collection;
import java.util.Objects;

/**
 * The statement of conformity for one metric or unit. Declared from best to worst:
 * {@code PASS < CONDITIONAL_PASS < CONDITIONAL_FAIL < FAIL}; the labels are those of ILAC G8:09/2019 §4.2.
 */
public enum Verdict {

    /** Inside the acceptance limits. */
    PASS,
    /** Inside the tolerance but within the guard band of a limit (non-binary rule only). */
    CONDITIONAL_PASS,
    /** Outside the tolerance by no more than the guard band (non-binary rule only). */
    CONDITIONAL_FAIL,
    /** Rejected. */
    FAIL;

    /**
     * The worst of the given verdicts, e.g. a unit's verdict from its metrics' verdicts.
     *
     * @return the verdict latest in the order PASS, CONDITIONAL_PASS, CONDITIONAL_FAIL, FAIL
     * @throws NullPointerException when a verdict is null
     */
    public static Verdict worst(Verdict first, Verdict... others) {
        Verdict worst = Objects.requireNonNull(first, "verdict");
        for (Verdict other : others) {
            worst = worst.orWorse(other);
        }
        return worst;
    }

    /**
     * The worst of the given verdicts.
     *
     * @throws IllegalArgumentException when there are none
     */
    public static Verdict worst(Collection<Verdict> verdicts) {
        if (verdicts == null || verdicts.isEmpty()) {
            throw new IllegalArgumentException("no verdicts to combine");
        }
        Verdict worst = PASS;
        for (Verdict verdict : verdicts) {
            worst = worst.orWorse(verdict);
        }
        return worst;
    }

    /** @return the worse of this and the other verdict */
    public Verdict orWorse(Verdict other) {
        return Objects.requireNonNull(other, "verdict").ordinal() > ordinal() ? other : this;
    }

    /**
     * Whether the measured value lies inside the tolerance, i.e. {@code PASS} or {@code CONDITIONAL_PASS}
     * (ILAC G8:09/2019 §4.2.3: a conditional pass is a statement of conformity with a caveat).
     */
    public boolean isConforming() {
        return this == PASS || this == CONDITIONAL_PASS;
    }
}
