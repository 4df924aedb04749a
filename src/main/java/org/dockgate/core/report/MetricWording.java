package org.dockgate.core.report;

import java.util.Locale;
import org.dockgate.core.evaluation.MetricResult;
import org.dockgate.core.evaluation.PointCheck;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.procedure.SensorSpecification;

/**
 * One metric's result as it reads on the unit page and the certificate: the metric named with what it
 * was judged against (the nonlinearity's reference line, the set point that decided a per-point metric),
 * the value at U's decimal place with its unit, U with its unit and k, the tolerance and the acceptance
 * zone in words ({@link ResultFormat}).
 */
public final class MetricWording {

    private MetricWording() {
    }

    /**
     * "sensitivity", "nonlinearity (best-fit straight line)", "nonlinearity (terminal line)",
     * "rtd tolerance at −50 °C", "accuracy at 250 bar, down, cycle 2".
     */
    public static String name(MetricResult m, SensorSpecification spec) {
        String name = m.metric().name().toLowerCase(Locale.ROOT).replace('_', ' ');
        if (m.metric() == Metric.NONLINEARITY) {
            return name + (spec != null && spec.nonlinearityReference() == SensorSpecification.NonlinearityReference.TERMINAL
                    ? " (terminal line)" : " (best-fit straight line)");
        }
        return name + decidingPoint(m, spec == null ? null : spec.inputUnit());
    }

    /**
     * " at −50 °C" for a metric judged point by point: the set point of the check whose error and verdict
     * are the metric's (the worst verdict, then the lowest p_c — see {@link MetricResult}); "" otherwise.
     */
    public static String decidingPoint(MetricResult m, String inputUnit) {
        PointCheck deciding = m.points().stream()
                .filter(p -> p.error() == m.measured() && p.verdict() == m.verdict())
                .findFirst().orElse(null);
        if (deciding == null) {
            return "";
        }
        String unit = inputUnit == null || inputUnit.isBlank() ? "" : " " + inputUnit;
        String where = " at " + ResultFormat.stated(deciding.input()) + unit;
        if (m.metric() == Metric.ACCURACY) {
            where += ", " + deciding.direction().name().toLowerCase(Locale.ROOT) + ", cycle " + deciding.cycle();
        }
        return where;
    }

    /** "10.000 mV/bar". */
    public static String measured(MetricResult m) {
        return ResultFormat.value(m.measured(), m.uncertainty().value()) + unit(m);
    }

    /** "0.013 mV/bar (k = 2.00)". */
    public static String uncertainty(MetricResult m) {
        return ResultFormat.uncertaintyWithUnit(m.uncertainty().value(), m.uncertainty().coverageFactor(), m.unit());
    }

    /** "9.9 … 10.1 mV/bar", "≤ 0.25 %FSO". */
    public static String tolerance(MetricResult m) {
        return ResultFormat.interval(m.tolerance().lower(), m.tolerance().upper(), m.unit());
    }

    /** The acceptance zone, or "no acceptance zone: the guard band leaves none". */
    public static String acceptance(MetricResult m) {
        return ResultFormat.acceptanceZone(m.tolerance().lower(), m.tolerance().upper(), m.acceptanceLower(),
                m.acceptanceUpper(), m.unit());
    }

    private static String unit(MetricResult m) {
        return m.unit().isBlank() ? "" : " " + m.unit();
    }
}
