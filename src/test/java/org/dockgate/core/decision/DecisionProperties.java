package org.dockgate.core.decision;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.dockgate.core.PropertyCheck.forAll;
import org.dockgate.core.PropertyCheck;
import org.junit.jupiter.api.Test;


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

    private static DecisionPolicy policy(PropertyCheck.Gen g) {
        return switch (g.ints(0, 3)) {
            case 0 -> DecisionPolicy.simpleAcceptance();
            case 1 -> DecisionPolicy.nonBinary();
            case 2 -> DecisionPolicy.guardBanded(g.doubles(0.0, 3.0, 3));
            default -> DecisionPolicy.riskBased(g.doubles(0.001, 0.3, 4));
        };
    }

    /**
     * Moving the measured value away from the tolerance centre (two-sided) or towards and past the limit
     * (one-sided) never improves the verdict, under every rule.
     */
    @Test
    void verdictsAreMonotonicInTheMeasuredValue() {
        forAll(3000, g -> {
            DecisionPolicy policy = policy(g);
            int shape = g.ints(0, 2);
            double lower = g.doubles(-100, 100, 3);
            double width = g.doubles(0.01, 50, 3);
            double expanded = g.doubles(0, 60, 3);
            double k = g.doubles(1, 3, 2);
            double measured = g.doubles(-200, 200, 4);
            double step = g.doubles(0, 100, 4);
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
        });
    }

    @Test
    void probabilityOfConformanceIsAProbability() {
        forAll(1000, g -> {
            int shape = g.ints(0, 2);
            double lower = g.doubles(-100, 100, 3);
            double width = g.doubles(0.01, 50, 3);
            double standardUncertainty = g.doubles(0, 60, 4);
            double measured = g.doubles(-1e6, 1e6, 3);
            double pc = ConformanceProbability.of(measured, tolerance(shape, lower, width), standardUncertainty);
            assertTrue(pc >= 0.0 && pc <= 1.0, () -> "p_c = " + pc);
        });
    }

    @Test
    void acceptanceLimitsLieInsideTheTolerance() {
        forAll(1000, g -> {
            DecisionPolicy policy = policy(g);
            int shape = g.ints(0, 2);
            double lower = g.doubles(-100, 100, 3);
            double width = g.doubles(0.01, 50, 3);
            double expanded = g.doubles(0, 60, 3);
            Tolerance tolerance = tolerance(shape, lower, width);
            AcceptanceLimits limits = policy.acceptanceLimits(tolerance, ExpandedUncertainty.of(expanded, 2.0));
            limits.lower().ifPresent(a -> assertTrue(a >= tolerance.lower().getAsDouble()));
            limits.upper().ifPresent(a -> assertTrue(a <= tolerance.upper().getAsDouble()));
        });
    }

    @Test
    void riskBasedLimitsAreWhereTheProbabilityIsOneLessAlpha() {
        forAll(1000, g -> {
            double alpha = g.doubles(0.001, 0.3, 4);
            int shape = g.ints(0, 2);
            double lower = g.doubles(-100, 100, 3);
            double width = g.doubles(0.01, 50, 3);
            double expanded = g.doubles(0.001, 60, 3);
            // JCGM 106:2012: the acceptance limits solve p_c(A) = 1 − α
            Tolerance tolerance = tolerance(shape, lower, width);
            ExpandedUncertainty u = ExpandedUncertainty.of(expanded, 2.0);
            AcceptanceLimits limits = DecisionPolicy.riskBased(alpha).acceptanceLimits(tolerance, u);
            limits.upper().ifPresent(a -> assertEquals(1 - alpha,
                    ConformanceProbability.of(a, tolerance, u.standardUncertainty()), 1e-9));
            limits.lower().ifPresent(a -> assertEquals(1 - alpha,
                    ConformanceProbability.of(a, tolerance, u.standardUncertainty()), 1e-9));
        });
    }

    @Test
    void nonBinaryConformsExactlyInsideTheTolerance() {
        forAll(1000, g -> {
            int shape = g.ints(0, 2);
            double lower = g.doubles(-100, 100, 3);
            double width = g.doubles(0.01, 50, 3);
            double expanded = g.doubles(0, 60, 3);
            double measured = g.doubles(-200, 200, 4);
            Tolerance tolerance = tolerance(shape, lower, width);
            Verdict verdict = DecisionPolicy.nonBinary().decide(measured, tolerance, ExpandedUncertainty.of(expanded, 2))
                    .verdict();
            assertEquals(tolerance.contains(measured), verdict.isConforming());
        });
    }

    @Test
    void aGuardBandedPassIsAlsoASimplePass() {
        forAll(1000, g -> {
            double r = g.doubles(0, 3, 3);
            int shape = g.ints(0, 2);
            double lower = g.doubles(-100, 100, 3);
            double width = g.doubles(0.01, 50, 3);
            double expanded = g.doubles(0, 60, 3);
            double measured = g.doubles(-200, 200, 4);
            Tolerance tolerance = tolerance(shape, lower, width);
            ExpandedUncertainty u = ExpandedUncertainty.of(expanded, 2);
            if (DecisionPolicy.guardBanded(r).decide(measured, tolerance, u).verdict() == Verdict.PASS) {
                assertEquals(Verdict.PASS, DecisionPolicy.simpleAcceptance().decide(measured, tolerance, u).verdict());
            }
        });
    }
}
