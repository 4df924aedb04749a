package org.dockgate.core.sampling;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Every cell of the tables stored as printed (with arrows), after resolution, against an independent
 * resolved copy (src/test/resources/sampling, see SOURCE.md there):
 * ISO 2859-1:1999 Tables 2-A/2-B/2-C against the GB/T 2828.1-2012 retyped copy, and
 * ANSI/ASQ Z1.4-2008 Tables II-A/II-B/II-C against the MIL-STD-105E retyped copy, AQL 0.010 … 10,
 * code letters A … R (and S for tightened). One case per table.
 *
 * <p>The two retyped copies disagree in one cell shared by both tables, Table 2-B code letter A at
 * AQL 10 (ISO "0 1" vs Z1.4 ↓); each scheme is compared with its own source, so both values are
 * checked, and {@link #sourcesDisagreeOnlyWhereSamplingMdSaysSo} pins that the disagreement is that cell alone.
 */
class PlanTablesMatchResolvedCopyTest {

    private static final JsonNode ISO_JSON = read("/sampling/iso2859_1_1999_single_resolved.json");
    private static final JsonNode MIL_JSON = read("/sampling/mil105e_z14_single_resolved.json");

    static Stream<Arguments> tables() {
        List<Arguments> cases = new ArrayList<>();
        for (Scheme scheme : Scheme.values()) {
            for (Severity severity : Severity.values()) {
                cases.add(Arguments.of(scheme, severity));
            }
        }
        return cases.stream();
    }

    @ParameterizedTest(name = "{0} {1}")
    @MethodSource("tables")
    void everyResolvedCellMatchesTheResolvedCopy(Scheme scheme, Severity severity) {
        JsonNode source = scheme == Scheme.ISO_2859_1_1999 ? ISO_JSON : MIL_JSON;
        JsonNode table = source.get("plans").get(severity.name().toLowerCase(Locale.ROOT));
        // the column order of the file must be the AQL series, or the comparison below would be shifted
        for (Aql aql : Aql.values()) {
            assertEquals(aql.label(), source.get("aql").get(aql.ordinal()).asString());
        }
        int compared = 0;
        for (CodeLetter letter : CodeLetter.values()) {
            JsonNode row = table.get(letter.name());
            if (letter == CodeLetter.S && (severity != Severity.TIGHTENED || scheme == Scheme.ANSI_ASQ_Z1_4_2008)) {
                // no row S outside Table 2-B; the MIL file lists rows A..R only (S is reached via Q and R / 0.025,
                // which are compared below: n 3150, 1/2)
                assertEquals(null, row, "no row S in " + scheme + " " + severity);
                continue;
            }
            for (Aql aql : Aql.values()) {
                String where = scheme + " " + severity + " " + letter + " / " + aql.label();
                JsonNode expected = row == null ? null : row.get(aql.ordinal());
                String printed = SingleSamplingPlans.printedCell(scheme, severity, letter, aql);
                if (printed.equals("-")) {
                    // blank cell (row S of Table 2-B): the ISO file has null, the MIL file has no row S
                    assertTrue(expected == null || expected.isNull(), where + " should be blank");
                    assertThrows(IllegalArgumentException.class,
                            () -> SingleSamplingPlans.resolve(scheme, severity, letter, aql));
                    continue;
                }
                SingleSamplingPlans.Resolved actual = SingleSamplingPlans.resolve(scheme, severity, letter, aql);
                if (scheme == Scheme.ISO_2859_1_1999) {
                    // [letter used, n, Ac, Re]
                    assertEquals(expected.get(0).asString(), actual.letter().name(), where + " letter used");
                    assertEquals(expected.get(1).asInt(), actual.sampleSize(), where + " n");
                    assertEquals(expected.get(2).asInt(), actual.acceptNumber(), where + " Ac");
                    assertEquals(expected.get(3).asInt(), actual.rejectNumber(), where + " Re");
                } else {
                    // [n, Ac, Re]; the letter used must carry that sample size in the table
                    assertEquals(expected.get(0).asInt(), actual.sampleSize(), where + " n");
                    assertEquals(expected.get(1).asInt(), actual.acceptNumber(), where + " Ac");
                    assertEquals(expected.get(2).asInt(), actual.rejectNumber(), where + " Re");
                    assertEquals(SingleSamplingPlans.sampleSize(actual.letter(), severity), actual.sampleSize());
                }
                compared++;
            }
        }
        boolean rowS = severity == Severity.TIGHTENED && scheme == Scheme.ISO_2859_1_1999;
        int expectedCells = 16 * 16 + (rowS ? 1 : 0); // A..R x 16 AQLs (+ S / 0.025 in the ISO file)
        assertEquals(expectedCells, compared, "cells compared");
    }

    /** SAMPLING.md section 6.1: 2-A 416/416 agree; 2-B all but A / 10; 2-C differs (the 1999 change). */
    @ParameterizedTest(name = "{1}")
    @MethodSource("tables")
    void sourcesDisagreeOnlyWhereSamplingMdSaysSo(Scheme ignored, Severity severity) {
        if (ignored != Scheme.ISO_2859_1_1999) {
            return; // one comparison per severity
        }
        List<String> differing = new ArrayList<>();
        for (CodeLetter letter : CodeLetter.values()) {
            if (letter == CodeLetter.S) {
                continue;
            }
            for (Aql aql : Aql.values()) {
                var iso = SingleSamplingPlans.resolve(Scheme.ISO_2859_1_1999, severity, letter, aql);
                var z14 = SingleSamplingPlans.resolve(Scheme.ANSI_ASQ_Z1_4_2008, severity, letter, aql);
                if (iso.sampleSize() != z14.sampleSize() || iso.acceptNumber() != z14.acceptNumber()
                        || iso.rejectNumber() != z14.rejectNumber()) {
                    differing.add(letter + "/" + aql.label());
                }
            }
        }
        switch (severity) {
            case NORMAL -> assertEquals(List.of(), differing);
            case TIGHTENED -> assertEquals(List.of("A/10"), differing);
            case REDUCED -> assertTrue(differing.size() > 100, "the 1999 gap-free reduced table differs widely");
        }
    }

    private static JsonNode read(String resource) {
        try (InputStream in = PlanTablesMatchResolvedCopyTest.class.getResourceAsStream(resource)) {
            if (in == null) {
                throw new IllegalStateException("missing test resource " + resource);
            }
            return JsonMapper.builder().build().readTree(in);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }
}
