package org.dockgate.core.sampling;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * The tables of ISO 2859-1:1999 (and ANSI/ASQ Z1.4-2008) in one place, stored <em>as printed</em>:
 * Table 1 (sample-size code letters) and the single-sampling Tables 2-A, 2-B and 2-C with their arrows.
 * Arrows are resolved at look-up time, so a reader can compare each text block cell by cell with the
 * printed standard.
 *
 * <p>Cell notation: {@code Ac/Re} is a plan, {@code ↓} "use the first sampling plan below the arrow",
 * {@code ↑} "use the first sampling plan above the arrow", {@code -} a blank cell (row S of Table 2-B).
 * The column {@code n} is the sample size of the row; when an arrow is followed, the sample size
 * and code letter of the row where the plan is found are used (legend of Tables 2-A/2-B/2-C).
 *
 * <p>Provenance (see the shared note SAMPLING.md): Table 2-A is identical in ISO 2859-1:1999,
 * ANSI/ASQ Z1.4-2008 and MIL-STD-105E; Table 2-B is identical in all of them except cell A / AQL 10
 * (see {@link #TIGHTENED_ISO_A_10}); Table 2-C differs (ISO 1999 removed the gaps between Ac and Re).
 * The ISO 2-C values rest on a single retyped copy of the identical national adoption
 * GB/T 2828.1-2012 and must be checked against a printed ISO 2859-1:1999 before release. For the Z1.4
 * reduced table, the placement of arrows versus plans in rows A–C (all n = 2) is inferred from the
 * table's diagonal pattern; the resolved plans are certain.
 */
final class SamplingTables {

    private SamplingTables() {
    }

    // ISO 2859-1:1999 Table 1, sample size code letters (= ANSI/ASQ Z1.4-2008 Table I).
    // Columns: lot size from, to (inclusive; "max" = and over), then S-1 S-2 S-3 S-4 I II III.
    private static final String TABLE_1 = """
            #  from     to   S1 S2 S3 S4 I  II III
                   2      8  A  A  A  A  A  A  B
                   9     15  A  A  A  A  A  B  C
                  16     25  A  A  B  B  B  C  D
                  26     50  A  B  B  C  C  D  E
                  51     90  B  B  C  C  C  E  F
                  91    150  B  B  C  D  D  F  G
                 151    280  B  C  D  E  E  G  H
                 281    500  B  C  D  E  F  H  J
                 501   1200  C  C  E  F  G  J  K
                1201   3200  C  D  E  G  H  K  L
                3201  10000  C  D  F  G  J  L  M
               10001  35000  C  D  F  H  K  M  N
               35001 150000  D  E  G  J  L  N  P
              150001 500000  D  E  G  J  M  P  Q
              500001    max  D  E  H  K  N  Q  R
            """;

    // Table 2-A, normal inspection: ISO 2859-1:1999 = ANSI/ASQ Z1.4-2008 Table II-A = MIL-STD-105E.
    private static final String NORMAL_PRINTED = """
            #      n  0.010 0.015 0.025 0.040 0.065 0.10  0.15  0.25  0.40  0.65  1.0   1.5   2.5   4.0   6.5   10
            A      2  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓
            B      3  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓
            C      5  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     1/2
            D      8  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     1/2   2/3
            E     13  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     1/2   2/3   3/4
            F     20  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     1/2   2/3   3/4   5/6
            G     32  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     1/2   2/3   3/4   5/6   7/8
            H     50  ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     1/2   2/3   3/4   5/6   7/8   10/11
            J     80  ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     1/2   2/3   3/4   5/6   7/8   10/11 14/15
            K    125  ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     1/2   2/3   3/4   5/6   7/8   10/11 14/15 21/22
            L    200  ↓     ↓     ↓     ↓     0/1   ↑     ↓     1/2   2/3   3/4   5/6   7/8   10/11 14/15 21/22 ↑
            M    315  ↓     ↓     ↓     0/1   ↑     ↓     1/2   2/3   3/4   5/6   7/8   10/11 14/15 21/22 ↑     ↑
            N    500  ↓     ↓     0/1   ↑     ↓     1/2   2/3   3/4   5/6   7/8   10/11 14/15 21/22 ↑     ↑     ↑
            P    800  ↓     0/1   ↑     ↓     1/2   2/3   3/4   5/6   7/8   10/11 14/15 21/22 ↑     ↑     ↑     ↑
            Q   1250  0/1   ↑     ↓     1/2   2/3   3/4   5/6   7/8   10/11 14/15 21/22 ↑     ↑     ↑     ↑     ↑
            R   2000  ↑     ↑     1/2   2/3   3/4   5/6   7/8   10/11 14/15 21/22 ↑     ↑     ↑     ↑     ↑     ↑
            """;
    // Table 2-B, tightened inspection, as printed in ANSI/ASQ Z1.4-2008 Table II-B (= MIL-STD-105E);
    // ISO 2859-1:1999 Table 2-B is the same except cell A / 10, see TIGHTENED_ISO_A_10.
    // Row S carries a plan only at AQL 0.025; it is reached only by the arrows from Q and R.
    private static final String TIGHTENED_PRINTED = """
            #      n  0.010 0.015 0.025 0.040 0.065 0.10  0.15  0.25  0.40  0.65  1.0   1.5   2.5   4.0   6.5   10
            A      2  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓
            B      3  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓
            C      5  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓     ↓
            D      8  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓     ↓     1/2
            E     13  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓     ↓     1/2   2/3
            F     20  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓     ↓     1/2   2/3   3/4
            G     32  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓     ↓     1/2   2/3   3/4   5/6
            H     50  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓     ↓     1/2   2/3   3/4   5/6   8/9
            J     80  ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓     ↓     1/2   2/3   3/4   5/6   8/9   12/13
            K    125  ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓     ↓     1/2   2/3   3/4   5/6   8/9   12/13 18/19
            L    200  ↓     ↓     ↓     ↓     ↓     0/1   ↓     ↓     1/2   2/3   3/4   5/6   8/9   12/13 18/19 ↑
            M    315  ↓     ↓     ↓     ↓     0/1   ↓     ↓     1/2   2/3   3/4   5/6   8/9   12/13 18/19 ↑     ↑
            N    500  ↓     ↓     ↓     0/1   ↓     ↓     1/2   2/3   3/4   5/6   8/9   12/13 18/19 ↑     ↑     ↑
            P    800  ↓     ↓     0/1   ↓     ↓     1/2   2/3   3/4   5/6   8/9   12/13 18/19 ↑     ↑     ↑     ↑
            Q   1250  ↓     0/1   ↓     ↓     1/2   2/3   3/4   5/6   8/9   12/13 18/19 ↑     ↑     ↑     ↑     ↑
            R   2000  0/1   ↑     ↓     1/2   2/3   3/4   5/6   8/9   12/13 18/19 ↑     ↑     ↑     ↑     ↑     ↑
            S   3150  -     -     1/2   -     -     -     -     -     -     -     -     -     -     -     -     -
            """;
    /**
     * The one conflicting cell (SAMPLING.md section 4, open item 1): ISO 2859-1:1999 Table 2-B, code
     * letter A, AQL 10 is "0 1" in the only ISO retyped copy available (GB/T 2828.1-2012), where the
     * Z1.4 / MIL-STD-105E Table II-B prints ↓ (resolving to D, n 8, 1/2). Dockgate follows each
     * scheme's own source; the ISO value must be checked against a printed ISO 2859-1:1999.
     */
    static final String TIGHTENED_ISO_A_10 = "0/1";

    // Table II-C, reduced inspection, ANSI/ASQ Z1.4-2008 (= MIL-STD-105E): gap plans such as 1/4.
    private static final String MIL_REDUCED_PRINTED = """
            #      n  0.010 0.015 0.025 0.040 0.065 0.10  0.15  0.25  0.40  0.65  1.0   1.5   2.5   4.0   6.5   10
            A      2  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓
            B      2  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓
            C      2  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     0/2
            D      3  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     0/2   1/3
            E      5  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     0/2   1/3   1/4
            F      8  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     0/2   1/3   1/4   2/5
            G     13  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     0/2   1/3   1/4   2/5   3/6
            H     20  ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     0/2   1/3   1/4   2/5   3/6   5/8
            J     32  ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     0/2   1/3   1/4   2/5   3/6   5/8   7/10
            K     50  ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     0/2   1/3   1/4   2/5   3/6   5/8   7/10  10/13
            L     80  ↓     ↓     ↓     ↓     0/1   ↑     ↓     0/2   1/3   1/4   2/5   3/6   5/8   7/10  10/13 ↑
            M    125  ↓     ↓     ↓     0/1   ↑     ↓     0/2   1/3   1/4   2/5   3/6   5/8   7/10  10/13 ↑     ↑
            N    200  ↓     ↓     0/1   ↑     ↓     0/2   1/3   1/4   2/5   3/6   5/8   7/10  10/13 ↑     ↑     ↑
            P    315  ↓     0/1   ↑     ↓     0/2   1/3   1/4   2/5   3/6   5/8   7/10  10/13 ↑     ↑     ↑     ↑
            Q    500  0/1   ↑     ↓     0/2   1/3   1/4   2/5   3/6   5/8   7/10  10/13 ↑     ↑     ↑     ↑     ↑
            R    800  ↑     ↑     0/2   1/3   1/4   2/5   3/6   5/8   7/10  10/13 ↑     ↑     ↑     ↑     ↑     ↑
            """;
    // Table 2-C, reduced inspection, ISO 2859-1:1999: no gaps, every plan has Re = Ac + 1.
    private static final String ISO_REDUCED_PRINTED = """
            #      n  0.010 0.015 0.025 0.040 0.065 0.10  0.15  0.25  0.40  0.65  1.0   1.5   2.5   4.0   6.5   10
            A      2  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↓
            B      2  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓
            C      2  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     ↓
            D      3  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     ↓     1/2
            E      5  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     ↓     1/2   2/3
            F      8  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     ↓     1/2   2/3   3/4
            G     13  ↓     ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     ↓     1/2   2/3   3/4   5/6
            H     20  ↓     ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     ↓     1/2   2/3   3/4   5/6   6/7
            J     32  ↓     ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     ↓     1/2   2/3   3/4   5/6   6/7   8/9
            K     50  ↓     ↓     ↓     ↓     ↓     0/1   ↑     ↓     ↓     1/2   2/3   3/4   5/6   6/7   8/9   10/11
            L     80  ↓     ↓     ↓     ↓     0/1   ↑     ↓     ↓     1/2   2/3   3/4   5/6   6/7   8/9   10/11 ↑
            M    125  ↓     ↓     ↓     0/1   ↑     ↓     ↓     1/2   2/3   3/4   5/6   6/7   8/9   10/11 ↑     ↑
            N    200  ↓     ↓     0/1   ↑     ↓     ↓     1/2   2/3   3/4   5/6   6/7   8/9   10/11 ↑     ↑     ↑
            P    315  ↓     0/1   ↑     ↓     ↓     1/2   2/3   3/4   5/6   6/7   8/9   10/11 ↑     ↑     ↑     ↑
            Q    500  0/1   ↑     ↑     ↓     1/2   2/3   3/4   5/6   6/7   8/9   10/11 ↑     ↑     ↑     ↑     ↑
            R    800  ↑     ↑     ↑     1/2   2/3   3/4   5/6   6/7   8/9   10/11 ↑     ↑     ↑     ↑     ↑     ↑
            """;
    /** One parsed row of a plan table. */
    record Row(CodeLetter letter, int sampleSize, List<String> cells) {
    }

    /** A plan table as printed, rows top to bottom. */
    record PrintedTable(List<Row> rows) {

        int indexOf(CodeLetter letter) {
            for (int i = 0; i < rows.size(); i++) {
                if (rows.get(i).letter() == letter) {
                    return i;
                }
            }
            return -1;
        }
    }

    /** One row of Table 1. */
    record LotSizeRange(int fromInclusive, int toInclusive, Map<InspectionLevel, CodeLetter> letters) {
    }

    static final List<LotSizeRange> CODE_LETTER_TABLE = parseTable1(TABLE_1);

    private static final Map<Scheme, Map<Severity, PrintedTable>> PLAN_TABLES = buildPlanTables();

    /**
     * The printed table for a scheme and severity.
     */
    static PrintedTable table(Scheme scheme, Severity severity) {
        return PLAN_TABLES.get(scheme).get(severity);
    }

    private static Map<Scheme, Map<Severity, PrintedTable>> buildPlanTables() {
        PrintedTable normal = parsePlanTable(NORMAL_PRINTED);
        PrintedTable tightenedZ14 = parsePlanTable(TIGHTENED_PRINTED);
        PrintedTable tightenedIso = withCell(tightenedZ14, CodeLetter.A, Aql.AQL_10, TIGHTENED_ISO_A_10);

        Map<Severity, PrintedTable> iso = new EnumMap<>(Severity.class);
        iso.put(Severity.NORMAL, normal);
        iso.put(Severity.TIGHTENED, tightenedIso);
        iso.put(Severity.REDUCED, parsePlanTable(ISO_REDUCED_PRINTED));
        Map<Severity, PrintedTable> z14 = new EnumMap<>(Severity.class);
        z14.put(Severity.NORMAL, normal);
        z14.put(Severity.TIGHTENED, tightenedZ14);
        z14.put(Severity.REDUCED, parsePlanTable(MIL_REDUCED_PRINTED));

        Map<Scheme, Map<Severity, PrintedTable>> all = new EnumMap<>(Scheme.class);
        all.put(Scheme.ISO_2859_1_1999, iso);
        all.put(Scheme.ANSI_ASQ_Z1_4_2008, z14);
        return all;
    }

    private static PrintedTable withCell(PrintedTable table, CodeLetter letter, Aql aql, String cell) {
        List<Row> rows = new ArrayList<>();
        for (Row row : table.rows()) {
            if (row.letter() == letter) {
                List<String> cells = new ArrayList<>(row.cells());
                cells.set(aql.ordinal(), cell);
                rows.add(new Row(row.letter(), row.sampleSize(), List.copyOf(cells)));
            } else {
                rows.add(row);
            }
        }
        return new PrintedTable(List.copyOf(rows));
    }

    private static PrintedTable parsePlanTable(String text) {
        List<Row> rows = new ArrayList<>();
        for (String line : text.split("\n")) {
            String trimmed = line.trim();
            if (trimmed.isEmpty() || trimmed.startsWith("#")) {
                continue;
            }
            String[] parts = trimmed.split("\\s+");
            if (parts.length != 2 + Aql.values().length) {
                throw new IllegalStateException("Malformed plan table row: " + line);
            }
            List<String> cells = List.of(parts).subList(2, parts.length);
            for (String cell : cells) {
                if (!cell.equals("↓") && !cell.equals("↑") && !cell.equals("-") && !cell.matches("\\d+/\\d+")) {
                    throw new IllegalStateException("Malformed plan table cell '" + cell + "' in: " + line);
                }
            }
            rows.add(new Row(CodeLetter.valueOf(parts[0]), Integer.parseInt(parts[1]), List.copyOf(cells)));
        }
        return new PrintedTable(List.copyOf(rows));
    }

    private static List<LotSizeRange> parseTable1(String text) {
        List<LotSizeRange> ranges = new ArrayList<>();
        InspectionLevel[] levels = InspectionLevel.values();
        for (String line : text.split("\n")) {
            String trimmed = line.trim();
            if (trimmed.isEmpty() || trimmed.startsWith("#")) {
                continue;
            }
            String[] parts = trimmed.split("\\s+");
            if (parts.length != 2 + levels.length) {
                throw new IllegalStateException("Malformed Table 1 row: " + line);
            }
            Map<InspectionLevel, CodeLetter> letters = new EnumMap<>(InspectionLevel.class);
            for (int i = 0; i < levels.length; i++) {
                letters.put(levels[i], CodeLetter.valueOf(parts[2 + i]));
            }
            int to = parts[1].equals("max") ? Integer.MAX_VALUE : Integer.parseInt(parts[1]);
            ranges.add(new LotSizeRange(Integer.parseInt(parts[0]), to, Map.copyOf(letters)));
        }
        return List.copyOf(ranges);
    }
}
