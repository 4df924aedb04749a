package org.dockgate.core.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Structural checks of the stored tables, as listed in SAMPLING.md section 6 (the checks its
 * retyped copies were subjected to), so that a typo in a text block cannot go unnoticed even where
 * both retyped copies might share it.
 */
class TableStructureTest {

    private static final List<CodeLetter> A_TO_R = List.of(CodeLetter.values()).subList(0, 16);

    @ParameterizedTest
    @EnumSource(Scheme.class)
    void plansComeFromEachTablesSeries(Scheme scheme) {
        // SAMPLING.md 6.3: direct plans per table, and Re = Ac + 1 for normal, tightened and ISO reduced
        Set<String> normal = Set.of("0/1", "1/2", "2/3", "3/4", "5/6", "7/8", "10/11", "14/15", "21/22");
        Set<String> tightened = Set.of("0/1", "1/2", "2/3", "3/4", "5/6", "8/9", "12/13", "18/19");
        Set<String> reduced = scheme == Scheme.ISO_2859_1_1999
                ? Set.of("0/1", "1/2", "2/3", "3/4", "5/6", "6/7", "8/9", "10/11")
                : Set.of("0/1", "0/2", "1/3", "1/4", "2/5", "3/6", "5/8", "7/10", "10/13");
        for (CodeLetter letter : CodeLetter.values()) {
            for (Aql aql : Aql.values()) {
                check(scheme, Severity.NORMAL, letter, aql, normal);
                check(scheme, Severity.TIGHTENED, letter, aql, tightened);
                check(scheme, Severity.REDUCED, letter, aql, reduced);
            }
        }
    }

    private static void check(Scheme scheme, Severity severity, CodeLetter letter, Aql aql, Set<String> series) {
        if (letter == CodeLetter.S && severity != Severity.TIGHTENED) {
            return;
        }
        String cell = SingleSamplingPlans.printedCell(scheme, severity, letter, aql);
        if (cell.contains("/")) {
            assertTrue(series.contains(cell), scheme + " " + severity + " " + letter + "/" + aql.label() + ": " + cell);
        }
    }

    @Test
    void everyIsoPlanHasNoGap() {
        // ISO 2859-1:1999 Foreword: reduced plans changed "to eliminate the gap between the acceptance and
        // rejection numbers"; Tables 2-A and 2-B have no gaps either
        for (Severity severity : Severity.values()) {
            for (CodeLetter letter : A_TO_R) {
                for (Aql aql : Aql.values()) {
                    var plan = SingleSamplingPlans.resolve(Scheme.ISO_2859_1_1999, severity, letter, aql);
                    assertEquals(plan.acceptNumber() + 1, plan.rejectNumber(), severity + " " + letter + "/" + aql.label());
                }
            }
        }
    }

    @ParameterizedTest
    @EnumSource(Scheme.class)
    void tightenedNeverAcceptsAHigherFractionThanNormal(Scheme scheme) {
        // SAMPLING.md 6.2: Ac_T / n_T <= Ac_N / n_N in all 256 cells, and Pa_T(p = AQL) <= Pa_N(p = AQL)
        for (CodeLetter letter : A_TO_R) {
            for (Aql aql : Aql.values()) {
                var n = SingleSamplingPlans.resolve(scheme, Severity.NORMAL, letter, aql);
                var t = SingleSamplingPlans.resolve(scheme, Severity.TIGHTENED, letter, aql);
                String where = scheme + " " + letter + "/" + aql.label();
                assertTrue((double) t.acceptNumber() / t.sampleSize() <= (double) n.acceptNumber() / n.sampleSize(), where);
                double p = aql.percentNonconforming() / 100;
                assertTrue(pa(t, p) <= pa(n, p) + 1e-12, where);
            }
        }
    }

    @ParameterizedTest
    @EnumSource(Scheme.class)
    void tightenedOcCurveLiesBelowNormalExceptTheConflictingCell(Scheme scheme) {
        // SAMPLING.md 6.2: with the MIL/Z1.4 values Pa_T(p) <= Pa_N(p) for every p in all 256 cells; with the
        // ISO/GB value at A / 10 (n 2, 0/1 against normal C n 5, 1/2) it fails for p >= 0.36, the only exception
        List<String> failures = new ArrayList<>();
        for (CodeLetter letter : A_TO_R) {
            for (Aql aql : Aql.values()) {
                var n = SingleSamplingPlans.resolve(scheme, Severity.NORMAL, letter, aql);
                var t = SingleSamplingPlans.resolve(scheme, Severity.TIGHTENED, letter, aql);
                for (int percent = 1; percent <= 99; percent++) {
                    if (pa(t, percent / 100.0) > pa(n, percent / 100.0) + 1e-12) {
                        failures.add(letter + "/" + aql.label() + "@" + percent);
                    }
                }
            }
        }
        if (scheme == Scheme.ANSI_ASQ_Z1_4_2008) {
            assertEquals(List.of(), failures);
        } else {
            List<String> expected = new ArrayList<>();
            for (int percent = 36; percent <= 99; percent++) {
                expected.add("A/10@" + percent);
            }
            assertEquals(expected, failures);
        }
    }

    @Test
    void directNormalPlansWithAcTwoOrMoreHaveASameSizePlanOneStepTighter() {
        // SAMPLING.md 7.5: every direct normal plan with Ac >= 2 has, in the next tighter column of the same row,
        // a direct plan with the same n and a smaller Ac; 70 such plans with AQL <= 10
        int count = 0;
        for (CodeLetter letter : A_TO_R) {
            for (Aql aql : Aql.values()) {
                String cell = SingleSamplingPlans.printedCell(Scheme.ISO_2859_1_1999, Severity.NORMAL, letter, aql);
                if (!cell.contains("/") || Integer.parseInt(cell.split("/")[0]) < 2) {
                    continue;
                }
                count++;
                String tighter = SingleSamplingPlans.printedCell(Scheme.ISO_2859_1_1999, Severity.NORMAL, letter,
                        aql.tighter().orElseThrow());
                assertTrue(tighter.contains("/"), letter + "/" + aql.label());
                assertTrue(Integer.parseInt(tighter.split("/")[0]) < Integer.parseInt(cell.split("/")[0]));
            }
        }
        assertEquals(70, count);
    }

    @Test
    void upArrowCellsLeadingToAcTwoOrMoreAreTheTwentyOneOfSamplingMd() {
        // SAMPLING.md 7.5: 21 cells with AQL <= 10 (rows L-R in the 21/22 region) reach an Ac >= 2 plan by an up arrow;
        // for all of them, and for every other normal cell, the one-step-tighter look-up must succeed
        int upToAcTwo = 0;
        for (CodeLetter letter : A_TO_R) {
            for (Aql aql : Aql.values()) {
                String cell = SingleSamplingPlans.printedCell(Scheme.ISO_2859_1_1999, Severity.NORMAL, letter, aql);
                var plan = SingleSamplingPlans.resolve(Scheme.ISO_2859_1_1999, Severity.NORMAL, letter, aql);
                if (cell.equals("↑") && plan.acceptNumber() >= 2) {
                    upToAcTwo++;
                    assertEquals("21/22", plan.acceptNumber() + "/" + plan.rejectNumber());
                }
                SamplingPlan full = SingleSamplingPlans.plan(letter, aql, Severity.NORMAL, Scheme.ISO_2859_1_1999,
                        1_000_000);
                var tighter = SingleSamplingPlans.acceptNumberOneStepTighter(full);
                assertEquals(plan.acceptNumber() >= 2, tighter.isPresent(), letter + "/" + aql.label());
            }
        }
        assertEquals(21, upToAcTwo);
    }

    private static double pa(SingleSamplingPlans.Resolved plan, double p) {
        // ISO 2859-1 OC curve for percent nonconforming: binomial probability of d <= Ac (REFERENCE.md 5.6)
        return new BinomialDistribution(null, plan.sampleSize(), p).cumulativeProbability(plan.acceptNumber());
    }
}
