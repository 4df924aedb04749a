package org.dockgate.core.evaluation;

import static org.dockgate.core.evaluation.UnitFactors.factor;
import static org.dockgate.core.evaluation.UnitFactors.fmt;
import static org.dockgate.core.evaluation.UnitFactors.quotient;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.NavigableMap;
import java.util.Optional;
import java.util.OptionalDouble;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.Tolerance;
import org.dockgate.core.evaluation.Judgement.Judged;
import org.dockgate.core.metrics.Accuracy;
import org.dockgate.core.metrics.StaticCharacteristics;
import org.dockgate.core.metrics.TransferFunction;
import org.dockgate.core.procedure.ProcedureProposal.MetricAcceptance;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.NonlinearityReference;
import org.dockgate.core.quantity.Units;
import org.dockgate.core.rtd.CallendarVanDusen;
import org.dockgate.core.rtd.ToleranceClass;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.CalibrationSeries;
import org.dockgate.core.series.Direction;
import org.dockgate.core.uncertainty.UncertaintyContribution;

/**
 * The static metrics of one unit (sensitivity, zero offset, nonlinearity, hysteresis, repeatability,
 * accuracy, an RTD's class tolerance) with their budgets. The formulas are in {@link UnitEvaluation}.
 */
final class StaticMetrics {

    private final SensorSpecification spec;
    private final DecisionPolicy policy;
    private final MeasurementContext context;
    /** The readings at their applied inputs: the fit, accuracy and RTD errors. */
    private final CalibrationSeries series;
    /** The readings referred to their set points along the fitted slope: grouping metrics. */
    private final CalibrationSeries grouped;
    /** The fit of {@link #series}: sensitivity, offset. */
    private final StaticCharacteristics characteristics;
    /** Of {@link #grouped}: nonlinearity, hysteresis, repeatability (the same as the fit's when all are on nominal). */
    private final StaticCharacteristics groupedCharacteristics;
    private final String notEvaluable;
    private final String in;
    private final String out;

    StaticMetrics(SensorSpecification spec, DecisionPolicy policy, MeasurementContext context,
            Optional<CalibrationSeries> series) {
        this.spec = spec;
        this.policy = policy;
        this.context = context;
        this.series = series.orElse(null);
        this.in = spec.inputUnit();
        this.out = spec.outputUnit();
        StaticCharacteristics sc = null;
        StaticCharacteristics gc = null;
        CalibrationSeries reduced = this.series;
        String reason = "no static readings yet";
        if (this.series != null) {
            boolean offNominal = this.series.points().stream().anyMatch(CalibrationPoint::offNominal);
            long setPoints = this.series.points().stream().mapToDouble(CalibrationPoint::nominal).distinct().count();
            if (setPoints < 2) {
                reason = "readings at two set points at least are needed, there are readings at one only";
            } else {
                try {
                    sc = StaticCharacteristics.of(this.series, spec.rangeMin(), spec.rangeMax());
                    if (offNominal) {
                        double slope = sc.sensitivity();
                        reduced = CalibrationSeries.of(this.series.points().stream()
                                .map(p -> p.reducedToNominal(slope)).toList());
                        gc = StaticCharacteristics.of(reduced, spec.rangeMin(), spec.rangeMax());
                    } else {
                        gc = sc;
                    }
                } catch (UnevaluableException e) {
                    reason = e.getMessage();
                    sc = null;
                    gc = null;
                }
            }
        }
        this.characteristics = sc;
        this.groupedCharacteristics = gc;
        this.grouped = reduced;
        this.notEvaluable = reason;
    }

    /** The fitted characteristics, absent with fewer than two set points. */
    Optional<StaticCharacteristics> characteristics() {
        return Optional.ofNullable(characteristics);
    }

    private StaticCharacteristics fit() {
        if (characteristics == null) {
            throw new UnevaluableException(notEvaluable);
        }
        return characteristics;
    }

    private StaticCharacteristics groupedFit() {
        if (groupedCharacteristics == null) {
            throw new UnevaluableException(notEvaluable);
        }
        return groupedCharacteristics;
    }

    private CalibrationSeries readings() {
        if (series == null) {
            throw new UnevaluableException("no static readings yet");
        }
        return series;
    }

    MetricResult sensitivity(MetricAcceptance a) {
        StaticCharacteristics sc = fit();
        double f = factor(quotient(out, in), a.unit());
        double slope = sc.sensitivity() * f;
        double[] x = series.inputs();
        double sxx = sumOfSquaredDeviations(x);
        double top = topInput(x);
        List<UncertaintyContribution> lines = new ArrayList<>();
        lines.add(sc.sensitivityStdUncertainty().isPresent()
                ? BudgetLines.typeA("Type A: standard uncertainty of the least-squares slope, s/√S_xx, ν = n − 2 = "
                        + sc.fit().degreesOfFreedom(), sc.sensitivityStdUncertainty().getAsDouble() * f,
                        sc.fit().degreesOfFreedom(), 1.0)
                : BudgetLines.none("Type A: two readings only, the slope's scatter cannot be evaluated"));
        lines.add(BudgetLines.reference(context.staticReference(), top, in, Math.abs(slope) / Math.abs(top),
                ", the top point; the slope takes the reference's error as a scale error (in proportion to the"
                        + " input): c = S/x"));
        lines.add(BudgetLines.resolution(context, out, f / Math.sqrt(sxx),
                ", independent at each reading: c = 1/√S_xx"));
        lines.addAll(BudgetLines.readout(context, sc.fit().valueAt(top), out, f / Math.abs(top),
                ", the top reading, taken as a scale error: c = 1/x"));
        lines.addAll(BudgetLines.excitation(context, "sensitivity", slope, 1.0));
        lines.addAll(BudgetLines.environment(context.environment(), "sensitivity", slope, 1.0, Double.NaN, 0));
        Tolerance tolerance = Judgement.tolerance(a);
        Judged judged = Judgement.judge(slope, tolerance, lines, policy);
        return Judgement.result(a, slope, tolerance, judged, "Least-squares slope of " + x.length + " readings: "
                + fmt(slope) + " " + a.unit() + ".", List.of());
    }

    MetricResult zeroOffset(MetricAcceptance a) {
        StaticCharacteristics sc = fit();
        double f = factor(out, a.unit());
        double offset = sc.offset() * f;
        double[] x = series.inputs();
        double sxx = sumOfSquaredDeviations(x);
        double mean = mean(x);
        double nearestZero = series.points().stream().mapToDouble(CalibrationPoint::input)
                .boxed().min(Comparator.comparingDouble(Math::abs)).orElseThrow();
        List<UncertaintyContribution> lines = new ArrayList<>();
        lines.add(sc.offsetStdUncertainty().isPresent()
                ? BudgetLines.typeA("Type A: standard uncertainty of the least-squares intercept, "
                        + "s·√(1/n + x̄²/S_xx), ν = n − 2 = " + sc.fit().degreesOfFreedom(),
                        sc.offsetStdUncertainty().getAsDouble() * f, sc.fit().degreesOfFreedom(), 1.0)
                : BudgetLines.none("Type A: two readings only, the intercept's scatter cannot be evaluated"));
        lines.add(BudgetLines.reference(context.staticReference(), nearestZero, in, Math.abs(sc.sensitivity()) * f,
                ", the point nearest zero input; the offset takes the reference's error there as a point error: c = S"));
        lines.add(BudgetLines.resolution(context, out,
                f * Math.sqrt(1.0 / x.length + mean * mean / sxx), ", independent at each reading: c = √(1/n + x̄²/S_xx)"));
        lines.addAll(BudgetLines.readout(context, sc.fit().valueAt(nearestZero), out, f,
                ", the reading nearest zero input: c = 1"));
        lines.addAll(BudgetLines.excitation(context, "zero offset", offset, 1.0));
        lines.addAll(BudgetLines.environment(context.environment(), "zero offset", offset, 1.0,
                sc.fullScaleOutput() * f, 1.0));
        Tolerance tolerance = Judgement.tolerance(a);
        Judged judged = Judgement.judge(offset, tolerance, lines, policy);
        return Judgement.result(a, offset, tolerance, judged, "Least-squares intercept (output at zero input) of "
                + x.length + " readings: " + fmt(offset) + " " + a.unit() + ".", List.of());
    }

    MetricResult nonlinearity(MetricAcceptance a) {
        StaticCharacteristics sc = groupedFit();
        boolean terminal = spec.nonlinearityReference() == NonlinearityReference.TERMINAL;
        double measured = terminal ? sc.nonlinearityTerminalPercentFso() : sc.nonlinearityBestFitPercentFso();
        NavigableMap<Double, Double> curve = grouped.meanOutputByInput();
        double xLo = curve.firstKey();
        double xHi = curve.lastKey();
        double yLo = curve.firstEntry().getValue();
        double yHi = curve.lastEntry().getValue();
        double worstInput = xLo;
        double worst = -1;
        for (Map.Entry<Double, Double> e : curve.entrySet()) {
            double line = terminal ? yLo + (yHi - yLo) * ((e.getKey() - xLo) / (xHi - xLo))
                    : sc.fit().valueAt(e.getKey());
            double deviation = Math.abs(e.getValue() - line);
            if (clearlyLarger(deviation, worst)) {
                worst = deviation;
                worstInput = e.getKey();
            }
        }
        int n = count(worstInput, null);
        double perOutput = 100.0 / sc.fullScaleOutput();
        List<UncertaintyContribution> lines = new ArrayList<>();
        lines.add(pooledRepeatability(sc).isPresent()
                ? BudgetLines.typeA("Type A: mean of " + n + " readings at " + fmt(worstInput) + " " + in
                        + ", s_p/√n with the pooled repeatability s_p, ν = " + sc.repeatabilityDegreesOfFreedom(),
                        sc.repeatabilityStdDev().getAsDouble() / Math.sqrt(n), sc.repeatabilityDegreesOfFreedom(),
                        perOutput)
                : BudgetLines.none("Type A: no set point read twice from one direction, scatter not evaluated"));
        lines.add(BudgetLines.referenceLargest(context.staticReference(), curve.keySet(), in, 100.0 / spec.span(),
                ", the largest over the set points; the deviation from a line takes the reference's error as a"
                        + " point error, and every set point fixes the line: c = 100/span"));
        lines.add(BudgetLines.resolution(context, out, perOutput, ": c = 100/FSO"));
        lines.addAll(BudgetLines.readout(context, curve.get(worstInput), out, perOutput,
                ", the set point of the largest deviation: c = 100/FSO"));
        lines.addAll(BudgetLines.excitation(context, "nonlinearity", Double.NaN, 0));
        lines.addAll(BudgetLines.environment(context.environment(), "nonlinearity", Double.NaN, 0, Double.NaN, 0));
        Tolerance tolerance = Judgement.tolerance(a);
        Judged judged = Judgement.judge(measured, tolerance, lines, policy);
        return Judgement.result(a, measured, tolerance, judged, (terminal ? "Terminal-based" : "Best-fit (least-squares)")
                + " nonlinearity: largest deviation of the mean curve from the " + (terminal ? "end-point" : "fitted")
                + " line at " + fmt(worstInput) + " " + in + ", over FSO = " + fmt(sc.fullScaleOutput()) + " " + out
                + ".", List.of());
    }

    MetricResult hysteresis(MetricAcceptance a) {
        StaticCharacteristics sc = groupedFit();
        if (sc.hysteresisPercentFso().isEmpty()) {
            throw new UnevaluableException("no set point was read in both directions yet (DOWN readings missing)");
        }
        double measured = sc.hysteresisPercentFso().getAsDouble();
        NavigableMap<Double, Double> up = grouped.meanOutputByInput(Direction.UP);
        NavigableMap<Double, Double> down = grouped.meanOutputByInput(Direction.DOWN);
        double worstInput = Double.NaN;
        double worst = -1;
        for (Map.Entry<Double, Double> e : up.entrySet()) {
            Double d = down.get(e.getKey());
            if (d != null && clearlyLarger(Math.abs(e.getValue() - d), worst)) {
                worst = Math.abs(e.getValue() - d);
                worstInput = e.getKey();
            }
        }
        int nUp = count(worstInput, Direction.UP);
        int nDown = count(worstInput, Direction.DOWN);
        double perOutput = 100.0 / sc.fullScaleOutput();
        List<UncertaintyContribution> lines = new ArrayList<>();
        lines.add(pooledRepeatability(sc).isPresent()
                ? BudgetLines.typeA("Type A: difference of the UP mean of " + nUp + " and the DOWN mean of " + nDown
                        + " readings at " + fmt(worstInput) + " " + in + ", s_p·√(1/n_up + 1/n_down), ν = "
                        + sc.repeatabilityDegreesOfFreedom(),
                        sc.repeatabilityStdDev().getAsDouble() * Math.sqrt(1.0 / nUp + 1.0 / nDown),
                        sc.repeatabilityDegreesOfFreedom(), perOutput)
                : BudgetLines.none("Type A: no set point read twice from one direction, scatter not evaluated"));
        lines.add(BudgetLines.none("reference certificate: its error at a set point is common to the UP and DOWN"
                + " readings there and cancels in their difference, no contribution"));
        lines.add(BudgetLines.resolution(context, out, Math.sqrt(2.0) * perOutput,
                ", two readings differenced: c = √2·100/FSO"));
        lines.addAll(BudgetLines.readoutCancels(context, "hysteresis"));
        lines.addAll(BudgetLines.excitation(context, "hysteresis", Double.NaN, 0));
        lines.addAll(BudgetLines.environment(context.environment(), "hysteresis", Double.NaN, 0, Double.NaN, 0));
        Tolerance tolerance = Judgement.tolerance(a);
        Judged judged = Judgement.judge(measured, tolerance, lines, policy);
        return Judgement.result(a, measured, tolerance, judged, "Largest difference of the UP and DOWN means at "
                + fmt(worstInput) + " " + in + ", over FSO = " + fmt(sc.fullScaleOutput()) + " " + out + ".",
                List.of());
    }

    MetricResult repeatability(MetricAcceptance a) {
        StaticCharacteristics sc = groupedFit();
        if (pooledRepeatability(sc).isEmpty()) {
            throw new UnevaluableException(
                    "no set point was read twice from the same direction yet (the repeat cycles are missing)");
        }
        double measured = sc.repeatabilityPercentFso().getAsDouble();
        double s = sc.repeatabilityStdDev().getAsDouble();
        int nu = sc.repeatabilityDegreesOfFreedom();
        double perOutput = 100.0 / sc.fullScaleOutput();
        List<UncertaintyContribution> lines = new ArrayList<>();
        lines.add(BudgetLines.typeA("Type A: uncertainty of a standard deviation with ν = " + nu
                + " degrees of freedom, s_p/√(2ν) (GUM E.4.3)", s / Math.sqrt(2.0 * nu), nu, // GUM E.4.3: clause number from memory
                perOutput));
        lines.add(BudgetLines.none("reference certificate: its error at a set point is common to every cycle there"
                + " and cancels in the scatter about the point's mean, no contribution"));
        lines.add(BudgetLines.resolution(context, out, perOutput, ": c = 100/FSO"));
        lines.addAll(BudgetLines.readoutCancels(context, "repeatability"));
        lines.addAll(BudgetLines.excitation(context, "repeatability", Double.NaN, 0));
        lines.addAll(BudgetLines.environment(context.environment(), "repeatability", Double.NaN, 0, Double.NaN, 0));
        Tolerance tolerance = Judgement.tolerance(a);
        Judged judged = Judgement.judge(measured, tolerance, lines, policy);
        return Judgement.result(a, measured, tolerance, judged, "Pooled standard deviation s_p = " + fmt(s) + " " + out
                + " of the readings repeated at each set point and direction (ν = " + nu + "), over FSO = "
                + fmt(sc.fullScaleOutput()) + " " + out + ".", List.of());
    }

    MetricResult accuracy(MetricAcceptance a) {
        CalibrationSeries readings = readings();
        TransferFunction nominal = nominalCurve().orElseThrow(() -> new UnevaluableException(
                "the specification gives no nominal transfer function (a sensitivity or an RTD curve)"));
        Accuracy largest = Accuracy.of(readings, nominal, spec.rangeMin(), spec.rangeMax());
        double span = spec.span();
        double nominalFso = Math.abs(nominal.output(spec.rangeMax()) - nominal.output(spec.rangeMin()));
        Tolerance tolerance = Judgement.tolerance(a);
        List<PointCheck> checks = new ArrayList<>();
        List<Judged> judgedPoints = new ArrayList<>();
        for (CalibrationPoint p : readings.points()) {
            double error = (nominal.input(p.output()) - p.input()) / span * 100.0;
            double perOutput = 100.0 / (span * Math.abs(nominal.sensitivityAt(p.input())));
            List<UncertaintyContribution> lines = new ArrayList<>();
            lines.add(pooledRepeatability(groupedCharacteristics).isPresent()
                    ? BudgetLines.typeA("Type A: one reading, the pooled repeatability s_p, ν = "
                            + groupedCharacteristics.repeatabilityDegreesOfFreedom(),
                            groupedCharacteristics.repeatabilityStdDev().getAsDouble(),
                            groupedCharacteristics.repeatabilityDegreesOfFreedom(), perOutput)
                    : BudgetLines.none("Type A: no set point read twice from one direction, scatter not evaluated"));
            lines.add(BudgetLines.reference(context.staticReference(), p.input(), in, 100.0 / span,
                    ", this reading's set point; a point error: c = 100/span"));
            lines.add(BudgetLines.resolution(context, out, perOutput,
                    ": c = 100/(span·S_nominal)"));
            lines.addAll(BudgetLines.readout(context, p.output(), out, perOutput, ": c = 100/(span·S_nominal)"));
            lines.addAll(BudgetLines.excitation(context, "accuracy", p.output(), perOutput));
            lines.addAll(BudgetLines.environment(context.environment(), "accuracy", p.output(), perOutput, nominalFso,
                    perOutput));
            Judged judged = Judgement.judge(error, tolerance, lines, policy);
            judgedPoints.add(judged);
            checks.add(new PointCheck(p.input(), p.direction(), p.cycle(), error, tolerance, judged.expanded(),
                    judged.budget(), judged.decision().verdict(), judged.decision().probabilityOfConformance()));
        }
        int deciding = decidingPoint(checks);
        PointCheck d = checks.get(deciding);
        return Judgement.result(a, d.error(), tolerance, judgedPoints.get(deciding), "Error of each reading against"
                + " the nominal transfer function, in % of the span; the largest is " + fmt(signedLargest(largest))
                + " %FSO at " + fmt(largest.worstReading().input()) + " " + in + "; deciding reading: "
                + describe(d) + ".", checks);
    }

    MetricResult rtdTolerance(MetricAcceptance a) {
        CalibrationSeries readings = readings();
        if (spec.rtd() == null) {
            throw new UnevaluableException("the specification gives no RTD class");
        }
        ToleranceClass cls = ToleranceClass.parse(spec.rtd().toleranceClass());
        CallendarVanDusen curve = CallendarVanDusen.iec60751(spec.rtd().r0Ohm());
        double celsiusPerInput = factor(in, "Cel");
        double ohmPerOutput = factor(out, "Ohm");
        double fsoOhm = Math.abs(curve.resistanceOhm(Units.convert(spec.rangeMax(), in, "Cel"))
                - curve.resistanceOhm(Units.convert(spec.rangeMin(), in, "Cel")));
        List<PointCheck> checks = new ArrayList<>();
        List<Judged> judgedPoints = new ArrayList<>();
        List<String> outside = new ArrayList<>();
        for (CalibrationPoint p : readings.points()) {
            double t = Units.convert(p.input(), in, "Cel");
            double error = curve.temperatureC(p.output() * ohmPerOutput) - t;
            double halfWidth = cls.toleranceC(t);
            if (!cls.isValidAt(t, spec.rtd().construction())) {
                // IEC 60751:2008 Table 3: the class is not defined here for this construction, so no verdict.
                outside.add(fmt(t));
                continue;
            }
            Tolerance tolerance = Tolerance.between(-halfWidth, halfWidth);
            double perOutput = ohmPerOutput / curve.sensitivityOhmPerC(t);
            List<UncertaintyContribution> lines = new ArrayList<>();
            lines.add(pooledRepeatability(groupedCharacteristics).isPresent()
                    ? BudgetLines.typeA("Type A: one reading, the pooled repeatability s_p, ν = "
                            + groupedCharacteristics.repeatabilityDegreesOfFreedom(),
                            groupedCharacteristics.repeatabilityStdDev().getAsDouble(),
                            groupedCharacteristics.repeatabilityDegreesOfFreedom(), perOutput)
                    : BudgetLines.none("Type A: single readings at each temperature, scatter not evaluated"));
            lines.add(BudgetLines.reference(context.staticReference(), p.input(), in, celsiusPerInput,
                    ", this reading's set point; a point error: c = 1 (the error is t(R) − t_reference)"));
            lines.add(BudgetLines.resolution(context, out, perOutput, ": c = 1/(dR/dt)"));
            lines.addAll(BudgetLines.readout(context, p.output(), out, perOutput, ": c = 1/(dR/dt)"));
            lines.addAll(BudgetLines.excitation(context, "temperature error", p.output(), perOutput));
            lines.addAll(BudgetLines.environment(context.environment(), "temperature error", p.output(), perOutput,
                    fsoOhm / ohmPerOutput, perOutput));
            Judged judged = Judgement.judge(error, tolerance, lines, policy);
            judgedPoints.add(judged);
            checks.add(new PointCheck(p.input(), p.direction(), p.cycle(), error, tolerance, judged.expanded(),
                    judged.budget(), judged.decision().verdict(), judged.decision().probabilityOfConformance()));
        }
        var construction = spec.rtd().construction();
        String notApplied = " Class " + cls.name() + " does not apply at " + String.join(", ", outside) + " °C: outside"
                + " its validity range for a " + construction.label() + " element, " + fmt(cls.minTemperatureC(construction))
                + " … " + fmt(cls.maxTemperatureC(construction)) + " °C (IEC 60751:2008 Table 3); those readings are"
                + " not judged.";
        if (checks.isEmpty()) {
            throw new UnevaluableException("no reading lies where class " + cls.name() + " applies to a "
                    + construction.label() + " element (" + fmt(cls.minTemperatureC(construction)) + " … "
                    + fmt(cls.maxTemperatureC(construction)) + " °C, IEC 60751:2008 Table 3)");
        }
        int deciding = decidingPoint(checks);
        PointCheck d = checks.get(deciding);
        String note = "Temperature error t(R) − t_reference of each reading, t(R) by the IEC 60751 Callendar–Van Dusen"
                + " equation with R0 = " + fmt(spec.rtd().r0Ohm()) + " Ω, judged against class " + cls.name()
                + " (" + construction.label() + ") ±(tolerance at that temperature); deciding reading: " + describe(d)
                + ", tolerance ±" + fmt(d.tolerance().upper().getAsDouble()) + " °C.";
        if (!outside.isEmpty()) {
            note += notApplied;
        }
        return Judgement.result(a, d.error(), d.tolerance(), judgedPoints.get(deciding), note, checks);
    }

    /**
     * The nominal transfer function in the specification's units: the IEC 60751 curve for an RTD, else the
     * line S_nominal·x + offset_nominal (offset 0 when the datasheet gives none).
     */
    Optional<TransferFunction> nominalCurve() {
        if (spec.rtd() != null) {
            CallendarVanDusen curve = CallendarVanDusen.iec60751(spec.rtd().r0Ohm());
            double ohmPerOutput = factor(out, "Ohm");
            return Optional.of(new TransferFunction() {
                @Override
                public double output(double input) {
                    return curve.resistanceOhm(Units.convert(input, in, "Cel")) / ohmPerOutput;
                }

                @Override
                public double input(double output) {
                    return Units.convert(curve.temperatureC(output * ohmPerOutput), "Cel", in);
                }

                @Override
                public double sensitivityAt(double input) {
                    // dy/dx = (dR/dt)·(dt/dx)/(Ω per output unit), dt/dx the size of the input unit in °C
                    return curve.sensitivityOhmPerC(Units.convert(input, in, "Cel")) * factor(in, "Cel")
                            / ohmPerOutput;
                }
            });
        }
        if (spec.sensitivity() != null) {
            double s = spec.sensitivity().nominal() * factor(spec.sensitivity().unit(), quotient(out, in));
            double offset = spec.zeroOffset() == null ? 0.0
                    : spec.zeroOffset().nominal() * factor(spec.zeroOffset().unit(), out);
            return Optional.of(TransferFunction.linear(s, offset));
        }
        return Optional.empty();
    }

    /**
     * Larger beyond rounding (10⁻⁹ relative): equal deviations at several set points keep the first, whatever
     * the last bits of their sums say.
     */
    private static boolean clearlyLarger(double value, double than) {
        return value > than + 1e-9 * Math.abs(than);
    }

    /**
     * The deciding point: the worst verdict; among equal verdicts the lowest probability of conformance; among
     * equal probabilities (p_c rounds to 1 well inside a tolerance) the smallest margin to a tolerance limit,
     * relative to the tolerance's half-width; then the first.
     */
    static int decidingPoint(List<PointCheck> checks) {
        int best = 0;
        for (int i = 1; i < checks.size(); i++) {
            PointCheck c = checks.get(i);
            PointCheck b = checks.get(best);
            int byVerdict = c.verdict().compareTo(b.verdict());
            if (byVerdict > 0 || (byVerdict == 0 && (c.probabilityOfConformance() < b.probabilityOfConformance()
                    || (c.probabilityOfConformance() == b.probabilityOfConformance()
                            && relativeMargin(c) < relativeMargin(b) - 1e-12)))) {
                best = i;
            }
        }
        return best;
    }

    /** The distance from the error to the nearer tolerance limit (negative outside), over the half-width. */
    private static double relativeMargin(PointCheck p) {
        Tolerance t = p.tolerance();
        double margin = Double.POSITIVE_INFINITY;
        if (t.upper().isPresent()) {
            margin = Math.min(margin, t.upper().getAsDouble() - p.error());
        }
        if (t.lower().isPresent()) {
            margin = Math.min(margin, p.error() - t.lower().getAsDouble());
        }
        return t.width().isPresent() ? margin / (t.width().getAsDouble() / 2) : margin;
    }

    private String describe(PointCheck p) {
        return fmt(p.input()) + " " + in + " " + p.direction() + " cycle " + p.cycle() + ", error " + fmt(p.error())
                + ", " + p.verdict();
    }

    private static double signedLargest(Accuracy accuracy) {
        return Math.copySign(accuracy.maxErrorPercentSpan(), accuracy.maxErrorInput());
    }

    private static OptionalDouble pooledRepeatability(StaticCharacteristics sc) {
        return sc == null ? OptionalDouble.empty() : sc.repeatabilityStdDev();
    }

    private int count(double input, Direction direction) {
        return (int) grouped.points().stream()
                .filter(p -> p.input() == input && (direction == null || p.direction() == direction)).count();
    }

    private static double topInput(double[] inputs) {
        double top = 0;
        for (double x : inputs) {
            if (Math.abs(x) > Math.abs(top)) {
                top = x;
            }
        }
        return top;
    }

    private static double mean(double[] values) {
        double sum = 0;
        for (double v : values) {
            sum += v;
        }
        return sum / values.length;
    }

    /** S_xx = Σ(x − x̄)² over all readings. */
    private static double sumOfSquaredDeviations(double[] values) {
        double m = mean(values);
        double s = 0;
        for (double v : values) {
            s += (v - m) * (v - m);
        }
        return s;
    }
}
