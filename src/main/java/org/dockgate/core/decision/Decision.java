package org.dockgate.core.decision;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The outcome of applying a decision rule to one measured value.
 *
 * @param verdict                   the statement of conformity
 * @param acceptanceLower           A_L, absent where the tolerance has no lower limit or the acceptance zone is
 *                                  empty (see {@link AcceptanceLimits})
 * @param acceptanceUpper           A_U, absent where the tolerance has no upper limit or the zone is empty
 * @param probabilityOfConformance  p_c in [0, 1] (JCGM 106:2012, normal PDF with u = U/k), reported for every rule
 * @param testUncertaintyRatio      TUR = (T_U − T_L)/(2U); +∞ when U = 0; absent for a one-sided tolerance, where
 *                                  this ratio is not defined
 * @param turAdequate               whether TUR ≥ 4:1 (common practice; the fallback criterion of ANSI/NCSL
 *                                  Z540.3-2006 §5.3 when the false-accept risk is not estimated); false when TUR is
 *                                  absent
 */
public record Decision(Verdict verdict, OptionalDouble acceptanceLower, OptionalDouble acceptanceUpper,
        double probabilityOfConformance, OptionalDouble testUncertaintyRatio, boolean turAdequate) {

    /** Checks the fields are present and p_c is a probability. */
    public Decision {
        Objects.requireNonNull(verdict, "verdict");
        Objects.requireNonNull(acceptanceLower, "acceptanceLower");
        Objects.requireNonNull(acceptanceUpper, "acceptanceUpper");
        Objects.requireNonNull(testUncertaintyRatio, "testUncertaintyRatio");
        if (!(probabilityOfConformance >= 0.0 && probabilityOfConformance <= 1.0)) {
            throw new IllegalArgumentException("probabilityOfConformance must lie in [0, 1], was "
                    + probabilityOfConformance);
        }
    }
}
