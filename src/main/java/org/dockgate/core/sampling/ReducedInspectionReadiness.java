package org.dockgate.core.sampling;

import java.util.List;
import java.util.Objects;

/**
 * What still stands between a switching state and reduced inspection (ISO 2859-1:1999 clause 9.3.3;
 * ANSI/ASQ Z1.4-2008 clause 8.3.3), for the switching page. Computed by
 * {@link SwitchingRules#reducedReadiness(SwitchingState, boolean)}.
 *
 * @param onReduced true when the state is already on reduced inspection (then {@code missing} is empty)
 * @param missing the unmet conditions, each a sentence naming its clause, in the order of the clause;
 *     empty when reduced inspection applies or is due from the next lot
 */
public record ReducedInspectionReadiness(boolean onReduced, List<String> missing) {

    /**
     * Validates the readiness and copies the list.
     *
     * @throws NullPointerException when {@code missing} is null
     * @throws IllegalArgumentException when a state on reduced inspection lists missing conditions
     */
    public ReducedInspectionReadiness {
        missing = List.copyOf(Objects.requireNonNull(missing, "missing"));
        if (onReduced && !missing.isEmpty()) {
            throw new IllegalArgumentException("A state on reduced inspection has nothing missing for it.");
        }
    }

    /**
     * Whether every condition for reduced inspection is met.
     *
     * @return true when nothing is missing
     */
    public boolean ready() {
        return missing.isEmpty();
    }
}
