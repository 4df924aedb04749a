package org.dockgate.core.spc;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.dockgate.core.UnevaluableException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

class ProportionIntervalTest {

    @Test
    void threeRejectsInEightyWorkedByHand() {
        // Wilson (1927) score interval; REFERENCE.md A10 [X]: 3/80 at 95 % → (0.012835, 0.104547)
        ProportionInterval interval = ProportionInterval.wilson(3, 80, 0.95);
        assertEquals(0.0375, interval.estimate(), 1e-17);
        assertEquals(0.012835, interval.lower(), 5e-7);
        assertEquals(0.104547, interval.upper(), 5e-7);
    }

    @ParameterizedTest(name = "Newcombe 1998 Table II: {0}/{1}")
    @CsvSource({
        // Newcombe (1998), Stat. Med. 17:857, Table II, Wilson score method, 95 %, four decimals
        // (from memory, REFERENCE.md §7.4 [M], recomputed there and here to four decimals)
        "81, 263, 0.2553, 0.3662",
        "15, 148, 0.0624, 0.1605",
        "0, 20, 0.0000, 0.1611",
        "1, 29, 0.0061, 0.1718"})
    void newcombeTableII(long rejected, long inspected, double lower, double upper) {
        ProportionInterval interval = ProportionInterval.wilson(rejected, inspected, 0.95);
        assertEquals(lower, interval.lower(), 5e-5);
        assertEquals(upper, interval.upper(), 5e-5);
    }

    @ParameterizedTest(name = "score test at the limits: {0}/{1}, {2}")
    @CsvSource({"3, 80, 0.95", "81, 263, 0.95", "1, 29, 0.90", "17, 20, 0.99", "500, 1000, 0.6827"})
    void limitsAreWhereTheScoreStatisticReachesTheNormalQuantile(long x, long n, double confidence) {
        // Independent oracle: Wilson's limits solve |p̂ − p| / √(p(1 − p)/n) = z; Commons Math's normal CDF of
        // that statistic must give back (1 + confidence)/2 (a forward CDF, not the quantile the code uses)
        ProportionInterval interval = ProportionInterval.wilson(x, n, confidence);
        NormalDistribution normal = new NormalDistribution();
        double p = (double) x / n;
        for (double limit : new double[] {interval.lower(), interval.upper()}) {
            double score = Math.abs(p - limit) / Math.sqrt(limit * (1 - limit) / n);
            assertEquals((1 + confidence) / 2, normal.cumulativeProbability(score), 1e-12, "limit " + limit);
        }
    }

    @Test
    void noRejectsOrAllRejectedReachTheBoundsExactly() {
        assertEquals(0.0, ProportionInterval.wilson(0, 20, 0.95).lower());
        assertEquals(1.0, ProportionInterval.wilson(20, 20, 0.95).upper());
        // symmetry p ↔ 1 − p: 20/20 mirrors 0/20 (upper 0.1611, Newcombe 1998 Table II)
        assertEquals(1 - 0.1611, ProportionInterval.wilson(20, 20, 0.95).lower(), 5e-5);
    }

    @Test
    void nothingInspectedCannotBeEvaluated() {
        assertThrows(UnevaluableException.class, () -> ProportionInterval.wilson(0, 0, 0.95));
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.0, 1.0, Double.NaN, -0.1, Double.POSITIVE_INFINITY})
    void rejectsConfidenceOutsideTheOpenUnitInterval(double confidence) {
        assertThrows(IllegalArgumentException.class, () -> ProportionInterval.wilson(1, 10, confidence));
    }

    @Test
    void rejectsImpossibleCounts() {
        assertAll(
                () -> assertThrows(IllegalArgumentException.class, () -> ProportionInterval.wilson(11, 10, 0.95)),
                () -> assertThrows(IllegalArgumentException.class, () -> ProportionInterval.wilson(-1, 10, 0.95)),
                () -> assertThrows(IllegalArgumentException.class, () -> ProportionInterval.wilson(0, -5, 0.95)));
    }
}
