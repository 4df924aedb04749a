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
