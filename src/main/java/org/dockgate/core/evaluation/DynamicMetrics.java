package org.dockgate.core.evaluation;

import static org.dockgate.core.evaluation.UnitFactors.factor;
import static org.dockgate.core.evaluation.UnitFactors.fmt;
import static org.dockgate.core.evaluation.UnitFactors.quotient;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.Tolerance;
import org.dockgate.core.evaluation.Judgement.Judged;
import org.dockgate.core.metrics.FrequencyPoint;
import org.dockgate.core.metrics.FrequencyResponse;
import org.dockgate.core.metrics.NoiseAnalysis;
import org.dockgate.core.metrics.StaticCharacteristics;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.ProcedureProposal.MetricAcceptance;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.Referred;
import org.dockgate.core.uncertainty.UncertaintyContribution;

/** Noise, resolution, bandwidth and flatness of one unit with their budgets; formulas in {@link UnitEvaluation}. */
final class DynamicMetrics {

    /** 20/ln 10: dB per unit of relative amplitude change, d(20·log₁₀ A)/dA·A. */
    private static final double DB_PER_RELATIVE = 20.0 / Math.log(10.0);

    private final SensorSpecification spec;
    private final ProcedureProposal procedure;
    private final DecisionPolicy policy;
    private final MeasurementContext context;
    private final UnitMeasurements measurements;
    private final Optional<StaticCharacteristics> statics;
    private final String in;
    private final String out;

    DynamicMetrics(SensorSpecification spec, ProcedureProposal procedure, DecisionPolicy policy,
            UnitMeasurements measurements, Optional<StaticCharacteristics> statics) {
        this.spec = spec;
        this.procedure = procedure;
        this.policy = policy;
        this.context = measurements.context();
        this.measurements = measurements;
        this.statics = statics;
        this.in = spec.inputUnit();
        this.out = spec.outputUnit();
    }

    /** The sensitivity used to refer noise to the input: measured when there is a static fit, else nominal. */
    private record SensitivityUsed(double outputPerInput, OptionalDouble standardUncertainty, int degreesOfFreedom,
            String source) {
    }

    private SensitivityUsed sensitivity() {
        if (statics.isPresent()) {
            StaticCharacteristics sc = statics.get();
            return new SensitivityUsed(sc.sensitivity(), sc.sensitivityStdUncertainty(), sc.fit().degreesOfFreedom(),
                    "the measured sensitivity " + fmt(sc.sensitivity()) + " " + quotient(out, in));
        }
        if (spec.sensitivity() != null) {
            double s = spec.sensitivity().nominal() * factor(spec.sensitivity().unit(), quotient(out, in));
            return new SensitivityUsed(s, OptionalDouble.empty(), 0,
                    "the nominal sensitivity " + fmt(s) + " " + quotient(out, in) + " (no static calibration yet)");
        }
        throw new UnevaluableException("a sensitivity is needed to refer the noise to the input: no static"
                + " calibration yet and none in the specification");
    }

    private NoiseAnalysis noise(double sensitivity) {
        double[] samples = measurements.noiseSampleArray();
        if (samples.length < 2) {
            throw new UnevaluableException("fewer than two noise samples yet");
        }
        return NoiseAnalysis.of(samples, sensitivity);
    }

    MetricResult noise(MetricAcceptance a) {
        if (spec.noiseFloor() == null) {
            throw new UnevaluableException("the specification gives no noise floor");
        }
        if (spec.noiseFloor().referred() == Referred.INPUT) {
            return inputReferred(a, spec.noiseFloor().unit(), "input-referred RMS noise");
        }
        // Output-referred: the RMS does not depend on the sensitivity, which NoiseAnalysis needs non-zero.
        NoiseAnalysis analysis = noise(1.0);
        double f = factor(out, spec.noiseFloor().unit());
        double measured = analysis.rmsNoise() * f;
        List<UncertaintyContribution> lines = new ArrayList<>();
        lines.add(standardDeviationLine(analysis, f));
        lines.add(BudgetLines.none("reference certificate: no stimulus is applied at zero input, no contribution"));
        lines.add(BudgetLines.resolution(context.readoutResolution(), out, f, ": c = 1"));
        lines.addAll(BudgetLines.environment(context.environment(), "noise", Double.NaN, 0, Double.NaN, 0));
        Tolerance tolerance = Judgement.tolerance(a);
        Judged judged = Judgement.judge(measured, tolerance, lines, policy);
        return Judgement.result(a, measured, tolerance, judged, "Sample standard deviation of " + analysis.n()
                + " samples at zero input: " + fmt(measured) + " " + spec.noiseFloor().unit() + " rms.", List.of());
    }

    MetricResult resolution(MetricAcceptance a) {
        return inputReferred(a, in, "resolution (RMS noise / sensitivity)");
    }

    private MetricResult inputReferred(MetricAcceptance a, String unit, String what) {
        SensitivityUsed s = sensitivity();
        NoiseAnalysis analysis = noise(s.outputPerInput());
        double f = factor(in, unit);
        double measured = analysis.resolution() * f;
        double perOutput = f / Math.abs(s.outputPerInput());
        List<UncertaintyContribution> lines = new ArrayList<>();
        lines.add(standardDeviationLine(analysis, perOutput));
        lines.add(s.standardUncertainty().isPresent()
                ? BudgetLines.typeA("Type A: the sensitivity's standard uncertainty u(b₁), ν = " + s.degreesOfFreedom()
                        + ": c = −noise/S²", s.standardUncertainty().getAsDouble(), s.degreesOfFreedom(),
                        measured / Math.abs(s.outputPerInput()))
                : BudgetLines.none("sensitivity: " + s.source() + ", taken without uncertainty"));
        lines.add(BudgetLines.resolution(context.readoutResolution(), out, perOutput, ": c = 1/S"));
        lines.addAll(BudgetLines.environment(context.environment(), what, Double.NaN, 0, Double.NaN, 0));
        Tolerance tolerance = Judgement.tolerance(a);
        Judged judged = Judgement.judge(measured, tolerance, lines, policy);
        return Judgement.result(a, measured, tolerance, judged, "Sample standard deviation of " + analysis.n()
                + " samples at zero input over " + s.source() + ": " + fmt(measured) + " " + unit + ".", List.of());
    }

    /** u(s) ≈ s/√(2(N − 1)) for a sample standard deviation of N samples, ν = N − 1 (GUM E.4.3, from memory). */
    private static UncertaintyContribution standardDeviationLine(NoiseAnalysis analysis, double c) {
        int nu = analysis.n() - 1;
        return BudgetLines.typeA("Type A: uncertainty of a standard deviation of " + analysis.n()
                        + " samples, s/√(2(N − 1)) (GUM E.4.3), ν = " + nu, // clause number from memory; the source stays in the javadoc
                analysis.rmsNoise() / Math.sqrt(2.0 * nu), nu, c);
    }

    private FrequencyResponse response() {
        List<FrequencyPoint> points = measurements.sweepPoints();
        if (points.size() < 2) {
            throw new UnevaluableException("fewer than two frequency-response points yet");
        }
        Double reference = spec.bandwidth() != null && spec.bandwidth().referenceHz() != null
                ? spec.bandwidth().referenceHz()
                : procedure.frequencySweep() != null ? Double.valueOf(procedure.frequencySweep().referenceHz()) : null;
        return FrequencyResponse.of(points, reference == null ? OptionalDouble.empty() : OptionalDouble.of(reference));
    }

    /** The sweep reference's relative standard uncertainty u/a at the sweep amplitude a, if recorded. */
    private OptionalDouble sweepRelativeUncertainty() {
        if (context.sweepReference().isEmpty() || procedure.frequencySweep() == null) {
            return OptionalDouble.empty();
        }
        ReferenceUncertainty r = context.sweepReference().get();
        double amplitude = Math.abs(procedure.frequencySweep().amplitude());
        return OptionalDouble.of(r.expandedAt(amplitude) / r.coverageFactor() / amplitude);
    }

    private String sweepReferenceName() {
        return "reference " + context.sweepReference().map(ReferenceUncertainty::instrument).orElse("");
    }

    MetricResult bandwidth(MetricAcceptance a) {
        FrequencyResponse response = response();
        List<UncertaintyContribution> lines = new ArrayList<>();
        double measured;
        String note;
        if (response.withinSweep()) {
            measured = response.bandwidthHz().getAsDouble();
            // The segment holding the -3 dB crossing: the level is linear in log10 f there (as FrequencyResponse
            // interpolates), so dL/df = (ΔL/Δlog10 f) / (f ln 10).
            double fPrev = response.referenceFrequencyHz();
            double lPrev = 0.0;
            double slopeDbPerDecade = 0.0;
            for (FrequencyPoint p : response.points()) {
                if (p.frequencyHz() <= response.referenceFrequencyHz()) {
                    continue;
                }
                double level = response.levelDbAt(p.frequencyHz());
                if (level <= FrequencyResponse.HALF_POWER_LEVEL_DB) {
                    slopeDbPerDecade = (level - lPrev) / (Math.log10(p.frequencyHz()) - Math.log10(fPrev));
                    break;
                }
                fPrev = p.frequencyHz();
                lPrev = level;
            }
            double hzPerDb = measured * Math.log(10.0) / Math.abs(slopeDbPerDecade);
            OptionalDouble relative = sweepRelativeUncertainty();
            if (relative.isPresent()) {
                double uDb = DB_PER_RELATIVE * relative.getAsDouble();
                lines.add(BudgetLines.certificate(sweepReferenceName() + ": relative u of the amplitude at f, in"
                        + " dB, through the response's slope at the −3 dB point: c = 1/|dL/df|", uDb, hzPerDb));
                lines.add(BudgetLines.certificate(sweepReferenceName() + ": relative u of the amplitude at the"
                        + " reference frequency, in dB (taken as independent of the one at f): c = 1/|dL/df|", uDb,
                        hzPerDb));
            } else {
                lines.add(BudgetLines.none("sweep reference: not recorded, no contribution (the evaluation is"
                        + " incomplete)"));
            }
            note = "Frequency where the level falls to −3.0103 dB relative to " + fmt(response.referenceFrequencyHz())
                    + " Hz, interpolated linearly in dB against log f: " + fmt(measured) + " Hz.";
        } else {
            measured = response.points().get(response.points().size() - 1).frequencyHz();
            lines.add(BudgetLines.none("the level stays above −3 dB over the whole sweep; the highest frequency"
                    + " swept is a lower bound of the bandwidth, set closely enough to need no contribution"));
            note = "The level stays above −3 dB up to the highest frequency swept, " + fmt(measured)
                    + " Hz: the bandwidth is at least that (judged as that value).";
        }
        lines.add(BudgetLines.none("readout resolution: not applied to sweep amplitudes"));
        lines.addAll(BudgetLines.environment(context.environment(), "bandwidth", Double.NaN, 0, Double.NaN, 0));
        Tolerance tolerance = Judgement.tolerance(a);
        Judged judged = Judgement.judge(measured, tolerance, lines, policy);
        return Judgement.result(a, measured, tolerance, judged, note, List.of());
    }

    MetricResult flatness(MetricAcceptance a) {
        if (spec.bandwidth() == null || spec.bandwidth().upToHz() == null) {
            throw new UnevaluableException("the specification gives no flatness band");
        }
        FrequencyResponse response = response();
        double lowHz = response.points().get(0).frequencyHz();
        double highHz = spec.bandwidth().upToHz();
        double sweptHz = response.points().get(response.points().size() - 1).frequencyHz();
        if (highHz > sweptHz) {
            throw new UnevaluableException("the sweep reaches " + fmt(sweptHz) + " Hz, not yet the " + fmt(highHz)
                    + " Hz of the flatness band");
        }
        // Deviation in percent of the reference amplitude, 100·(A/A_ref − 1) = 100·(10^(L/20) − 1): examined at the
        // band edges and every point inside (the extreme of the interpolated curve lies at one of them).
        double worstHz = lowHz;
        double worst = deviationPercent(response.levelDbAt(lowHz));
        List<Double> candidates = new ArrayList<>();
        candidates.add(highHz);
        for (FrequencyPoint p : response.points()) {
            if (p.frequencyHz() > lowHz && p.frequencyHz() < highHz) {
                candidates.add(p.frequencyHz());
            }
        }
        for (double f : candidates) {
            double d = deviationPercent(response.levelDbAt(f));
            if (Math.abs(d) > Math.abs(worst)) {
                worst = d;
                worstHz = f;
            }
        }
        double measured = Math.abs(worst);
        double ratio = 1.0 + worst / 100.0;
        List<UncertaintyContribution> lines = new ArrayList<>();
        OptionalDouble relative = sweepRelativeUncertainty();
        if (relative.isPresent()) {
            double uPercent = 100.0 * relative.getAsDouble();
            lines.add(BudgetLines.certificate(sweepReferenceName() + ": relative u of the amplitude at "
                    + fmt(worstHz) + " Hz, in %: c = A/A_ref", uPercent, ratio));
            lines.add(BudgetLines.certificate(sweepReferenceName() + ": relative u of the amplitude at the reference"
                    + " frequency, in % (taken as independent of the one at f): c = A/A_ref", uPercent, ratio));
        } else {
            lines.add(BudgetLines.none("sweep reference: not recorded, no contribution (the evaluation is incomplete)"));
        }
        lines.add(BudgetLines.none("readout resolution: not applied to sweep amplitudes"));
        lines.addAll(BudgetLines.environment(context.environment(), "flatness", Double.NaN, 0, Double.NaN, 0));
        Tolerance tolerance = Judgement.tolerance(a);
        Judged judged = Judgement.judge(measured, tolerance, lines, policy);
        return Judgement.result(a, measured, tolerance, judged, "Largest deviation from the amplitude at "
                + fmt(response.referenceFrequencyHz()) + " Hz between " + fmt(lowHz) + " and " + fmt(highHz) + " Hz: "
                + fmt(worst) + " % at " + fmt(worstHz) + " Hz.", List.of());
    }

    private static double deviationPercent(double levelDb) {
        return 100.0 * (Math.pow(10.0, levelDb / 20.0) - 1.0);
    }
}
