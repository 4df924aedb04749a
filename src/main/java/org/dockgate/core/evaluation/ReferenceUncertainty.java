package org.dockgate.core.evaluation;

import java.util.Objects;
import java.util.function.DoubleUnaryOperator;
import org.dockgate.core.InputChecks;
import org.dockgate.core.procedure.ReferenceCandidate;

/**
 * What a reference instrument's calibration certificate says about the stimulus it applies: its expanded
 * uncertainty U at an input value (in the unit of that input) and the coverage factor k the certificate
 * states it with. The standard uncertainty of the stimulus is u = U/k (GUM 4.3.3).
 *
 * <p><b>How the reference's error enters each metric</b> (one model, applied the same way in the evaluation
 * and in the procedure derivation). The reference applies its set point x with an error e(x), unknown but the
 * same for every reading taken at that set point (a systematic error of the certificate, u(e(x)) = U(x)/k):
 * <ul>
 *   <li>it <b>cancels in a difference at one set point</b>: hysteresis (UP mean − DOWN mean at x) and
 *       repeatability (scatter about the mean at x) get a line of zero that says so, and no TUR against
 *       the reference is planned for them;</li>
 *   <li>it enters the <b>sensitivity as a scale error</b>: e(x) in proportion to x, u(S) = S·u(x_top)/x_top
 *       at the top point (c = S/x);</li>
 *   <li>it enters as a <b>point error</b> where a figure compares one reading with a value it should have:
 *       the zero offset (at the set point nearest zero, c = S), each reading's accuracy error (c = 100/span)
 *       and RTD temperature error (c = 1) at its own set point, and the nonlinearity (deviation from a line
 *       that every set point helps fix) with the largest u over the set points (c = 100/span), so its U does
 *       not depend on where the largest deviation falls.</li>
 * </ul>
 * The register never gives U = 0 (U = max(floor, a + b·|x|) over the calibrated range, see the instruments
 * module); a function given here may still return 0 (e.g. {@link #constant} in a test).
 *
 * @param instrument            the instrument's identifier, shown in budget lines
 * @param expandedUncertaintyAt U(x) at an input x, in input units; must give a finite value ≥ 0
 * @param coverageFactor        k of the certificate, finite and greater than 0
 */
public record ReferenceUncertainty(String instrument, DoubleUnaryOperator expandedUncertaintyAt,
        double coverageFactor) {

    /**
     * Validates the fields.
     *
     * @throws IllegalArgumentException when the identifier is blank, the function is missing or k is not a
     *                                  positive finite number
     */
    public ReferenceUncertainty {
        if (instrument == null || instrument.isBlank()) {
            throw new IllegalArgumentException("A reference instrument needs an identifier");
        }
        if (expandedUncertaintyAt == null) {
            throw new IllegalArgumentException("Reference " + instrument + " needs its expanded uncertainty");
        }
        InputChecks.positive("coverage factor of reference " + instrument, coverageFactor);
    }

    /**
     * A reference with the same expanded uncertainty over its whole range.
     *
     * @param instrument          the identifier
     * @param expandedUncertainty U in input units, ≥ 0
     * @param coverageFactor      k
     * @return the reference
     * @throws IllegalArgumentException for a negative or non-finite U, or a bad k
     */
    public static ReferenceUncertainty constant(String instrument, double expandedUncertainty, double coverageFactor) {
        InputChecks.nonNegative("expanded uncertainty of reference " + instrument, expandedUncertainty);
        return new ReferenceUncertainty(instrument, x -> expandedUncertainty, coverageFactor);
    }

    /**
     * The reference the procedure derivation was given, in the same form (identifier, U(x), k).
     *
     * @param candidate a reference candidate of the procedures module
     * @return the reference
     * @throws IllegalArgumentException when the candidate is null
     */
    public static ReferenceUncertainty from(ReferenceCandidate candidate) {
        Objects.requireNonNull(candidate, "candidate");
        return new ReferenceUncertainty(candidate.identifier(), candidate.expandedUncertaintyAt(),
                candidate.coverageFactor());
    }

    /**
     * The certificate's expanded uncertainty at an input.
     *
     * @param input x in input units
     * @return U(x), finite and ≥ 0
     * @throws IllegalArgumentException when the certificate's function gives a negative or non-finite value
     */
    public double expandedAt(double input) {
        return InputChecks.nonNegative("expanded uncertainty of reference " + instrument + " at " + input,
                expandedUncertaintyAt.applyAsDouble(input));
    }
}
