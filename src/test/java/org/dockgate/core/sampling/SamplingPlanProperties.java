package org.dockgate.core.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;

/** Properties of the plan look-up over all lot sizes, levels, severities, AQLs and schemes. */
class SamplingPlanProperties {

    @Property
    void sampleSizeNeverExceedsTheLot(@ForAll @IntRange(min = 1, max = 2_000_000) int lotSize,
            @ForAll Aql aql, @ForAll InspectionLevel level, @ForAll Severity severity, @ForAll Scheme scheme) {
        SamplingPlan plan = SingleSamplingPlans.plan(lotSize, aql, level, severity, scheme);
        assertTrue(plan.sampleSize() <= lotSize);
        // 100 % inspection exactly when the tabulated sample reaches the lot (legend of Tables 2-A/2-B/2-C)
        int tabulated = SingleSamplingPlans.sampleSize(plan.planCodeLetter(), severity);
        assertEquals(tabulated >= lotSize, plan.fullInspection());
        assertEquals(Math.min(tabulated, lotSize), plan.sampleSize());
    }

    @Property
    void sampleSizeIsNonDecreasingInTheLotSize(@ForAll @IntRange(min = 1, max = 1_000_000) int lotSize,
            @ForAll @IntRange(min = 1, max = 1_000_000) int extra, @ForAll Aql aql, @ForAll InspectionLevel level,
            @ForAll Severity severity, @ForAll Scheme scheme) {
        SamplingPlan smaller = SingleSamplingPlans.plan(lotSize, aql, level, severity, scheme);
        SamplingPlan larger = SingleSamplingPlans.plan(lotSize + extra, aql, level, severity, scheme);
        assertTrue(smaller.sampleSize() <= larger.sampleSize(),
                () -> "lot " + lotSize + " -> n " + smaller.sampleSize() + ", lot " + (lotSize + extra) + " -> n "
                        + larger.sampleSize());
    }

    @Property
    void acceptingIsMonotonicInTheNumberNonconforming(@ForAll @IntRange(min = 1, max = 600_000) int lotSize,
            @ForAll Aql aql, @ForAll InspectionLevel level, @ForAll Severity severity, @ForAll Scheme scheme) {
        SamplingPlan plan = SingleSamplingPlans.plan(lotSize, aql, level, severity, scheme);
        boolean rejectedBefore = false;
        for (int d = 0; d <= plan.sampleSize(); d++) {
            boolean rejected = plan.disposition(d) == Disposition.REJECT;
            assertTrue(!rejectedBefore || rejected, "once rejected, more nonconforming items cannot be accepted");
            rejectedBefore = rejected;
        }
    }
}
