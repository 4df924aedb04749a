package org.dockgate.core.spc;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;

import org.junit.jupiter.api.Test;

class PChartTest {

    @Test
    void variableSubgroupSizesWorkedByHand() {
        // REFERENCE.md A10 [X], formulas NIST/SEMATECH e-Handbook 6.3.3.2: d = 4, 2, 5, 3, 6, 1, 4, 8 rejects in
        // n = 120, 80, 150, 100, 200, 60, 110, 90; p̄ = 33/910; limits p̄ ± 3√(p̄(1 − p̄)/n_i), LCL floored at 0
        long[] rejected = {4, 2, 5, 3, 6, 1, 4, 8};
        long[] inspected = {120, 80, 150, 100, 200, 60, 110, 90};
        double[] ucl = {0.087461, 0.098967, 0.082056, 0.092347, 0.075921, 0.108667, 0.089737, 0.095381};
        List<PChart.Subgroup> subgroups = new ArrayList<>();
        for (int i = 0; i < rejected.length; i++) {
            subgroups.add(new PChart.Subgroup("lot " + (i + 1), inspected[i], rejected[i]));
        }
        PChart chart = PChart.of(subgroups);
        assertEquals(0.0362637363, chart.centerLine(), 5e-11);
        assertEquals(33.0 / 910.0, chart.centerLine(), 1e-17);
        assertAll(IntStream.range(0, ucl.length).mapToObj(i -> () -> {
            PChart.PChartPoint point = chart.points().get(i);
            assertEquals("lot " + (i + 1), point.label());
            assertEquals(ucl[i], point.upperControlLimit(), 5e-7, "UCL of lot " + (i + 1)); // printed to 6 decimals
            assertEquals(0.0, point.lowerControlLimit(), "raw LCL is negative, floored at 0");
            assertEquals((double) rejected[i] / inspected[i], point.proportion(), 1e-17);
            assertFalse(point.outOfControl());
        }));
        // lot 8: p = 0.088889 < UCL 0.095381, in control but close (REFERENCE.md A10)
        assertEquals(0.088889, chart.points().get(7).proportion(), 5e-7);
    }

    @Test
    void nistWaferExampleLimits() {
        // NIST/SEMATECH e-Handbook 6.3.3.2 wafer example: n = 50 per subgroup, p̄ = 0.2313 [C: S16]; limits
        // UCL 0.410197, LCL 0.052403 [X]. 200 subgroups of 50 with 2313 rejects give p̄ = 0.2313 exactly.
        List<PChart.Subgroup> subgroups = new ArrayList<>();
        for (int i = 0; i < 200; i++) {
            subgroups.add(new PChart.Subgroup("wafer " + i, 50, i < 113 ? 12 : 11));
        }
        PChart chart = PChart.of(subgroups);
        assertEquals(0.2313, chart.centerLine(), 1e-15);
        PChart.PChartPoint point = chart.points().get(0);
        assertEquals(0.410197, point.upperControlLimit(), 5e-7);
        assertEquals(0.052403, point.lowerControlLimit(), 5e-7);
    }

    @Test
    void pointsBeyondALimitAreFlagged() {
        // rule 1 of the Western Electric rules (common practice): a point outside the 3σ limits
        PChart chart = PChart.of(List.of(
                new PChart.Subgroup("a", 100, 2), new PChart.Subgroup("b", 100, 3),
                new PChart.Subgroup("c", 100, 2), new PChart.Subgroup("d", 100, 15),
                new PChart.Subgroup("e", 100, 3)));
        // p̄ = 25/500 = 0.05, UCL = 0.05 + 3√(0.05·0.95/100) = 0.115383
        assertEquals(0.115383, chart.points().get(3).upperControlLimit(), 5e-7);
        assertTrue(chart.points().get(3).outOfControl(), "0.15 > UCL");
        assertFalse(chart.points().get(0).outOfControl());
    }

    @Test
    void lowPointsBelowAPositiveLowerLimitAreFlagged() {
        PChart chart = PChart.of(List.of(
                new PChart.Subgroup("a", 1000, 100), new PChart.Subgroup("b", 1000, 100),
                new PChart.Subgroup("c", 1000, 40)));
        // p̄ = 0.08, LCL = 0.08 − 3√(0.08·0.92/1000) = 0.054263
        assertEquals(0.054263, chart.points().get(2).lowerControlLimit(), 5e-7);
        assertTrue(chart.points().get(2).outOfControl(), "0.040 < LCL");
    }

    @Test
    void aPointOnALimitIsInControl() {
        // documented convention (REFERENCE.md §7.1 asks for it to be stated): strictly beyond counts. With no
        // rejects anywhere p̄ = 0, both limits are 0 and every point sits on them.
        PChart chart = PChart.of(List.of(new PChart.Subgroup("a", 50, 0), new PChart.Subgroup("b", 80, 0)));
        assertEquals(0.0, chart.centerLine());
        chart.points().forEach(point -> {
            assertEquals(0.0, point.lowerControlLimit());
            assertEquals(0.0, point.upperControlLimit());
            assertFalse(point.outOfControl());
        });
    }

    @Test
    void upperLimitIsCappedAtOne() {
        PChart chart = PChart.of(List.of(new PChart.Subgroup("a", 2, 1), new PChart.Subgroup("b", 2, 1)));
        assertEquals(1.0, chart.points().get(0).upperControlLimit());
        assertEquals(0.0, chart.points().get(0).lowerControlLimit());
    }

    @Test
    void rejectsMalformedSubgroups() {
        assertAll(
                () -> assertThrows(IllegalArgumentException.class, () -> PChart.of(List.of())),
                () -> assertThrows(IllegalArgumentException.class, () -> new PChart.Subgroup("a", 0, 0)),
                () -> assertThrows(IllegalArgumentException.class, () -> new PChart.Subgroup("a", 10, 11)),
                () -> assertThrows(IllegalArgumentException.class, () -> new PChart.Subgroup("a", 10, -1)));
    }
}
