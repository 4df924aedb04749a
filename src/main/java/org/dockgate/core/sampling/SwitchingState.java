package org.dockgate.core.sampling;

import java.util.List;
import java.util.Objects;

/**
 * Where a sequence of lots stands in the switching rules of ISO 2859-1:1999 clause 9 (or ANSI/ASQ
 * Z1.4-2008 clause 8): the current severity, whether the acceptance procedures are discontinued, and
 * the counters the rules need. Immutable; {@link SwitchingRules} computes the next state.
 *
 * <p>The rules apply to each class of nonconformity independently (clause 9.2), so keep one state per
 * supplier, sensor model and class of nonconformity.
 *
 * @param scheme the published scheme whose rules apply
 * @param severity the inspection severity for the next lot; {@link Severity#TIGHTENED} while
 *     discontinued (inspection resumes on tightened, clause 9.4)
 * @param discontinued true when the acceptance procedures are discontinued (clause 9.4): no lot may be
 *     evaluated until {@link SwitchingRules#resume(SwitchingState, String)}
 * @param recentNormalLotsAccepted outcomes (true = accepted) of the most recent lots on normal
 *     inspection since normal inspection began, oldest first, at most 5: the window of the
 *     "2 out of 5 or fewer consecutive lots" rule (clause 9.3.1); empty on other severities
 * @param switchingScore the switching score of clause 9.3.3.2, set to 0 at the start of normal
 *     inspection and updated after each lot on normal inspection; 0 on other severities
 * @param consecutiveAcceptedOnNormal lots accepted in a row on normal inspection (the "preceding 10
 *     lots" of ANSI/ASQ Z1.4-2008 clause 8.3.3 a; informative under ISO)
 * @param consecutiveAcceptedOnTightened lots accepted in a row since tightened inspection began
 *     (5 switch back to normal, clause 9.3.2)
 * @param notAcceptedOnTightened cumulative number of lots not accepted since tightened inspection
 *     began (5 discontinue the procedures, clause 9.4)
 */
public record SwitchingState(
        Scheme scheme,
        Severity severity,
        boolean discontinued,
        List<Boolean> recentNormalLotsAccepted,
        int switchingScore,
        int consecutiveAcceptedOnNormal,
        int consecutiveAcceptedOnTightened,
        int notAcceptedOnTightened) {

    /** Length of the window of the normal-to-tightened rule: "2 out of 5 or fewer consecutive lots". */
    public static final int NORMAL_WINDOW = 5;

    /**
     * Validates the state and makes the window list immutable.
     *
     * @throws IllegalArgumentException when a field is null or negative, the window is longer than 5,
     *     or a discontinued state is not on tightened inspection
     */
    public SwitchingState {
        Objects.requireNonNull(scheme, "scheme");
        Objects.requireNonNull(severity, "severity");
        recentNormalLotsAccepted = List.copyOf(Objects.requireNonNull(recentNormalLotsAccepted,
                "recentNormalLotsAccepted"));
        if (recentNormalLotsAccepted.size() > NORMAL_WINDOW) {
            throw new IllegalArgumentException("The normal-inspection window holds at most " + NORMAL_WINDOW
                    + " lots, got " + recentNormalLotsAccepted.size() + ".");
        }
        if (switchingScore < 0 || consecutiveAcceptedOnNormal < 0 || consecutiveAcceptedOnTightened < 0
                || notAcceptedOnTightened < 0) {
            throw new IllegalArgumentException("Switching counters cannot be negative.");
        }
        if (discontinued && severity != Severity.TIGHTENED) {
            throw new IllegalArgumentException("Discontinuation happens on, and resumes with, tightened inspection.");
        }
    }

    /**
     * The state at the start of inspection under ISO 2859-1:1999: normal inspection (clause 9.1),
     * switching score 0 (clause 9.3.3.2).
     *
     * @return the initial state
     */
    public static SwitchingState start() {
        return start(Scheme.ISO_2859_1_1999, Severity.NORMAL);
    }

    /**
     * The state at the start of inspection with the given scheme and severity. Inspection starts on
     * normal "unless otherwise specified by the responsible authority" (clause 9.1).
     *
     * @param scheme the published scheme
     * @param severity the severity to start with
     * @return a fresh state on that severity with all counters at 0
     */
    public static SwitchingState start(Scheme scheme, Severity severity) {
        return new SwitchingState(scheme, severity, false, List.of(), 0, 0, 0, 0);
    }
}
