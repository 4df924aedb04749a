package org.dockgate.core.uncertainty;

import org.dockgate.core.InputChecks;

/**
 * Assumed probability distribution of a Type B input known only by the half-width {@code a} of the interval
 * that contains it; the standard uncertainty is {@code a} divided by the distribution's divisor.
 */
public enum Distribution {

    /** Equal probability anywhere in ±a: u = a/√3 (GUM 4.3.7). Also the model for readout resolution. */
    RECTANGULAR(Math.sqrt(3.0)),

    /** Values near the centre more likely, falling linearly to zero at ±a: u = a/√6 (GUM 4.3.9). */
    TRIANGULAR(Math.sqrt(6.0)),

    /**
     * Arcsine (U-shaped), values near ±a most likely, e.g. a sinusoidally cycling temperature:
     * u = a/√2 (EA-4/02 and UKAS M3003; not a GUM core clause).
     */
    U_SHAPED(Math.sqrt(2.0));

    private final double divisor;

    Distribution(double divisor) {
        this.divisor = divisor;
    }

    /** @return the divisor: √3, √6 or √2 */
    public double divisor() {
        return divisor;
    }

    /**
     * Standard uncertainty u = a / divisor.
     *
     * @param halfWidth the half-width a of the interval, finite and not negative (0 gives u = 0)
     * @return the standard uncertainty
     * @throws IllegalArgumentException when a is NaN, infinite or negative
     */
    public double standardUncertainty(double halfWidth) {
        return InputChecks.nonNegative("halfWidth", halfWidth) / divisor;
    }
}
