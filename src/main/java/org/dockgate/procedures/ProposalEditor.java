package org.dockgate.procedures;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.dockgate.core.procedure.EnvironmentalLimits;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.ProcedureDerivation;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.ProcedureProposal.FrequencySweep;
import org.dockgate.core.procedure.ProcedureProposal.MetricAcceptance;
import org.dockgate.core.procedure.ProcedureProposal.NoiseCapture;
import org.dockgate.core.procedure.ProcedureProposal.StaticCalibration;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.platform.RefusedField;

/**
 * Applies an engineer's edits to a derived proposal. Each editable value has a key; a value that breaks
 * a rule of the trade (points outside the range, a sample rate below 2.5 × the bandwidth, an acceptance
 * limit outside the tolerance) is refused with the reason.
 */
final class ProposalEditor {

    /** The editable values and what each means, for the page and the API. */
    static final Map<String, String> FIELDS = new LinkedHashMap<>();

    static {
        FIELDS.put("static.points", "Static test points, in the input unit, comma-separated");
        FIELDS.put("static.cycles", "Number of cycles");
        FIELDS.put("static.settleSeconds", "Settle time per point (s)");
        FIELDS.put("static.instrument", "Reference instrument for the static calibration (identifier)");
        FIELDS.put("noise.samples", "Noise capture: number of samples");
        FIELDS.put("noise.sampleRateHz", "Noise capture: sample rate (Hz)");
        FIELDS.put("sweep.frequencies", "Frequency sweep: frequencies in Hz, comma-separated");
        FIELDS.put("sweep.instrument", "Reference instrument for the frequency sweep (identifier)");
        FIELDS.put("benchMinutes", "Estimated bench time per unit (min)");
        FIELDS.put("environment.ambientMinC", "Lowest ambient temperature allowed at the bench (°C)");
        FIELDS.put("environment.ambientMaxC", "Highest ambient temperature allowed at the bench (°C)");
        FIELDS.put("environment.humidityMinPercent", "Lowest relative humidity allowed at the bench (% RH)");
        FIELDS.put("environment.humidityMaxPercent", "Highest relative humidity allowed at the bench (% RH)");
        for (Metric m : Metric.values()) {
            FIELDS.put("limit." + m.name() + ".lower", "Acceptance lower limit for " + m.name().toLowerCase().replace('_', ' '));
            FIELDS.put("limit." + m.name() + ".upper", "Acceptance upper limit for " + m.name().toLowerCase().replace('_', ' '));
        }
    }

    private ProposalEditor() {
    }

    static void requireKnown(String field) {
        if (!FIELDS.containsKey(field)) {
            throw new IllegalArgumentException("'" + field + "' is not an editable value. Editable: "
                    + String.join(", ", FIELDS.keySet().stream().filter(f -> !f.startsWith("limit.")).toList())
                    + ", limit.<METRIC>.lower|upper.");
        }
    }

    static ProcedureProposal apply(ProcedureProposal p, SensorSpecification spec, Map<String, String> overrides) {
        StaticCalibration s = p.staticCalibration();
        NoiseCapture n = p.noiseCapture();
        FrequencySweep f = p.frequencySweep();
        List<MetricAcceptance> acceptance = new ArrayList<>(p.acceptance());
        java.util.OptionalInt minutes = java.util.OptionalInt.empty();
        EnvironmentalLimits limits = p.environmentalLimits();
        boolean limitsEdited = false;
        for (var e : overrides.entrySet()) {
            String key = e.getKey();
            String field = "overrides." + key;
            if (!FIELDS.containsKey(key)) {
                try {
                    requireKnown(key);
                } catch (IllegalArgumentException unknown) {
                    throw new RefusedField(field, unknown.getMessage());
                }
            }
            if (e.getValue() == null) {
                throw new RefusedField(field, "The override '" + key + "' (" + field + ") has no value: give it as"
                        + " text, e.g. \"" + key + "\": \"" + example(key) + "\", or leave it out to keep the proposed value.");
            }
            String value = e.getValue().trim();
            switch (key) {
                case "static.points" -> {
                    List<Double> points = numbers(value, key);
                    for (double x : points) {
                        if (x < spec.rangeMin() - 1e-9 * spec.span() || x > spec.rangeMax() + 1e-9 * spec.span()) {
                            throw new IllegalArgumentException("The point " + x + " " + spec.inputUnit()
                                    + " lies outside the input range " + spec.rangeMin() + " … " + spec.rangeMax() + ".");
                        }
                    }
                    if (points.stream().distinct().count() < 2) {
                        throw new IllegalArgumentException("A static calibration needs at least two distinct points.");
                    }
                    List<Double> percent = points.stream().map(x -> (x - spec.rangeMin()) / spec.span() * 100).toList();
                    s = new StaticCalibration(percent, points, s.inputUnit(), s.directions(), s.cycles(), s.settleSeconds(),
                            s.referenceInstrument(), s.reasoning(), s.appliedWindow());
                }
                case "static.cycles" -> {
                    int cycles = whole(value, key, 1, 20);
                    if (spec.repeatabilityPctFso() != null && cycles < 3) {
                        throw new IllegalArgumentException("Repeatability is specified: keep at least 3 cycles.");
                    }
                    s = new StaticCalibration(s.pointsPercentOfSpan(), s.pointsInput(), s.inputUnit(), s.directions(),
                            cycles, s.settleSeconds(), s.referenceInstrument(), s.reasoning(), s.appliedWindow());
                }
                case "static.settleSeconds" -> s = new StaticCalibration(s.pointsPercentOfSpan(), s.pointsInput(),
                        s.inputUnit(), s.directions(), s.cycles(), whole(value, key, 0, 7200), s.referenceInstrument(),
                        s.reasoning(), s.appliedWindow());
                case "static.appliedWindow" -> s = s.withAppliedWindow(positive(value, key));
                case "noise.samples" -> {
                    require(n != null, "This procedure has no noise capture.");
                    int samples = whole(value, key, 100, 100_000_000);
                    n = new NoiseCapture(samples, n.sampleRateHz(), samples / n.sampleRateHz(), n.reasoning());
                }
                case "noise.sampleRateHz" -> {
                    require(n != null, "This procedure has no noise capture.");
                    double rate = positive(value, key);
                    if (spec.bandwidth() != null && rate < 2.5 * spec.bandwidth().upperHz()) {
                        throw new IllegalArgumentException("The sample rate must be at least 2.5 × the specified "
                                + spec.bandwidth().upperHz() + " Hz, i.e. " + 2.5 * spec.bandwidth().upperHz() + " Hz.");
                    }
                    n = new NoiseCapture(n.samples(), rate, n.samples() / rate, n.reasoning());
                }
                case "sweep.frequencies" -> {
                    require(f != null, "This procedure has no frequency sweep.");
                    List<Double> freqs = numbers(value, key).stream().sorted().toList();
                    if (freqs.stream().anyMatch(x -> x <= 0)) {
                        throw new IllegalArgumentException("Frequencies must be positive.");
                    }
                    if (spec.bandwidth() != null && freqs.get(freqs.size() - 1) <= spec.bandwidth().upperHz()) {
                        throw new IllegalArgumentException("The sweep must go beyond the specified "
                                + spec.bandwidth().upperHz() + " Hz.");
                    }
                    f = new FrequencySweep(f.referenceHz(), freqs, f.amplitude(), f.amplitudeUnit(), f.referenceInstrument(),
                            f.reasoning());
                }
                case "benchMinutes" -> minutes = java.util.OptionalInt.of(whole(value, key, 1, 100_000));
                case "environment.ambientMinC", "environment.ambientMaxC", "environment.humidityMinPercent",
                     "environment.humidityMaxPercent" -> {
                    double v = number(value, key);
                    limits = new EnvironmentalLimits(
                            key.endsWith("ambientMinC") ? v : limits.ambientMinC(),
                            key.endsWith("ambientMaxC") ? v : limits.ambientMaxC(),
                            key.endsWith("humidityMinPercent") ? v : limits.humidityMinPercent(),
                            key.endsWith("humidityMaxPercent") ? v : limits.humidityMaxPercent(),
                            "set by the engineer");
                    limitsEdited = true;
                }
                case "static.instrument", "sweep.instrument" -> {
                    // applied by restricting the candidates before derivation
                }
                default -> {
                    String[] parts = key.split("\\.");
                    Metric metric = Metric.valueOf(parts[1]);
                    double limit = finite(value, key);
                    int index = -1;
                    for (int i = 0; i < acceptance.size(); i++) {
                        if (acceptance.get(i).metric() == metric) {
                            index = i;
                        }
                    }
                    require(index >= 0, "This procedure does not judge " + metric + ".");
                    MetricAcceptance a = acceptance.get(index);
                    boolean lower = parts[2].equals("lower");
                    OptionalDouble tol = lower ? a.toleranceLower() : a.toleranceUpper();
                    require(tol.isPresent(), "The " + metric + " tolerance has no " + parts[2] + " limit to move.");
                    if (lower ? limit < tol.getAsDouble() : limit > tol.getAsDouble()) {
                        throw new IllegalArgumentException("An acceptance limit may not lie outside the tolerance ("
                                + parts[2] + " tolerance limit " + tol.getAsDouble() + ").");
                    }
                    acceptance.set(index, new MetricAcceptance(a.metric(), a.unit(), a.toleranceLower(), a.toleranceUpper(),
                            a.plannedExpandedUncertainty(), a.coverageFactor(),
                            lower ? OptionalDouble.of(limit) : a.acceptanceLower(),
                            lower ? a.acceptanceUpper() : OptionalDouble.of(limit), a.testUncertaintyRatio(), a.turAdequate(),
                            a.referenceInstrument(), a.reasoning() + " Acceptance " + parts[2] + " limit set by the engineer."));
                }
            }
        }
        ProcedureProposal edited = new ProcedureProposal(s, n, f, acceptance, p.sampling(),
                limitsEdited ? ProcedureDerivation.environment(limits) : p.environment(), p.cautions(),
                p.estimatedBenchMinutes(), p.reasoning(), limits);
        // The sentences, reading counts and bench time that depend on the edited values, by the derivation's rules.
        return ProcedureDerivation.restate(edited, spec, minutes);
    }

    private static String example(String key) {
        return switch (key) {
            case "static.points", "sweep.frequencies" -> "10, 20, 50";
            case "static.instrument", "sweep.instrument" -> "RI-PRS-01";
            default -> "3";
        };
    }

    private static double finite(String value, String key) {
        try {
            double v = Double.parseDouble(value);
            if (!Double.isFinite(v)) {
                throw new NumberFormatException();
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("'" + value + "' is not a number (" + key + ").");
        }
    }

    private static void require(boolean condition, String message) {
        if (!condition) {
            throw new IllegalArgumentException(message);
        }
    }

    private static List<Double> numbers(String value, String key) {
        try {
            List<Double> list = Arrays.stream(value.split("[,;\\s]+")).filter(t -> !t.isBlank())
                    .map(Double::parseDouble).toList();
            if (list.isEmpty() || list.stream().anyMatch(d -> !Double.isFinite(d))) {
                throw new NumberFormatException();
            }
            return list;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("'" + value + "' is not a list of numbers (" + key + ").");
        }
    }

    private static int whole(String value, String key, int min, int max) {
        try {
            int v = Integer.parseInt(value);
            if (v < min || v > max) {
                throw new IllegalArgumentException("'" + key + "' must be between " + min + " and " + max + ".");
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("'" + value + "' is not a whole number (" + key + ").");
        }
    }

    private static double number(String value, String key) {
        try {
            double v = Double.parseDouble(value);
            if (!Double.isFinite(v)) {
                throw new NumberFormatException();
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("'" + value + "' is not a number (" + key + ").");
        }
    }

    private static double positive(String value, String key) {
        try {
            double v = Double.parseDouble(value);
            if (!(v > 0) || !Double.isFinite(v)) {
                throw new NumberFormatException();
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("'" + value + "' is not a positive number (" + key + ").");
        }
    }
}
