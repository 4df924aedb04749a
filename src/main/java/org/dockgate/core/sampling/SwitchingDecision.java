package org.dockgate.core.sampling;

import java.util.Objects;

/**
 * The outcome of one step of the switching rules: the state before and after, and a human-readable
 * explanation for the audit trail and the lot page (what happened to the lot, how the counters moved,
 * and which clause caused a change of severity, if any).
 *
 * @param previous the state before the step
 * @param state the state after the step, to be used for the next lot
 * @param explanation plain-English explanation naming the clause applied
 */
public record SwitchingDecision(SwitchingState previous, SwitchingState state, String explanation) {

    /**
     * Validates the decision.
     *
     * @throws IllegalArgumentException when a field is null or the explanation is blank
     */
    public SwitchingDecision {
        Objects.requireNonNull(previous, "previous");
        Objects.requireNonNull(state, "state");
        if (explanation == null || explanation.isBlank()) {
            throw new IllegalArgumentException("A switching decision needs an explanation.");
        }
    }

    /**
     * Whether the step changed the severity or the discontinued flag (a transition worth an audit entry
     * of its own).
     *
     * @return true when severity or discontinuation changed
     */
    public boolean transition() {
        return previous.severity() != state.severity() || previous.discontinued() != state.discontinued();
    }
}
