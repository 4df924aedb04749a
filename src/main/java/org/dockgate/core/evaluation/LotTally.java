package org.dockgate.core.evaluation;

import java.util.List;
import java.util.Objects;
import org.dockgate.core.decision.Verdict;

/**
 * The number of nonconforming units in a lot's sample, the d that ISO 2859-1 compares with Ac and Re
 * (d ≤ Ac accepts, d ≥ Re rejects; see {@code org.dockgate.core.sampling.LotResult}).
 */
public final class LotTally {

    private LotTally() {
    }

    /**
     * Counts the nonconforming units: d = #{verdicts the rule counts as nonconforming}.
     *
     * @param unitVerdicts one verdict per tested unit (the sample's units, complete results only)
     * @param rule         how conditional verdicts count, e.g. {@link ConditionalCounting#DEFAULT}
     * @return d, 0 or more
     * @throws IllegalArgumentException when the list or the rule is null or a verdict is null
     */
    public static int count(List<Verdict> unitVerdicts, ConditionalCounting rule) {
        if (unitVerdicts == null || rule == null) {
            throw new IllegalArgumentException("A lot tally needs the unit verdicts and the counting rule");
        }
        if (unitVerdicts.stream().anyMatch(Objects::isNull)) {
            throw new IllegalArgumentException("A lot tally must not contain an empty (null) verdict");
        }
        return (int) unitVerdicts.stream().filter(rule::isNonconforming).count();
    }
}
