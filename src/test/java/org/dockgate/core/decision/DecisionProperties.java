package org.dockgate.core.decision;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Scale;

/** Properties every decision rule must have, whatever its parameters. */
class DecisionProperties {

    /** 0 two-sided, 1 upper limit only, 2 lower limit only. */
    private static Tolerance tolerance(int shape, double lower, double width) {
        return switch (shape) {
            case 0 -> Tolerance.between(lower, lower + width);
            case 1 -> Tolerance.atMost(lower + width);
            default -> Tolerance.atLeast(lower);
        };
    }

    @Provide
    Arbitrary<DecisionPolicy> policies() {
        return Arbitraries.oneOf(
                Arbitraries.just(DecisionPolicy.simpleAcceptance()),
                Arbitraries.just(DecisionPolicy.nonBinary()),
                Arbitraries.doubles().between(0.0, 3.0).ofScale(3).map(DecisionPolicy::guardBanded),
                Arbitraries.doubles().between(0.001, 0.3).ofScale(4).map(DecisionPolicy::riskBased));
    }

    /**
     * Moving the measured value away from the tolerance centre (two-sided) or towards and past the limit
     * (one-sided) never improves the verdict, under every rule.
     */
    @Property(tries = 3000)
    void verdictsAreMonotonicInTheMeasuredValue(@ForAll("policies") DecisionPolicy policy,
            @ForAll @IntRange(min = 0, max = 2) int shape,
            @ForAll @DoubleRange(min = -100, max = 100) @Scale(3) double lower,
            @ForAll @DoubleRange(min = 0.01, max = 50) @Scale(3) double width,
            @ForAll @DoubleRange(min = 0, max = 60) @Scale(3) double expanded,
            @ForAll @DoubleRange(min = 1, max = 3) @Scale(2) double k,
            @ForAll @DoubleRange(min = -200, max = 200) @Scale(4) double measured,
            @ForAll @DoubleRange(min = 0, max = 100) @Scale(4) double step) {
        Tolerance tolerance = tolerance(shape, lower, width);
        ExpandedUncertainty u = ExpandedUncertainty.of(expanded, k);
        double direction = switch (shape) {
            case 0 -> measured >= tolerance.centre().getAsDouble() ? 1.0 : -1.0;
            case 1 -> 1.0;
            default -> -1.0;
        };
        Verdict near = policy.decide(measured, tolerance, u).verdict();
        Verdict far = policy.decide(measured + direction * step, tolerance, u).verdict();
        assertTrue(far.ordinal() >= near.ordinal(), () -> policy + ": " + near + " at " + measured + " but " + far
                + " further out by " + step);
    }

    @Property
    void probabilityOfConformanceIsAProbability(@ForAll @IntRange(min = 0, max = 2) int shape,
            @ForAll @DoubleRange(min = -100, max = 100) @Scale(3) double lower,
            @ForAll @DoubleRange(min = 0.01, max = 50) @Scale(3) double width,
            @ForAll @DoubleRange(min = 0, max = 60) @Scale(4) double standardUncertainty,
            @ForAll @DoubleRange(min = -1e6, max = 1e6) @Scale(3) double measured) {
        double pc = ConformanceProbability.of(measured, tolerance(shape, lower, width), standardUncertainty);
        assertTrue(pc >= 0.0 && pc <= 1.0, () -> "p_c = " + pc);
    }

    @Property
    void acceptanceLimitsLieInsideTheTolerance(@ForAll("policies") DecisionPolicy policy,
            @ForAll @IntRange(min = 0, max = 2) int shape,
            @ForAll @DoubleRange(min = -100, max = 100) @Scale(3) double lower,
            @ForAll @DoubleRange(min = 0.01, max = 50) @Scale(3) double width,
            @ForAll @DoubleRange(min = 0, max = 60) @Scale(3) double expanded) {
        Tolerance tolerance = tolerance(shape, lower, width);
        AcceptanceLimits limits = policy.acceptanceLimits(tolerance, ExpandedUncertainty.of(expanded, 2.0));
        limits.lower().ifPresent(a -> assertTrue(a >= tolerance.lower().getAsDouble()));
        limits.upper().ifPresent(a -> assertTrue(a <= tolerance.upper().getAsDouble()));
    }

    @Property
    void riskBasedLimitsAreWhereTheProbabilityIsOneLessAlpha(
            @ForAll @DoubleRange(min = 0.001, max = 0.3) @Scale(4) double alpha,
            @ForAll @IntRange(min = 0, max = 2) int shape,
            @ForAll @DoubleRange(min = -100, max = 100) @Scale(3) double lower,
            @ForAll @DoubleRange(min = 0.01, max = 50) @Scale(3) double width,
            @ForAll @DoubleRange(min = 0.001, max = 60) @Scale(3) double expanded) {
        // JCGM 106:2012: the acceptance limits solve p_c(A) = 1 − α
        Tolerance tolerance = tolerance(shape, lower, width);
        ExpandedUncertainty u = ExpandedUncertainty.of(expanded, 2.0);
        AcceptanceLimits limits = DecisionPolicy.riskBased(alpha).acceptanceLimits(tolerance, u);
        limits.upper().ifPresent(a -> assertEquals(1 - alpha,
                ConformanceProbability.of(a, tolerance, u.standardUncertainty()), 1e-9));
        limits.lower().ifPresent(a -> assertEquals(1 - alpha,
                ConformanceProbability.of(a, tolerance, u.standardUncertainty()), 1e-9));
    }

    @Property
    void nonBinaryConformsExactlyInsideTheTolerance(@ForAll @IntRange(min = 0, max = 2) int shape,
            @ForAll @DoubleRange(min = -100, max = 100) @Scale(3) double lower,
            @ForAll @DoubleRange(min = 0.01, max = 50) @Scale(3) double width,
            @ForAll @DoubleRange(min = 0, max = 60) @Scale(3) double expanded,
            @ForAll @DoubleRange(min = -200, max = 200) @Scale(4) double measured) {
        Tolerance tolerance = tolerance(shape, lower, width);
        Verdict verdict = DecisionPolicy.nonBinary().decide(measured, tolerance, ExpandedUncertainty.of(expanded, 2))
                .verdict();
        assertEquals(tolerance.contains(measured), verdict.isConforming());
    }

    @Property
    void aGuardBandedPassIsAlsoASimplePass(@ForAll @DoubleRange(min = 0, max = 3) @Scale(3) double r,
            @ForAll @IntRange(min = 0, max = 2) int shape,
            @ForAll @DoubleRange(min = -100, max = 100) @Scale(3) double lower,
            @ForAll @DoubleRange(min = 0.01, max = 50) @Scale(3) double width,
            @ForAll @DoubleRange(min = 0, max = 60) @Scale(3) double expanded,
            @ForAll @DoubleRange(min = -200, max = 200) @Scale(4) double measured) {
        Tolerance tolerance = tolerance(shape, lower, width);
        ExpandedUncertainty u = ExpandedUncertainty.of(expanded, 2);
        if (DecisionPolicy.guardBanded(r).decide(measured, tolerance, u).verdict() == Verdict.PASS) {
            assertEquals(Verdict.PASS, DecisionPolicy.simpleAcceptance().decide(measured, tolerance, u).verdict());
        }
    }
}
