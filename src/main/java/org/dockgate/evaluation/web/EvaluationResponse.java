package org.dockgate.evaluation.web;

import com.fasterxml.jackson.annotation.JsonInclude;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Set;
import org.dockgate.core.decision.Tolerance;
import org.dockgate.core.evaluation.MetricResult;
import org.dockgate.core.evaluation.PointCheck;
import org.dockgate.core.uncertainty.UncertaintyBudget;
import org.dockgate.core.uncertainty.UncertaintyContribution;
import org.dockgate.evaluation.LotEvaluationView;
import org.dockgate.evaluation.NonconformanceReport;
import org.dockgate.evaluation.UnitEvaluationView;
import org.dockgate.procedures.ApprovedProcedure;
import org.dockgate.receiving.LotView;

/**
 * The JSON answer of {@code GET /api/v1/lots/{id}/evaluation} (and of a disposition): the API's own records,
 * not the core's types serialised, so that the field names are a contract (DEVELOPERS.md, "Evaluation API
 * answer") and a change in the core does not change the API by accident.
 *
 * <p>Every figure that is absent or not finite is JSON {@code null}: ν_eff = ∞ (a budget of Type B lines
 * only), TUR of a one-sided tolerance, a missing tolerance or acceptance limit. The default answer is compact
 * (per metric: value, U, k, ν_eff, limits, verdict, p_c); {@code ?detail=budgets} adds each metric's budget
 * lines, its note, the per-point checks of metrics judged point by point, and the units' chart points.
 *
 * <p>All mapping from the core's result types is in this file ({@link #of}, {@link MetricAnswer#of},
 * {@link BudgetAnswer#of}, {@link LineAnswer#of}, {@link PointAnswer#of}): a new field of a budget line is
 * one more component of {@link LineAnswer} and one more argument in its {@code of}.
 *
 * @param lotId          the lot
 * @param lot            the lot as the receiving API gives it (state, version for a disposition, plan, sample)
 * @param procedure      which approved procedure revision the lot is evaluated against
 * @param frozen         true when every unit's result is the record frozen at disposition
 * @param detail         {@code summary} (the default) or {@code budgets}
 * @param complete       whether every sampled unit has all its readings and context
 * @param nonconforming  d, the number of nonconforming units under the procedure's counting
 * @param wouldAccept    the lot's result from Ac/Re once the sample is complete, else null
 * @param nonconformance the nonconformance report of a rejected lot, else null
 * @param units          one entry per sampled unit, in the order of the sample
 */
public record EvaluationResponse(long lotId, LotView lot, ProcedureAnswer procedure, boolean frozen, String detail,
                                 boolean complete, int nonconforming, Boolean wouldAccept,
                                 NonconformanceReport nonconformance, List<UnitAnswer> units) {

    /** How much of each unit's evaluation the answer carries. */
    public enum Detail {
        /** Per metric: value, U, k, ν_eff, limits, verdict, p_c (the default). */
        SUMMARY,
        /** Also each metric's budget lines, note and per-point checks, and the chart points. */
        BUDGETS;

        /**
         * @param value the {@code detail} request parameter, null or blank for the default
         * @throws IllegalArgumentException for anything but {@code summary} or {@code budgets}, naming the field
         */
        public static Detail of(String value) {
            if (value == null || value.isBlank() || value.strip().equalsIgnoreCase("summary")) {
                return SUMMARY;
            }
            if (value.strip().equalsIgnoreCase("budgets")) {
                return BUDGETS;
            }
            throw new IllegalArgumentException("'detail' must be 'budgets' (budget lines, notes and per-point checks)"
                    + " or absent (the compact answer); was '" + value.strip() + "'.");
        }

        String label() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /** Maps a lot's evaluation (computed, or read back from the frozen record) to the answer. */
    public static EvaluationResponse of(LotEvaluationView ev, Detail detail) {
        boolean budgets = detail == Detail.BUDGETS;
        List<UnitAnswer> units = ev.units().stream().map(u -> UnitAnswer.of(u, budgets)).toList();
        boolean frozen = !ev.units().isEmpty() && ev.units().stream().allMatch(UnitEvaluationView::frozen);
        return new EvaluationResponse(ev.lot().id(), ev.lot(), ProcedureAnswer.of(ev.procedure()), frozen,
                detail.label(), ev.complete(), ev.nonconforming(), ev.wouldAccept().orElse(null),
                ev.nonconformance().orElse(null), units);
    }

    /** The procedure revision, by reference (its content: {@code GET /api/v1/procedures/{id}}). */
    public record ProcedureAnswer(long id, String label, String partNumber, int revisionNo,
                                  long specificationRevisionId, int specificationRevisionNo, String approvedBy,
                                  Instant approvedAt) {

        static ProcedureAnswer of(ApprovedProcedure p) {
            return new ProcedureAnswer(p.id(), p.label(), p.partNumber(), p.revisionNo(), p.specificationRevisionId(),
                    p.specificationRevisionNo(), p.approvedBy(), p.approvedAt());
        }
    }

    /**
     * One sampled unit.
     *
     * @param verdict                 the unit's verdict (worst of its metrics), null while no metric could be
     *                                evaluated; provisional while {@code complete} is false
     * @param missing                 what is still missing, one sentence each; empty when complete
     * @param calibrations            the calibration record of each instrument in force when the readings were taken
     * @param ambientC                the recorded ambient temperature, null when not recorded
     * @param relativeHumidityPercent the recorded relative humidity, null when not recorded
     * @param staticPoints            with {@code detail=budgets} only: the static readings (chart points)
     * @param sweepPoints             with {@code detail=budgets} only: the sweep readings
     */
    public record UnitAnswer(String serial, String verdict, boolean complete, boolean frozen, int readings,
                             Set<String> operators, Set<String> instruments, List<CalibrationAnswer> calibrations,
                             Double ambientC, Double relativeHumidityPercent, List<String> missing,
                             List<MetricAnswer> metrics,
                             @JsonInclude(JsonInclude.Include.NON_NULL) List<UnitEvaluationView.StaticPoint> staticPoints,
                             @JsonInclude(JsonInclude.Include.NON_NULL) List<UnitEvaluationView.SweepPoint> sweepPoints) {

        static UnitAnswer of(UnitEvaluationView u, boolean budgets) {
            return new UnitAnswer(u.serial(), u.result().unitVerdict().map(Enum::name).orElse(null), u.complete(),
                    u.frozen(), u.readings(), u.operators(), u.instruments(),
                    u.calibrations().stream().map(CalibrationAnswer::of).toList(),
                    u.ambientC().filter(Double::isFinite).orElse(null),
                    u.humidityPercent().filter(Double::isFinite).orElse(null), u.result().missing(),
                    u.result().metrics().stream().map(m -> MetricAnswer.of(m, budgets)).toList(),
                    budgets ? u.staticPoints() : null, budgets ? u.sweepPoints() : null);
        }
    }

    /** A calibration record used: instrument, certificate number, calibration and due date, its k. */
    public record CalibrationAnswer(String instrument, String certificateNumber, LocalDate calibratedOn, LocalDate dueOn,
                                    Double coverageFactor) {

        static CalibrationAnswer of(UnitEvaluationView.CalibrationUsed c) {
            return new CalibrationAnswer(c.instrument(), c.certificateNumber(), c.calibratedOn(), c.dueOn(),
                    finite(c.coverageFactor()));
        }
    }

    /**
     * One metric of a unit. For metrics judged point by point (ACCURACY, RTD_TOLERANCE) the figures are those of
     * the deciding point; {@code points} (with {@code detail=budgets}) has every point.
     *
     * @param value                     the measured value, in {@code unit}
     * @param expandedUncertainty       U, in {@code unit}
     * @param coverageFactor            k
     * @param effectiveDegreesOfFreedom ν_eff; null when infinite
     * @param toleranceLower            T_L, null when the tolerance has no lower limit
     * @param toleranceUpper            T_U, null when it has no upper limit
     * @param acceptanceLower           A_L the decision rule drew from U, null for none (or an empty zone)
     * @param acceptanceUpper           A_U likewise
     * @param verdict                   PASS, CONDITIONAL_PASS, CONDITIONAL_FAIL or FAIL
     * @param probabilityOfConformance  p_c, null where it is not a number
     * @param testUncertaintyRatio      TUR, null for a one-sided tolerance or U = 0
     * @param note                      with {@code detail=budgets} only: how the value was obtained
     * @param budget                    with {@code detail=budgets} only: the uncertainty budget
     * @param points                    with {@code detail=budgets} only, for metrics judged point by point
     */
    public record MetricAnswer(String metric, Double value, String unit, Double expandedUncertainty,
                               Double coverageFactor, Double effectiveDegreesOfFreedom, Double toleranceLower,
                               Double toleranceUpper, Double acceptanceLower, Double acceptanceUpper, String verdict,
                               Double probabilityOfConformance, Double testUncertaintyRatio,
                               @JsonInclude(JsonInclude.Include.NON_NULL) String note,
                               @JsonInclude(JsonInclude.Include.NON_NULL) BudgetAnswer budget,
                               @JsonInclude(JsonInclude.Include.NON_NULL) List<PointAnswer> points) {

        static MetricAnswer of(MetricResult m, boolean budgets) {
            Tolerance t = m.tolerance();
            return new MetricAnswer(m.metric().name(), finite(m.measured()), m.unit(), finite(m.uncertainty().value()),
                    finite(m.uncertainty().coverageFactor()), finite(m.budget().effectiveDegreesOfFreedom()),
                    finite(t.lower()), finite(t.upper()), finite(m.acceptanceLower()), finite(m.acceptanceUpper()),
                    m.verdict().name(), finite(m.probabilityOfConformance()), finite(m.testUncertaintyRatio()),
                    budgets ? m.note() : null, budgets ? BudgetAnswer.of(m.budget()) : null,
                    budgets && !m.points().isEmpty() ? m.points().stream().map(PointAnswer::of).toList() : null);
        }
    }

    /**
     * An uncertainty budget (GUM 5.1.2, G.4.1, 6.2.1).
     *
     * @param effectiveDegreesOfFreedom ν_eff, null when infinite
     */
    public record BudgetAnswer(List<LineAnswer> lines, Double combinedStandardUncertainty,
                               Double effectiveDegreesOfFreedom, Double coverageProbability, Double coverageFactor,
                               Double expandedUncertainty) {

        static BudgetAnswer of(UncertaintyBudget b) {
            return new BudgetAnswer(b.contributions().stream().map(LineAnswer::of).toList(),
                    finite(b.combinedStandardUncertainty()), finite(b.effectiveDegreesOfFreedom()),
                    finite(b.coverageProbability()), finite(b.coverageFactor()), finite(b.expandedUncertainty()));
        }
    }

    /**
     * One budget line.
     *
     * @param basis                  TYPE_A, RECTANGULAR, TRIANGULAR, U_SHAPED, EXPANDED or STANDARD
     * @param standardUncertainty    u(x_i), in the input's unit
     * @param degreesOfFreedom       ν_i, null when infinite (a Type B line)
     * @param sensitivityCoefficient c_i
     * @param contribution           |c_i|·u(x_i), in the metric's unit
     */
    public record LineAnswer(String name, String basis, Double standardUncertainty, Double degreesOfFreedom,
                             Double sensitivityCoefficient, Double contribution) {

        static LineAnswer of(UncertaintyContribution c) {
            return new LineAnswer(c.name(), c.basis().name(), finite(c.standardUncertainty()),
                    finite(c.degreesOfFreedom()), finite(c.sensitivityCoefficient()), finite(c.contribution()));
        }
    }

    /** One point of a metric judged point by point: its error, tolerance, U, k, verdict, p_c and budget. */
    public record PointAnswer(Double input, String direction, int cycle, Double error, Double toleranceLower,
                              Double toleranceUpper, Double expandedUncertainty, Double coverageFactor,
                              Double effectiveDegreesOfFreedom, String verdict, Double probabilityOfConformance,
                              BudgetAnswer budget) {

        static PointAnswer of(PointCheck p) {
            return new PointAnswer(finite(p.input()), p.direction().name(), p.cycle(), finite(p.error()),
                    finite(p.tolerance().lower()), finite(p.tolerance().upper()), finite(p.uncertainty().value()),
                    finite(p.uncertainty().coverageFactor()), finite(p.budget().effectiveDegreesOfFreedom()),
                    p.verdict().name(), finite(p.probabilityOfConformance()), BudgetAnswer.of(p.budget()));
        }
    }

    /** JSON null for ∞ and NaN: JSON has no such numbers, and clients should not parse "Infinity" strings. */
    static Double finite(double value) {
        return Double.isFinite(value) ? value : null;
    }

    static Double finite(OptionalDouble value) {
        return value.isPresent() ? finite(value.getAsDouble()) : null;
    }
}
