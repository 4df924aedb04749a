package org.dockgate.core.procedure;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.TreeSet;
import org.dockgate.core.decision.AcceptanceLimits;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.ExpandedUncertainty;
import org.dockgate.core.decision.Tolerance;
import org.dockgate.core.procedure.ProcedureProposal.FrequencySweep;
import org.dockgate.core.procedure.ProcedureProposal.MetricAcceptance;
import org.dockgate.core.procedure.ProcedureProposal.NoiseCapture;
import org.dockgate.core.procedure.ProcedureProposal.SamplingRow;
import org.dockgate.core.procedure.ProcedureProposal.StaticCalibration;
import org.dockgate.core.quantity.Units;
import org.dockgate.core.rtd.CallendarVanDusen;
import org.dockgate.core.rtd.ToleranceClass;
import org.dockgate.core.sampling.Severity;
import org.dockgate.core.sampling.SingleSamplingPlans;
import org.dockgate.core.series.Direction;

/**
 * Derives an inspection procedure from a specification revision: the rules a quality engineer applies
 * by hand, made explicit so each value carries its reason.
 *
 * <ul>
 *   <li>Static points at 0, 20, 40, 60, 80, 100 % of span (common practice: six points, ends included;
 *       for an accelerometer, peak amplitudes of 10 … 100 % of the range at the reference frequency,
 *       since a piezoelectric sensor has no static response); descending too when hysteresis is
 *       specified; three cycles when repeatability is specified (the pooled standard deviation then has
 *       at least two degrees of freedom per point), else one.</li>
 *   <li>Noise capture when a noise floor or resolution is specified: sample rate at least 2.5 × the
 *       specified upper frequency (Nyquist's 2 plus margin for the anti-alias filter's roll-off, common
 *       practice), at least 1 kHz; duration 10 periods of the lowest frequency of interest (1 Hz unless the
 *       reference frequency is lower), at least 1 s.</li>
 *   <li>Frequency sweep when a bandwidth or flatness band is specified: log-spaced from the reference
 *       frequency, 3 per decade up to half the limit, 10 per decade from there to twice the limit (denser
 *       near the limit, and beyond it), the limit itself included.</li>
 *   <li>Acceptance limits from the decision policy with the planned reference instrument's expanded
 *       uncertainty (core decision rules), and TUR = (TU − TL)/(2U) (ANSI/NCSL Z540.3 fallback ratio,
 *       4:1 adequate). For a one-sided upper limit L on a non-negative metric (nonlinearity) the natural
 *       lower bound 0 gives the span: TUR = L / (2U), common practice. The planned U follows the reference
 *       model of {@code org.dockgate.core.evaluation.ReferenceUncertainty}: the relative U at the top point
 *       carried to the slope (scale error), U at the point nearest zero times S (offset), the largest U over
 *       the points (accuracy, nonlinearity; point error), U at the tightest point (RTD); hysteresis and
 *       repeatability get no reference U and no TUR, since a common error at a set point cancels in them.</li>
 *   <li>A reference instrument serves the static calibration only when every point lies inside the range its
 *       calibration covers; otherwise another is chosen, or the reasoning names the points and ranges.</li>
 * </ul>
 */
public final class ProcedureDerivation {

    static final List<Double> DEFAULT_POINTS_PERCENT = List.of(0.0, 20.0, 40.0, 60.0, 80.0, 100.0);
    static final List<Double> ACCELEROMETER_POINTS_PERCENT = List.of(10.0, 20.0, 40.0, 60.0, 80.0, 100.0);
    static final double SAMPLE_RATE_FACTOR = 2.5;
    static final int SECONDS_PER_READING = 15;
    static final int SETUP_SECONDS = 600;

    private ProcedureDerivation() {
    }

    /**
     * Proposes a procedure.
     *
     * @param spec       the specification revision
     * @param options    AQL, inspection level, decision policy, lot sizes to tabulate
     * @param candidates reference instruments in calibration that could serve (any test; the best
     *                   covering one is chosen per test)
     * @return the proposal; metrics without a covering instrument get no planned uncertainty and no TUR,
     *         and say so in their reasoning
     */
    public static ProcedureProposal derive(SensorSpecification spec, DerivationOptions options,
                                           List<ReferenceCandidate> candidates) {
        List<String> reasoning = new ArrayList<>();
        StaticCalibration statics = staticCalibration(spec, candidates);
        Optional<ReferenceCandidate> staticRef = find(candidates, statics.referenceInstrument());
        NoiseCapture noise = noiseCapture(spec);
        FrequencySweep sweep = frequencySweep(spec, candidates);
        Optional<ReferenceCandidate> sweepRef = sweep == null ? Optional.empty() : find(candidates, sweep.referenceInstrument());

        List<MetricAcceptance> acceptance = new ArrayList<>();
        DecisionPolicy policy = options.policy();
        double span = spec.span();
        double fullScale = Math.max(Math.abs(spec.rangeMin()), Math.abs(spec.rangeMax()));
        // The worst (largest) stimulus uncertainty over the points, in input units.
        OptionalDouble stimulusU = staticRef.map(r -> OptionalDouble.of(statics.pointsInput().stream()
                .mapToDouble(x -> r.expandedUncertaintyAt().applyAsDouble(x)).max().orElse(0)))
                .orElse(OptionalDouble.empty());
        double k = staticRef.map(ReferenceCandidate::coverageFactor).orElse(2.0);
        String refId = staticRef.map(ReferenceCandidate::identifier).orElse(null);

        if (spec.sensitivity() != null) {
            var s = spec.sensitivity();
            Tolerance tol = Tolerance.between(s.nominal() - s.halfWidth(), s.nominal() + s.halfWidth());
            OptionalDouble u = staticRef.map(r -> {
                double top = spec.kind() == SensorKind.ACCELEROMETER ? spec.rangeMax() : topPoint(statics);
                double relative = r.expandedUncertaintyAt().applyAsDouble(top) / Math.abs(top);
                return OptionalDouble.of(Math.abs(s.nominal()) * relative);
            }).orElse(OptionalDouble.empty());
            acceptance.add(metric(Metric.SENSITIVITY, s.unit(), tol, u, k, policy, refId,
                    "Nominal " + fmt(s.nominal()) + " ± " + fmt(s.halfWidth()) + " " + s.unit()
                            + "; planned U is the reference's relative uncertainty at the top point carried to"
                            + " the slope (readout and repeatability are added from the readings).", false));
        }
        if (spec.zeroOffset() != null && spec.sensitivity() != null) {
            var z = spec.zeroOffset();
            Tolerance tol = Tolerance.between(z.nominal() - z.tolerance(), z.nominal() + z.tolerance());
            double nearestZero = statics.pointsInput().stream().min(Comparator.comparingDouble(Math::abs)).orElseThrow();
            OptionalDouble u = staticRef.map(r -> {
                double sensitivityInOutputPerInput = Units.convert(spec.sensitivity().nominal(),
                        spec.sensitivity().unit(), "(" + spec.outputUnit() + ")/(" + spec.inputUnit() + ")");
                double uOut = r.expandedUncertaintyAt().applyAsDouble(nearestZero) * Math.abs(sensitivityInOutputPerInput);
                return OptionalDouble.of(Units.convert(uOut, spec.outputUnit(), z.unit()));
            }).orElse(OptionalDouble.empty());
            acceptance.add(metric(Metric.ZERO_OFFSET, z.unit(), tol, u, k, policy, refId,
                    "Output at zero input, " + fmt(z.nominal()) + " ± " + fmt(z.tolerance()) + " " + z.unit()
                            + "; planned U is the reference's uncertainty at the point nearest zero ("
                            + fmt(nearestZero) + " " + spec.inputUnit() + ", a point error) times the nominal"
                            + " sensitivity.",
                    false));
        }
        OptionalDouble uPctFso = stimulusU.isPresent()
                ? OptionalDouble.of(stimulusU.getAsDouble() / span * 100.0) : OptionalDouble.empty();
        if (spec.accuracyPctFso() != null) {
            double a = spec.accuracyPctFso();
            acceptance.add(metric(Metric.ACCURACY, "%FSO", Tolerance.between(-a, a), uPctFso, k, policy, refId,
                    "Largest error against the nominal transfer function within ± " + fmt(a)
                            + " %FSO; planned U is the reference's largest uncertainty over the points in %FSO"
                            + " (a point error at each reading).",
                    false));
        }
        if (spec.nonlinearityPctFso() != null) {
            acceptance.add(metric(Metric.NONLINEARITY, "%FSO", Tolerance.atMost(spec.nonlinearityPctFso()), uPctFso,
                    k, policy, refId, (spec.nonlinearityReference() == SensorSpecification.NonlinearityReference.TERMINAL
                            ? "Terminal" : "Best-fit") + " nonlinearity at most " + fmt(spec.nonlinearityPctFso())
                            + " %FSO; reference U the largest over the points in %FSO (every point fixes the"
                            + " line); TUR from the span 0 … limit.", true));
        }
        String cancels = "; the reference's error at a set point is common to the readings compared there and"
                + " cancels, so no reference uncertainty and no TUR apply: U comes from the readings' scatter and"
                + " the readout at evaluation.";
        if (spec.hysteresisPctFso() != null) {
            acceptance.add(metric(Metric.HYSTERESIS, "%FSO", Tolerance.atMost(spec.hysteresisPctFso()),
                    OptionalDouble.empty(), k, policy, refId, "Hysteresis at most " + fmt(spec.hysteresisPctFso())
                            + " %FSO from ascending and descending points" + cancels, true));
        }
        if (spec.repeatabilityPctFso() != null) {
            acceptance.add(metric(Metric.REPEATABILITY, "%FSO", Tolerance.atMost(spec.repeatabilityPctFso()),
                    OptionalDouble.empty(), k, policy, refId, "Repeatability (pooled standard deviation over"
                            + " the cycles of the static plan) at most " + fmt(spec.repeatabilityPctFso())
                            + " %FSO" + cancels, true));
        }
        if (spec.rtd() != null) {
            ToleranceClass cls = ToleranceClass.parse(spec.rtd().toleranceClass());
            List<Double> inClassRange = rtdPointsInClassRange(spec, statics.pointsInput());
            List<Double> judged = inClassRange.isEmpty() ? statics.pointsInput() : inClassRange;
            double tightest = judged.stream().mapToDouble(cls::toleranceC).min().orElseThrow();
            double tightestAt = judged.stream().min(Comparator.comparingDouble(cls::toleranceC)).orElseThrow();
            OptionalDouble u = staticRef.map(r -> OptionalDouble.of(r.expandedUncertaintyAt().applyAsDouble(tightestAt)))
                    .orElse(OptionalDouble.empty());
            acceptance.add(metric(Metric.RTD_TOLERANCE, "°C", Tolerance.between(-tightest, tightest), u, k, policy,
                    refId, "IEC 60751 class " + cls.name() + ": temperature error within ± " + fmt(tightest)
                            + " °C at " + fmt(tightestAt) + " °C, the tightest point (each point is judged against"
                            + " its own class tolerance at evaluation); R0 = " + fmt(spec.rtd().r0Ohm()) + " Ω, "
                            + "R(t) by Callendar–Van Dusen.", false));
            // Check the curve exists for R0 (throws a clear message otherwise).
            CallendarVanDusen.iec60751(spec.rtd().r0Ohm());
            rtdOutsideClassRange(spec, statics.pointsInput()).ifPresent(reasoning::add);
        }
        if (spec.noiseFloor() != null) {
            var n = spec.noiseFloor();
            acceptance.add(metric(Metric.NOISE, n.unit() + " rms", Tolerance.atMost(n.limit()), OptionalDouble.empty(), 2,
                    policy, null, "RMS noise at zero input at most " + fmt(n.limit()) + " " + n.unit() + " ("
                            + n.referred().name().toLowerCase() + "-referred); a TUR does not apply to a noise"
                            + " floor: the readout's own noise must stay well below it.", true));
        }
        if (spec.resolution() != null) {
            acceptance.add(metric(Metric.RESOLUTION, spec.inputUnit(), Tolerance.atMost(spec.resolution()),
                    OptionalDouble.empty(), 2, policy, null, "Resolution (RMS noise / sensitivity) at most "
                            + fmt(spec.resolution()) + " " + spec.inputUnit() + "; no TUR.", true));
        }
        if (spec.bandwidth() != null) {
            var b = spec.bandwidth();
            if (b.minus3dBHz() != null) {
                acceptance.add(metric(Metric.BANDWIDTH, "Hz", Tolerance.atLeast(b.minus3dBHz()), OptionalDouble.empty(),
                        2, policy, sweepRef.map(ReferenceCandidate::identifier).orElse(null),
                        "−3 dB bandwidth at least " + fmt(b.minus3dBHz()) + " Hz; the frequency itself is set"
                                + " far more precisely than the limit, so no TUR.", false));
            } else {
                OptionalDouble u = sweepRef.map(r -> OptionalDouble.of(
                        r.expandedUncertaintyAt().applyAsDouble(sweep.amplitude()) / Math.abs(sweep.amplitude()) * 100))
                        .orElse(OptionalDouble.empty());
                MetricAcceptance m = metric(Metric.FLATNESS, "%", Tolerance.atMost(b.flatnessPercent()), u,
                        sweepRef.map(ReferenceCandidate::coverageFactor).orElse(2.0), policy,
                        sweepRef.map(ReferenceCandidate::identifier).orElse(null),
                        "Largest deviation from the reference amplitude within ± " + fmt(b.flatnessPercent())
                                + " % up to " + fmt(b.upToHz()) + " Hz; TUR from the two-sided band ± "
                                + fmt(b.flatnessPercent()) + " %.", false);
                // The band is two-sided (±flatness): TUR = 2·flatness / (2U).
                OptionalDouble tur = u.isPresent() && u.getAsDouble() > 0
                        ? OptionalDouble.of(b.flatnessPercent() / u.getAsDouble()) : OptionalDouble.empty();
                acceptance.add(new MetricAcceptance(m.metric(), m.unit(), m.toleranceLower(), m.toleranceUpper(),
                        m.plannedExpandedUncertainty(), m.coverageFactor(), m.acceptanceLower(), m.acceptanceUpper(),
                        tur, adequate(tur),
                        m.referenceInstrument(), m.reasoning()));
            }
        }
        for (MetricAcceptance m : acceptance) {
            if (m.testUncertaintyRatio().isPresent() && !m.turAdequate()) {
                reasoning.add("No reference instrument in the register reaches TUR 4:1 for " + m.metric().name()
                        .toLowerCase().replace('_', ' ') + " (best " + fmt(m.testUncertaintyRatio().getAsDouble())
                        + ":1): approval needs a recorded justification.");
            }
            if (m.plannedExpandedUncertainty().isEmpty() && m.reasoning().contains("planned U")) {
                reasoning.add("No reference instrument in calibration covers the range for "
                        + m.metric().name().toLowerCase().replace('_', ' ') + ".");
            }
        }

        List<SamplingRow> sampling = new ArrayList<>();
        for (int lotSize : options.typicalLotSizes()) {
            sampling.add(new SamplingRow(lotSize,
                    SingleSamplingPlans.plan(lotSize, options.aql(), options.level(), Severity.NORMAL),
                    SingleSamplingPlans.plan(lotSize, options.aql(), options.level(), Severity.TIGHTENED),
                    SingleSamplingPlans.plan(lotSize, options.aql(), options.level(), Severity.REDUCED)));
        }

        EnvironmentalLimits limits = EnvironmentalLimits.defaultFor(spec.kind());
        List<String> environment = environment(limits);
        List<String> cautions = new ArrayList<>(spec.kind().cautions());
        cautions.add("Acceptance by this inspection does not qualify a part for a safety function. Local codes,"
                + " licensed practice and the lab's own safety rules govern every test.");

        reasoning.add(benchSentence(statics, noise, sweep));
        return new ProcedureProposal(statics, noise, sweep, acceptance, sampling, environment, cautions,
                benchMinutes(statics, noise, sweep), reasoning, limits);
    }

    /** Opens the proposal's reasoning line on bench time, so that a restatement replaces it rather than adds one. */
    static final String BENCH_TIME = "Bench time: ";

    /**
     * Restates, after an engineer's edits, every text and figure that depends on an edited value, by the
     * same rules the derivation used: the static plan's sentences on points, directions, cycles and settle
     * time, the noise capture's sentences on sample rate and duration, the sweep's sentence on its
     * frequencies, and the bench time with its reasoning line. Nothing else changes: the reference
     * instruments, limits, sampling plans and cautions are carried over as they are.
     *
     * <p>Bench time t = 600 s set-up + n·(settle + 15 s) + (noise duration + 60 s) + 20 s per sweep point,
     * with n = points × directions × cycles readings per unit (the lab's own estimate, common practice),
     * rounded up to whole minutes.
     *
     * @param edited       the proposal with the engineer's values in place
     * @param spec         the specification it was derived from
     * @param benchMinutes the bench time the engineer set, which then replaces the estimate (and the
     *                     reasoning says so); empty to estimate it
     * @return the proposal with its dependent texts and figures recomputed
     */
    public static ProcedureProposal restate(ProcedureProposal edited, SensorSpecification spec,
                                            java.util.OptionalInt benchMinutes) {
        StaticCalibration s = edited.staticCalibration();
        List<String> staticWhy = new ArrayList<>(s.reasoning());
        if (staticWhy.size() >= 4) {
            staticWhy.set(0, pointsSentence(spec, s.pointsInput()));
            staticWhy.set(1, directionsSentence(s.directions()));
            staticWhy.set(2, cyclesSentence(spec, s.cycles()));
            staticWhy.set(3, settleSentence(spec, s.settleSeconds()));
        }
        s = new StaticCalibration(s.pointsPercentOfSpan(), s.pointsInput(), s.inputUnit(), s.directions(), s.cycles(),
                s.settleSeconds(), s.referenceInstrument(), staticWhy, s.appliedWindow());
        NoiseCapture n = edited.noiseCapture();
        if (n != null) {
            n = new NoiseCapture(n.samples(), n.sampleRateHz(), n.durationSeconds(),
                    noiseReasoning(spec, n.sampleRateHz(), n.durationSeconds(), n.samples()));
        }
        FrequencySweep f = edited.frequencySweep();
        if (f != null && !f.reasoning().isEmpty()) {
            List<String> why = new ArrayList<>(f.reasoning());
            why.set(0, sweepSentence(spec, f.referenceHz(), f.frequenciesHz()));
            f = new FrequencySweep(f.referenceHz(), f.frequenciesHz(), f.amplitude(), f.amplitudeUnit(),
                    f.referenceInstrument(), why);
        }
        int estimate = benchMinutes(s, n, f);
        List<String> reasoning = new ArrayList<>(edited.reasoning().stream().filter(r -> !r.startsWith(BENCH_TIME)).toList());
        String bench = benchSentence(s, n, f);
        if (benchMinutes.isPresent() && benchMinutes.getAsInt() != estimate) {
            bench = bench.substring(0, bench.length() - 1) + ": about " + estimate + " min; the engineer set "
                    + benchMinutes.getAsInt() + " min.";
        }
        reasoning.add(bench);
        return new ProcedureProposal(s, n, f, edited.acceptance(), edited.sampling(), edited.environment(),
                edited.cautions(), benchMinutes.orElse(estimate), reasoning, edited.environmentalLimits());
    }

    /** The bench time per unit in whole minutes, rounded up (formula in {@link #restate}). */
    static int benchMinutes(StaticCalibration statics, NoiseCapture noise, FrequencySweep sweep) {
        int seconds = SETUP_SECONDS + statics.readingsPerUnit() * (statics.settleSeconds() + SECONDS_PER_READING);
        if (noise != null) {
            seconds += (int) Math.ceil(noise.durationSeconds()) + 60;
        }
        if (sweep != null) {
            seconds += sweep.frequenciesHz().size() * 20;
        }
        return (int) Math.ceil(seconds / 60.0);
    }

    static String benchSentence(StaticCalibration statics, NoiseCapture noise, FrequencySweep sweep) {
        return BENCH_TIME + "10 min set-up, " + statics.readingsPerUnit() + " static readings ("
                + statics.pointsInput().size() + " points × " + statics.directions().size()
                + (statics.directions().size() == 1 ? " direction × " : " directions × ") + statics.cycles()
                + (statics.cycles() == 1 ? " cycle" : " cycles") + ") × ("
                + statics.settleSeconds() + " s settle + " + SECONDS_PER_READING + " s reading)"
                + (noise != null ? ", noise capture " + fmt(noise.durationSeconds()) + " s + 1 min" : "")
                + (sweep != null ? ", " + sweep.frequenciesHz().size() + " sweep points × 20 s" : "") + ".";
    }

    private static final String[] NUMBER_WORDS = {"Zero", "One", "Two", "Three", "Four", "Five", "Six", "Seven",
            "Eight", "Nine", "Ten", "Eleven", "Twelve"};

    private static String count(int n) {
        return n < NUMBER_WORDS.length ? NUMBER_WORDS[n] : String.valueOf(n);
    }

    private static List<Double> derivedPoints(SensorSpecification spec) {
        boolean accelerometer = spec.kind() == SensorKind.ACCELEROMETER;
        List<Double> percent = accelerometer ? ACCELEROMETER_POINTS_PERCENT : DEFAULT_POINTS_PERCENT;
        return percent.stream().map(p -> accelerometer ? round(spec.rangeMax() * p / 100.0)
                : round(spec.rangeMin() + spec.span() * p / 100.0)).toList();
    }

    static String pointsSentence(SensorSpecification spec, List<Double> points) {
        if (points.equals(derivedPoints(spec))) {
            return spec.kind() == SensorKind.ACCELEROMETER ? "Peak amplitudes of 10 … 100 % of the range at the"
                    + " reference frequency: a piezoelectric accelerometer has no static response."
                    : "Six points over the span, ends included.";
        }
        return count(points.size()) + " points set by the engineer: " + points.stream().map(ProcedureDerivation::fmt)
                .collect(java.util.stream.Collectors.joining(", ")) + " " + spec.inputUnit() + ".";
    }

    static String directionsSentence(List<Direction> directions) {
        return directions.size() == 2 ? "Ascending and descending, because hysteresis is specified."
                : "Ascending only: no hysteresis is specified.";
    }

    static String cyclesSentence(SensorSpecification spec, int cycles) {
        boolean repeatability = spec.repeatabilityPctFso() != null;
        if (cycles == 3 && repeatability) {
            return "Three cycles, because repeatability is specified.";
        }
        if (cycles == 1 && !repeatability) {
            return "One cycle: no repeatability is specified.";
        }
        return count(cycles) + (cycles == 1 ? " cycle" : " cycles") + ", set by the engineer ("
                + (repeatability ? "repeatability is specified: three cycles at least" : "no repeatability is specified")
                + ").";
    }

    static String settleSentence(SensorSpecification spec, int seconds) {
        String kind = spec.kind().name().toLowerCase().replace('_', ' ');
        return seconds == spec.kind().settleSeconds() ? "Settle " + seconds + " s per point for a " + kind + "."
                : "Settle " + seconds + " s per point, set by the engineer (" + spec.kind().settleSeconds()
                + " s is usual for a " + kind + ").";
    }

    static List<String> noiseReasoning(SensorSpecification spec, double rate, double duration, int samples) {
        double upper = spec.bandwidth() == null ? 0 : spec.bandwidth().upperHz();
        double lowest = spec.bandwidth() != null && spec.bandwidth().referenceHz() != null
                ? Math.min(1.0, spec.bandwidth().referenceHz()) : 1.0;
        double tenPeriods = Math.max(1.0, 10.0 / lowest);
        List<String> why = new ArrayList<>();
        why.add(upper > 0 ? "Sample rate " + fmt(rate) + " Hz ≥ 2.5 × the specified " + fmt(upper) + " Hz."
                : "Sample rate " + (rate == 1000.0 ? "1 kHz" : fmt(rate) + " Hz") + ": no bandwidth is specified.");
        why.add(Math.abs(duration - tenPeriods) <= 1e-9 * tenPeriods
                ? "Duration " + fmt(duration) + " s: ten periods of the lowest frequency of interest (" + fmt(lowest) + " Hz)."
                : "Duration " + fmt(duration) + " s (" + samples + " samples at " + fmt(rate) + " Hz); ten periods of the"
                + " lowest frequency of interest (" + fmt(lowest) + " Hz) take " + fmt(tenPeriods) + " s.");
        return why;
    }

    static String sweepSentence(SensorSpecification spec, double reference, List<Double> frequencies) {
        double limit = spec.bandwidth() == null ? 0 : spec.bandwidth().upperHz();
        FrequencySweep derived = spec.bandwidth() == null ? null : frequencySweep(spec, List.of());
        if (derived != null && derived.frequenciesHz().equals(frequencies)) {
            return "From the reference frequency " + fmt(reference) + " Hz, 3 points per decade up to "
                    + fmt(limit / 2) + " Hz, then 10 per decade up to " + fmt(limit * 2)
                    + " Hz, beyond the limit of " + fmt(limit) + " Hz.";
        }
        return count(frequencies.size()) + " frequencies set by the engineer, " + fmt(frequencies.get(0)) + " … "
                + fmt(frequencies.get(frequencies.size() - 1)) + " Hz"
                + (limit > 0 ? ", beyond the limit of " + fmt(limit) + " Hz." : ".");
    }

    /**
     * What the bench records for each unit, with the limits each must lie within.
     *
     * @param limits the procedure's environmental limits
     * @return one line per quantity to record
     */
    public static List<String> environment(EnvironmentalLimits limits) {
        return List.of(
                "Ambient temperature in °C, within " + limits.ambientText() + " (" + limits.basis() + ")",
                "Relative humidity in %, within " + limits.humidityText(),
                "Barometric pressure in kPa where the bench has a barometer (recorded, not judged)");
    }

    static StaticCalibration staticCalibration(SensorSpecification spec, List<ReferenceCandidate> candidates) {
        boolean accelerometer = spec.kind() == SensorKind.ACCELEROMETER;
        List<Double> percent = accelerometer ? ACCELEROMETER_POINTS_PERCENT : DEFAULT_POINTS_PERCENT;
        List<Double> inputs = percent.stream().map(p -> accelerometer ? round(spec.rangeMax() * p / 100.0)
                : round(spec.rangeMin() + spec.span() * p / 100.0)).toList();
        List<Direction> directions = spec.hysteresisPctFso() != null ? List.of(Direction.UP, Direction.DOWN)
                : List.of(Direction.UP);
        int cycles = spec.repeatabilityPctFso() != null ? 3 : 1;
        double min = inputs.stream().mapToDouble(Double::doubleValue).min().orElseThrow();
        double max = inputs.stream().mapToDouble(Double::doubleValue).max().orElseThrow();
        Optional<ReferenceCandidate> ref = best(candidates, TestKind.STATIC_CALIBRATION, min, max, max);
        List<String> why = new ArrayList<>();
        why.add(pointsSentence(spec, inputs));
        why.add(directionsSentence(directions));
        why.add(cyclesSentence(spec, cycles));
        why.add(settleSentence(spec, spec.kind().settleSeconds()));
        why.add(ref.map(r -> "Reference " + r.identifier() + ": in calibration, calibrated over every point ("
                + fmt(min) + " … " + fmt(max) + " " + spec.inputUnit() + ") with the smallest uncertainty.").orElse(
                "No reference instrument in calibration covers " + fmt(min) + " … " + fmt(max) + " " + spec.inputUnit()
                        + "." + outOfRange(candidates, TestKind.STATIC_CALIBRATION, inputs, spec.inputUnit())));
        why.add("Instruments per reading: " + spec.kind().instrumentRoles().entrySet().stream()
                .map(e -> e.getKey().name().toLowerCase(java.util.Locale.ROOT) + " — " + e.getValue())
                .collect(java.util.stream.Collectors.joining("; ")) + "; each in calibration when the reading is taken.");
        double window = StaticCalibration.defaultAppliedWindow(spec);
        why.add("The value the reference applies may lie within ±" + fmt(window) + " " + spec.inputUnit()
                + " of each set point (" + (spec.kind() == SensorKind.RTD || spec.kind() == SensorKind.THERMOCOUPLE
                ? "±0.5 °C for a dry block or bath" : "±1 % of the span") + "); the evaluation uses the applied value.");
        return new StaticCalibration(percent, inputs, spec.inputUnit(), directions, cycles, spec.kind().settleSeconds(),
                ref.map(ReferenceCandidate::identifier).orElse(null), why, window);
    }

    static NoiseCapture noiseCapture(SensorSpecification spec) {
        if (spec.noiseFloor() == null && spec.resolution() == null) {
            return null;
        }
        double upper = spec.bandwidth() == null ? 0 : spec.bandwidth().upperHz();
        double rate = Math.max(1000.0, niceCeil(SAMPLE_RATE_FACTOR * upper));
        double lowest = spec.bandwidth() != null && spec.bandwidth().referenceHz() != null
                ? Math.min(1.0, spec.bandwidth().referenceHz()) : 1.0;
        double duration = Math.max(1.0, 10.0 / lowest);
        int samples = (int) Math.ceil(rate * duration);
        return new NoiseCapture(samples, rate, duration, noiseReasoning(spec, rate, duration, samples));
    }

    static FrequencySweep frequencySweep(SensorSpecification spec, List<ReferenceCandidate> candidates) {
        if (spec.bandwidth() == null) {
            return null;
        }
        double limit = spec.bandwidth().upperHz();
        double reference = spec.bandwidth().referenceHz() != null ? spec.bandwidth().referenceHz()
                : Math.max(1.0, niceCeil(limit / 50.0));
        TreeSet<Double> frequencies = new TreeSet<>();
        frequencies.add(reference);
        addLogSpaced(frequencies, reference, limit / 2, 3);
        addLogSpaced(frequencies, Math.max(reference, limit / 2), limit * 2, 10);
        frequencies.add(limit);
        frequencies.add(round(limit * 2));
        List<Double> list = frequencies.stream().filter(f -> f >= reference).toList();
        double amplitude = round(Math.max(Math.abs(spec.rangeMax()), Math.abs(spec.rangeMin())) * 0.2);
        Optional<ReferenceCandidate> ref = best(candidates, TestKind.FREQUENCY_SWEEP, 0, amplitude, amplitude);
        List<String> why = List.of("From the reference frequency " + fmt(reference) + " Hz, 3 points per decade up to "
                        + fmt(limit / 2) + " Hz, then 10 per decade up to " + fmt(limit * 2)
                        + " Hz, beyond the limit of " + fmt(limit) + " Hz.",
                "Amplitude " + fmt(amplitude) + " " + spec.inputUnit() + " (20 % of the range): well above the noise,"
                        + " well below the mounting's limits.",
                ref.map(r -> "Reference " + r.identifier() + " covers the amplitude with the smallest uncertainty.")
                        .orElse("No reference instrument in calibration covers the sweep."));
        return new FrequencySweep(reference, list, amplitude, spec.inputUnit(),
                ref.map(ReferenceCandidate::identifier).orElse(null), why);
    }

    private static MetricAcceptance metric(Metric metric, String unit, Tolerance tolerance, OptionalDouble u, double k,
                                           DecisionPolicy policy, String referenceInstrument, String reasoning,
                                           boolean oneSidedFromZero) {
        if (u.isEmpty()) {
            return new MetricAcceptance(metric, unit, tolerance.lower(), tolerance.upper(), OptionalDouble.empty(), k,
                    tolerance.lower(), tolerance.upper(), OptionalDouble.empty(), false, referenceInstrument, reasoning);
        }
        ExpandedUncertainty expanded = ExpandedUncertainty.of(u.getAsDouble(), k);
        AcceptanceLimits limits = policy.acceptanceLimits(tolerance, expanded);
        OptionalDouble tur;
        if (oneSidedFromZero && tolerance.upper().isPresent() && tolerance.lower().isEmpty()) {
            // U = 0 would be a ratio without meaning (the register never gives it; a TUR is then left out).
            tur = u.getAsDouble() > 0 ? OptionalDouble.of(tolerance.upper().getAsDouble() / (2 * u.getAsDouble()))
                    : OptionalDouble.empty();
        } else {
            tur = DecisionPolicy.testUncertaintyRatio(tolerance, expanded);
        }
        boolean adequate = adequate(tur);
        return new MetricAcceptance(metric, unit, tolerance.lower(), tolerance.upper(), u, k, limits.lower(),
                limits.upper(), tur, adequate, referenceInstrument, reasoning);
    }

    /** TUR ≥ 4, with a relative allowance of 1e-12 so that a ratio of exactly 4 is not lost to rounding. */
    static boolean adequate(OptionalDouble tur) {
        return tur.isPresent() && tur.getAsDouble() >= DecisionPolicy.ADEQUATE_TEST_UNCERTAINTY_RATIO * (1 - 1e-12);
    }

    private static Optional<ReferenceCandidate> best(List<ReferenceCandidate> candidates, TestKind test, double min,
                                                     double max, double at) {
        return candidates.stream().filter(c -> c.test() == test && c.covers(min, max))
                .min(Comparator.comparingDouble(c -> c.expandedUncertaintyAt().applyAsDouble(at)));
    }

    /**
     * Why the candidates of a test do not qualify: per candidate, the points outside its calibrated range, e.g.
     * " RI-PRS-01 is calibrated over 0.2 … 20 bar only: 0 bar lies outside."
     */
    static String outOfRange(List<ReferenceCandidate> candidates, TestKind test, List<Double> points, String unit) {
        StringBuilder why = new StringBuilder();
        for (ReferenceCandidate c : candidates) {
            if (c.test() != test) {
                continue;
            }
            List<String> outside = points.stream().filter(x -> !c.covers(x, x)).map(ProcedureDerivation::fmt).toList();
            if (!outside.isEmpty()) {
                why.append(" ").append(c.identifier()).append(" is calibrated over ").append(fmt(c.rangeMin()))
                        .append(" … ").append(fmt(c.rangeMax())).append(" ").append(unit).append(" only: ")
                        .append(String.join(", ", outside)).append(" ").append(unit)
                        .append(outside.size() == 1 ? " lies" : " lie").append(" outside.");
            }
        }
        return why.toString();
    }

    private static Optional<ReferenceCandidate> find(List<ReferenceCandidate> candidates, String identifier) {
        return identifier == null ? Optional.empty()
                : candidates.stream().filter(c -> c.identifier().equals(identifier)).findFirst();
    }

    private static double topPoint(StaticCalibration statics) {
        return statics.pointsInput().stream().max(Comparator.comparingDouble(Math::abs)).orElseThrow();
    }

    private static void addLogSpaced(TreeSet<Double> into, double from, double to, int perDecade) {
        if (!(to > from) || from <= 0) {
            return;
        }
        double step = 1.0 / perDecade;
        for (double e = Math.log10(from); e <= Math.log10(to) + 1e-9; e += step) {
            into.add(round(Math.pow(10, e)));
        }
    }

    /** Three significant digits: a frequency or a point the technician can set and read. */
    static double round(double value) {
        if (value == 0 || !Double.isFinite(value)) {
            return value;
        }
        return new BigDecimal(value).round(new MathContext(3)).doubleValue();
    }

    /** The next number of the 1-1.25-1.6-2-2.5-3.2-4-5-6.4-8 series at or above the value. */
    static double niceCeil(double value) {
        if (value <= 0) {
            return 0;
        }
        double decade = Math.pow(10, Math.floor(Math.log10(value)));
        for (double m : new double[] {1, 1.25, 1.6, 2, 2.5, 3.2, 4, 5, 6.4, 8, 10}) {
            if (m * decade >= value - 1e-9 * decade) {
                return round(m * decade);
            }
        }
        return 10 * decade;
    }

    static String fmt(double value) {
        if (value == Math.rint(value) && Math.abs(value) < 1e9) {
            return String.valueOf((long) value);
        }
        return new BigDecimal(value).round(new MathContext(4)).stripTrailingZeros().toPlainString();
    }

    /**
     * The test temperatures at which the specification's IEC 60751 class is defined for its element's
     * construction (IEC 60751:2008 Table 3, {@link ToleranceClass#isValidAt(double, org.dockgate.core.rtd.RtdConstruction)}).
     */
    private static List<Double> rtdPointsInClassRange(SensorSpecification spec, List<Double> pointsC) {
        ToleranceClass cls = ToleranceClass.parse(spec.rtd().toleranceClass());
        return pointsC.stream().filter(t -> cls.isValidAt(t, spec.rtd().construction())).toList();
    }

    /**
     * A reasoning line flagging test temperatures outside the class's validity range for the element's
     * construction (IEC 60751:2008 Table 3): the class does not apply there, so those readings are
     * recorded but not judged against it.
     */
    private static Optional<String> rtdOutsideClassRange(SensorSpecification spec, List<Double> pointsC) {
        ToleranceClass cls = ToleranceClass.parse(spec.rtd().toleranceClass());
        var construction = spec.rtd().construction();
        List<String> outside = pointsC.stream().filter(t -> !cls.isValidAt(t, construction)).map(ProcedureDerivation::fmt)
                .toList();
        if (outside.isEmpty()) {
            return Optional.empty();
        }
        return Optional.of("Outside the validity range of class " + cls.name() + " for a " + construction.label()
                + " element (" + fmt(cls.minTemperatureC(construction)) + " … " + fmt(cls.maxTemperatureC(construction))
                + " °C, IEC 60751:2008 Table 3): " + String.join(", ", outside) + " °C. The class does not apply there:"
                + " those readings are recorded but not judged against it; trim the range or change the points to"
                + " judge the class over its whole range.");
    }
}
