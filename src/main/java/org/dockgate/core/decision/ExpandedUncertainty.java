package org.dockgate.core.decision;

import org.dockgate.core.InputChecks;

/**
 * An expanded uncertainty U of a measurement result and the coverage factor k it was stated with
 * (GUM 6.2.1: U = k·u_c).
 *
 * @param value          U ≥ 0, in the unit of the measured value
 * @param coverageFactor k &gt; 0 (commonly 2)
 */
public record ExpandedUncertainty(double value, double coverageFactor) {

    /**
     * Validates U and k.
     *
     * @throws IllegalArgumentException when U is negative, NaN or infinite, or k is not a positive finite number
     */
    public ExpandedUncertainty {
        InputChecks.nonNegative("expandedUncertainty", value);
        InputChecks.positive("coverageFactor", coverageFactor);
    }

    /** @return U with coverage factor k */
    public static ExpandedUncertainty of(double value, double coverageFactor) {
        return new ExpandedUncertainty(value, coverageFactor);
    }

    /** @return the standard uncertainty u = U/k, the σ of the normal PDF JCGM 106:2012 assigns to the measurand */
    public double standardUncertainty() {
        return value / coverageFactor;
    }
}
