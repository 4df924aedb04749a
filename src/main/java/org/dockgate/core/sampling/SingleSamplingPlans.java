package org.dockgate.core.sampling;

import java.util.List;
import java.util.Objects;
import java.util.OptionalInt;

/**
 * Sample-size code letters and single sampling plans by attributes, ISO 2859-1:1999 (default) and
 * ANSI/ASQ Z1.4-2008 (explicit choice). The tables themselves, as printed with their arrows, live in
 * one place ({@code SamplingTables}); this class looks them up and follows the arrows.
 */
public final class SingleSamplingPlans {

    private SingleSamplingPlans() {
    }

    /**
     * The sample-size code letter for a lot, ISO 2859-1:1999 Table 1.
     *
     * <p>Edge cases: Table 1 starts at lot size 2; a lot of one item is given the letter of the first
     * range (2 to 8), and every plan then means 100 % inspection because every sample size is at
     * least 2.
     *
     * @param lotSize number of items in the lot, at least 1
     * @param level the inspection level
     * @return the code letter (A … R)
     * @throws IllegalArgumentException when {@code lotSize} is 0 or negative, or {@code level} is null
     */
    public static CodeLetter codeLetter(int lotSize, InspectionLevel level) {
        requireLotSize(lotSize);
        Objects.requireNonNull(level, "level");
        for (SamplingTables.LotSizeRange range : SamplingTables.CODE_LETTER_TABLE) {
            if (lotSize <= range.toInclusive()) {
                return range.letters().get(level);
            }
        }
        throw new IllegalStateException("Table 1 does not cover lot size " + lotSize);
    }

    /**
     * The ISO 2859-1:1999 single sampling plan for a lot: code letter from Table 1, plan from
     * Table 2-A, 2-B or 2-C with arrows followed, 100 % inspection when the sample size reaches the
     * lot size. Same as {@link #plan(int, Aql, InspectionLevel, Severity, Scheme)} with
     * {@link Scheme#ISO_2859_1_1999}.
     *
     * @param lotSize number of items in the lot, at least 1
     * @param aql acceptance quality limit
     * @param level inspection level
     * @param severity normal, tightened or reduced
     * @return the plan
     * @throws IllegalArgumentException when {@code lotSize} is 0 or negative, or an argument is null
     */
    public static SamplingPlan plan(int lotSize, Aql aql, InspectionLevel level, Severity severity) {
        return plan(lotSize, aql, level, severity, Scheme.ISO_2859_1_1999);
    }

    /**
     * The single sampling plan for a lot under the given scheme.
     *
     * <p>Procedure (ISO 2859-1:1999 Tables 1, 2-A, 2-B, 2-C and their legend): find the code letter
     * for the lot size and level; read the cell for that letter and the AQL; while the cell is an arrow,
     * move one row in the arrow's direction ("use the first sampling plan below/above the arrow"); take
     * Ac and Re from the plan found and the sample size and code letter of <em>that</em> row. When that
     * sample size equals or exceeds the lot size, inspect 100 % (see {@link SamplingPlan}).
     *
     * @param lotSize number of items in the lot, at least 1
     * @param aql acceptance quality limit
     * @param level inspection level
     * @param severity normal, tightened or reduced
     * @param scheme the published scheme
     * @return the plan
     * @throws IllegalArgumentException when {@code lotSize} is 0 or negative, or an argument is null
     */
    public static SamplingPlan plan(int lotSize, Aql aql, InspectionLevel level, Severity severity,
            Scheme scheme) {
        return plan(codeLetter(lotSize, level), aql, severity, scheme, lotSize);
    }

    /**
     * The single sampling plan for a given code letter (for procedures that prescribe the letter
     * directly), following arrows as in {@link #plan(int, Aql, InspectionLevel, Severity, Scheme)}.
     *
     * @param codeLetter the code letter to start from; {@code S} only with tightened inspection
     * @param aql acceptance quality limit
     * @param severity normal, tightened or reduced
     * @param scheme the published scheme
     * @param lotSize number of items in the lot, at least 1 (decides 100 % inspection)
     * @return the plan
     * @throws IllegalArgumentException when {@code lotSize} is 0 or negative, an argument is null, the
     *     letter does not exist in the table for {@code severity}, or its cell is blank (row S of
     *     Table 2-B away from AQL 0.025)
     */
    public static SamplingPlan plan(CodeLetter codeLetter, Aql aql, Severity severity, Scheme scheme,
            int lotSize) {
        requireLotSize(lotSize);
        Objects.requireNonNull(codeLetter, "codeLetter");
        Objects.requireNonNull(aql, "aql");
        Objects.requireNonNull(severity, "severity");
        Objects.requireNonNull(scheme, "scheme");
        Resolved resolved = resolve(scheme, severity, codeLetter, aql);
        boolean full = resolved.sampleSize() >= lotSize;
        return new SamplingPlan(codeLetter, resolved.letter(), full ? lotSize : resolved.sampleSize(),
                resolved.acceptNumber(), resolved.rejectNumber(), full, severity, aql, scheme);
    }

    /**
     * The tabulated sample size of a code letter's row (before any reduction to the lot size).
     * Normal and tightened: A 2, B 3, C 5 … R 2000 (S 3150, tightened only); reduced: A 2, B 2, C 2,
     * D 3 … R 800 (ISO 2859-1:1999 Tables 2-A, 2-B, 2-C; the same in both schemes).
     *
     * @param codeLetter the code letter
     * @param severity the table
     * @return the sample size n of that row
     * @throws IllegalArgumentException when the letter has no row in that table (S outside Table 2-B)
     */
    public static int sampleSize(CodeLetter codeLetter, Severity severity) {
        Objects.requireNonNull(codeLetter, "codeLetter");
        Objects.requireNonNull(severity, "severity");
        SamplingTables.PrintedTable table = SamplingTables.table(Scheme.ISO_2859_1_1999, severity);
        int index = table.indexOf(codeLetter);
        if (index < 0) {
            throw new IllegalArgumentException(noRow(codeLetter, severity));
        }
        return table.rows().get(index).sampleSize();
    }

    /**
     * The lot decision for a plan: accept when d ≤ Ac, not accept when d ≥ Re (ISO 2859-1:1999, rule of
     * Tables 2-A/2-B/2-C). For a gap plan (Re &gt; Ac + 1, only in the ANSI/ASQ Z1.4 reduced table),
     * Ac &lt; d &lt; Re gives {@link Disposition#ACCEPT_AND_RETURN_TO_NORMAL} (Z1.4-2008 clause 10.1.4).
     *
     * @param plan the plan used
     * @param nonconforming number of nonconforming items d found among the plan's sample
     * @return the disposition
     * @throws IllegalArgumentException when {@code plan} is null, or d is negative or exceeds the
     *     sample size
     */
    public static Disposition disposition(SamplingPlan plan, int nonconforming) {
        Objects.requireNonNull(plan, "plan");
        if (nonconforming < 0 || nonconforming > plan.sampleSize()) {
            throw new IllegalArgumentException("Number of nonconforming items must be between 0 and the sample size "
                    + plan.sampleSize() + ", was " + nonconforming + ".");
        }
        if (nonconforming <= plan.acceptNumber()) {
            return Disposition.ACCEPT;
        }
        if (nonconforming >= plan.rejectNumber()) {
            return Disposition.REJECT;
        }
        return Disposition.ACCEPT_AND_RETURN_TO_NORMAL;
    }

    /**
     * The acceptance number the same sample would have had at the next tighter AQL, for the switching
     * score of ISO 2859-1:1999 clause 9.3.3.2 a) 1) ("add 3 if the lot would have been accepted if the
     * AQL had been one step tighter").
     *
     * <p>Dockgate reads the next tighter column in the row of the plan actually used
     * ({@code planCodeLetter}), not in the row of the original code letter. The standard does not say
     * which row applies when the plan was reached by an ↑ arrow (e.g. R / 10 → K, n 125, 21/22, where
     * row R at 6.5 leads to a different sample); in the plan's own row every direct normal plan with
     * Ac ≥ 2 has, at the next tighter AQL, a direct plan with the same sample size, so the question
     * "would this sample have been accepted" has an unambiguous answer there (checked for every cell
     * by the tests).
     *
     * <p>The clause asks this question only for plans with Ac ≥ 2 (for Ac 0 or 1 the score adds 2 per
     * accepted lot), so the result is empty for Ac 0 or 1, and at AQL 0.010, which has no tighter column.
     *
     * @param plan a normal-inspection plan
     * @return the acceptance number at one step tighter AQL; empty for Ac &lt; 2 or AQL 0.010
     * @throws IllegalArgumentException when the plan is null or not a normal-inspection plan
     */
    public static OptionalInt acceptNumberOneStepTighter(SamplingPlan plan) {
        Objects.requireNonNull(plan, "plan");
        if (plan.severity() != Severity.NORMAL) {
            throw new IllegalArgumentException("The switching score uses normal-inspection plans only, got "
                    + plan.severity() + ".");
        }
        if (plan.acceptNumber() < 2 || plan.aql().tighter().isEmpty()) {
            return OptionalInt.empty();
        }
        Resolved tighter = resolve(plan.scheme(), Severity.NORMAL, plan.planCodeLetter(), plan.aql().tighter().get());
        int usedSampleSize = sampleSize(plan.planCodeLetter(), Severity.NORMAL);
        if (tighter.sampleSize() != usedSampleSize) {
            // Cannot happen for the tables as stored (tested); guards against a future table edit.
            throw new IllegalStateException("Tighter plan for " + plan.planCodeLetter() + " at "
                    + plan.aql().tighter().get().label() + " uses n " + tighter.sampleSize()
                    + " instead of " + usedSampleSize);
        }
        return OptionalInt.of(tighter.acceptNumber());
    }

    /** A cell after following its arrows: letter and sample size of the row holding the plan. */
    record Resolved(CodeLetter letter, int sampleSize, int acceptNumber, int rejectNumber) {
    }

    /**
     * Follows the arrows of the printed table from (letter, aql). Package-private for the tests that
     * compare every cell with the independent resolved copy in the test resources.
     */
    static Resolved resolve(Scheme scheme, Severity severity, CodeLetter letter, Aql aql) {
        SamplingTables.PrintedTable table = SamplingTables.table(scheme, severity);
        List<SamplingTables.Row> rows = table.rows();
        int row = table.indexOf(letter);
        if (row < 0) {
            throw new IllegalArgumentException(noRow(letter, severity));
        }
        int column = aql.ordinal();
        String cell = rows.get(row).cells().get(column);
        if (cell.equals("-")) {
            throw new IllegalArgumentException("The " + severity.name().toLowerCase(java.util.Locale.ROOT)
                    + " table has no plan for code letter " + letter + " at AQL " + aql.label() + ".");
        }
        String direction = null;
        while (cell.equals("↓") || cell.equals("↑")) {
            if (direction != null && !direction.equals(cell)) {
                throw new IllegalStateException("Arrows point against each other at column " + aql.label());
            }
            direction = cell;
            row += cell.equals("↓") ? 1 : -1;
            if (row < 0 || row >= rows.size()) {
                throw new IllegalStateException("Arrow leads off the table at column " + aql.label());
            }
            cell = rows.get(row).cells().get(column);
        }
        if (cell.equals("-")) {
            throw new IllegalStateException("Arrow leads to a blank cell at column " + aql.label());
        }
        String[] acRe = cell.split("/");
        SamplingTables.Row found = rows.get(row);
        return new Resolved(found.letter(), found.sampleSize(), Integer.parseInt(acRe[0]), Integer.parseInt(acRe[1]));
    }

    /** The cell as printed, e.g. "↓" or "2/3"; package-private for tests. */
    static String printedCell(Scheme scheme, Severity severity, CodeLetter letter, Aql aql) {
        SamplingTables.PrintedTable table = SamplingTables.table(scheme, severity);
        int row = table.indexOf(letter);
        if (row < 0) {
            throw new IllegalArgumentException(noRow(letter, severity));
        }
        return table.rows().get(row).cells().get(aql.ordinal());
    }

    private static String noRow(CodeLetter letter, Severity severity) {
        return "Code letter " + letter + " has no row in the " + severity.name().toLowerCase(java.util.Locale.ROOT)
                + " table (S exists only for tightened inspection).";
    }

    private static void requireLotSize(int lotSize) {
        if (lotSize < 1) {
            throw new IllegalArgumentException("Lot size must be at least 1, was " + lotSize + ".");
        }
    }
}
