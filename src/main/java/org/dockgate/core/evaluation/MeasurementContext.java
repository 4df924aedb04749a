package org.dockgate.core.evaluation;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.dockgate.core.InputChecks;

/**
 * The Type B side of a unit's measurement: the reference instruments' certificates, the readout's
 * resolution and the environment.
 *
 * @param staticReference    the stimulus of the static calibration (U(x) in input units, k); without it the
 *                           static metrics miss their largest Type B contribution and the result is incomplete
 * @param sweepReference     the reference of the frequency sweep, U(a) at the sweep amplitude a (input units);
 *                           needed for bandwidth and flatness
 * @param readoutResolution  the digit δ of the indicating instrument, in output units (&gt; 0): a rectangular
 *                           contribution of half-width δ/2 (GUM F.2.2.1); without it the result is incomplete
 * @param environment        ambient deviation and temperature coefficients, if recorded (optional)
 */
public record MeasurementContext(Optional<ReferenceUncertainty> staticReference,
        Optional<ReferenceUncertainty> sweepReference, OptionalDouble readoutResolution,
        Optional<Environment> environment) {

    /**
     * Validates the fields.
     *
     * @throws IllegalArgumentException when an optional is null or the resolution is not a positive finite number
     */
    public MeasurementContext {
        Objects.requireNonNull(staticReference, "staticReference");
        Objects.requireNonNull(sweepReference, "sweepReference");
        Objects.requireNonNull(readoutResolution, "readoutResolution");
        Objects.requireNonNull(environment, "environment");
        readoutResolution.ifPresent(d -> InputChecks.positive("readout resolution", d));
    }

    /** @return a context with nothing recorded yet */
    public static MeasurementContext empty() {
        return new MeasurementContext(Optional.empty(), Optional.empty(), OptionalDouble.empty(), Optional.empty());
    }

    /**
     * The usual context of a static calibration.
     *
     * @param staticReference   the stimulus reference
     * @param readoutResolution the readout's digit in output units
     * @return the context, without sweep reference or environment
     */
    public static MeasurementContext of(ReferenceUncertainty staticReference, double readoutResolution) {
        return new MeasurementContext(Optional.of(staticReference), Optional.empty(),
                OptionalDouble.of(readoutResolution), Optional.empty());
    }

    /** @return a copy with the static calibration's reference */
    public MeasurementContext withStaticReference(ReferenceUncertainty reference) {
        return new MeasurementContext(Optional.of(reference), sweepReference, readoutResolution, environment);
    }

    /** @return a copy with the frequency sweep's reference */
    public MeasurementContext withSweepReference(ReferenceUncertainty reference) {
        return new MeasurementContext(staticReference, Optional.of(reference), readoutResolution, environment);
    }

    /** @return a copy with the readout's digit δ (output units) */
    public MeasurementContext withReadoutResolution(double digit) {
        return new MeasurementContext(staticReference, sweepReference, OptionalDouble.of(digit), environment);
    }

    /** @return a copy with the environment */
    public MeasurementContext withEnvironment(Environment recorded) {
        return new MeasurementContext(staticReference, sweepReference, readoutResolution, Optional.of(recorded));
    }
}
