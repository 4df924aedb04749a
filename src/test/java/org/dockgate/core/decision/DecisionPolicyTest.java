package org.dockgate.core.decision;

import static org.dockgate.core.decision.Verdict.CONDITIONAL_FAIL;
import static org.dockgate.core.decision.Verdict.CONDITIONAL_PASS;
import static org.dockgate.core.decision.Verdict.FAIL;
import static org.dockgate.core.decision.Verdict.PASS;
import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.params.provider.ValueSource;

class DecisionPolicyTest {

    /** REFERENCE.md A6: tolerance ±1.0, U = 0.25 with k = 2 (u = 0.125). */
    private static final Tolerance PLUS_MINUS_ONE = Tolerance.between(-1.0, 1.0);
    private static final ExpandedUncertainty U = ExpandedUncertainty.of(0.25, 2.0);

    /**
     * ILAC G8:09/2019 §4.2.1–4.2.3 with w = U, verdicts as worked in REFERENCE.md A6 [C: rule; X: numbers]. The
     * rows marked "boundary" follow Dockgate's documented convention (limits inclusive, each boundary in the
     * better zone), which ILAC leaves open.
     */
    static Stream<Arguments> ilacG8Verdicts() {
        return Stream.of(
                Arguments.of(DecisionRule.GUARD_BANDED, 0.70, PASS),
                Arguments.of(DecisionRule.GUARD_BANDED, 0.80, FAIL),
                Arguments.of(DecisionRule.GUARD_BANDED, -0.60, PASS),
                Arguments.of(DecisionRule.GUARD_BANDED, -0.90, FAIL),
                Arguments.of(DecisionRule.GUARD_BANDED, 0.75, PASS), // boundary
                Arguments.of(DecisionRule.GUARD_BANDED, -0.75, PASS), // boundary
                Arguments.of(DecisionRule.NON_BINARY, 0.70, PASS),
                Arguments.of(DecisionRule.NON_BINARY, 0.80, CONDITIONAL_PASS),
                Arguments.of(DecisionRule.NON_BINARY, 0.95, CONDITIONAL_PASS),
                Arguments.of(DecisionRule.NON_BINARY, 1.10, CONDITIONAL_FAIL),
                Arguments.of(DecisionRule.NON_BINARY, 1.30, FAIL),
                Arguments.of(DecisionRule.NON_BINARY, -1.20, CONDITIONAL_FAIL),
                Arguments.of(DecisionRule.NON_BINARY, -1.26, FAIL),
                Arguments.of(DecisionRule.NON_BINARY, 0.75, PASS), // boundary
                Arguments.of(DecisionRule.NON_BINARY, -0.75, PASS), // boundary
                Arguments.of(DecisionRule.NON_BINARY, 1.00, CONDITIONAL_PASS), // boundary
                Arguments.of(DecisionRule.NON_BINARY, -1.00, CONDITIONAL_PASS), // boundary
                Arguments.of(DecisionRule.NON_BINARY, 1.25, CONDITIONAL_FAIL), // boundary
                Arguments.of(DecisionRule.NON_BINARY, -1.25, CONDITIONAL_FAIL), // boundary
                Arguments.of(DecisionRule.SIMPLE_ACCEPTANCE, 0.99, PASS),
                Arguments.of(DecisionRule.SIMPLE_ACCEPTANCE, 1.01, FAIL),
                Arguments.of(DecisionRule.SIMPLE_ACCEPTANCE, 1.00, PASS), // boundary
                Arguments.of(DecisionRule.SIMPLE_ACCEPTANCE, -1.00, PASS)); // boundary
    }

    @ParameterizedTest(name = "ILAC G8 {0}, y = {1} -> {2}")
    @MethodSource("ilacG8Verdicts")
    void ilacG8Verdicts(DecisionRule rule, double measured, Verdict expected) {
        assertEquals(expected, DecisionPolicy.of(rule).decide(measured, PLUS_MINUS_ONE, U).verdict());
    }

    @Test
    void ilacG8AcceptanceLimitsAndTestUncertaintyRatio() {
        // ILAC G8:09/2019 §4.1 (w = TL − AL) with w = U: AL = ±0.75; TUR = 2.0/(2·0.25) = 4 (REFERENCE.md A6)
        AcceptanceLimits limits = DecisionPolicy.guardBanded(1.0).acceptanceLimits(PLUS_MINUS_ONE, U);
        assertAll(
                () -> assertEquals(-0.75, limits.lower().getAsDouble(), 1e-15),
                () -> assertEquals(0.75, limits.upper().getAsDouble(), 1e-15),
                () -> assertFalse(limits.empty()),
                () -> assertEquals(4.0, limits.testUncertaintyRatio().getAsDouble(), 1e-15),
                () -> assertTrue(limits.turAdequate()));
        AcceptanceLimits simple = DecisionPolicy.simpleAcceptance().acceptanceLimits(PLUS_MINUS_ONE, U);
        assertEquals(-1.0, simple.lower().getAsDouble());
        assertEquals(1.0, simple.upper().getAsDouble());
    }

    @ParameterizedTest(name = "JCGM 106 p_c at y = {0}")
    @CsvSource({
        // REFERENCE.md A6 [X]: p_c = Φ((1 − y)/0.125) − Φ((−1 − y)/0.125), JCGM 106:2012 normal PDF
        "0.75, 0.977249868",
        "0.90, 0.788144601",
        "1.00, 0.500000000",
        "-0.80, 0.945200708"})
    void jcgm106ConformanceProbability(double measured, double expected) {
        // printed to 9 decimals: tolerance half a unit of the last digit
        assertEquals(expected, ConformanceProbability.of(measured, PLUS_MINUS_ONE, 0.125), 5e-10);
        assertEquals(expected, DecisionPolicy.simpleAcceptance().decide(measured, PLUS_MINUS_ONE, U)
                .probabilityOfConformance(), 5e-10);
    }

    @Test
    void conformanceProbabilityAtTheCentreIsOneLessTwoTails() {
        // REFERENCE.md A6 [X]: 1 − 2Φ(−8) = 1 − 1.24e-15
        assertEquals(1.0, ConformanceProbability.of(0.0, PLUS_MINUS_ONE, 0.125), 2e-15);
    }

    @Test
    void conformanceProbabilityFarBelowTheLowerLimitKeepsItsTail() {
        // Φ(−8) − Φ(−24) = 6.22096057e-16 (Φ(−8) from any normal table, e.g. Abramowitz & Stegun 26.2); a
        // naive Φ(24) − Φ(8) would give 0 or 1.1e-16
        assertEquals(6.22096057e-16, ConformanceProbability.of(-2.0, PLUS_MINUS_ONE, 0.125), 1e-24);
    }

    @ParameterizedTest(name = "ILAC G8 guard band r = {0}: specific risk at AL {1}")
    @CsvSource({
        // REFERENCE.md §4.1 / A6 [X]: one-sided specific false-accept risk at AL = T_U − r·U, U = 2u: 1 − Φ(2r).
        // ILAC G8:09/2019 names r = 1 the "2σ" rule (< 2.5 %), r = 1.5 "3σ", r = 0.83 ISO 14253-1 (from memory)
        "0.0, 0.5",
        "0.83, 0.0484572263",
        "1.0, 0.0227501319",
        "1.5, 0.0013498980"})
    void guardBandSpecificRiskAtTheAcceptanceLimit(double r, double risk) {
        Tolerance upperOnly = Tolerance.atMost(1.0);
        AcceptanceLimits limits = DecisionPolicy.guardBanded(r).acceptanceLimits(upperOnly, U);
        double pc = ConformanceProbability.of(limits.upper().getAsDouble(), upperOnly, U.standardUncertainty());
        assertEquals(risk, 1.0 - pc, 5e-11);
    }

    @Test
    void riskBasedOneSidedLimitInClosedForm() {
        // JCGM 106:2012, single upper limit: Φ((T_U − A_U)/u) = 1 − α → A_U = T_U − u·z_0.975;
        // z_0.975 = 1.959963985 (REFERENCE.md §7.4), so A_U = 1 − 0.125 × 1.959963985 = 0.755004502
        AcceptanceLimits limits = DecisionPolicy.riskBased(0.025).acceptanceLimits(Tolerance.atMost(1.0), U);
        assertEquals(0.755004502, limits.upper().getAsDouble(), 1e-9);
        assertTrue(limits.lower().isEmpty());
        assertTrue(limits.testUncertaintyRatio().isEmpty(), "TUR is not defined for a one-sided tolerance");
        assertFalse(limits.turAdequate());
        AcceptanceLimits lowerOnly = DecisionPolicy.riskBased(0.025).acceptanceLimits(Tolerance.atLeast(-1.0), U);
        assertEquals(-0.755004502, lowerOnly.lower().getAsDouble(), 1e-9);
    }

    @Test
    void riskBasedTwoSidedLimitsAreSymmetricAndWhereTheProbabilityIsOneLessAlpha() {
        AcceptanceLimits limits = DecisionPolicy.riskBased(0.025).acceptanceLimits(PLUS_MINUS_ONE, U);
        double upper = limits.upper().getAsDouble();
        // the far tail Φ(−(2 − 0.245)/0.125) ≈ 1e-44 is negligible: same as the one-sided closed form
        assertEquals(0.755004502, upper, 1e-9);
        assertEquals(-upper, limits.lower().getAsDouble(), 1e-15);
        assertEquals(0.975, ConformanceProbability.of(upper, PLUS_MINUS_ONE, 0.125), 1e-13);
    }

    @Test
    void riskBasedTwoSidedLimitsWhenBothTailsMatter() {
        // narrow tolerance ±0.25 with u = 0.1: p_c(A_U) = 0.975 must count both tails (JCGM 106:2012)
        Tolerance narrow = Tolerance.between(-0.25, 0.25);
        ExpandedUncertainty wide = ExpandedUncertainty.of(0.2, 2.0);
        AcceptanceLimits limits = DecisionPolicy.riskBased(0.025).acceptanceLimits(narrow, wide);
        double upper = limits.upper().getAsDouble();
        assertEquals(0.975, ConformanceProbability.of(upper, narrow, 0.1), 1e-13);
        assertTrue(upper > 0 && upper < 0.25 - 0.1 * 1.959963985 + 1e-6);
    }

    @Test
    void riskBasedVerdicts() {
        DecisionPolicy policy = DecisionPolicy.of(DecisionRule.RISK_BASED);
        // p_c(0.75) = 0.977 ≥ 0.975 (REFERENCE.md A6) → PASS; p_c(0.76) = Φ(1.92) = 0.9726 < 0.975 → FAIL
        assertEquals(PASS, policy.decide(0.75, PLUS_MINUS_ONE, U).verdict());
        assertEquals(FAIL, policy.decide(0.76, PLUS_MINUS_ONE, U).verdict());
        assertEquals(FAIL, policy.decide(-0.90, PLUS_MINUS_ONE, U).verdict());
        double limit = policy.acceptanceLimits(PLUS_MINUS_ONE, U).upper().getAsDouble();
        assertEquals(PASS, policy.decide(limit, PLUS_MINUS_ONE, U).verdict(), "limits are inclusive");
    }

    @ParameterizedTest
    @EnumSource(DecisionRule.class)
    void zeroUncertaintyIsSimpleAcceptanceForEveryRule(DecisionRule rule) {
        ExpandedUncertainty none = ExpandedUncertainty.of(0.0, 2.0);
        DecisionPolicy policy = DecisionPolicy.of(rule);
        Decision atLimit = policy.decide(1.0, PLUS_MINUS_ONE, none);
        assertEquals(PASS, atLimit.verdict());
        assertEquals(1.0, atLimit.probabilityOfConformance());
        assertEquals(1.0, atLimit.acceptanceUpper().getAsDouble());
        assertEquals(Double.POSITIVE_INFINITY, atLimit.testUncertaintyRatio().getAsDouble());
        assertTrue(atLimit.turAdequate());
        Decision outside = policy.decide(1.0000001, PLUS_MINUS_ONE, none);
        assertEquals(FAIL, outside.verdict());
        assertEquals(0.0, outside.probabilityOfConformance());
    }

    @Test
    void guardBandThatSwallowsTheZoneAcceptsNothing() {
        // U = 1.2 > half of the tolerance (1.0): A_L = 0.2 > A_U = −0.2
        ExpandedUncertainty large = ExpandedUncertainty.of(1.2, 2.0);
        Decision guarded = DecisionPolicy.guardBanded(1.0).decide(0.0, PLUS_MINUS_ONE, large);
        assertEquals(FAIL, guarded.verdict());
        assertTrue(guarded.acceptanceLower().isEmpty() && guarded.acceptanceUpper().isEmpty());
        assertEquals(2.0 / 2.4, guarded.testUncertaintyRatio().getAsDouble(), 1e-15);
        assertFalse(guarded.turAdequate());
        assertTrue(DecisionPolicy.guardBanded(1.0).acceptanceLimits(PLUS_MINUS_ONE, large).empty());

        DecisionPolicy nonBinary = DecisionPolicy.nonBinary();
        assertEquals(CONDITIONAL_PASS, nonBinary.decide(0.0, PLUS_MINUS_ONE, large).verdict());
        assertEquals(CONDITIONAL_FAIL, nonBinary.decide(1.5, PLUS_MINUS_ONE, large).verdict());
        assertEquals(FAIL, nonBinary.decide(2.3, PLUS_MINUS_ONE, large).verdict());

        // risk-based: p_c at the centre = 2Φ(1/0.6) − 1 = 0.904 < 0.975, no value qualifies
        Decision risk = DecisionPolicy.riskBased(0.025).decide(0.0, PLUS_MINUS_ONE, large);
        assertEquals(FAIL, risk.verdict());
        assertTrue(risk.acceptanceLower().isEmpty() && risk.acceptanceUpper().isEmpty());
        assertEquals(0.904419, risk.probabilityOfConformance(), 5e-7); // 2Φ(5/3) − 1, recomputed
    }

    @Test
    void guardBandOfExactlyHalfTheToleranceLeavesOnlyTheCentre() {
        ExpandedUncertainty half = ExpandedUncertainty.of(1.0, 2.0);
        AcceptanceLimits limits = DecisionPolicy.guardBanded(1.0).acceptanceLimits(PLUS_MINUS_ONE, half);
        assertEquals(0.0, limits.lower().getAsDouble());
        assertEquals(0.0, limits.upper().getAsDouble());
        assertEquals(PASS, DecisionPolicy.guardBanded(1.0).decide(0.0, PLUS_MINUS_ONE, half).verdict());
        assertEquals(FAIL, DecisionPolicy.guardBanded(1.0).decide(1e-9, PLUS_MINUS_ONE, half).verdict());
    }

    @Test
    void oneSidedToleranceHasNoRatio() {
        Decision decision = DecisionPolicy.nonBinary().decide(9.0, Tolerance.atMost(10.0), ExpandedUncertainty.of(0.5, 2));
        assertEquals(PASS, decision.verdict());
        assertTrue(decision.acceptanceLower().isEmpty());
        assertEquals(9.5, decision.acceptanceUpper().getAsDouble());
        assertTrue(decision.testUncertaintyRatio().isEmpty());
        assertFalse(decision.turAdequate());
        assertEquals(CONDITIONAL_PASS,
                DecisionPolicy.nonBinary().decide(9.8, Tolerance.atMost(10.0), ExpandedUncertainty.of(0.5, 2)).verdict());
        assertEquals(PASS,
                DecisionPolicy.nonBinary().decide(-1e6, Tolerance.atMost(10.0), ExpandedUncertainty.of(0.5, 2)).verdict());
    }

    @ParameterizedTest(name = "TUR {0}:1 adequate = {1}")
    @CsvSource({"4.0, true", "3.99, false", "10, true", "1, false"})
    void testUncertaintyRatioThreshold(double tur, boolean adequate) {
        // 4:1 common practice; ANSI/NCSL Z540.3-2006 §5.3 fallback (from memory, REFERENCE.md §4.5)
        ExpandedUncertainty u = ExpandedUncertainty.of(1.0 / tur, 2.0);
        AcceptanceLimits limits = DecisionPolicy.simpleAcceptance().acceptanceLimits(PLUS_MINUS_ONE, u);
        assertEquals(tur, limits.testUncertaintyRatio().getAsDouble(), 1e-12);
        assertEquals(adequate, limits.turAdequate());
    }

    @ParameterizedTest
    @ValueSource(doubles = {Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY})
    void rejectsNonFiniteInput(double bad) {
        DecisionPolicy policy = DecisionPolicy.nonBinary();
        assertAll(
                () -> assertThrows(IllegalArgumentException.class, () -> policy.decide(bad, PLUS_MINUS_ONE, U)),
                () -> assertThrows(IllegalArgumentException.class, () -> ExpandedUncertainty.of(bad, 2)),
                () -> assertThrows(IllegalArgumentException.class, () -> ExpandedUncertainty.of(0.1, bad)),
                () -> assertThrows(IllegalArgumentException.class, () -> Tolerance.between(bad, 1.0)),
                () -> assertThrows(IllegalArgumentException.class, () -> Tolerance.atMost(bad)),
                () -> assertThrows(IllegalArgumentException.class, () -> DecisionPolicy.guardBanded(bad)),
                () -> assertThrows(IllegalArgumentException.class, () -> DecisionPolicy.riskBased(bad)),
                () -> assertThrows(IllegalArgumentException.class,
                        () -> ConformanceProbability.of(0.0, PLUS_MINUS_ONE, bad)));
    }

    @Test
    void rejectsMalformedParameters() {
        assertAll(
                () -> assertThrows(IllegalArgumentException.class, () -> Tolerance.of(null, null)),
                () -> assertThrows(IllegalArgumentException.class, () -> Tolerance.between(1.0, 1.0)),
                () -> assertThrows(IllegalArgumentException.class, () -> Tolerance.between(2.0, 1.0)),
                () -> assertThrows(IllegalArgumentException.class, () -> ExpandedUncertainty.of(-0.1, 2)),
                () -> assertThrows(IllegalArgumentException.class, () -> ExpandedUncertainty.of(0.1, 0)),
                () -> assertThrows(IllegalArgumentException.class, () -> DecisionPolicy.guardBanded(-0.5)),
                () -> assertThrows(IllegalArgumentException.class, () -> DecisionPolicy.riskBased(0.0)),
                () -> assertThrows(IllegalArgumentException.class, () -> DecisionPolicy.riskBased(0.5)));
    }
}
