package org.dockgate.core.evaluation;

import static org.dockgate.core.evaluation.UnitFactors.fmt;

import java.util.List;
import java.util.OptionalDouble;
import org.dockgate.core.decision.Decision;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.ExpandedUncertainty;
import org.dockgate.core.decision.Tolerance;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.ProcedureProposal.MetricAcceptance;
import org.dockgate.core.uncertainty.UncertaintyBudget;
import org.dockgate.core.uncertainty.UncertaintyContribution;

/** From budget lines to a verdict: u_c, ν_eff, k and U (GUM), then the procedure's decision rule. */
final class Judgement {

    private Judgement() {
    }

    /** An evaluated budget, its expanded uncertainty and the decision on a measured value. */
    record Judged(UncertaintyBudget budget, ExpandedUncertainty expanded, Decision decision) {
    }

    /**
     * Evaluates the budget at p = 95.45 % (u_c by GUM 5.1.2, ν_eff by Welch–Satterthwaite GUM G.4.1, k = t_p(ν_eff)),
     * and applies the rule: {@code policy.decide(measured, tolerance, U)}.
     */
    static Judged judge(double measured, Tolerance tolerance, List<UncertaintyContribution> lines,
            DecisionPolicy policy) {
        UncertaintyBudget budget = UncertaintyBudget.of(lines, UnitEvaluation.COVERAGE_PROBABILITY);
        ExpandedUncertainty expanded = ExpandedUncertainty.of(budget.expandedUncertainty(), budget.coverageFactor());
        return new Judged(budget, expanded, policy.decide(measured, tolerance, expanded));
    }

    /** The tolerance of a procedure's acceptance line. */
    static Tolerance tolerance(MetricAcceptance acceptance) {
        return new Tolerance(acceptance.toleranceLower(), acceptance.toleranceUpper());
    }

    /** The metric's result from a judged value, with the procedure's unit and a note on the planned U. */
    static MetricResult result(MetricAcceptance acceptance, double measured, Tolerance tolerance, Judged judged,
            String note, List<PointCheck> points) {
        Decision d = judged.decision();
        return new MetricResult(acceptance.metric(), acceptance.unit(), measured, judged.expanded(), judged.budget(),
                tolerance, d.acceptanceLower(), d.acceptanceUpper(), d.verdict(), d.probabilityOfConformance(),
                note + plannedNote(acceptance, judged.expanded()),
                testUncertaintyRatio(acceptance.metric(), tolerance, judged.expanded(), d), points);
    }

    /**
     * TUR as the procedure derivation defines it, so that planned and measured ratios compare: (T_U − T_L)/(2U)
     * for two-sided tolerances; for an upper limit L on a non-negative scatter figure (nonlinearity, hysteresis,
     * repeatability) L/(2U), the span 0 … L; for flatness, a ± band, L/U; absent otherwise.
     */
    private static OptionalDouble testUncertaintyRatio(Metric metric, Tolerance tolerance, ExpandedUncertainty u,
            Decision decision) {
        boolean upperOnly = tolerance.upper().isPresent() && tolerance.lower().isEmpty();
        double divisor = switch (metric) {
            case NONLINEARITY, HYSTERESIS, REPEATABILITY -> 2.0;
            case FLATNESS -> 1.0;
            default -> 0.0;
        };
        if (!upperOnly || divisor == 0.0) {
            return decision.testUncertaintyRatio();
        }
        // U = 0 gives no ratio worth printing (never "∞:1"): the TUR is then left out.
        return u.value() == 0.0 ? OptionalDouble.empty()
                : OptionalDouble.of(tolerance.upper().getAsDouble() / (divisor * u.value()));
    }

    private static String plannedNote(MetricAcceptance acceptance, ExpandedUncertainty expanded) {
        if (acceptance.plannedExpandedUncertainty().isPresent()
                && expanded.value() > acceptance.plannedExpandedUncertainty().getAsDouble() * (1 + 1e-9)) {
            return " U = " + fmt(expanded.value()) + " " + acceptance.unit() + " is larger than the "
                    + fmt(acceptance.plannedExpandedUncertainty().getAsDouble())
                    + " the procedure planned: the guard band is wider than approved.";
        }
        return "";
    }
}
