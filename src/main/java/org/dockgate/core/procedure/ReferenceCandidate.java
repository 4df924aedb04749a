package org.dockgate.core.procedure;

import java.util.Objects;
import java.util.function.DoubleUnaryOperator;

/**
 * A reference instrument the derivation may plan for a test: its identifier, the range its calibration
 * covers (the calibrated range, not merely the instrument's range) in the specification's input unit, and its expanded uncertainty (k as stated) at an input
 * value, in the input unit. The caller (the procedures module) converts the register's record into
 * this form, so the core needs no knowledge of the register.
 */
public record ReferenceCandidate(String identifier, TestKind test, double rangeMin, double rangeMax,
                                 DoubleUnaryOperator expandedUncertaintyAt, double coverageFactor) {

    public ReferenceCandidate {
        Objects.requireNonNull(identifier, "identifier");
        Objects.requireNonNull(test, "test");
        Objects.requireNonNull(expandedUncertaintyAt, "expandedUncertaintyAt");
        if (!(coverageFactor > 0)) {
            throw new IllegalArgumentException("A coverage factor must be positive.");
        }
    }

    /**
     * Whether [min, max] lies inside the calibrated range, with a relative slack of 1e-9 of the range for the
     * rounding of a unit conversion.
     */
    public boolean covers(double min, double max) {
        double slack = 1e-9 * Math.max(rangeMax - rangeMin, Math.max(Math.abs(rangeMin), Math.abs(rangeMax)));
        return rangeMin - slack <= min && rangeMax + slack >= max;
    }
}
