package org.dockgate.core.evaluation;

import static org.dockgate.core.evaluation.UnitFactors.fmt;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.Verdict;
import org.dockgate.core.metrics.FrequencyPoint;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.ProcedureProposal.MetricAcceptance;
import org.dockgate.core.procedure.ProcedureProposal.StaticCalibration;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.CalibrationSeries;
import org.dockgate.core.series.Direction;
import org.dockgate.core.uncertainty.CoverageFactor;

/**
 * Evaluates one unit against its procedure: for every metric of {@code procedure.acceptance()}, the measured
 * value, its uncertainty budget, the expanded uncertainty and the verdict; the unit's verdict is the worst.
 *
 * <p><b>Measured values</b> (the core's metrics; FSO = |b₁|·span of the measured fit, span = rangeMax − rangeMin):
 * <ul>
 *   <li>inputs: each static reading's input is the value the reference applied (recorded beside the set point;
 *       the set point when none was recorded). Fits, errors and tolerances use the applied value; the set point
 *       only groups readings: for nonlinearity, hysteresis and repeatability each reading is referred to its set
 *       point along the fitted slope, y − b₁·(x_applied − x_set) ({@link CalibrationPoint#reducedToNominal});</li>
 *   <li>sensitivity b₁ and zero offset b₀: the least-squares line through all static readings at their applied inputs
 *       ({@link org.dockgate.core.fit.LineFit}), converted to the acceptance's unit;</li>
 *   <li>nonlinearity: best-fit or terminal per the specification, hysteresis, repeatability (pooled s_p), all
 *       in %FSO ({@link org.dockgate.core.metrics.StaticCharacteristics});</li>
 *   <li>accuracy: each reading's error e = (x_nom⁻¹(y) − x)/span × 100 %FSO against the nominal transfer
 *       function (the datasheet line S·x + offset, or the IEC 60751 curve of an RTD;
 *       {@link org.dockgate.core.metrics.Accuracy});</li>
 *   <li>RTD class tolerance: each reading's temperature error e = t(R) − t_ref with t(R) the inverse
 *       Callendar–Van Dusen equation (IEC 60751), judged against the class tolerance ±(c₀ + c₁|t_ref|) at that
 *       temperature;</li>
 *   <li>noise: the sample standard deviation of the zero-input samples, output-referred or divided by |S|;
 *       resolution = noise/|S| (S the measured slope, or the nominal one before a static calibration exists)
 *       ({@link org.dockgate.core.metrics.NoiseAnalysis});</li>
 *   <li>bandwidth: the −3.0103 dB frequency (or the highest swept frequency as a lower bound when the response
 *       stays above it); flatness: the largest |100·(A/A_ref − 1)| % up to the band's upper frequency
 *       ({@link org.dockgate.core.metrics.FrequencyResponse}).</li>
 * </ul>
 *
 * <p><b>Budgets</b> (JCGM 100:2008): u_c = √Σ(c_i·u_i)² for uncorrelated inputs (GUM 5.1.2), ν_eff by
 * Welch–Satterthwaite (GUM G.4.1), k = t_p(⌊ν_eff⌋) at p = 95.45 % (GUM G.6.4), U = k·u_c. Lines per metric:
 * <ul>
 *   <li>Type A from the readings: u(b₁) = s/√S_xx and u(b₀) = s·√(1/n + x̄²/S_xx) with ν = n − 2; the mean of n
 *       readings s_p/√n (nonlinearity), a difference of two means s_p·√(1/n_up + 1/n_dn) (hysteresis), one
 *       reading s_p (accuracy, RTD), all with the pooled ν; a standard deviation s/√(2ν) (repeatability, noise;
 *       GUM E.4.3, from memory);</li>
 *   <li>Type B from the reference certificate, u = U(x)/k (GUM 4.3.3), by the model stated in
 *       {@link ReferenceUncertainty}: a scale error for the slope (S/x at the top point), a point error for the
 *       offset (S at the point nearest zero), each reading's accuracy and RTD error (100/span, 1, at its own set
 *       point) and the nonlinearity (100/span with the largest u over the set points); a line of zero for
 *       hysteresis and repeatability (a common error at a set point cancels in differences there) and for noise
 *       (no stimulus at zero input);</li>
 *   <li>Type B from the readout's digit δ, rectangular with half-width δ/2 (GUM F.2.2.1), carried to the metric
 *       (1/√S_xx for the slope, √(1/n + x̄²/S_xx) for the offset, 100/FSO for %FSO figures, 1/S for input units);
 *       δ is the register's resolution of the readout the readings name;</li>
 *   <li>Type B from the readout's certificate U(y)/k at the reading ({@link ReadoutInstrument}): a scale error for the
 *       slope (c = 1/x at the top reading), a point error for the offset, nonlinearity and accuracy, cancelling in
 *       hysteresis and repeatability; from the excitation supply's u(V)/V ({@link ExcitationSupply}) a scale error
 *       of the slope, offset and accuracy, or a line saying a ratiometric measurement cancels it;</li>
 *   <li>Type B from the environment when recorded with a temperature coefficient ({@link Environment}); a line
 *       of zero that says so otherwise.</li>
 * </ul>
 * Sources that are not recorded, or cannot act on a metric, appear as lines of zero with the reason.
 *
 * <p><b>Verdicts</b>: {@code policy.decide(measured, tolerance, U)} with the tolerance of the procedure's
 * {@link MetricAcceptance}; accuracy and RTD tolerance decide each reading and the worst decides the metric.
 * The unit's verdict is {@link Verdict#worst} of its metrics.
 *
 * <p><b>Completeness</b>: the planned static readings (each point × direction × cycle of the procedure), the
 * planned number of noise samples, each planned sweep frequency, the static reference and the readout
 * resolution (when static or noise metrics are accepted on) and the sweep reference (for bandwidth and
 * flatness) must be there, and every metric must have been evaluated. Until then the result is partial:
 * what can be computed is, and {@link UnitResult#missing()} says what is not.
 */
public final class UnitEvaluation {

    /** p = 2Φ(2) − 1 = 0.9544997…, the coverage probability of k = 2 for a normal distribution (GUM G.6.6). */
    public static final double COVERAGE_PROBABILITY = CoverageFactor.normalCoverageProbability(2.0);

    /** A static reading counts for a planned set point within this fraction of the span (unit-conversion rounding). */
    public static final double SET_POINT_TOLERANCE_OF_SPAN = 1e-6;

    /** At most this many missing readings are listed one by one; the rest are counted. */
    static final int MISSING_LISTED = 20;

    private static final Set<Metric> STATIC_METRICS = EnumSet.of(Metric.SENSITIVITY, Metric.ZERO_OFFSET,
            Metric.ACCURACY, Metric.NONLINEARITY, Metric.HYSTERESIS, Metric.REPEATABILITY, Metric.RTD_TOLERANCE);
    private static final Set<Metric> NOISE_METRICS = EnumSet.of(Metric.NOISE, Metric.RESOLUTION);
    private static final Set<Metric> SWEEP_METRICS = EnumSet.of(Metric.BANDWIDTH, Metric.FLATNESS);

    private UnitEvaluation() {
    }

    /**
     * Evaluates a unit (formulas and completeness rules in the class description).
     *
     * <p>Edge cases: a metric that cannot be evaluated yet (no readings of its kind, fewer than two set points,
     * no DOWN readings for hysteresis, no repeated cycle for repeatability, a reference frequency not yet swept)
     * is left out of {@code metrics} and named in {@code missing} with the reason; the unit verdict is then the
     * worst of the others, provisional, and absent when no metric could be evaluated.
     *
     * @param spec        the specification revision the procedure was derived from
     * @param procedure   the procedure revision (planned readings and acceptance per metric)
     * @param policy      the procedure's decision rule
     * @param measurements the unit's readings so far and their context
     * @return the unit's result
     * @throws IllegalArgumentException when an argument is null or the units of the specification and the
     *                                  acceptance do not convert
     */
    public static UnitResult evaluate(SensorSpecification spec, ProcedureProposal procedure, DecisionPolicy policy,
            UnitMeasurements measurements) {
        if (spec == null || procedure == null || policy == null || measurements == null) {
            throw new IllegalArgumentException("A unit evaluation needs the specification, the procedure, the decision"
                    + " rule and the measurements");
        }
        Set<Metric> accepted = EnumSet.noneOf(Metric.class);
        procedure.acceptance().forEach(a -> accepted.add(a.metric()));
        List<String> missing = new ArrayList<>();

        List<CalibrationPoint> snapped = snapToSetPoints(spec, procedure.staticCalibration(), measurements.staticPoints());
        Optional<CalibrationSeries> series = snapped.isEmpty() ? Optional.empty()
                : Optional.of(CalibrationSeries.of(snapped));
        missing.addAll(missingStaticReadings(spec, procedure.staticCalibration(), snapped));
        if (accepted.stream().anyMatch(NOISE_METRICS::contains)) {
            missing.addAll(missingNoise(procedure, measurements));
        }
        if (accepted.stream().anyMatch(SWEEP_METRICS::contains)) {
            missing.addAll(missingSweep(procedure, measurements.sweepPoints()));
        }
        MeasurementContext context = measurements.context();
        if (accepted.stream().anyMatch(STATIC_METRICS::contains) && context.staticReference().isEmpty()) {
            missing.add("the static calibration's reference instrument and its certificate (U, k)");
        }
        // Readings that name no readout (saved before readouts were recorded) are evaluated and say so in their
        // budgets; a named readout without a resolution in the register leaves the result incomplete.
        if (accepted.stream().anyMatch(m -> STATIC_METRICS.contains(m) || NOISE_METRICS.contains(m))
                && context.readoutResolution().isEmpty() && !context.readoutNotRecorded()) {
            missing.add(context.readout().map(r -> "the resolution of readout " + r.name() + " (enter it in the"
                    + " register)").orElse("the readout's resolution (the digit of the indicating instrument)"));
        }
        if (accepted.stream().anyMatch(SWEEP_METRICS::contains) && context.sweepReference().isEmpty()) {
            missing.add("the frequency sweep's reference instrument and its certificate (U, k)");
        }

        StaticMetrics statics = new StaticMetrics(spec, policy, context, series);
        DynamicMetrics dynamics = new DynamicMetrics(spec, procedure, policy, measurements, statics.characteristics());
        List<MetricResult> results = new ArrayList<>();
        for (MetricAcceptance a : procedure.acceptance()) {
            try {
                results.add(switch (a.metric()) {
                    case SENSITIVITY -> statics.sensitivity(a);
                    case ZERO_OFFSET -> statics.zeroOffset(a);
                    case ACCURACY -> statics.accuracy(a);
                    case NONLINEARITY -> statics.nonlinearity(a);
                    case HYSTERESIS -> statics.hysteresis(a);
                    case REPEATABILITY -> statics.repeatability(a);
                    case RTD_TOLERANCE -> statics.rtdTolerance(a);
                    case NOISE -> dynamics.noise(a);
                    case RESOLUTION -> dynamics.resolution(a);
                    case BANDWIDTH -> dynamics.bandwidth(a);
                    case FLATNESS -> dynamics.flatness(a);
                });
            } catch (UnevaluableException e) {
                missing.add(label(a.metric()) + " not evaluated yet: " + e.getMessage());
            }
        }
        Optional<Verdict> verdict = results.isEmpty() ? Optional.empty()
                : Optional.of(Verdict.worst(results.stream().map(MetricResult::verdict).toList()));
        return new UnitResult(results, verdict, missing.isEmpty(), missing);
    }

    /** "Sensitivity", "Zero offset", "Rtd tolerance" → the metric's name as a person writes it. */
    static String label(Metric metric) {
        String words = metric == Metric.RTD_TOLERANCE ? "RTD class tolerance"
                : metric.name().toLowerCase(Locale.ROOT).replace('_', ' ');
        return Character.toUpperCase(words.charAt(0)) + words.substring(1);
    }

    /**
     * Replaces a nominal within {@link #SET_POINT_TOLERANCE_OF_SPAN} of a planned set point by the set point (and
     * the input with it when the reading was taken at its set point; an applied value off the set point stays).
     */
    static List<CalibrationPoint> snapToSetPoints(SensorSpecification spec, StaticCalibration plan,
            List<CalibrationPoint> points) {
        if (plan == null || plan.pointsInput().isEmpty()) {
            return points;
        }
        double tolerance = SET_POINT_TOLERANCE_OF_SPAN * spec.span();
        List<CalibrationPoint> snapped = new ArrayList<>(points.size());
        for (CalibrationPoint p : points) {
            double nominal = p.nominal();
            for (double planned : plan.pointsInput()) {
                if (Math.abs(nominal - planned) <= tolerance) {
                    nominal = planned;
                    break;
                }
            }
            double input = p.offNominal() ? p.input() : nominal;
            snapped.add(nominal == p.nominal() ? p
                    : new CalibrationPoint(input, p.output(), p.direction(), p.cycle(), nominal));
        }
        return snapped;
    }

    private static List<String> missingStaticReadings(SensorSpecification spec, StaticCalibration plan,
            List<CalibrationPoint> snapped) {
        if (plan == null || plan.pointsInput().isEmpty()) {
            return List.of();
        }
        int planned = plan.readingsPerUnit();
        if (snapped.isEmpty()) {
            return List.of("static calibration: no readings yet (" + planned + " planned)");
        }
        Set<String> taken = new HashSet<>();
        for (CalibrationPoint p : snapped) {
            taken.add(key(p.nominal(), p.direction(), p.cycle()));
        }
        List<String> gaps = new ArrayList<>();
        int count = 0;
        for (int cycle = 1; cycle <= plan.cycles(); cycle++) {
            for (Direction direction : plan.directions()) {
                List<Double> order = new ArrayList<>(plan.pointsInput());
                if (direction == Direction.DOWN) {
                    java.util.Collections.reverse(order);
                }
                for (double x : order) {
                    if (!taken.contains(key(x, direction, cycle))) {
                        count++;
                        if (gaps.size() < MISSING_LISTED) {
                            gaps.add("static reading at " + fmt(x) + " " + spec.inputUnit() + ", " + direction
                                    + ", cycle " + cycle);
                        }
                    }
                }
            }
        }
        if (count > gaps.size()) {
            gaps.add("… and " + (count - gaps.size()) + " more static readings (" + count + " of " + planned
                    + " missing)");
        }
        return gaps;
    }

    private static String key(double input, Direction direction, int cycle) {
        return (input + 0.0) + "|" + direction + "|" + cycle;
    }

    private static List<String> missingNoise(ProcedureProposal procedure, UnitMeasurements measurements) {
        int planned = procedure.noiseCapture() == null ? 2 : Math.max(2, procedure.noiseCapture().samples());
        int recorded = measurements.noiseSamples().size();
        if (recorded >= planned) {
            return List.of();
        }
        return List.of(recorded == 0 ? "noise capture: no samples yet (" + planned + " planned)"
                : "noise capture: " + recorded + " of " + planned + " samples");
    }

    private static List<String> missingSweep(ProcedureProposal procedure, List<FrequencyPoint> points) {
        if (procedure.frequencySweep() == null) {
            return points.size() >= 2 ? List.of() : List.of("frequency sweep: fewer than two points yet");
        }
        List<Double> planned = procedure.frequencySweep().frequenciesHz();
        if (points.isEmpty()) {
            return List.of("frequency sweep: no points yet (" + planned.size() + " planned)");
        }
        List<String> gaps = new ArrayList<>();
        for (double f : planned) {
            boolean taken = points.stream().anyMatch(p -> Math.abs(p.frequencyHz() - f) <= 1e-6 * f);
            if (!taken) {
                gaps.add("frequency sweep point at " + fmt(f) + " Hz");
            }
        }
        return gaps;
    }
}
