package org.dockgate.receiving;

import java.util.Optional;
import org.dockgate.core.sampling.ReducedInspectionReadiness;

/**
 * Reduced inspection for one switching state: the decision in force (none until a supervisor decides)
 * and what is still missing for reduced inspection.
 */
public record ReducedInspectionStatus(Optional<ReducedInspectionDecision> decision,
                                      ReducedInspectionReadiness readiness) {

    /** Whether the responsible authority's approval is in force. */
    public boolean approved() {
        return decision.map(ReducedInspectionDecision::approved).orElse(false);
    }
}
