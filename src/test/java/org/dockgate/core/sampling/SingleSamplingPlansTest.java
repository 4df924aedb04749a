package org.dockgate.core.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Single sampling plans, ISO 2859-1:1999 Tables 2-A/2-B/2-C and ANSI/ASQ Z1.4-2008 Tables II-A/II-B/II-C. */
class SingleSamplingPlansTest {

    private static final Scheme ISO = Scheme.ISO_2859_1_1999;
    private static final Scheme Z14 = Scheme.ANSI_ASQ_Z1_4_2008;

    /**
     * Normal inspection, the worked cases of REFERENCE.md A7. Code letter from ISO 2859-1:1999 Table 1;
     * plan from Table 2-A; "printed" is the cell as printed for the original code letter.
     */
    @ParameterizedTest(name = "lot {0}, level {1}, AQL {2}: {3} -> {5} n {6} {7}/{8}")
    @CsvSource({
        // lot,  level, AQL,   code, printed, used, n,    Ac, Re, full  -- ISO 2859-1:1999 Table 2-A cell
        "1000,   II,    1.0,   J,    2/3,     J,    80,   2,  3,  false", // code letter J, AQL 1.0
        "1000,   II,    0.65,  J,    1/2,     J,    80,   1,  2,  false", // code letter J, AQL 0.65
        "1000,   II,    0.40,  J,    ↓,       K,    125,  1,  2,  false", // J, AQL 0.40: down arrow, n changes
        "1000,   II,    0.10,  J,    ↓,       K,    125,  0,  1,  false", // J, AQL 0.10: down arrow
        "2500,   II,    2.5,   K,    7/8,     K,    125,  7,  8,  false", // K, AQL 2.5
        "300,    II,    0.25,  H,    0/1,     H,    50,   0,  1,  false", // H, AQL 0.25
        "5000,   I,     1.5,   J,    3/4,     J,    80,   3,  4,  false", // J, AQL 1.5
        "40,     II,    4.0,   D,    ↓,       E,    13,   1,  2,  false", // D, AQL 4.0: down arrow
        "15,     II,    6.5,   B,    ↑,       A,    2,    0,  1,  false", // B, AQL 6.5: up arrow
        "800,    S2,    1.0,   C,    ↓,       E,    13,   0,  1,  false", // C, AQL 1.0: arrow over two rows
        "200000, III,   0.15,  Q,    5/6,     Q,    1250, 5,  6,  false", // Q, AQL 0.15
        "50,     II,    0.65,  D,    ↓,       F,    20,   0,  1,  false", // D, AQL 0.65: arrow over two rows
        "12000,  II,    6.5,   M,    ↑,       L,    200,  21, 22, false", // M, AQL 6.5: up arrow to 21/22
        "600000, II,    0.065, Q,    2/3,     Q,    1250, 2,  3,  false", // Q, AQL 0.065
        "1200,   S4,    2.5,   F,    1/2,     F,    20,   1,  2,  false", // F, AQL 2.5
        "120,    II,    0.065, F,    ↓,       L,    120,  0,  1,  true",  // F, AQL 0.065 -> L n 200 >= lot 120: 100 %
        "600000, III,   0.010, R,    ↑,       Q,    1250, 0,  1,  false", // R, AQL 0.010: up arrow (SAMPLING.md 3.1 edges)
        "600000, III,   0.015, R,    ↑,       P,    800,  0,  1,  false", // R, AQL 0.015: up past Q's arrow
        "200000, III,   0.025, Q,    ↓,       R,    2000, 1,  2,  false", // Q, AQL 0.025: down to R
        "600000, III,   10,    R,    ↑,       K,    125,  21, 22, false", // R, AQL 10: up six rows to K
        "5,      II,    10,    A,    ↓,       C,    5,    1,  2,  true",  // A, AQL 10: down arrow (not up, see A/10 note)
    })
    void normalInspection(int lotSize, String level, String aql, CodeLetter code, String printed, CodeLetter used,
            int n, int ac, int re, boolean full) {
        assertPlan(lotSize, level, aql, Severity.NORMAL, ISO, code, printed, used, n, ac, re, full);
    }

    /** Tightened inspection, ISO 2859-1:1999 Table 2-B; lot-1000 vectors from SAMPLING.md section 6.5. */
    @ParameterizedTest(name = "lot {0}, level {1}, AQL {2}: {3} -> {5} n {6} {7}/{8}")
    @CsvSource({
        // lot,  level, AQL,   code, printed, used, n,    Ac, Re, full  -- ISO 2859-1:1999 Table 2-B cell
        "1000,   II,    1.0,   J,    1/2,     J,    80,   1,  2,  false", // code letter J, AQL 1.0
        "1000,   II,    2.5,   J,    3/4,     J,    80,   3,  4,  false", // J, AQL 2.5
        "1000,   II,    0.65,  J,    ↓,       K,    125,  1,  2,  false", // J, AQL 0.65: down arrow
        "1000,   II,    4.0,   J,    5/6,     J,    80,   5,  6,  false", // J, AQL 4.0
        "1000,   II,    6.5,   J,    8/9,     J,    80,   8,  9,  false", // J, AQL 6.5 (8/9: tightened series)
        "200000, III,   0.025, Q,    ↓,       S,    3150, 1,  2,  false", // Q, AQL 0.025 -> row S, n 3150
        "600000, III,   0.025, R,    ↓,       S,    3150, 1,  2,  false", // R, AQL 0.025 -> row S, n 3150
        "600000, III,   0.010, R,    0/1,     R,    2000, 0,  1,  false", // R, AQL 0.010: its own plan
        "600000, III,   0.015, R,    ↑,       Q,    1250, 0,  1,  false", // R, AQL 0.015: up arrow
        "200000, III,   0.010, Q,    ↓,       R,    2000, 0,  1,  false", // Q, AQL 0.010: down arrow
        "600000, III,   10,    R,    ↑,       K,    125,  18, 19, false", // R, AQL 10: up to K 18/19
        "10,     II,    0.010, B,    ↓,       R,    10,   0,  1,  true",  // B, AQL 0.010 -> R n 2000 >= lot 10: 100 %
        "8,      II,    10,    A,    0/1,     A,    2,    0,  1,  false", // A, AQL 10: ISO retyped copy "0 1" (conflict)
    })
    void tightenedInspection(int lotSize, String level, String aql, CodeLetter code, String printed, CodeLetter used,
            int n, int ac, int re, boolean full) {
        assertPlan(lotSize, level, aql, Severity.TIGHTENED, ISO, code, printed, used, n, ac, re, full);
    }

    /** Reduced inspection, ISO 2859-1:1999 Table 2-C (no gaps); lot-1000 vectors from SAMPLING.md 5.4. */
    @ParameterizedTest(name = "lot {0}, level {1}, AQL {2}: {3} -> {5} n {6} {7}/{8}")
    @CsvSource({
        // lot,  level, AQL,   code, printed, used, n,    Ac, Re, full  -- ISO 2859-1:1999 Table 2-C cell
        "1000,   II,    1.0,   J,    1/2,     J,    32,   1,  2,  false", // code letter J, AQL 1.0
        "1000,   II,    2.5,   J,    3/4,     J,    32,   3,  4,  false", // J, AQL 2.5
        "1000,   II,    6.5,   J,    6/7,     J,    32,   6,  7,  false", // J, AQL 6.5 (6/7: only in the ISO series)
        "1000,   II,    0.65,  J,    ↓,       K,    50,   1,  2,  false", // J, AQL 0.65: down arrow
        "200000, III,   0.025, Q,    ↑,       N,    200,  0,  1,  false", // Q, AQL 0.025: up, over P's arrow
        "600000, III,   0.025, R,    ↑,       N,    200,  0,  1,  false", // R, AQL 0.025: one long up arrow
        "600000, III,   0.040, R,    1/2,     R,    800,  1,  2,  false", // R, AQL 0.040
        "5,      II,    10,    A,    ↓,       D,    3,    1,  2,  false", // A, AQL 10: down three rows to D n 3
        "2,      II,    10,    A,    ↓,       D,    2,    1,  2,  true",  // same plan, n 3 >= lot 2: 100 %
    })
    void reducedInspectionIso(int lotSize, String level, String aql, CodeLetter code, String printed, CodeLetter used,
            int n, int ac, int re, boolean full) {
        assertPlan(lotSize, level, aql, Severity.REDUCED, ISO, code, printed, used, n, ac, re, full);
    }

    /** Reduced inspection, ANSI/ASQ Z1.4-2008 Table II-C (gap plans); vectors from SAMPLING.md 5.4. */
    @ParameterizedTest(name = "lot {0}, level {1}, AQL {2}: {3} -> {5} n {6} {7}/{8}")
    @CsvSource({
        // lot,  level, AQL,   code, printed, used, n,    Ac, Re, full  -- ANSI/ASQ Z1.4-2008 Table II-C cell
        "1000,   II,    1.0,   J,    1/3,     J,    32,   1,  3,  false", // code letter J, AQL 1.0
        "1000,   II,    2.5,   J,    2/5,     J,    32,   2,  5,  false", // J, AQL 2.5
        "1000,   II,    6.5,   J,    5/8,     J,    32,   5,  8,  false", // J, AQL 6.5
        "1000,   II,    0.65,  J,    0/2,     J,    32,   0,  2,  false", // J, AQL 0.65: own cell (ISO has an arrow)
        "600000, III,   0.025, R,    0/2,     R,    800,  0,  2,  false", // R, AQL 0.025
        "600000, III,   10,    R,    ↑,       K,    50,   10, 13, false", // R, AQL 10: up to K 10/13
    })
    void reducedInspectionZ14(int lotSize, String level, String aql, CodeLetter code, String printed, CodeLetter used,
            int n, int ac, int re, boolean full) {
        assertPlan(lotSize, level, aql, Severity.REDUCED, Z14, code, printed, used, n, ac, re, full);
    }

    private static void assertPlan(int lotSize, String level, String aql, Severity severity, Scheme scheme,
            CodeLetter code, String printed, CodeLetter used, int n, int ac, int re, boolean full) {
        Aql column = Aql.parse(aql);
        SamplingPlan plan = SingleSamplingPlans.plan(lotSize, column, InspectionLevel.parse(level), severity, scheme);
        assertEquals(printed, SingleSamplingPlans.printedCell(scheme, severity, code, column), "printed cell");
        assertEquals(new SamplingPlan(code, used, n, ac, re, full, severity, column, scheme), plan);
    }

    @Test
    void isoIsTheDefaultScheme() {
        assertEquals(SingleSamplingPlans.plan(1000, Aql.AQL_1_0, InspectionLevel.II, Severity.REDUCED, ISO),
                SingleSamplingPlans.plan(1000, Aql.AQL_1_0, InspectionLevel.II, Severity.REDUCED));
    }

    @Test
    void theConflictingTightenedCellFollowsEachSchemesSource() {
        // ISO 2859-1:1999 Table 2-B, code letter A, AQL 10: "0 1" per the only ISO retyped copy (GB/T 2828.1-2012);
        // ANSI/ASQ Z1.4-2008 Table II-B prints a down arrow there: D, n 8, 1/2. SAMPLING.md section 8, item 1: open.
        assertEquals("0/1", SingleSamplingPlans.printedCell(ISO, Severity.TIGHTENED, CodeLetter.A, Aql.AQL_10));
        assertEquals("↓", SingleSamplingPlans.printedCell(Z14, Severity.TIGHTENED, CodeLetter.A, Aql.AQL_10));
        SamplingPlan z14 = SingleSamplingPlans.plan(50, Aql.AQL_10, InspectionLevel.S1, Severity.TIGHTENED, Z14);
        assertEquals(CodeLetter.A, z14.codeLetter());
        assertEquals(CodeLetter.D, z14.planCodeLetter());
        assertEquals(8, z14.sampleSize());
        assertEquals(1, z14.acceptNumber());
    }

    @Test
    void rowSOfTheTightenedTableHasAPlanOnlyAtAql0025() {
        // ISO 2859-1:1999 Table 2-B, code letter S (n 3150): 1 2 at AQL 0.025, every other cell blank
        for (Aql aql : Aql.values()) {
            String cell = SingleSamplingPlans.printedCell(ISO, Severity.TIGHTENED, CodeLetter.S, aql);
            assertEquals(aql == Aql.AQL_0_025 ? "1/2" : "-", cell, "S / " + aql.label());
        }
        assertEquals(3150, SingleSamplingPlans.sampleSize(CodeLetter.S, Severity.TIGHTENED));
        IllegalArgumentException blank = assertThrows(IllegalArgumentException.class,
                () -> SingleSamplingPlans.plan(CodeLetter.S, Aql.AQL_0_010, Severity.TIGHTENED, ISO, 5000));
        assertEquals("The tightened table has no plan for code letter S at AQL 0.010.", blank.getMessage());
        assertThrows(IllegalArgumentException.class,
                () -> SingleSamplingPlans.plan(CodeLetter.S, Aql.AQL_0_025, Severity.NORMAL, ISO, 5000));
        assertThrows(IllegalArgumentException.class, () -> SingleSamplingPlans.sampleSize(CodeLetter.S, Severity.REDUCED));
    }

    @Test
    void rowSWithALotSmallerThanItsSampleIsInspectedInFull() {
        // ISO 2859-1:1999 Table 2-B, Q / 0.025 -> S n 3150 >= 2000 -> 100 % inspection, plan's Ac/Re kept
        SamplingPlan plan = SingleSamplingPlans.plan(CodeLetter.Q, Aql.AQL_0_025, Severity.TIGHTENED, ISO, 2000);
        assertEquals(new SamplingPlan(CodeLetter.Q, CodeLetter.S, 2000, 1, 2, true, Severity.TIGHTENED,
                Aql.AQL_0_025, ISO), plan);
    }

    @Test
    void fullInspectionExactlyWhenTheSampleReachesTheLot() {
        // Legend of ISO 2859-1:1999 Tables 2-A/2-B/2-C: "if sample size equals or exceeds lot size" -> 100 %.
        // Table 2-A, code letter J (lots 501-1200 at level II), AQL 1.0: n 80 < lot, never full here; use
        // plan(CodeLetter...) to put the lot exactly at the sample size.
        SamplingPlan equal = SingleSamplingPlans.plan(CodeLetter.J, Aql.AQL_1_0, Severity.NORMAL, ISO, 80);
        assertTrue(equal.fullInspection());
        assertEquals(80, equal.sampleSize());
        SamplingPlan larger = SingleSamplingPlans.plan(CodeLetter.J, Aql.AQL_1_0, Severity.NORMAL, ISO, 81);
        assertFalse(larger.fullInspection());
        assertEquals(80, larger.sampleSize());
        assertEquals(2, equal.acceptNumber());
        assertEquals(3, equal.rejectNumber());
    }

    @Test
    void tabulatedSampleSizesPerSeverity() {
        // ISO 2859-1:1999 Tables 2-A/2-B (A 2 ... R 2000) and 2-C (A 2, B 2, C 2, D 3 ... R 800)
        int[] normal = {2, 3, 5, 8, 13, 20, 32, 50, 80, 125, 200, 315, 500, 800, 1250, 2000};
        int[] reduced = {2, 2, 2, 3, 5, 8, 13, 20, 32, 50, 80, 125, 200, 315, 500, 800};
        for (int i = 0; i < normal.length; i++) {
            CodeLetter letter = CodeLetter.values()[i];
            assertEquals(normal[i], SingleSamplingPlans.sampleSize(letter, Severity.NORMAL), letter.name());
            assertEquals(normal[i], SingleSamplingPlans.sampleSize(letter, Severity.TIGHTENED), letter.name());
            assertEquals(reduced[i], SingleSamplingPlans.sampleSize(letter, Severity.REDUCED), letter.name());
        }
    }

    @Test
    void aqlOutsideTheSeriesIsRejectedWithTheValidList() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Aql.of(0.5));
        assertEquals("AQL 0.5 is not in the ISO 2859-1 series; valid values are 0.010, 0.015, 0.025, 0.040, 0.065,"
                + " 0.10, 0.15, 0.25, 0.40, 0.65, 1.0, 1.5, 2.5, 4.0, 6.5, 10 (percent nonconforming).", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Aql.of(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> Aql.of(Double.POSITIVE_INFINITY));
        assertThrows(IllegalArgumentException.class, () -> Aql.of(15)); // nonconformities per 100 units: out of scope
        assertThrows(IllegalArgumentException.class, () -> Aql.parse("one"));
        assertThrows(IllegalArgumentException.class, () -> Aql.parse(" "));
        assertThrows(IllegalArgumentException.class, () -> Aql.parse("NaN"));
        assertThrows(IllegalArgumentException.class, () -> Aql.parse("Infinity"));
        assertThrows(IllegalArgumentException.class, () -> Aql.parse("1f"));
        assertEquals("AQL 'one' is not a number; valid values are 0.010, 0.015, 0.025, 0.040, 0.065, 0.10, 0.15,"
                + " 0.25, 0.40, 0.65, 1.0, 1.5, 2.5, 4.0, 6.5, 10.", assertThrows(IllegalArgumentException.class,
                        () -> Aql.parse("one")).getMessage());
        assertEquals(Aql.AQL_1_0, Aql.parse("1"));
        assertEquals(Aql.AQL_0_010, Aql.parse("0.01"));
        assertEquals(Aql.AQL_10, Aql.parse("10.0"));
    }

    @Test
    void tighterAqlStepsThroughTheSeries() {
        assertEquals(Aql.AQL_0_65, Aql.AQL_1_0.tighter().orElseThrow());
        assertTrue(Aql.AQL_0_010.tighter().isEmpty());
    }

    @Test
    void acceptNumberOneStepTighterReadsThePlansOwnRow() {
        // ISO 2859-1:1999 Table 2-A: J / 1.0 is 2/3 and J / 0.65 is 1/2, same n 80 (clause 9.3.3.2 example)
        SamplingPlan j = SingleSamplingPlans.plan(1000, Aql.AQL_1_0, InspectionLevel.II, Severity.NORMAL);
        assertEquals(1, SingleSamplingPlans.acceptNumberOneStepTighter(j).getAsInt());
        // R / 10 -> K n 125 21/22; one step tighter in row K: K / 6.5 = 14/15 (documented choice, SAMPLING.md 7.5)
        SamplingPlan r = SingleSamplingPlans.plan(600000, Aql.AQL_10, InspectionLevel.III, Severity.NORMAL);
        assertEquals(CodeLetter.K, r.planCodeLetter());
        assertEquals(14, SingleSamplingPlans.acceptNumberOneStepTighter(r).getAsInt());
        // Ac 0 or 1: the clause adds 2 per accepted lot, no tighter plan is consulted
        SamplingPlan oneTwo = SingleSamplingPlans.plan(1000, Aql.AQL_0_65, InspectionLevel.II, Severity.NORMAL);
        assertTrue(SingleSamplingPlans.acceptNumberOneStepTighter(oneTwo).isEmpty());
        SamplingPlan tightened = SingleSamplingPlans.plan(1000, Aql.AQL_1_0, InspectionLevel.II, Severity.TIGHTENED);
        assertThrows(IllegalArgumentException.class, () -> SingleSamplingPlans.acceptNumberOneStepTighter(tightened));
    }
}
