package org.dockgate.core.sampling;

import java.util.Objects;

/**
 * A single sampling plan by attributes for one lot, after following the table's arrows
 * (ISO 2859-1:1999 Tables 1 and 2-A/2-B/2-C).
 *
 * <p>Accept the lot when the number of nonconforming items d in the sample is at most
 * {@code acceptNumber}; do not accept it when d is at least {@code rejectNumber}. Only the gap plans
 * of the ANSI/ASQ Z1.4 reduced table have {@code rejectNumber > acceptNumber + 1} (see
 * {@link Disposition#ACCEPT_AND_RETURN_TO_NORMAL}).
 *
 * <p>100 % inspection: when the tabulated sample size reaches or exceeds the lot size ("If sample size
 * equals or exceeds lot size, carry out 100 % inspection", legend of Tables 2-A/2-B/2-C),
 * {@code fullInspection} is true, {@code sampleSize} is the lot size and the plan's Ac/Re are kept and
 * applied to the whole lot. The standard does not say which criterion then applies; keeping the plan's
 * numbers is Dockgate's documented choice, so a fully inspected lot is judged as strictly as the plan
 * would have judged a sample, and the items found nonconforming remain individually nonconforming.
 *
 * @param codeLetter the code letter from Table 1 for the lot size and inspection level
 * @param planCodeLetter the code letter of the row whose plan is used, after following arrows
 *     ({@code S} only for tightened inspection at AQL 0.025)
 * @param sampleSize number of items to inspect: the sample size of {@code planCodeLetter}'s row, or the
 *     lot size under 100 % inspection
 * @param acceptNumber Ac, the largest number of nonconforming items for which the lot is accepted
 * @param rejectNumber Re, the smallest number of nonconforming items for which the lot is not accepted
 * @param fullInspection true when the tabulated sample size reaches or exceeds the lot size
 * @param severity the table the plan comes from
 * @param aql the acceptance quality limit (column)
 * @param scheme the published scheme the tables belong to
 */
public record SamplingPlan(
        CodeLetter codeLetter,
        CodeLetter planCodeLetter,
        int sampleSize,
        int acceptNumber,
        int rejectNumber,
        boolean fullInspection,
        Severity severity,
        Aql aql,
        Scheme scheme) {

    /**
     * Validates the plan: all references present, sample size at least 1, 0 ≤ Ac &lt; Re.
     *
     * @throws IllegalArgumentException when a field is null or the numbers are inconsistent
     */
    public SamplingPlan {
        Objects.requireNonNull(codeLetter, "codeLetter");
        Objects.requireNonNull(planCodeLetter, "planCodeLetter");
        Objects.requireNonNull(severity, "severity");
        Objects.requireNonNull(aql, "aql");
        Objects.requireNonNull(scheme, "scheme");
        if (sampleSize < 1) {
            throw new IllegalArgumentException("Sample size must be at least 1, was " + sampleSize + ".");
        }
        if (acceptNumber < 0 || rejectNumber <= acceptNumber) {
            throw new IllegalArgumentException("A plan needs 0 <= Ac < Re, was Ac " + acceptNumber
                    + ", Re " + rejectNumber + ".");
        }
    }

    /**
     * The lot decision for {@code nonconforming} items found; see
     * {@link SingleSamplingPlans#disposition(SamplingPlan, int)}.
     *
     * @param nonconforming number of nonconforming items d found among the {@link #sampleSize()} items
     * @return the disposition
     * @throws IllegalArgumentException when d is negative or larger than the sample size
     */
    public Disposition disposition(int nonconforming) {
        return SingleSamplingPlans.disposition(this, nonconforming);
    }
}
