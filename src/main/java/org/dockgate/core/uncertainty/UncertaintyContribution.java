package org.dockgate.core.uncertainty;

import java.util.Objects;

import org.dockgate.core.InputChecks;

/**
 * One line of an uncertainty budget: an input quantity's standard uncertainty u(x_i), its degrees of freedom ν_i
 * and its sensitivity coefficient c_i = ∂f/∂x_i (GUM 5.1.3). Its contribution to the measurand is
 * u_i(y) = |c_i|·u(x_i) (GUM 5.1.3, Eq. 11b).
 *
 * @param name                   what the input is, e.g. "repeatability" or "reference certificate"
 * @param basis                  how the standard uncertainty was obtained
 * @param standardUncertainty    u(x_i) ≥ 0, in the input's unit
 * @param degreesOfFreedom       ν_i ≥ 1, or {@link Double#POSITIVE_INFINITY} when the value is taken as exactly
 *                               known (the usual case for a Type B evaluation, GUM G.4.3)
 * @param sensitivityCoefficient c_i, finite; may be negative or zero
 */
public record UncertaintyContribution(String name, Basis basis, double standardUncertainty,
        double degreesOfFreedom, double sensitivityCoefficient) {

    /** How a standard uncertainty was evaluated. */
    public enum Basis {
        /** Type A from repeated readings (GUM 4.2). */
        TYPE_A,
        /** Type B, half-width with a rectangular distribution (GUM 4.3.7). */
        RECTANGULAR,
        /** Type B, half-width with a triangular distribution (GUM 4.3.9). */
        TRIANGULAR,
        /** Type B, half-width with a U-shaped (arcsine) distribution (EA-4/02). */
        U_SHAPED,
        /** Type B from an expanded uncertainty and its coverage factor, e.g. a certificate (GUM 4.3.3). */
        EXPANDED,
        /** A standard uncertainty stated directly. */
        STANDARD;

        static Basis of(Distribution distribution) {
            return switch (distribution) {
                case RECTANGULAR -> RECTANGULAR;
                case TRIANGULAR -> TRIANGULAR;
                case U_SHAPED -> U_SHAPED;
            };
        }
    }

    /**
     * Validates the line.
     *
     * @throws IllegalArgumentException when the name is blank, u is NaN, infinite or negative, ν is NaN or below 1,
     *                                  c is NaN or infinite, or |c|·u overflows a double
     */
    public UncertaintyContribution {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("a contribution needs a name");
        }
        Objects.requireNonNull(basis, "basis");
        InputChecks.nonNegative("standardUncertainty of '" + name + "'", standardUncertainty);
        InputChecks.degreesOfFreedom("degreesOfFreedom of '" + name + "'", degreesOfFreedom);
        InputChecks.finite("sensitivityCoefficient of '" + name + "'", sensitivityCoefficient);
        if (!Double.isFinite(Math.abs(sensitivityCoefficient) * standardUncertainty)) {
            throw new IllegalArgumentException("the contribution |c|·u of '" + name + "' is too large to compute with");
        }
    }

    /**
     * A standard uncertainty stated directly, c = 1.
     *
     * @param degreesOfFreedom ν ≥ 1, or +∞ when not known to be finite
     */
    public static UncertaintyContribution standard(String name, double standardUncertainty,
            double degreesOfFreedom) {
        return new UncertaintyContribution(name, Basis.STANDARD, standardUncertainty, degreesOfFreedom, 1.0);
    }

    /** Type A from repeated readings: u = s/√n, ν = n − 1 (GUM 4.2.3), c = 1; see {@link TypeAEvaluation#of}. */
    public static UncertaintyContribution typeA(String name, double... readings) {
        TypeAEvaluation a = TypeAEvaluation.of(readings);
        return new UncertaintyContribution(name, Basis.TYPE_A, a.standardUncertainty(), a.degreesOfFreedom(), 1.0);
    }

    /**
     * Type B from a half-width a: u = a/√3, a/√6 or a/√2 (see {@link Distribution}); ν = +∞ (limits taken as
     * exactly known, GUM G.4.3), c = 1.
     */
    public static UncertaintyContribution halfWidth(String name, double halfWidth, Distribution distribution) {
        Objects.requireNonNull(distribution, "distribution");
        return new UncertaintyContribution(name, Basis.of(distribution),
                distribution.standardUncertainty(halfWidth), Double.POSITIVE_INFINITY, 1.0);
    }

    /**
     * Type B from an expanded uncertainty U quoted with coverage factor k, e.g. on a calibration certificate:
     * u = U/k (GUM 4.3.3); ν = +∞, c = 1. A certificate that states ν_eff for its U can be entered with
     * {@link #standard(String, double, double)} instead.
     *
     * @throws IllegalArgumentException when U is negative or not finite, or k is not a positive finite number
     */
    public static UncertaintyContribution expanded(String name, double expandedUncertainty, double coverageFactor) {
        InputChecks.nonNegative("expandedUncertainty", expandedUncertainty);
        InputChecks.positive("coverageFactor", coverageFactor);
        return new UncertaintyContribution(name, Basis.EXPANDED, expandedUncertainty / coverageFactor,
                Double.POSITIVE_INFINITY, 1.0);
    }

    /** @return a copy with sensitivity coefficient c (finite, any sign) */
    public UncertaintyContribution withSensitivityCoefficient(double c) {
        return new UncertaintyContribution(name, basis, standardUncertainty, degreesOfFreedom, c);
    }

    /** @return the contribution u_i(y) = |c_i|·u(x_i) to the measurand (GUM 5.1.3) */
    public double contribution() {
        return Math.abs(sensitivityCoefficient) * standardUncertainty;
    }
}
