package org.dockgate.core.uncertainty;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.stream.Stream;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

class CoverageFactorTest {

    /** The columns of GUM Table G.2; 68.27 %, 95.45 % and 99.73 % are exactly 2Φ(k) − 1 for k = 1, 2, 3. */
    private static final double[] COLUMNS = {
        CoverageFactor.normalCoverageProbability(1), 0.90, 0.95,
        CoverageFactor.normalCoverageProbability(2), 0.99, CoverageFactor.normalCoverageProbability(3)};

    /**
     * JCGM 100:2008 (GUM) Table G.2, reproduced in NIST TN 1297 Table B.1: t_p(ν) for p = 68.27 %, 90 %, 95 %,
     * 95.45 %, 99 %, 99.73 %. Compared after rounding to the printed two (∞ row: three) decimals.
     */
    static Stream<Arguments> gumTableG2() {
        return Stream.of(
                Arguments.of(1, new String[] {"1.84", "6.31", "12.71", "13.97", "63.66", "235.80"}),
                Arguments.of(2, new String[] {"1.32", "2.92", "4.30", "4.53", "9.92", "19.21"}),
                Arguments.of(3, new String[] {"1.20", "2.35", "3.18", "3.31", "5.84", "9.22"}),
                Arguments.of(4, new String[] {"1.14", "2.13", "2.78", "2.87", "4.60", "6.62"}),
                Arguments.of(5, new String[] {"1.11", "2.02", "2.57", "2.65", "4.03", "5.51"}),
                Arguments.of(6, new String[] {"1.09", "1.94", "2.45", "2.52", "3.71", "4.90"}),
                Arguments.of(8, new String[] {"1.07", "1.86", "2.31", "2.37", "3.36", "4.28"}),
                Arguments.of(10, new String[] {"1.05", "1.81", "2.23", "2.28", "3.17", "3.96"}),
                Arguments.of(20, new String[] {"1.03", "1.72", "2.09", "2.13", "2.85", "3.42"}),
                Arguments.of(50, new String[] {"1.01", "1.68", "2.01", "2.05", "2.68", "3.16"}),
                Arguments.of(Double.POSITIVE_INFINITY,
                        new String[] {"1.000", "1.645", "1.960", "2.000", "2.576", "3.000"}));
    }

    @ParameterizedTest(name = "GUM Table G.2, nu = {0}")
    @MethodSource("gumTableG2")
    void reproducesGumTableG2Row(double degreesOfFreedom, String[] printed) {
        assertAll(Stream.of(0, 1, 2, 3, 4, 5).map(column -> () -> {
            BigDecimal expected = new BigDecimal(printed[column]);
            BigDecimal actual = BigDecimal.valueOf(CoverageFactor.forProbability(COLUMNS[column], degreesOfFreedom))
                    .setScale(expected.scale(), RoundingMode.HALF_UP);
            assertEquals(expected, actual, "p = " + COLUMNS[column]);
        }));
    }

    @Test
    void unroundedValuesAtNuOne() {
        // REFERENCE.md §3.2 [X]: unrounded t at exact p for ν = 1: 1.8373 / 13.9677 / 235.8015 (tolerance 5e-5)
        assertEquals(1.8373, CoverageFactor.forProbability(COLUMNS[0], 1), 5e-5);
        assertEquals(13.9677, CoverageFactor.forProbability(COLUMNS[3], 1), 5e-5);
        assertEquals(235.8015, CoverageFactor.forProbability(COLUMNS[5], 1), 5e-5);
    }

    @Test
    void rowSeventeenUsedByTheWelchSatterthwaiteExample() {
        // NIST TN 1297 Table B.1 row 17 (= GUM Table G.2): 95.45 % → 2.16, 95 % → 2.11
        assertEquals(2.16, CoverageFactor.forProbability(COLUMNS[3], 17), 0.005);
        assertEquals(2.11, CoverageFactor.forProbability(0.95, 17), 0.005);
    }

    @Test
    void exactNormalCoverageProbabilities() {
        // 2Φ(k) − 1, values from any normal table (e.g. NIST/SEMATECH e-Handbook 1.3.6.7.1), 10 decimals
        assertEquals(0.6826894921, CoverageFactor.normalCoverageProbability(1), 5e-11);
        assertEquals(0.9544997361, CoverageFactor.normalCoverageProbability(2), 5e-11);
        assertEquals(0.9973002039, CoverageFactor.normalCoverageProbability(3), 5e-11);
    }

    @Test
    void nonIntegerDegreesOfFreedomAreTruncatedDown() {
        // GUM G.4.1 Note 1 / G.6.4: truncate ν_eff to the next lower integer before entering Table G.2
        assertEquals(CoverageFactor.forProbability(0.95, 17), CoverageFactor.forProbability(0.95, 17.99));
        assertEquals(17.0, CoverageFactor.truncatedDegreesOfFreedom(17.1689189));
        assertEquals(20.0, CoverageFactor.truncatedDegreesOfFreedom(19.999999999999996), "rounding noise");
        assertEquals(Double.POSITIVE_INFINITY, CoverageFactor.truncatedDegreesOfFreedom(Double.POSITIVE_INFINITY));
    }

    @Test
    void veryLargeDegreesOfFreedomUseTheNormalQuantile() {
        // Commons Math NormalDistribution as an independent oracle for the limit ν → ∞
        double z = new NormalDistribution().inverseCumulativeProbability(0.975);
        assertEquals(z, CoverageFactor.forProbability(0.95, 1e9), 1e-12);
        // t_0.975(10⁶) ≈ z + (z³ + z)/(4ν) (Cornish–Fisher expansion), a check the switch-over loses nothing
        assertEquals(z + (z * z * z + z) / 4e6, CoverageFactor.forProbability(0.95, 1e6), 1e-9);
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.0, 1.0, -0.5, 1.5, Double.NaN, Double.POSITIVE_INFINITY})
    void rejectsCoverageProbabilitiesOutsideTheOpenUnitInterval(double p) {
        assertThrows(IllegalArgumentException.class, () -> CoverageFactor.forProbability(p, 10));
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.0, 0.5, -1.0, Double.NaN, Double.NEGATIVE_INFINITY})
    void rejectsDegreesOfFreedomBelowOne(double nu) {
        assertThrows(IllegalArgumentException.class, () -> CoverageFactor.forProbability(0.95, nu));
    }

    /**
     * k is remembered per (p, ⌊ν⌋): asked in a shuffled order, for several p and ν (integer and not, and above
     * 10⁶), every answer is still the quantile computed afresh — a key that mixed up p or ν would show here.
     */
    @Test
    void rememberedCoverageFactorsAreThoseComputedAfresh() {
        double[] probabilities = {0.6826894921370859, 0.95, CoverageFactor.normalCoverageProbability(2.0), 0.99};
        java.util.List<double[]> asks = new java.util.ArrayList<>();
        for (double p : probabilities) {
            for (int nu = 1; nu <= 60; nu++) {
                asks.add(new double[] {p, nu});
                asks.add(new double[] {p, nu + 0.5});
            }
            asks.add(new double[] {p, 2.0e6});
            asks.add(new double[] {p, Double.POSITIVE_INFINITY});
        }
        java.util.Collections.shuffle(asks, new java.util.Random(11));
        for (int pass = 0; pass < 2; pass++) {
            for (double[] ask : asks) {
                double nu = Math.floor(ask[1]);
                double quantile = (1.0 + ask[0]) / 2.0;
                double fresh = nu > 1.0e6 ? new NormalDistribution(null, 0, 1).inverseCumulativeProbability(quantile)
                        : new org.apache.commons.math3.distribution.TDistribution(null, nu).inverseCumulativeProbability(quantile);
                assertEquals(fresh, CoverageFactor.forProbability(ask[0], ask[1]), 0.0, "p " + ask[0] + ", ν " + ask[1]);
            }
        }
    }
}
