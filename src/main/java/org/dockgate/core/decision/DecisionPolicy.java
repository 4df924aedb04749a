package org.dockgate.core.decision;

import java.util.Objects;
import java.util.OptionalDouble;

import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.dockgate.core.InputChecks;

/**
 * A decision rule with its parameters: the guard-band factor r of {@link DecisionRule#GUARD_BANDED} and the
 * largest accepted specific false-accept risk α of {@link DecisionRule#RISK_BASED}. A parameter the rule does not
 * use is ignored (NON_BINARY always uses w = U, SIMPLE_ACCEPTANCE w = 0).
 *
 * <p>All limits are inclusive: a value on an acceptance limit passes, a value on a tolerance limit is inside the
 * tolerance, and under NON_BINARY a value exactly U outside a limit is CONDITIONAL_FAIL.
 *
 * @param rule               the rule
 * @param guardBandFactor    r ≥ 0, the guard band w = r·U of GUARD_BANDED (default 1)
 * @param maxFalseAcceptRisk α with 0 &lt; α &lt; 0.5 for RISK_BASED (default 0.025)
 */
public record DecisionPolicy(DecisionRule rule, double guardBandFactor, double maxFalseAcceptRisk) {

    /** r = 1: w = U (ILAC G8:09/2019, "2σ" rule for k = 2). */
    public static final double DEFAULT_GUARD_BAND_FACTOR = 1.0;

    /** α = 2.5 %: the one-sided tail beyond 1.96σ. */
    public static final double DEFAULT_MAX_FALSE_ACCEPT_RISK = 0.025;

    /** TUR of 4:1, the ratio common practice (and ANSI/NCSL Z540.3-2006 as its fallback) calls adequate. */
    public static final double ADEQUATE_TEST_UNCERTAINTY_RATIO = 4.0;

    /**
     * Validates the parameters.
     *
     * @throws IllegalArgumentException when r is negative or not finite, or α is not in (0, 0.5)
     */
    public DecisionPolicy {
        Objects.requireNonNull(rule, "rule");
        InputChecks.nonNegative("guardBandFactor", guardBandFactor);
        if (!(maxFalseAcceptRisk > 0.0 && maxFalseAcceptRisk < 0.5)) {
            throw new IllegalArgumentException(
                    "maxFalseAcceptRisk must lie strictly between 0 and 0.5, was " + maxFalseAcceptRisk);
        }
    }

    /** @return the rule with default parameters (r = 1, α = 0.025) */
    public static DecisionPolicy of(DecisionRule rule) {
        return new DecisionPolicy(rule, DEFAULT_GUARD_BAND_FACTOR, DEFAULT_MAX_FALSE_ACCEPT_RISK);
    }

    /** @return simple acceptance, w = 0 */
    public static DecisionPolicy simpleAcceptance() {
        return of(DecisionRule.SIMPLE_ACCEPTANCE);
    }

    /** @return a binary guard-banded rule with w = r·U */
    public static DecisionPolicy guardBanded(double guardBandFactor) {
        return new DecisionPolicy(DecisionRule.GUARD_BANDED, guardBandFactor, DEFAULT_MAX_FALSE_ACCEPT_RISK);
    }

    /** @return the non-binary rule with w = U */
    public static DecisionPolicy nonBinary() {
        return of(DecisionRule.NON_BINARY);
    }

    /** @return the risk-based rule with largest specific false-accept risk α */
    public static DecisionPolicy riskBased(double maxFalseAcceptRisk) {
        return new DecisionPolicy(DecisionRule.RISK_BASED, DEFAULT_GUARD_BAND_FACTOR, maxFalseAcceptRisk);
    }

    /**
     * The acceptance limits for a planned measurement, without a measured value — what a procedure prints before
     * anything is measured.
     *
     * <ul>
     * <li>SIMPLE_ACCEPTANCE: A = T (w = 0).</li>
     * <li>GUARD_BANDED: A_L = T_L + r·U, A_U = T_U − r·U (ILAC G8:09/2019 §4.1–4.2.2).</li>
     * <li>NON_BINARY: A_L = T_L + U, A_U = T_U − U, the limits of the PASS zone (§4.2.3).</li>
     * <li>RISK_BASED (JCGM 106:2012, u = U/k): the values of y where p_c = 1 − α. One-sided, closed form
     * A_U = T_U − u·z_{1−α}, A_L = T_L + u·z_{1−α}. Two-sided, p_c is symmetric about the centre m and falls
     * away from it, so A_U is the root of p_c(y) = 1 − α in [m, T_U] (Brent's method) and A_L = 2m − A_U; when
     * p_c(m) = 2Φ((T_U − T_L)/(2u)) − 1 &lt; 1 − α, no value qualifies and the zone is empty.</li>
     * </ul>
     * U = 0 gives the tolerance itself for every rule. A two-sided zone that the guard band crosses
     * (A_L &gt; A_U) is empty: nothing can PASS; under NON_BINARY every value inside the tolerance is then
     * CONDITIONAL_PASS. The test uncertainty ratio is TUR = (T_U − T_L)/(2U) (ANSI/NCSL Z540.3-2006), +∞ for
     * U = 0, absent for a one-sided tolerance; it is adequate at 4:1 or more (common practice).
     *
     * @param tolerance   the tolerance
     * @param uncertainty the expanded uncertainty the measurement is planned (or known) to have
     * @return the acceptance zone and TUR
     */
    public AcceptanceLimits acceptanceLimits(Tolerance tolerance, ExpandedUncertainty uncertainty) {
        Objects.requireNonNull(tolerance, "tolerance");
        Objects.requireNonNull(uncertainty, "uncertainty");
        OptionalDouble tur = testUncertaintyRatio(tolerance, uncertainty);
        boolean adequate = tur.isPresent() && tur.getAsDouble() >= ADEQUATE_TEST_UNCERTAINTY_RATIO;
        double u = uncertainty.standardUncertainty();
        double upperGuard;
        double lowerGuard;
        switch (rule) {
            case SIMPLE_ACCEPTANCE -> {
                upperGuard = 0.0;
                lowerGuard = 0.0;
            }
            case GUARD_BANDED -> {
                upperGuard = guardBandFactor * uncertainty.value();
                lowerGuard = upperGuard;
            }
            case NON_BINARY -> {
                upperGuard = uncertainty.value();
                lowerGuard = upperGuard;
            }
            case RISK_BASED -> {
                if (u == 0.0) {
                    upperGuard = 0.0;
                    lowerGuard = 0.0;
                } else if (tolerance.isTwoSided()) {
                    OptionalDouble upper = twoSidedRiskBasedUpperLimit(tolerance, u);
                    if (upper.isEmpty()) {
                        return new AcceptanceLimits(OptionalDouble.empty(), OptionalDouble.empty(), true, tur,
                                adequate);
                    }
                    // mirror image about the centre: p_c is symmetric there
                    upperGuard = tolerance.upper().getAsDouble() - upper.getAsDouble();
                    lowerGuard = upperGuard;
                } else {
                    upperGuard = u * ConformanceProbability.quantile(1.0 - maxFalseAcceptRisk);
                    lowerGuard = upperGuard;
                }
            }
            default -> throw new IllegalStateException("unhandled rule " + rule);
        }
        OptionalDouble lower = tolerance.lower().isPresent()
                ? OptionalDouble.of(tolerance.lower().getAsDouble() + lowerGuard) : OptionalDouble.empty();
        OptionalDouble upper = tolerance.upper().isPresent()
                ? OptionalDouble.of(tolerance.upper().getAsDouble() - upperGuard) : OptionalDouble.empty();
        if (lower.isPresent() && upper.isPresent() && lower.getAsDouble() > upper.getAsDouble()) {
            return new AcceptanceLimits(OptionalDouble.empty(), OptionalDouble.empty(), true, tur, adequate);
        }
        return new AcceptanceLimits(lower, upper, false, tur, adequate);
    }

    /**
     * Applies the rule to a measured value y (see {@link DecisionRule} for each rule's zones and
     * {@link #acceptanceLimits} for the limits). SIMPLE_ACCEPTANCE, GUARD_BANDED and RISK_BASED are binary:
     * PASS inside the acceptance limits, FAIL outside. RISK_BASED thus passes exactly when p_c ≥ 1 − α, to the
     * accuracy of the root (about 10⁻¹⁴ of the tolerance), and a value on the limit passes. NON_BINARY: PASS inside
     * the acceptance limits, CONDITIONAL_PASS elsewhere inside the tolerance, CONDITIONAL_FAIL within U outside it
     * (T_L − U ≤ y &lt; T_L or T_U &lt; y ≤ T_U + U), FAIL beyond.
     *
     * @param measured    y, finite
     * @param tolerance   the tolerance
     * @param uncertainty U and k of the measurement
     * @return the verdict with acceptance limits, p_c and TUR
     * @throws IllegalArgumentException when y is NaN or infinite
     */
    public Decision decide(double measured, Tolerance tolerance, ExpandedUncertainty uncertainty) {
        InputChecks.finite("measured", measured);
        AcceptanceLimits limits = acceptanceLimits(tolerance, uncertainty);
        double pc = ConformanceProbability.of(measured, tolerance, uncertainty.standardUncertainty());
        Verdict verdict;
        if (limits.contains(measured)) {
            verdict = Verdict.PASS;
        } else if (rule != DecisionRule.NON_BINARY) {
            verdict = Verdict.FAIL;
        } else if (tolerance.contains(measured)) {
            verdict = Verdict.CONDITIONAL_PASS;
        } else if (withinOutside(measured, tolerance, uncertainty.value())) {
            verdict = Verdict.CONDITIONAL_FAIL;
        } else {
            verdict = Verdict.FAIL;
        }
        return new Decision(verdict, limits.lower(), limits.upper(), pc, limits.testUncertaintyRatio(),
                limits.turAdequate());
    }

    /**
     * Test uncertainty ratio TUR = (T_U − T_L)/(2U) (ANSI/NCSL Z540.3-2006; for ±L, L/U). Defined only for a
     * two-sided tolerance: absent otherwise. +∞ when U = 0.
     *
     * @return TUR, absent for a one-sided tolerance
     */
    public static OptionalDouble testUncertaintyRatio(Tolerance tolerance, ExpandedUncertainty uncertainty) {
        Objects.requireNonNull(uncertainty, "uncertainty");
        OptionalDouble width = Objects.requireNonNull(tolerance, "tolerance").width();
        if (width.isEmpty()) {
            return OptionalDouble.empty();
        }
        return OptionalDouble.of(uncertainty.value() == 0.0 ? Double.POSITIVE_INFINITY
                : width.getAsDouble() / (2.0 * uncertainty.value()));
    }

    /** T_L − U ≤ y and y ≤ T_U + U for the limits that are given. */
    private static boolean withinOutside(double measured, Tolerance tolerance, double expanded) {
        return (tolerance.lower().isEmpty() || measured >= tolerance.lower().getAsDouble() - expanded)
                && (tolerance.upper().isEmpty() || measured <= tolerance.upper().getAsDouble() + expanded);
    }

    /** A_U for a two-sided tolerance under RISK_BASED, absent when even the centre has p_c &lt; 1 − α. */
    private OptionalDouble twoSidedRiskBasedUpperLimit(Tolerance tolerance, double u) {
        double target = 1.0 - maxFalseAcceptRisk;
        double centre = tolerance.centre().getAsDouble();
        double upperLimit = tolerance.upper().getAsDouble();
        double atCentre = ConformanceProbability.of(centre, tolerance, u) - target;
        if (atCentre < 0.0) {
            return OptionalDouble.empty();
        }
        if (atCentre == 0.0) {
            return OptionalDouble.of(centre);
        }
        // p_c(T_U) ≤ 1/2 < 1 − α, so [centre, T_U] brackets the root
        double scale = Math.max(Math.abs(upperLimit), Math.abs(tolerance.lower().getAsDouble()));
        BrentSolver solver = new BrentSolver(1.0e-15, Math.max(4.0 * Math.ulp(scale), Double.MIN_NORMAL));
        double root = solver.solve(200, y -> ConformanceProbability.of(y, tolerance, u) - target, centre,
                upperLimit);
        return OptionalDouble.of(root);
    }
}
