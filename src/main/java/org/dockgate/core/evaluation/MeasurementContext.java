package org.dockgate.core.evaluation;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.dockgate.core.InputChecks;

/**
 * The Type B side of a unit's measurement: the instruments of the measurement chain (the stimulus reference,
 * the readout with its resolution, the excitation supply) with their certificates, and the environment.
 *
 * @param staticReference    the stimulus of the static calibration (U(x) in input units, k); without it the
 *                           static metrics miss their largest Type B contribution and the result is incomplete
 * @param sweepReference     the reference of the frequency sweep, U(a) at the sweep amplitude a (input units);
 *                           needed for bandwidth and flatness
 * @param readoutResolution  the digit δ of the indicating instrument, in output units (&gt; 0): a rectangular
 *                           contribution of half-width δ/2 (GUM F.2.2.1); without it the result is incomplete
 * @param environment        ambient deviation and temperature coefficients, if recorded (optional)
 * @param readout            the readout instrument with its certificate in force and register resolution, when the
 *                           readings name one; its lines join every static budget ({@link ReadoutInstrument})
 * @param readoutNotRecorded true when the readings name no readout (saved before readouts were recorded): the
 *                           budgets then say "readout not recorded" instead of a readout or resolution line, and
 *                           no resolution is made up
 * @param excitation         the excitation supply, when the readings name one ({@link ExcitationSupply})
 */
public record MeasurementContext(Optional<ReferenceUncertainty> staticReference,
        Optional<ReferenceUncertainty> sweepReference, OptionalDouble readoutResolution,
        Optional<Environment> environment, Optional<ReadoutInstrument> readout, boolean readoutNotRecorded,
        Optional<ExcitationSupply> excitation) {

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
        Objects.requireNonNull(readout, "readout");
        Objects.requireNonNull(excitation, "excitation");
        readoutResolution.ifPresent(d -> InputChecks.positive("readout resolution", d));
    }

    /** A context without the readout and excitation instruments (the stimulus, a digit and the environment). */
    public MeasurementContext(Optional<ReferenceUncertainty> staticReference,
            Optional<ReferenceUncertainty> sweepReference, OptionalDouble readoutResolution,
            Optional<Environment> environment) {
        this(staticReference, sweepReference, readoutResolution, environment, Optional.empty(), false,
                Optional.empty());
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
        return new MeasurementContext(Optional.of(reference), sweepReference, readoutResolution, environment, readout,
                readoutNotRecorded, excitation);
    }

    /** @return a copy with the frequency sweep's reference */
    public MeasurementContext withSweepReference(ReferenceUncertainty reference) {
        return new MeasurementContext(staticReference, Optional.of(reference), readoutResolution, environment, readout,
                readoutNotRecorded, excitation);
    }

    /** @return a copy with the readout's digit δ (output units) */
    public MeasurementContext withReadoutResolution(double digit) {
        return new MeasurementContext(staticReference, sweepReference, OptionalDouble.of(digit), environment, readout,
                readoutNotRecorded, excitation);
    }

    /** @return a copy with the environment */
    public MeasurementContext withEnvironment(Environment recorded) {
        return new MeasurementContext(staticReference, sweepReference, readoutResolution, Optional.of(recorded),
                readout, readoutNotRecorded, excitation);
    }

    /**
     * @return a copy with the readout; its register resolution, when recorded, becomes the readout resolution
     */
    public MeasurementContext withReadout(ReadoutInstrument instrument) {
        return new MeasurementContext(staticReference, sweepReference,
                instrument.resolution().isPresent() ? instrument.resolution() : readoutResolution, environment,
                Optional.of(instrument), false, excitation);
    }

    /** @return a copy saying that the readings name no readout (and so no resolution is known) */
    public MeasurementContext withReadoutNotRecorded() {
        return new MeasurementContext(staticReference, sweepReference, OptionalDouble.empty(), environment,
                Optional.empty(), true, excitation);
    }

    /** @return a copy with the excitation supply */
    public MeasurementContext withExcitation(ExcitationSupply supply) {
        return new MeasurementContext(staticReference, sweepReference, readoutResolution, environment, readout,
                readoutNotRecorded, Optional.of(supply));
    }
}
