package org.dockgate.core.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Sample-size code letters, ISO 2859-1:1999 Table 1 (= ANSI/ASQ Z1.4-2008 Table I). */
class CodeLetterTableTest {

    /**
     * One case per lot-size range of ISO 2859-1:1999 Table 1; both ends of the range are checked at
     * every inspection level. Expected letters typed from the printed Table 1 (REFERENCE.md section 5.1).
     */
    @ParameterizedTest(name = "lot {0}..{1}: S-1 {2}, S-2 {3}, S-3 {4}, S-4 {5}, I {6}, II {7}, III {8}")
    @CsvSource({
        // from, to, S-1, S-2, S-3, S-4, I, II, III   -- ISO 2859-1:1999 Table 1, row by row
        "2,      8,          A, A, A, A, A, A, B",
        "9,      15,         A, A, A, A, A, B, C",
        "16,     25,         A, A, B, B, B, C, D",
        "26,     50,         A, B, B, C, C, D, E",
        "51,     90,         B, B, C, C, C, E, F",
        "91,     150,        B, B, C, D, D, F, G",
        "151,    280,        B, C, D, E, E, G, H",
        "281,    500,        B, C, D, E, F, H, J",
        "501,    1200,       C, C, E, F, G, J, K",
        "1201,   3200,       C, D, E, G, H, K, L",
        "3201,   10000,      C, D, F, G, J, L, M",
        "10001,  35000,      C, D, F, H, K, M, N",
        "35001,  150000,     D, E, G, J, L, N, P",
        "150001, 500000,     D, E, G, J, M, P, Q",
        "500001, 2147483647, D, E, H, K, N, Q, R",   // "500 001 and over"
    })
    void codeLetterAtBothEndsOfEachRange(int from, int to, CodeLetter s1, CodeLetter s2, CodeLetter s3,
            CodeLetter s4, CodeLetter i, CodeLetter ii, CodeLetter iii) {
        CodeLetter[] expected = {s1, s2, s3, s4, i, ii, iii};
        InspectionLevel[] levels = InspectionLevel.values();
        for (int k = 0; k < levels.length; k++) {
            assertEquals(expected[k], SingleSamplingPlans.codeLetter(from, levels[k]), "lot " + from + ", " + levels[k]);
            assertEquals(expected[k], SingleSamplingPlans.codeLetter(to, levels[k]), "lot " + to + ", " + levels[k]);
        }
    }

    @Test
    void levelTwoForTheWorkedLotOfAThousand() {
        // ISO 2859-1:1999 Table 1: lot 501-1200, level II -> J (REFERENCE.md A7, lot 1000)
        assertEquals(CodeLetter.J, SingleSamplingPlans.codeLetter(1000, InspectionLevel.II));
        // ISO 2859-1:1999 Table 1: lot 1201-3200 -> K at level II; 3201-10000 -> J at level I
        assertEquals(CodeLetter.K, SingleSamplingPlans.codeLetter(2500, InspectionLevel.II));
        assertEquals(CodeLetter.J, SingleSamplingPlans.codeLetter(5000, InspectionLevel.I));
    }

    @Test
    void lotOfOneItemUsesTheFirstRowAndIsInspectedInFull() {
        // Table 1 starts at 2; Dockgate's documented choice: one item -> first row (A at level II)
        assertEquals(CodeLetter.A, SingleSamplingPlans.codeLetter(1, InspectionLevel.II));
        assertEquals(CodeLetter.B, SingleSamplingPlans.codeLetter(1, InspectionLevel.III));
        SamplingPlan plan = SingleSamplingPlans.plan(1, Aql.AQL_6_5, InspectionLevel.II, Severity.NORMAL);
        assertTrue(plan.fullInspection());
        assertEquals(1, plan.sampleSize());
    }

    @Test
    void lotSizeZeroOrNegativeIsRejectedWithAClearMessage() {
        IllegalArgumentException zero = assertThrows(IllegalArgumentException.class,
                () -> SingleSamplingPlans.codeLetter(0, InspectionLevel.II));
        assertEquals("Lot size must be at least 1, was 0.", zero.getMessage());
        assertThrows(IllegalArgumentException.class, () -> SingleSamplingPlans.codeLetter(-5, InspectionLevel.II));
        assertThrows(IllegalArgumentException.class,
                () -> SingleSamplingPlans.plan(0, Aql.AQL_1_0, InspectionLevel.II, Severity.NORMAL));
    }

    @Test
    void levelNamesParseInBothSpellingsAndUnknownOnesListTheValidOnes() {
        assertEquals(InspectionLevel.S2, InspectionLevel.parse("S-2"));
        assertEquals(InspectionLevel.S2, InspectionLevel.parse("s2"));
        assertEquals(InspectionLevel.III, InspectionLevel.parse(" III "));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> InspectionLevel.parse("IV"));
        assertEquals("Unknown inspection level 'IV'; valid levels are S1, S2, S3, S4, I, II, III.", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> InspectionLevel.parse(null));
        IllegalArgumentException s = assertThrows(IllegalArgumentException.class, () -> Severity.parse("STRICT"));
        assertEquals("Unknown severity 'STRICT'; valid severities are NORMAL, TIGHTENED, REDUCED.", s.getMessage());
    }
}
