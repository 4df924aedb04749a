package org.dockgate.core.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Lot disposition: accept when d <= Ac, not accept when d >= Re (rule of ISO 2859-1:1999 Tables 2-A/2-B/2-C). */
class DispositionTest {

    @Test
    void normalPlanAtItsBoundaries() {
        // ISO 2859-1:1999 Table 2-A, code letter J, AQL 1.0: n 80, Ac 2, Re 3
        SamplingPlan plan = SingleSamplingPlans.plan(1000, Aql.AQL_1_0, InspectionLevel.II, Severity.NORMAL);
        assertEquals(Disposition.ACCEPT, plan.disposition(0));
        assertEquals(Disposition.ACCEPT, plan.disposition(2)); // d = Ac accepts
        assertEquals(Disposition.REJECT, plan.disposition(3)); // d = Re rejects
        assertEquals(Disposition.REJECT, plan.disposition(80));
    }

    @Test
    void zeroAcceptancePlan() {
        // ISO 2859-1:1999 Table 2-A, code letter H, AQL 0.25: n 50, Ac 0, Re 1
        SamplingPlan plan = SingleSamplingPlans.plan(300, Aql.AQL_0_25, InspectionLevel.II, Severity.NORMAL);
        assertEquals(Disposition.ACCEPT, plan.disposition(0));
        assertEquals(Disposition.REJECT, plan.disposition(1));
    }

    @Test
    void isoReducedPlansHaveNoGap() {
        // ISO 2859-1:1999 Table 2-C, code letter J, AQL 1.0: n 32, Ac 1, Re 2
        SamplingPlan plan = SingleSamplingPlans.plan(1000, Aql.AQL_1_0, InspectionLevel.II, Severity.REDUCED);
        assertEquals(Disposition.ACCEPT, plan.disposition(1));
        assertEquals(Disposition.REJECT, plan.disposition(2));
    }

    @Test
    void z14ReducedGapPlanHasTheSpecialOutcome() {
        // ANSI/ASQ Z1.4-2008 Table II-C, code letter J, AQL 1.0: n 32, Ac 1, Re 3; clause 10.1.4 for Ac < d < Re
        SamplingPlan plan = SingleSamplingPlans.plan(1000, Aql.AQL_1_0, InspectionLevel.II, Severity.REDUCED,
                Scheme.ANSI_ASQ_Z1_4_2008);
        assertEquals(Disposition.ACCEPT, plan.disposition(1));
        assertEquals(Disposition.ACCEPT_AND_RETURN_TO_NORMAL, plan.disposition(2));
        assertTrue(Disposition.ACCEPT_AND_RETURN_TO_NORMAL.accepted());
        assertEquals(Disposition.REJECT, plan.disposition(3));
        assertFalse(Disposition.REJECT.accepted());
    }

    @Test
    void fullInspectionKeepsThePlansNumbers() {
        // REFERENCE.md A7: lot 120, level II, AQL 0.065 -> F, down arrow to L (n 200 >= 120): 100 %, Ac 0, Re 1
        SamplingPlan plan = SingleSamplingPlans.plan(120, Aql.AQL_0_065, InspectionLevel.II, Severity.NORMAL);
        assertEquals(Disposition.ACCEPT, plan.disposition(0));
        assertEquals(Disposition.REJECT, plan.disposition(1));
        assertEquals(Disposition.REJECT, plan.disposition(120));
    }

    @Test
    void impossibleCountsAreRejected() {
        SamplingPlan plan = SingleSamplingPlans.plan(1000, Aql.AQL_1_0, InspectionLevel.II, Severity.NORMAL);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> plan.disposition(-1));
        assertEquals("Number of nonconforming items must be between 0 and the sample size 80, was -1.", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> plan.disposition(81));
    }

    @Test
    void inconsistentPlansCannotBeBuilt() {
        assertThrows(IllegalArgumentException.class, () -> new SamplingPlan(CodeLetter.J, CodeLetter.J, 80, 3, 3,
                false, Severity.NORMAL, Aql.AQL_1_0, Scheme.ISO_2859_1_1999));
        assertThrows(IllegalArgumentException.class, () -> new SamplingPlan(CodeLetter.J, CodeLetter.J, 0, 0, 1,
                false, Severity.NORMAL, Aql.AQL_1_0, Scheme.ISO_2859_1_1999));
    }
}
