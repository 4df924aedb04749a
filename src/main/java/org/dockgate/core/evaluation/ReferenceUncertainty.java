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
