package org.dockgate.core.procedure;

import java.util.List;
import java.util.Objects;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;

/**
 * The engineer's choices for a derivation: the AQL and inspection level of the sampling plan, the
 * decision rule (with its guard-band factor or risk), and the lot sizes to tabulate plans for.
 */
public record DerivationOptions(Aql aql, InspectionLevel level, DecisionPolicy policy, List<Integer> typicalLotSizes) {

    /** Lot sizes shown by default (common practice: one per usual delivery size band). */
    public static final List<Integer> DEFAULT_LOT_SIZES = List.of(25, 90, 280, 1200, 3200);

    public DerivationOptions {
        Objects.requireNonNull(aql, "aql");
        Objects.requireNonNull(level, "level");
        Objects.requireNonNull(policy, "policy");
        typicalLotSizes = typicalLotSizes == null || typicalLotSizes.isEmpty() ? DEFAULT_LOT_SIZES
                : List.copyOf(typicalLotSizes);
    }
}
