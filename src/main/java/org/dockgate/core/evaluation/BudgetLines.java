package org.dockgate.core.evaluation;

import static org.dockgate.core.evaluation.UnitFactors.fmt;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.dockgate.core.uncertainty.Distribution;
import org.dockgate.core.uncertainty.UncertaintyContribution;
import org.dockgate.core.uncertainty.UncertaintyContribution.Basis;

/**
 * The budget lines every metric draws from the measurement context, with names that say what each is.
 * A source that is not recorded, or does not act on a metric, still gets a line of zero, so the budget
 * table shows that it was considered.
 */
final class BudgetLines {

    private BudgetLines() {
    }

    /** A line of zero with a reason; ν = ∞ so it changes neither u_c nor ν_eff. */
    static UncertaintyContribution none(String why) {
        return UncertaintyContribution.standard(why, 0.0, Double.POSITIVE_INFINITY);
    }

    /** A Type A line: u with ν degrees of freedom and sensitivity coefficient c (GUM 4.2, 5.1.3). */
    static UncertaintyContribution typeA(String name, double standardUncertainty, double degreesOfFreedom,
            double sensitivityCoefficient) {
        return new UncertaintyContribution(name, Basis.TYPE_A, standardUncertainty, degreesOfFreedom,
                sensitivityCoefficient);
    }

    /** A line from a certificate's U/k already expressed in another unit (ν = ∞, GUM 4.3.3), carried by c. */
    static UncertaintyContribution certificate(String name, double standardUncertainty, double sensitivityCoefficient) {
        return new UncertaintyContribution(name, Basis.EXPANDED, standardUncertainty, Double.POSITIVE_INFINITY,
                sensitivityCoefficient);
    }

    /**
     * The reference certificate at an input: u = U(x)/k in input units (GUM 4.3.3), carried to the metric
     * by c (GUM 5.1.3).
     */
    static UncertaintyContribution reference(Optional<ReferenceUncertainty> reference, double input,
            String inputUnit, double sensitivityCoefficient, String how) {
        if (reference.isEmpty()) {
            return none("reference certificate: not recorded, no contribution (the evaluation is incomplete)");
        }
        ReferenceUncertainty r = reference.get();
        double expanded = r.expandedAt(input);
        return UncertaintyContribution.expanded("reference " + r.instrument() + ": U = " + fmt(expanded) + " "
                + inputUnit + " (k = " + fmt(r.coverageFactor()) + ") at " + fmt(input) + " " + inputUnit + how,
                expanded, r.coverageFactor()).withSensitivityCoefficient(sensitivityCoefficient);
    }

    /**
     * The reference certificate as a point error over several set points: u = max U(x_i)/k over the set points
     * x_i (GUM 4.3.3), carried by c. A figure that depends on the reference's errors at every set point (the
     * deviation from a fitted or end-point line) takes the largest, so its U does not depend on which set point
     * the largest deviation happens to fall on.
     */
    static UncertaintyContribution referenceLargest(Optional<ReferenceUncertainty> reference,
            java.util.Collection<Double> inputs, String inputUnit, double sensitivityCoefficient, String how) {
        if (reference.isEmpty()) {
            return none("reference certificate: not recorded, no contribution (the evaluation is incomplete)");
        }
        double at = inputs.iterator().next();
        double largest = -1;
        for (double x : inputs) {
            double u = reference.get().expandedAt(x);
            if (u > largest) {
                largest = u;
                at = x;
            }
        }
        return reference(reference, at, inputUnit, sensitivityCoefficient, how);
    }

    /** The readout's digit δ: rectangular with half-width δ/2, u = δ/(2√3) (GUM F.2.2.1), carried by c. */
    static UncertaintyContribution resolution(OptionalDouble digit, String outputUnit, double sensitivityCoefficient,
            String how) {
        if (digit.isEmpty()) {
            return none("readout resolution: not recorded, no contribution (the evaluation is incomplete)");
        }
        double d = digit.getAsDouble();
        return UncertaintyContribution.halfWidth("readout resolution: digit " + fmt(d) + " " + outputUnit
                        + ", rectangular with half-width δ/2" + how, d / 2.0, Distribution.RECTANGULAR)
                .withSensitivityCoefficient(sensitivityCoefficient);
    }

    /**
     * The readout's resolution line from the context: the register's digit of the readout named in the context,
     * "readout not recorded" when the readings name none, else the digit given (as {@link #resolution}).
     */
    static UncertaintyContribution resolution(MeasurementContext context, String outputUnit,
            double sensitivityCoefficient, String how) {
        if (context.readoutNotRecorded()) {
            return none("readout resolution: readout not recorded for these readings, no resolution is assumed and"
                    + " none is included");
        }
        if (context.readout().isPresent()) {
            ReadoutInstrument r = context.readout().get();
            if (context.readoutResolution().isEmpty()) {
                return none("readout " + r.name() + " resolution: not in the register, no contribution (the"
                        + " evaluation is incomplete)");
            }
            double d = context.readoutResolution().getAsDouble();
            return UncertaintyContribution.halfWidth("readout " + r.name() + " resolution: δ = " + fmt(d) + " "
                            + outputUnit + " (register), rectangular with half-width δ/2" + how, d / 2.0,
                    Distribution.RECTANGULAR).withSensitivityCoefficient(sensitivityCoefficient);
        }
        return resolution(context.readoutResolution(), outputUnit, sensitivityCoefficient, how);
    }

    /**
     * The readout's certificate at a reading y (a point error there): u = U(y)/k in output units (GUM 4.3.3),
     * carried by c. No line when the context has no readout information (callers that never record one);
     * "readout not recorded" when the readings name none.
     */
    static List<UncertaintyContribution> readout(MeasurementContext context, double reading, String outputUnit,
            double sensitivityCoefficient, String how) {
        if (context.readoutNotRecorded()) {
            return List.of(none("readout: not recorded for these readings, its uncertainty is not included"));
        }
        if (context.readout().isEmpty()) {
            return List.of();
        }
        ReadoutInstrument r = context.readout().get();
        double expanded = r.expandedAt(reading);
        return List.of(UncertaintyContribution.expanded("readout " + r.name() + ": U = " + fmt(expanded) + " "
                + outputUnit + " (k = " + fmt(r.coverageFactor()) + ") at " + fmt(reading) + " " + outputUnit + how,
                expanded, r.coverageFactor()).withSensitivityCoefficient(sensitivityCoefficient));
    }

    /** The readout's line where a common error at a set point cancels (a difference of readings at the point). */
    static List<UncertaintyContribution> readoutCancels(MeasurementContext context, String metricLabel) {
        if (context.readoutNotRecorded()) {
            return List.of(none("readout: not recorded for these readings"));
        }
        return context.readout().map(r -> List.of(none("readout " + r.name() + ": its error at a set point is the"
                + " same in every reading there and cancels in the " + metricLabel + ", no contribution")))
                .orElse(List.of());
    }

    /**
     * The excitation supply's line: a scale error u(V)/V × |base| (the base is what it scales: |reading|, |slope|
     * or |offset|), carried by c; a line of zero with the reason when the measurement cancels it or the metric
     * does not change under a scale error (base NaN). No line without an excitation in the context.
     */
    static List<UncertaintyContribution> excitation(MeasurementContext context, String metricLabel, double base,
            double sensitivityCoefficient) {
        if (context.excitation().isEmpty()) {
            return List.of();
        }
        ExcitationSupply e = context.excitation().get();
        if (e.cancelled()) {
            return List.of(none("excitation " + e.name() + ": " + e.why() + ", its error cancels, no contribution"));
        }
        if (Double.isNaN(base)) {
            return List.of(none("excitation " + e.name() + ": a scale error of every reading does not change the "
                    + metricLabel + " (a figure relative to the same readings), no contribution"));
        }
        return List.of(UncertaintyContribution.standard("excitation " + e.name() + ": u(V)/V = "
                        + fmt(e.relativeStandardUncertainty() * 100) + " %" + (e.why().isEmpty() ? "" : " " + e.why())
                        + ", a scale error × " + fmt(Math.abs(base)), e.relativeStandardUncertainty() * Math.abs(base),
                Double.POSITIVE_INFINITY).withSensitivityCoefficient(sensitivityCoefficient));
    }

    /**
     * The environment's lines: a rectangular half-width |coefficient| × |ΔT| on the quantity the coefficient
     * acts on (see {@link Environment}).
     *
     * @param environment the recorded environment, if any
     * @param metricLabel what is measured, for the "does not act" line
     * @param gainBase    the value a gain shift acts on (|reading| or |slope|), NaN when a gain shift does not
     *                    change the metric
     * @param gainC       sensitivity coefficient from gainBase's unit to the metric's
     * @param zeroBase    the full-scale output a zero shift is a percentage of, NaN when a zero shift does not
     *                    change the metric
     * @param zeroC       sensitivity coefficient from zeroBase's unit to the metric's
     */
    static List<UncertaintyContribution> environment(Optional<Environment> environment, String metricLabel,
            double gainBase, double gainC, double zeroBase, double zeroC) {
        if (environment.isEmpty()) {
            return List.of(none("environment: not recorded, no contribution"));
        }
        Environment e = environment.get();
        if (Double.isNaN(gainBase) && Double.isNaN(zeroBase)) {
            return List.of(none("environment: a temperature effect that stays the same throughout the test does not"
                    + " change the " + metricLabel + ", no contribution"));
        }
        double dt = Math.abs(e.temperatureDeviationC());
        List<UncertaintyContribution> lines = new ArrayList<>();
        if (!Double.isNaN(gainBase) && e.gainCoefficientPercentPerC().isPresent()) {
            double c = e.gainCoefficientPercentPerC().getAsDouble();
            lines.add(UncertaintyContribution.halfWidth("environment: thermal sensitivity shift " + fmt(c)
                            + " %/°C × |ΔT| = " + fmt(dt) + " K, rectangular", c / 100.0 * dt * Math.abs(gainBase),
                    Distribution.RECTANGULAR).withSensitivityCoefficient(gainC));
        }
        if (!Double.isNaN(zeroBase) && e.zeroCoefficientPercentFsoPerC().isPresent()) {
            double c = e.zeroCoefficientPercentFsoPerC().getAsDouble();
            lines.add(UncertaintyContribution.halfWidth("environment: thermal zero shift " + fmt(c)
                            + " %FSO/°C × |ΔT| = " + fmt(dt) + " K, rectangular", c / 100.0 * dt * Math.abs(zeroBase),
                    Distribution.RECTANGULAR).withSensitivityCoefficient(zeroC));
        }
        if (lines.isEmpty()) {
            lines.add(none("environment: ΔT = " + fmt(e.temperatureDeviationC())
                    + " K recorded, no temperature coefficient for the " + metricLabel + " given, no contribution"));
        }
        return lines;
    }
}
