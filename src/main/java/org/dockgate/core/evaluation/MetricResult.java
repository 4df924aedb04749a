package org.dockgate.core.evaluation;

import java.util.List;
import java.util.Objects;
import java.util.OptionalDouble;
import org.dockgate.core.decision.ExpandedUncertainty;
import org.dockgate.core.decision.Tolerance;
import org.dockgate.core.decision.Verdict;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.uncertainty.UncertaintyBudget;

/**
 * One metric of one unit: the measured value, its uncertainty budget and expanded uncertainty, the
 * tolerance of the procedure's {@code MetricAcceptance}, the acceptance limits the decision rule drew from
 * the measured U, and the verdict.
 *
 * <p>For metrics judged point by point ({@link Metric#ACCURACY}, {@link Metric#RTD_TOLERANCE}) the fields
 * describe the deciding point (the worst verdict, then the lowest probability of conformance) and
 * {@code points} holds every point; for the other metrics {@code points} is empty.
 *
 * @param metric                   the metric
 * @param unit                     the unit of measured, tolerance and U (the procedure's unit for the metric)
 * @param measured                 the measured value
 * @param uncertainty              U and k (k = t at 95.45 % for ν_eff, GUM G.4.1 and G.6.4)
 * @param budget                   the uncertainty budget (GUM 5.1.2 for u_c)
 * @param tolerance                the tolerance the value is judged against
 * @param acceptanceLower          A_L as the rule drew it from U; absent for no lower limit or an empty zone
 * @param acceptanceUpper          A_U likewise
 * @param verdict                  the verdict (ILAC G8:09/2019 terms)
 * @param probabilityOfConformance p_c (JCGM 106:2012, normal PDF with u = U/k)
 * @param note                     how the value was obtained, in a sentence or two for the unit page
 * @param testUncertaintyRatio     TUR = (T_U − T_L)/(2U) as measured; absent for a one-sided tolerance
 * @param points                   per-point checks, empty unless the metric is judged point by point
 */
public record MetricResult(Metric metric, String unit, double measured, ExpandedUncertainty uncertainty,
        UncertaintyBudget budget, Tolerance tolerance, OptionalDouble acceptanceLower,
        OptionalDouble acceptanceUpper, Verdict verdict, double probabilityOfConformance, String note,
        OptionalDouble testUncertaintyRatio, List<PointCheck> points) {

    /** Checks the fields are present and copies the points. */
    public MetricResult {
        Objects.requireNonNull(metric, "metric");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(uncertainty, "uncertainty");
        Objects.requireNonNull(budget, "budget");
        Objects.requireNonNull(tolerance, "tolerance");
        Objects.requireNonNull(acceptanceLower, "acceptanceLower");
        Objects.requireNonNull(acceptanceUpper, "acceptanceUpper");
        Objects.requireNonNull(verdict, "verdict");
        Objects.requireNonNull(note, "note");
        Objects.requireNonNull(testUncertaintyRatio, "testUncertaintyRatio");
        if (!Double.isFinite(measured)) {
            throw new IllegalArgumentException("The measured value of " + metric + " must be finite, was " + measured);
        }
        points = List.copyOf(points);
    }
}
