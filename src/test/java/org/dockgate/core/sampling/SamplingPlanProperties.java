package org.dockgate.core.sampling;

import static org.dockgate.core.PropertyCheck.forAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Properties of the plan look-up over all lot sizes, levels, severities, AQLs and schemes. */
class SamplingPlanProperties {

    @Test
    void sampleSizeNeverExceedsTheLot() {
        forAll(1000, g -> {
            int lotSize = g.ints(1, 2_000_000);
            Aql aql = g.oneOf(Aql.class);
            InspectionLevel level = g.oneOf(InspectionLevel.class);
            Severity severity = g.oneOf(Severity.class);
            Scheme scheme = g.oneOf(Scheme.class);
            SamplingPlan plan = SingleSamplingPlans.plan(lotSize, aql, level, severity, scheme);
            assertTrue(plan.sampleSize() <= lotSize);
            // 100 % inspection exactly when the tabulated sample reaches the lot (legend of Tables 2-A/2-B/2-C)
            int tabulated = SingleSamplingPlans.sampleSize(plan.planCodeLetter(), severity);
            assertEquals(tabulated >= lotSize, plan.fullInspection());
            assertEquals(Math.min(tabulated, lotSize), plan.sampleSize());
        });
    }

    @Test
    void sampleSizeIsNonDecreasingInTheLotSize() {
        forAll(1000, g -> {
            int lotSize = g.ints(1, 1_000_000);
            int extra = g.ints(1, 1_000_000);
            Aql aql = g.oneOf(Aql.class);
            InspectionLevel level = g.oneOf(InspectionLevel.class);
            Severity severity = g.oneOf(Severity.class);
            Scheme scheme = g.oneOf(Scheme.class);
            SamplingPlan smaller = SingleSamplingPlans.plan(lotSize, aql, level, severity, scheme);
            SamplingPlan larger = SingleSamplingPlans.plan(lotSize + extra, aql, level, severity, scheme);
            assertTrue(smaller.sampleSize() <= larger.sampleSize(),
                    () -> "lot " + lotSize + " -> n " + smaller.sampleSize() + ", lot " + (lotSize + extra) + " -> n "
                            + larger.sampleSize());
        });
    }

    @Test
    void acceptingIsMonotonicInTheNumberNonconforming() {
        forAll(1000, g -> {
            int lotSize = g.ints(1, 600_000);
            SamplingPlan plan = SingleSamplingPlans.plan(lotSize, g.oneOf(Aql.class), g.oneOf(InspectionLevel.class),
                    g.oneOf(Severity.class), g.oneOf(Scheme.class));
            boolean rejectedBefore = false;
            for (int d = 0; d <= plan.sampleSize(); d++) {
                boolean rejected = plan.disposition(d) == Disposition.REJECT;
                assertTrue(!rejectedBefore || rejected, "once rejected, more nonconforming items cannot be accepted");
                rejectedBefore = rejected;
            }
        });
    }
}
