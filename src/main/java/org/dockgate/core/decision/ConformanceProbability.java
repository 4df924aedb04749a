package org.dockgate.core.decision;

import java.util.Objects;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.dockgate.core.InputChecks;

/** The probability that the measurand conforms, given a measured value (JCGM 106:2012, normal PDF). */
public final class ConformanceProbability {

    private static final NormalDistribution STANDARD_NORMAL = new NormalDistribution(null, 0.0, 1.0);

    private ConformanceProbability() {
    }

    /**
     * p_c = Φ((T_U − y)/u) − Φ((T_L − y)/u) for a measurand with normal PDF N(y, u²) (JCGM 106:2012); an absent
     * limit contributes Φ(+∞) = 1 or Φ(−∞) = 0, so p_c = Φ((T_U − y)/u) for an upper limit only and
     * 1 − Φ((T_L − y)/u) for a lower limit only. The specific consumer's risk of accepting is 1 − p_c.
     *
     * <p>With u = 0 the value is known exactly: p_c is 1 inside the tolerance (limits inclusive) and 0 outside.
     * Computed from the tail nearer to y, so that values far outside the tolerance give a small p_c rather than a
     * difference of two numbers close to 1. The result is clamped to [0, 1].
     *
     * @param measured            y, finite
     * @param tolerance           the tolerance
     * @param standardUncertainty u ≥ 0
     * @return p_c in [0, 1]
     * @throws IllegalArgumentException when y or u is NaN or infinite, or u is negative
     */
    public static double of(double measured, Tolerance tolerance, double standardUncertainty) {
        InputChecks.finite("measured", measured);
        Objects.requireNonNull(tolerance, "tolerance");
        InputChecks.nonNegative("standardUncertainty", standardUncertainty);
        if (standardUncertainty == 0.0) {
            return tolerance.contains(measured) ? 1.0 : 0.0;
        }
        double upperZ = tolerance.upper().isPresent()
                ? (tolerance.upper().getAsDouble() - measured) / standardUncertainty : Double.POSITIVE_INFINITY;
        double lowerZ = tolerance.lower().isPresent()
                ? (tolerance.lower().getAsDouble() - measured) / standardUncertainty : Double.NEGATIVE_INFINITY;
        double p;
        if (lowerZ > 0) {
            // y below T_L: both arguments positive, use upper tails Φ(−z) = 1 − Φ(z)
            p = cdf(-lowerZ) - cdf(-upperZ);
        } else {
            p = cdf(upperZ) - cdf(lowerZ);
        }
        return Math.min(1.0, Math.max(0.0, p));
    }

    static double cdf(double z) {
        if (z == Double.POSITIVE_INFINITY) {
            return 1.0;
        }
        if (z == Double.NEGATIVE_INFINITY) {
            return 0.0;
        }
        return STANDARD_NORMAL.cumulativeProbability(z);
    }

    static double quantile(double probability) {
        return STANDARD_NORMAL.inverseCumulativeProbability(probability);
    }
}
