package org.dockgate.core.uncertainty;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.dockgate.core.UnevaluableException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.ValueSource;

class UncertaintyBudgetTest {

    private static final double P_K2 = CoverageFactor.normalCoverageProbability(2); // the 95.45 % column

    /** REFERENCE.md A5 readings (mV). */
    private static final double[] READINGS = {
        100.02, 100.05, 99.98, 100.01, 100.03, 99.99, 100.04, 100.00, 100.02, 100.01};

    @Test
    void typeBDivisors() {
        // GUM 4.3.7 (a/√3), 4.3.9 (a/√6), EA-4/02 (a/√2); values REFERENCE.md A5 [X], a = 0.05, ±5e-11
        assertEquals(0.0288675135, Distribution.RECTANGULAR.standardUncertainty(0.05), 5e-11);
        assertEquals(0.0204124145, Distribution.TRIANGULAR.standardUncertainty(0.05), 5e-11);
        assertEquals(0.0353553391, Distribution.U_SHAPED.standardUncertainty(0.05), 5e-11);
    }

    @Test
    void typeAFromRepeatedReadings() {
        // GUM 4.2.1–4.2.3; REFERENCE.md A5 [X]; each figure to half a unit of its last printed digit
        TypeAEvaluation a = TypeAEvaluation.of(READINGS);
        // independent hand sum: Σ deviations² from 100.015 = 0.00425 (deviations in units of 0.005: 1, 7, −7, −1,
        // 3, −5, 5, −3, 1, −1 → Σ squares 170 × 0.005² = 0.00425), s² = 0.00425/9
        assertAll(
                () -> assertEquals(100.015, a.mean(), 5e-10),
                () -> assertEquals(Math.sqrt(0.00425 / 9), a.standardDeviation(), 1e-15),
                () -> assertEquals(0.0217306747, a.standardDeviation(), 5e-11),
                () -> assertEquals(0.00687184271, a.standardUncertainty(), 5e-12),
                () -> assertEquals(9.0, a.degreesOfFreedom()),
                () -> assertEquals(10, a.count()));
    }

    @Test
    void welchSatterthwaiteSmallDegreesOfFreedom() {
        // GUM G.4.1 Eq. G.2b; REFERENCE.md A5 [X]: u1 = 0.012 (ν 4), u2 = 0.010 (ν ∞), u3 = 0.008 (ν 12)
        UncertaintyBudget budget = UncertaintyBudget.builder()
                .standard("u1", 0.012, 4).standard("u2", 0.010).standard("u3", 0.008, 12)
                .evaluate(P_K2);
        assertAll(
                () -> assertEquals(0.0175499288, budget.combinedStandardUncertainty(), 5e-11),
                () -> assertEquals(17.1689189, budget.effectiveDegreesOfFreedom(), 5e-8),
                // NIST TN 1297 Table B.1 (= GUM Table G.2) row 17, 95.45 %: 2.16; exact 2.158260 [X]
                () -> assertEquals(2.16, budget.coverageFactor(), 0.005),
                () -> assertEquals(2.158260, budget.coverageFactor(), 5e-7),
                () -> assertEquals(0.0378773, budget.expandedUncertainty(), 5e-8));
    }

    @Test
    void fullBudgetOfACalibrationPoint() {
        // REFERENCE.md A5 full budget [X]: Type A of the readings; resolution 0.01 (GUM F.2.2.1); certificate
        // U = 0.030, k = 2 (GUM 4.3.3); temperature rectangular a = 0.02 (GUM 4.3.7)
        UncertaintyBudget budget = UncertaintyBudget.builder()
                .typeA("repeatability", READINGS)
                .resolution("readout resolution", 0.01)
                .expanded("reference certificate", 0.030, 2)
                .rectangular("temperature", 0.02)
                .evaluate(P_K2);
        List<UncertaintyContribution> lines = budget.contributions();
        assertAll(
                () -> assertEquals(0.00687184271, lines.get(0).standardUncertainty(), 5e-12),
                () -> assertEquals(0.00288675135, lines.get(1).standardUncertainty(), 5e-12),
                () -> assertEquals(0.015, lines.get(2).standardUncertainty(), 1e-15),
                () -> assertEquals(0.0115470054, lines.get(3).standardUncertainty(), 5e-11),
                () -> assertEquals(UncertaintyContribution.Basis.TYPE_A, lines.get(0).basis()),
                () -> assertEquals(UncertaintyContribution.Basis.EXPANDED, lines.get(2).basis()),
                () -> assertEquals(0.0203442594, budget.combinedStandardUncertainty(), 5e-11),
                () -> assertEquals(691.38, budget.effectiveDegreesOfFreedom(), 0.005),
                () -> assertEquals(2.0036, budget.coverageFactor(), 5e-5),
                () -> assertEquals(0.04076, budget.expandedUncertainty(), 5e-6));
    }

    @Test
    void gumExampleG41() {
        // GUM G.4.1 Example, inputs from memory (REFERENCE.md §3.1 [M, arithmetic checked]): Y = bX1X2X3, relative
        // standard uncertainties 0.25 %, 0.57 %, 0.82 % with ν = 9, 4, 14. The GUM prints u_c,rel = 1.03 %,
        // ν_eff = 19.0 and U_95,rel = 2.2 %. Arithmetic re-done here independently: √(0.25² + 0.57² + 0.82²)
        // = 1.029466 and ν_eff = 1.029466⁴/(0.25⁴/9 + 0.57⁴/4 + 0.82⁴/14) = 18.999 (19.0 with the rounded 1.03).
        UncertaintyBudget budget = UncertaintyBudget.builder()
                .standard("X1", 0.25, 9).standard("X2", 0.57, 4).standard("X3", 0.82, 14)
                .evaluate(0.95);
        double expectedNuEff = Math.pow(0.25 * 0.25 + 0.57 * 0.57 + 0.82 * 0.82, 2)
                / (Math.pow(0.25, 4) / 9 + Math.pow(0.57, 4) / 4 + Math.pow(0.82, 4) / 14);
        assertAll(
                () -> assertEquals(1.03, budget.combinedStandardUncertainty(), 0.005),
                () -> assertEquals(1.029466, budget.combinedStandardUncertainty(), 5e-7),
                () -> assertEquals(19.0, budget.effectiveDegreesOfFreedom(), 0.05),
                () -> assertEquals(expectedNuEff, budget.effectiveDegreesOfFreedom(), 1e-12),
                // unrounded ν_eff 18.999 truncates to 18 (GUM G.4.1 Note 1): t_95(18) = 2.10 (GUM Table G.2
                // row 18 from memory; 2.100922 recomputed), so U differs from the GUM's t_95(19) = 2.09 only in the
                // third digit and still rounds to the GUM's 2.2 %
                () -> assertEquals(2.10, budget.coverageFactor(), 0.005),
                () -> assertEquals(2.2, budget.expandedUncertainty(), 0.05));
    }

    @Test
    void allInfiniteDegreesOfFreedomGiveTheNormalCoverageFactor() {
        // GUM G.6.6; k at 95 % from GUM Table G.2 row ∞: 1.960
        UncertaintyBudget budget = UncertaintyBudget.builder()
                .rectangular("a", 0.1).expanded("b", 0.2, 2).evaluate(0.95);
        assertTrue(budget.hasInfiniteDegreesOfFreedom());
        assertEquals(1.960, budget.coverageFactor(), 5e-4);
        assertEquals(Math.hypot(0.1 / Math.sqrt(3), 0.1), budget.combinedStandardUncertainty(), 1e-15);
    }

    @Test
    void sensitivityCoefficientsEnterAsTheirMagnitude() {
        // GUM 5.1.3: u_i(y) = |c_i| u(x_i)
        UncertaintyBudget budget = UncertaintyBudget.builder()
                .standard("temperature", 0.5).sensitivity(-0.04)
                .standard("pressure", 0.01).sensitivity(3.0)
                .evaluate(0.95);
        assertEquals(0.02, budget.contributions().get(0).contribution(), 1e-15);
        assertEquals(0.03, budget.contributions().get(1).contribution(), 1e-15);
        assertEquals(Math.hypot(0.02, 0.03), budget.combinedStandardUncertainty(), 1e-15);
        assertEquals(-0.04, budget.contributions().get(0).sensitivityCoefficient());
    }

    @Test
    void aSingleContributionKeepsItsOwnDegreesOfFreedom() {
        UncertaintyBudget budget = UncertaintyBudget.builder().standard("only", 0.3, 9).evaluate(0.95);
        assertEquals(9.0, budget.effectiveDegreesOfFreedom());
        // GUM Table G.2, ν = 9, 95 %: 2.26 (row from memory; 2.262157 recomputed)
        assertEquals(2.26, budget.coverageFactor(), 0.005);
    }

    @Test
    void zeroUncertaintyGivesZeroAndInfiniteDegreesOfFreedom() {
        UncertaintyBudget budget = UncertaintyBudget.builder()
                .standard("a", 0.0, 3).rectangular("b", 0.0).evaluate(0.95);
        assertEquals(0.0, budget.combinedStandardUncertainty());
        assertEquals(0.0, budget.expandedUncertainty());
        assertTrue(budget.hasInfiniteDegreesOfFreedom());
    }

    @Test
    void contributionsFarFromOneDoNotUnderflow() {
        // u⁴ of 1e-90 underflows in double; the ratio form of G.2b must not
        UncertaintyBudget budget = UncertaintyBudget.builder()
                .standard("a", 1e-90, 4).standard("b", 1e-90, 4).evaluate(0.95);
        assertEquals(8.0, budget.effectiveDegreesOfFreedom(), 1e-12);
        assertEquals(Math.sqrt(2) * 1e-90, budget.combinedStandardUncertainty(), 1e-104);
    }

    @Test
    void identicalReadingsGiveZeroTypeA() {
        TypeAEvaluation a = TypeAEvaluation.of(5.0, 5.0, 5.0);
        assertEquals(0.0, a.standardUncertainty());
        assertEquals(2.0, a.degreesOfFreedom());
    }

    @Test
    void aSingleReadingCannotBeEvaluated() {
        assertThrows(UnevaluableException.class, () -> TypeAEvaluation.of(1.0));
    }

    @ParameterizedTest
    @ValueSource(doubles = {Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY})
    void rejectsNonFiniteReadings(double bad) {
        assertThrows(IllegalArgumentException.class, () -> TypeAEvaluation.of(1.0, bad, 2.0));
    }

    @Test
    void rejectsMalformedInput() {
        assertAll(
                () -> assertThrows(IllegalArgumentException.class, () -> TypeAEvaluation.of()),
                () -> assertThrows(IllegalArgumentException.class, () -> UncertaintyBudget.builder().evaluate(0.95)),
                () -> assertThrows(IllegalArgumentException.class,
                        () -> UncertaintyBudget.builder().standard("a", 0.1).evaluate(1.0)),
                () -> assertThrows(IllegalArgumentException.class,
                        () -> UncertaintyBudget.builder().standard("a", 0.1).evaluate(Double.NaN)),
                () -> assertThrows(IllegalArgumentException.class, () -> UncertaintyBudget.builder().standard(" ", 0.1)),
                () -> assertThrows(IllegalArgumentException.class, () -> UncertaintyBudget.builder().standard("a", -0.1)),
                () -> assertThrows(IllegalArgumentException.class,
                        () -> UncertaintyBudget.builder().standard("a", Double.NaN)),
                () -> assertThrows(IllegalArgumentException.class,
                        () -> UncertaintyBudget.builder().standard("a", Double.POSITIVE_INFINITY)),
                () -> assertThrows(IllegalArgumentException.class, () -> UncertaintyBudget.builder().standard("a", 0.1, 0.5)),
                () -> assertThrows(IllegalArgumentException.class,
                        () -> UncertaintyBudget.builder().standard("a", 0.1, Double.NaN)),
                () -> assertThrows(IllegalArgumentException.class, () -> UncertaintyBudget.builder().rectangular("a", -1)),
                () -> assertThrows(IllegalArgumentException.class, () -> UncertaintyBudget.builder().expanded("a", 0.1, 0)),
                () -> assertThrows(IllegalArgumentException.class,
                        () -> UncertaintyBudget.builder().expanded("a", Double.NaN, 2)),
                () -> assertThrows(IllegalArgumentException.class,
                        () -> UncertaintyBudget.builder().standard("a", 0.1).sensitivity(Double.NaN)),
                () -> assertThrows(IllegalStateException.class, () -> UncertaintyBudget.builder().sensitivity(2.0)));
    }

    @ParameterizedTest
    @EnumSource(Distribution.class)
    void halfWidthOfZeroGivesZero(Distribution distribution) {
        assertEquals(0.0, distribution.standardUncertainty(0.0));
    }
}
