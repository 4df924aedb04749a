package org.dockgate.core.sampling;

/**
 * The result of original inspection of one lot, as fed to the switching rules
 * ({@link SwitchingRules#next(SwitchingState, LotResult)}). Resubmitted lots are not fed: the
 * switching rules count original inspection only (ISO 2859-1:1999 clause 9.3.1).
 *
 * <p>Whether the lot was accepted is derived from the plan and the number of nonconforming items, so
 * the two can never disagree. The two conditions the standard leaves to people are explicit inputs,
 * given per lot because they can change from one lot to the next: whether production is at a steady
 * rate, and whether the responsible authority considers reduced inspection desirable (clause 9.3.3
 * b and c; ANSI/ASQ Z1.4-2008 clause 8.3.3 c and d).
 *
 * @param plan the plan the lot was inspected with (its severity must match the switching state)
 * @param nonconforming number of nonconforming items d found in the sample (or the lot, under 100 %
 *     inspection)
 * @param productionSteady true when production is at a steady rate; false means irregular or delayed
 *     production, which ends reduced inspection (clause 9.3.4 b) and prevents switching to it
 * @param reducedInspectionApproved true when the responsible authority considers reduced inspection
 *     desirable; without it normal inspection never switches to reduced
 */
public record LotResult(SamplingPlan plan, int nonconforming, boolean productionSteady,
        boolean reducedInspectionApproved) {

    /**
     * Validates the result.
     *
     * @throws IllegalArgumentException when the plan is null or d is negative or exceeds the sample size
     */
    public LotResult {
        if (plan == null) {
            throw new IllegalArgumentException("A lot result needs the plan it was inspected with.");
        }
        SingleSamplingPlans.disposition(plan, nonconforming); // validates 0 <= d <= n
    }

    /**
     * A lot from steady production without approval for reduced inspection.
     *
     * @param plan the plan used
     * @param nonconforming number of nonconforming items found
     * @return the lot result
     * @throws IllegalArgumentException as the canonical constructor
     */
    public static LotResult of(SamplingPlan plan, int nonconforming) {
        return new LotResult(plan, nonconforming, true, false);
    }

    /**
     * The disposition of the lot: d ≤ Ac accept, d ≥ Re reject, in between (Z1.4 reduced gap plans only)
     * accept and return to normal.
     *
     * @return the disposition
     */
    public Disposition disposition() {
        return SingleSamplingPlans.disposition(plan, nonconforming);
    }

    /**
     * Whether the lot was accepted on original inspection.
     *
     * @return true unless the disposition is {@link Disposition#REJECT}
     */
    public boolean accepted() {
        return disposition().accepted();
    }

    /**
     * Copy with another approval flag.
     *
     * @param approved whether the responsible authority considers reduced inspection desirable
     * @return the copy
     */
    public LotResult withReducedInspectionApproved(boolean approved) {
        return new LotResult(plan, nonconforming, productionSteady, approved);
    }

    /**
     * Copy with another production flag.
     *
     * @param steady whether production is at a steady rate
     * @return the copy
     */
    public LotResult withProductionSteady(boolean steady) {
        return new LotResult(plan, nonconforming, steady, reducedInspectionApproved);
    }
}
