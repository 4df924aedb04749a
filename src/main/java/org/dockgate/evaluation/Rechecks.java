package org.dockgate.evaluation;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.dockgate.core.evaluation.MetricResult;

/** Compares a frozen unit result with its recomputation, figure by figure. */
final class Rechecks {

    private Rechecks() {
    }

    static List<Recheck.Difference> compare(String serial, UnitEvaluationView frozen, UnitEvaluationView now,
                                            Function<Object, String> canonical) {
        List<Recheck.Difference> out = new ArrayList<>();
        if (frozen == null || now == null) {
            out.add(new Recheck.Difference(serial, "UNIT", "present", frozen == null ? null : "frozen",
                    now == null ? null : "recomputed"));
            return out;
        }
        add(out, serial, "UNIT", "unitVerdict", frozen.result().unitVerdict().map(Enum::name).orElse(null),
                now.result().unitVerdict().map(Enum::name).orElse(null));
        add(out, serial, "UNIT", "complete", String.valueOf(frozen.complete()), String.valueOf(now.complete()));
        Map<String, String> frozenCals = calibrations(frozen);
        Map<String, String> nowCals = calibrations(now);
        if (!frozen.calibrations().isEmpty() || frozen.readings() > 0) {
            // Rows frozen before calibration records were kept have none to compare.
            java.util.Set<String> instruments = new java.util.TreeSet<>(frozenCals.keySet());
            instruments.addAll(nowCals.keySet());
            for (String instrument : instruments) {
                add(out, serial, "UNIT", "calibration " + instrument, frozenCals.get(instrument), nowCals.get(instrument));
            }
        }
        Map<String, MetricResult> f = byMetric(frozen);
        Map<String, MetricResult> n = byMetric(now);
        java.util.Set<String> metrics = new java.util.LinkedHashSet<>(f.keySet());
        metrics.addAll(n.keySet());
        for (String metric : metrics) {
            MetricResult a = f.get(metric);
            MetricResult b = n.get(metric);
            if (a == null || b == null) {
                add(out, serial, metric, "present", a == null ? null : "evaluated", b == null ? null : "evaluated");
                continue;
            }
            add(out, serial, metric, "measured", num(a.measured()), num(b.measured()));
            add(out, serial, metric, "U", num(a.uncertainty().value()), num(b.uncertainty().value()));
            add(out, serial, metric, "k", num(a.uncertainty().coverageFactor()), num(b.uncertainty().coverageFactor()));
            add(out, serial, metric, "nuEff", num(a.budget().effectiveDegreesOfFreedom()),
                    num(b.budget().effectiveDegreesOfFreedom()));
            add(out, serial, metric, "acceptanceLower", num(a.acceptanceLower()), num(b.acceptanceLower()));
            add(out, serial, metric, "acceptanceUpper", num(a.acceptanceUpper()), num(b.acceptanceUpper()));
            add(out, serial, metric, "pc", num(a.probabilityOfConformance()), num(b.probabilityOfConformance()));
            add(out, serial, metric, "verdict", a.verdict().name(), b.verdict().name());
            add(out, serial, metric, "tolerance", canonical.apply(a.tolerance()), canonical.apply(b.tolerance()));
            int before = out.size();
            add(out, serial, metric, "budget", canonical.apply(a.budget()), canonical.apply(b.budget()));
            if (out.size() == before) {
                add(out, serial, metric, "points", canonical.apply(a.points()), canonical.apply(b.points()));
            }
        }
        return out;
    }

    private static Map<String, String> calibrations(UnitEvaluationView unit) {
        return unit.calibrations().stream().collect(Collectors.groupingBy(UnitEvaluationView.CalibrationUsed::instrument,
                LinkedHashMap::new, Collectors.mapping(UnitEvaluationView.CalibrationUsed::certificateNumber,
                        Collectors.joining(", "))));
    }

    private static Map<String, MetricResult> byMetric(UnitEvaluationView unit) {
        Map<String, MetricResult> out = new LinkedHashMap<>();
        unit.result().metrics().forEach(m -> out.put(m.metric().name(), m));
        return out;
    }

    private static void add(List<Recheck.Difference> out, String serial, String metric, String field, String frozen,
                            String recomputed) {
        if (!Objects.equals(frozen, recomputed)) {
            out.add(new Recheck.Difference(serial, metric, field, frozen, recomputed));
        }
    }

    private static String num(double value) {
        return Double.toString(value);
    }

    private static String num(OptionalDouble value) {
        return value.isPresent() ? Double.toString(value.getAsDouble()) : null;
    }
}
