package org.dockgate.core.evaluation;

import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.dockgate.core.decision.Verdict;
import org.dockgate.core.procedure.Metric;

/**
 * The evaluation of one unit: a result per metric that could be evaluated, the unit's verdict, and
 * whether anything is still missing.
 *
 * @param metrics     results in the order of the procedure's acceptance list (metrics that cannot be
 *                    evaluated yet are absent and named in {@code missing})
 * @param unitVerdict the worst verdict of {@code metrics} ({@link Verdict#worst}); absent while no metric
 *                    could be evaluated. While {@code complete} is false it is provisional: it can change as
 *                    readings arrive
 * @param complete    true when every planned reading and every context item is there and every metric was
 *                    evaluated; only a complete result may count in a lot disposition
 * @param missing     what is missing, one readable line each (readings not yet taken, context not
 *                    recorded, metrics that could not be evaluated and why); empty when complete
 */
public record UnitResult(List<MetricResult> metrics, Optional<Verdict> unitVerdict, boolean complete,
        List<String> missing) {

    /** Copies the lists and checks that completeness agrees with the missing list. */
    public UnitResult {
        metrics = List.copyOf(metrics);
        missing = List.copyOf(missing);
        Objects.requireNonNull(unitVerdict, "unitVerdict");
        if (complete != missing.isEmpty()) {
            throw new IllegalArgumentException("A unit result is complete exactly when nothing is missing");
        }
    }

    /**
     * The result of one metric.
     *
     * @param metric the metric
     * @return its result, absent when the procedure does not accept on it or it could not be evaluated yet
     */
    public Optional<MetricResult> metric(Metric metric) {
        return metrics.stream().filter(m -> m.metric() == metric).findFirst();
    }
}
