package org.dockgate.core.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.dockgate.core.UnevaluableException;
import org.junit.jupiter.api.Test;

/**
 * Switching rules, ISO 2859-1:1999 clause 9 (clause numbers as in SAMPLING.md section 7.1) and
 * ANSI/ASQ Z1.4-2008 clause 8. Lots of 1000 at level II: code letter J (Table 1).
 */
class SwitchingRulesTest {

    private static final Scheme ISO = Scheme.ISO_2859_1_1999;
    private static final Scheme Z14 = Scheme.ANSI_ASQ_Z1_4_2008;

    /** Table 2-A, code letter J, AQL 1.0: n 80, Ac 2, Re 3. */
    private static SamplingPlan plan(Severity severity, Scheme scheme) {
        return SingleSamplingPlans.plan(1000, Aql.AQL_1_0, InspectionLevel.II, severity, scheme);
    }

    private static SwitchingDecision feed(SwitchingState state, Scheme scheme, int nonconforming) {
        return SwitchingRules.next(state, LotResult.of(plan(state.severity(), scheme), nonconforming));
    }

    /** Feeds lots with the given numbers nonconforming; returns every decision. */
    private static List<SwitchingDecision> feedAll(SwitchingState state, int... nonconforming) {
        List<SwitchingDecision> decisions = new ArrayList<>();
        for (int d : nonconforming) {
            SwitchingDecision decision = feed(state, state.scheme(), d);
            decisions.add(decision);
            state = decision.state();
        }
        return decisions;
    }

    private static SwitchingState last(List<SwitchingDecision> decisions) {
        return decisions.get(decisions.size() - 1).state();
    }

    @Test
    void inspectionStartsOnNormalWithScoreZero() {
        // ISO 2859-1:1999 clause 9.1 (start on normal) and 9.3.3.2 (score set to zero at the start)
        SwitchingState start = SwitchingState.start();
        assertEquals(Severity.NORMAL, start.severity());
        assertEquals(0, start.switchingScore());
        assertFalse(start.discontinued());
    }

    @Test
    void twoOfFiveConsecutiveLotsNotAcceptedSwitchToTightened() {
        // ISO 2859-1:1999 clause 9.3.1: 2 out of 5 or fewer consecutive lots not accepted -> tightened.
        // J / 1.0 (Ac 2, Re 3): lots 1 and 5 not accepted (d = 3), lots 2-4 accepted
        List<SwitchingDecision> decisions = feedAll(SwitchingState.start(), 3, 0, 1, 0, 3);
        for (int i = 0; i < 4; i++) {
            assertEquals(Severity.NORMAL, decisions.get(i).state().severity(), "lot " + (i + 1));
            assertFalse(decisions.get(i).transition());
        }
        SwitchingDecision fifth = decisions.get(4);
        assertTrue(fifth.transition());
        assertEquals(Severity.TIGHTENED, fifth.state().severity());
        assertTrue(fifth.explanation().contains("2 of the last 5 consecutive lots were not accepted"), fifth.explanation());
        assertTrue(fifth.explanation().contains("ISO 2859-1:1999 clause 9.3.1"), fifth.explanation());
    }

    @Test
    void twoOutOfTwoConsecutiveLotsSwitchToTightened() {
        // ISO 2859-1:1999 clause 9.3.1 (MIL-STD-105E wording "2 out of 2, 3, 4, or 5 consecutive lots")
        assertEquals(Severity.TIGHTENED, last(feedAll(SwitchingState.start(), 3, 3)).severity());
    }

    @Test
    void twoNotAcceptedLotsSixApartDoNotSwitch() {
        // ISO 2859-1:1999 clause 9.3.1: lots 1 and 6 are not within 5 consecutive lots
        SwitchingState state = last(feedAll(SwitchingState.start(), 3, 0, 0, 0, 0, 3));
        assertEquals(Severity.NORMAL, state.severity());
        assertEquals(List.of(false, false, false, false, true).size(), state.recentNormalLotsAccepted().size());
        assertEquals(List.of(true, true, true, true, false), state.recentNormalLotsAccepted());
    }

    @Test
    void fiveConsecutiveAcceptedOnTightenedReturnToNormal() {
        // ISO 2859-1:1999 clause 9.3.2; Table 2-B, code letter J, AQL 1.0: n 80, Ac 1, Re 2
        SwitchingState tightened = SwitchingState.start(ISO, Severity.TIGHTENED);
        List<SwitchingDecision> decisions = feedAll(tightened, 0, 1, 0, 2, 0, 0, 1, 0, 0);
        assertEquals(3, decisions.get(2).state().consecutiveAcceptedOnTightened());
        assertEquals(0, decisions.get(3).state().consecutiveAcceptedOnTightened()); // lot 4 not accepted: run restarts
        assertEquals(Severity.TIGHTENED, decisions.get(7).state().severity());
        assertEquals(4, decisions.get(7).state().consecutiveAcceptedOnTightened());
        SwitchingDecision ninth = decisions.get(8);
        assertEquals(Severity.NORMAL, ninth.state().severity());
        assertTrue(ninth.transition());
        assertTrue(ninth.explanation().contains("clause 9.3.2"), ninth.explanation());
        assertEquals(0, ninth.state().switchingScore()); // score restarts with normal inspection, clause 9.3.3.2
    }

    @Test
    void fiveLotsNotAcceptedOnTightenedDiscontinue() {
        // ISO 2859-1:1999 clause 9.4: the cumulative number of lots not accepted on tightened reaches 5
        // (not necessarily consecutive). Table 2-B J / 1.0: d = 2 not accepted, d = 0 accepted
        SwitchingState tightened = SwitchingState.start(ISO, Severity.TIGHTENED);
        List<SwitchingDecision> decisions = feedAll(tightened, 2, 0, 2, 0, 2, 0, 2, 0);
        SwitchingState beforeFifth = last(decisions);
        assertEquals(4, beforeFifth.notAcceptedOnTightened());
        assertFalse(beforeFifth.discontinued());
        SwitchingDecision fifth = feed(beforeFifth, ISO, 2);
        assertTrue(fifth.state().discontinued());
        assertTrue(fifth.transition());
        assertTrue(fifth.explanation().contains("discontinued"), fifth.explanation());
        assertTrue(fifth.explanation().contains("ISO 2859-1:1999 clause 9.4"), fifth.explanation());

        // no lot can be evaluated while discontinued; the web layer maps this to 422
        SwitchingState stopped = fifth.state();
        assertThrows(UnevaluableException.class, () -> feed(stopped, ISO, 0));

        // clause 9.4: resume on tightened, as if 9.3.1 had been invoked, after agreed corrective action
        assertThrows(IllegalArgumentException.class, () -> SwitchingRules.resume(stopped, " "));
        SwitchingDecision resumed = SwitchingRules.resume(stopped, "Supplier replaced the reflow oven; agreed by QA");
        assertEquals(SwitchingState.start(ISO, Severity.TIGHTENED), resumed.state());
        assertTrue(resumed.transition());
        assertTrue(resumed.explanation().endsWith("Reason: Supplier replaced the reflow oven; agreed by QA"));
        assertThrows(UnevaluableException.class, () -> SwitchingRules.resume(resumed.state(), "again"));
    }

    @Test
    void switchingScoreWorkedExampleReachesThirtyAfterTenLots() {
        // ISO 2859-1:1999 clause 9.3.3.2 a) 1), worked example of REFERENCE.md A7 (arithmetic): J / 1.0 has Ac 2,
        // so +3 whenever the lot would also pass at AQL 0.65 (J: Ac 1); d = 0,1,0,1,0,0,1,0,0,0 -> 3, 6, ..., 30
        SwitchingState state = SwitchingState.start();
        int[] d = {0, 1, 0, 1, 0, 0, 1, 0, 0, 0};
        for (int i = 0; i < d.length; i++) {
            boolean lastLot = i == d.length - 1;
            LotResult lot = LotResult.of(plan(Severity.NORMAL, ISO), d[i]).withReducedInspectionApproved(true);
            SwitchingDecision decision = SwitchingRules.next(state, lot);
            if (!lastLot) {
                assertEquals(3 * (i + 1), decision.state().switchingScore(), "after lot " + (i + 1));
                assertEquals(Severity.NORMAL, decision.state().severity());
            } else {
                // score 30, production steady and approval: reduced (clause 9.3.3)
                assertEquals(Severity.REDUCED, decision.state().severity());
                assertTrue(decision.explanation().contains("Switching score 30 (+3"), decision.explanation());
                assertTrue(decision.explanation().contains("ISO 2859-1:1999 clause 9.3.3)"), decision.explanation());
            }
            state = decision.state();
        }
    }

    @Test
    void lotAcceptedButNotAtTheTighterAqlResetsTheScore() {
        // ISO 2859-1:1999 clause 9.3.3.2 a) 1); REFERENCE.md A7: lot 5 with d = 2 (accepted at Ac 2, not at Ac 1)
        List<SwitchingDecision> decisions = feedAll(SwitchingState.start(), 0, 1, 0, 1, 2);
        assertEquals(12, decisions.get(3).state().switchingScore());
        SwitchingDecision fifth = decisions.get(4);
        assertEquals(0, fifth.state().switchingScore());
        assertEquals(Severity.NORMAL, fifth.state().severity());
        assertTrue(fifth.explanation().contains("reset to 0 (it would not have been accepted at AQL 0.65, Ac 1"),
                fifth.explanation());
    }

    @Test
    void switchingScoreSequenceOfTheSecondWorkedExample() {
        // ISO 2859-1:1999 clause 9.3.3.2; SAMPLING.md 7.1 worked sequence [E]: J n 80 Ac 2, lots with d = 2 are
        // accepted but would not be at AQL 0.65 -> scores 3, 0, 3, 6, 0, 3, 6
        List<SwitchingDecision> decisions = feedAll(SwitchingState.start(), 0, 2, 1, 0, 2, 0, 1);
        assertEquals(List.of(3, 0, 3, 6, 0, 3, 6),
                decisions.stream().map(x -> x.state().switchingScore()).toList());
    }

    @Test
    void acceptanceNumberZeroOrOneAddsTwoPerAcceptedLot() {
        // ISO 2859-1:1999 clause 9.3.3.2 a) 2); Table 2-A code letter H (lot 300), AQL 0.25: n 50, Ac 0, Re 1
        SamplingPlan h = SingleSamplingPlans.plan(300, Aql.AQL_0_25, InspectionLevel.II, Severity.NORMAL);
        SwitchingState state = SwitchingState.start();
        for (int lot = 1; lot <= 14; lot++) {
            state = SwitchingRules.next(state, new LotResult(h, 0, true, true)).state();
            assertEquals(2 * lot, state.switchingScore());
        }
        SwitchingDecision fifteenth = SwitchingRules.next(state, new LotResult(h, 0, true, true));
        assertEquals(Severity.REDUCED, fifteenth.state().severity()); // 30 after 15 lots
        // a lot not accepted resets the score: one not-accepted lot alone does not tighten (clause 9.3.1)
        SwitchingDecision rejected = SwitchingRules.next(state, LotResult.of(h, 1));
        assertEquals(0, rejected.state().switchingScore());
        assertEquals(Severity.NORMAL, rejected.state().severity());
    }

    @Test
    void scoreOfThirtyNeedsSteadyProductionAndApproval() {
        // ISO 2859-1:1999 clause 9.3.3 b) and c): the score alone is not enough
        SwitchingState state = last(feedAll(SwitchingState.start(), 0, 0, 0, 0, 0, 0, 0, 0, 0, 0));
        assertEquals(30, state.switchingScore());
        assertEquals(Severity.NORMAL, state.severity());
        SamplingPlan j = plan(Severity.NORMAL, ISO);
        SwitchingDecision irregular = SwitchingRules.next(state, new LotResult(j, 0, false, true));
        assertEquals(Severity.NORMAL, irregular.state().severity());
        assertTrue(irregular.explanation().contains("also needs steady production"), irregular.explanation());
        SwitchingDecision approved = SwitchingRules.next(irregular.state(), new LotResult(j, 0, true, true));
        assertEquals(Severity.REDUCED, approved.state().severity());
    }

    @Test
    void reducedReturnsToNormalWhenALotIsNotAccepted() {
        // ISO 2859-1:1999 clause 9.3.4 a); Table 2-C code letter J, AQL 1.0: n 32, Ac 1, Re 2
        SwitchingState reduced = SwitchingState.start(ISO, Severity.REDUCED);
        SwitchingDecision accepted = feed(reduced, ISO, 1);
        assertEquals(reduced, accepted.state());
        assertFalse(accepted.transition());
        SwitchingDecision rejected = feed(reduced, ISO, 2);
        assertEquals(SwitchingState.start(ISO, Severity.NORMAL), rejected.state());
        assertTrue(rejected.explanation().contains("a lot was not accepted (ISO 2859-1:1999 clause 9.3.4)"),
                rejected.explanation());
    }

    @Test
    void reducedReturnsToNormalWhenProductionIsIrregular() {
        // ISO 2859-1:1999 clause 9.3.4 b)
        SwitchingState reduced = SwitchingState.start(ISO, Severity.REDUCED);
        SwitchingDecision decision = SwitchingRules.next(reduced,
                LotResult.of(plan(Severity.REDUCED, ISO), 0).withProductionSteady(false));
        assertEquals(Severity.NORMAL, decision.state().severity());
        assertTrue(decision.explanation().contains("irregular or delayed"), decision.explanation());
    }

    @Test
    void reducedReturnsToNormalWhenOtherConditionsWarrant() {
        // ISO 2859-1:1999 clause 9.3.4 c): the responsible authority's decision, with a reason
        SwitchingState reduced = SwitchingState.start(ISO, Severity.REDUCED);
        SwitchingDecision decision = SwitchingRules.reinstateNormal(reduced, "new die supplier");
        assertEquals(Severity.NORMAL, decision.state().severity());
        assertTrue(decision.explanation().contains("clause 9.3.4"), decision.explanation());
        assertThrows(UnevaluableException.class, () -> SwitchingRules.reinstateNormal(SwitchingState.start(), "x"));
    }

    @Test
    void z14GapPlanAcceptsButReinstatesNormal() {
        // ANSI/ASQ Z1.4-2008 Table II-C J / 1.0: n 32, Ac 1, Re 3; d = 2 -> accepted, normal from the next lot
        // (clauses 10.1.4 and 8.3.4 b)
        SwitchingState reduced = SwitchingState.start(Z14, Severity.REDUCED);
        SwitchingDecision decision = feed(reduced, Z14, 2);
        assertEquals(Disposition.ACCEPT_AND_RETURN_TO_NORMAL, LotResult.of(plan(Severity.REDUCED, Z14), 2).disposition());
        assertEquals(Severity.NORMAL, decision.state().severity());
        assertTrue(decision.explanation().contains("ANSI/ASQ Z1.4-2008 clause 8.3.4"), decision.explanation());
        assertEquals(Severity.REDUCED, feed(reduced, Z14, 1).state().severity());
    }

    @Test
    void z14SwitchesToReducedAfterTenAcceptedLotsWithoutTheScore() {
        // ANSI/ASQ Z1.4-2008 clause 8.3.3 a), c), d) (limit numbers dropped under 8.5): ten accepted lots on normal.
        // The lots have d = 2, which would keep the ISO switching score at 0.
        SwitchingState state = SwitchingState.start(Z14, Severity.NORMAL);
        SwitchingState iso = SwitchingState.start();
        for (int lot = 1; lot <= 10; lot++) {
            SwitchingDecision z = SwitchingRules.next(state,
                    LotResult.of(plan(Severity.NORMAL, Z14), 2).withReducedInspectionApproved(true));
            SwitchingDecision i = SwitchingRules.next(iso,
                    LotResult.of(plan(Severity.NORMAL, ISO), 2).withReducedInspectionApproved(true));
            assertEquals(lot < 10 ? Severity.NORMAL : Severity.REDUCED, z.state().severity(), "lot " + lot);
            assertEquals(Severity.NORMAL, i.state().severity());
            state = z.state();
            iso = i.state();
        }
        assertEquals(0, iso.switchingScore());
    }

    @Test
    void aLotInspectedInFullCountsLikeAnyOther() {
        // Documented choice (sources silent, SAMPLING.md 7.5): 100 % inspected lots feed the rules normally.
        // REFERENCE.md A7: lot 120, AQL 0.065 -> L, n 200 >= 120, 100 %, Ac 0, Re 1
        SamplingPlan full = SingleSamplingPlans.plan(120, Aql.AQL_0_065, InspectionLevel.II, Severity.NORMAL);
        assertTrue(full.fullInspection());
        SwitchingDecision decision = SwitchingRules.next(SwitchingState.start(), LotResult.of(full, 0));
        assertEquals(2, decision.state().switchingScore());
        assertTrue(decision.explanation().contains("in the whole lot of 120"), decision.explanation());
    }

    @Test
    void aPlanOfAnotherSeverityOrSchemeIsRefused() {
        SwitchingState normal = SwitchingState.start();
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> SwitchingRules.next(normal, LotResult.of(plan(Severity.TIGHTENED, ISO), 0)));
        assertEquals("The lot was inspected with a tightened plan, but the switching state requires normal inspection.",
                e.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> SwitchingRules.next(normal, LotResult.of(plan(Severity.NORMAL, Z14), 0)));
        assertThrows(IllegalArgumentException.class, () -> SwitchingRules.next(normal, null));
        assertThrows(IllegalArgumentException.class, () -> LotResult.of(plan(Severity.NORMAL, ISO), 81));
    }

    @Test
    void statesAreValidated() {
        assertThrows(IllegalArgumentException.class,
                () -> new SwitchingState(ISO, Severity.NORMAL, true, List.of(), 0, 0, 0, 0));
        assertThrows(IllegalArgumentException.class,
                () -> new SwitchingState(ISO, Severity.NORMAL, false, List.of(true, true, true, true, true, true), 0, 0, 0, 0));
        assertThrows(IllegalArgumentException.class,
                () -> new SwitchingState(ISO, Severity.NORMAL, false, List.of(), -1, 0, 0, 0));
    }

    @Test
    void readinessNamesWhatIsStillMissingForReduced() {
        // ISO 2859-1:1999 clause 9.3.3 a) to c)
        SwitchingState six = last(feedAll(SwitchingState.start(), 0, 0));
        assertEquals(List.of("switching score 6 of 30 (ISO 2859-1:1999 clause 9.3.3 a)",
                "the responsible authority's approval of reduced inspection, which also confirms steady production"
                        + " (ISO 2859-1:1999 clause 9.3.3 b and c)"),
                SwitchingRules.reducedReadiness(six, false).missing());
        assertEquals(List.of("switching score 6 of 30 (ISO 2859-1:1999 clause 9.3.3 a)"),
                SwitchingRules.reducedReadiness(six, true).missing());
        // tightened must first return to normal (clause 9.3.2), where the score starts at 0 (9.3.3.2)
        SwitchingState tightened = SwitchingState.start(ISO, Severity.TIGHTENED);
        List<String> missing = SwitchingRules.reducedReadiness(tightened, true).missing();
        assertTrue(missing.get(0).contains("0 of 5 consecutive lots accepted on tightened"), missing.toString());
        assertTrue(missing.get(1).contains("switching score 0 of 30"), missing.toString());
        assertTrue(SwitchingRules.reducedReadiness(SwitchingState.start(ISO, Severity.REDUCED), false).onReduced());
        // ANSI/ASQ Z1.4-2008 clause 8.3.3 a) counts the preceding lots instead of a score
        assertTrue(SwitchingRules.reducedReadiness(SwitchingState.start(Z14, Severity.NORMAL), true).missing().get(0)
                .startsWith("0 of 10 preceding lots accepted"));
    }

    @Test
    void anApprovalGivenAfterTheScoreReachedThirtySwitchesFromTheNextLot() {
        // ISO 2859-1:1999 clause 9.3.3: all three conditions hold once the approval is given
        SwitchingState thirty = last(feedAll(SwitchingState.start(), 0, 0, 0, 0, 0, 0, 0, 0, 0, 0));
        SwitchingDecision approved = SwitchingRules.approvalGiven(thirty, true);
        assertEquals(SwitchingState.start(ISO, Severity.REDUCED), approved.state());
        assertTrue(approved.explanation().contains("clause 9.3.3"), approved.explanation());
        SwitchingDecision irregular = SwitchingRules.approvalGiven(thirty, false);
        assertEquals(thirty, irregular.state());
        assertTrue(irregular.explanation().contains("steady production (ISO 2859-1:1999 clause 9.3.3 b)"),
                irregular.explanation());
        SwitchingState six = last(feedAll(SwitchingState.start(), 0, 0));
        assertEquals(six, SwitchingRules.approvalGiven(six, true).state());
    }
}
