package org.dockgate.core.uncertainty;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

import org.dockgate.core.InputChecks;

/**
 * An evaluated uncertainty budget for one measurand with uncorrelated inputs (JCGM 100:2008, GUM).
 *
 * <ul>
 * <li>combined standard uncertainty u_c = √(Σ (c_i·u_i)²) (GUM 5.1.2, Eq. 10, no correlation terms);</li>
 * <li>effective degrees of freedom ν_eff = u_c⁴ / Σ ((c_i·u_i)⁴ / ν_i) (Welch–Satterthwaite, GUM G.4.1,
 * Eq. G.2b); a term with ν_i = +∞ adds nothing, so ν_eff = +∞ when every ν_i is infinite. It always lies between
 * min ν_i and Σ ν_i;</li>
 * <li>coverage factor k = t_p(⌊ν_eff⌋), the normal quantile when ν_eff = +∞ ({@link CoverageFactor});</li>
 * <li>expanded uncertainty U = k·u_c (GUM 6.2.1).</li>
 * </ul>
 *
 * <p>Build one with {@link #builder()}:
 * <pre>{@code
 * UncertaintyBudget budget = UncertaintyBudget.builder()
 *         .typeA("repeatability", readings)
 *         .rectangular("resolution", 0.005)
 *         .expanded("reference certificate", 0.030, 2.0)
 *         .rectangular("temperature", 0.02).sensitivity(0.5)
 *         .evaluate(0.95);
 * }</pre>
 *
 * @param contributions                the budget lines, in the order they were added, at least one
 * @param combinedStandardUncertainty  u_c ≥ 0
 * @param effectiveDegreesOfFreedom    ν_eff ≥ 1, {@link Double#POSITIVE_INFINITY} when infinite; not truncated
 * @param coverageProbability          p in (0, 1) the coverage factor was chosen for
 * @param coverageFactor               k &gt; 0
 * @param expandedUncertainty          U = k·u_c
 */
public record UncertaintyBudget(List<UncertaintyContribution> contributions, double combinedStandardUncertainty,
        double effectiveDegreesOfFreedom, double coverageProbability, double coverageFactor,
        double expandedUncertainty) {

    /**
     * Copies the lines and checks the figures are well-formed (it does not recompute them; use
     * {@link #of(List, double)} to evaluate).
     */
    public UncertaintyBudget {
        contributions = List.copyOf(contributions);
        if (contributions.isEmpty()) {
            throw new IllegalArgumentException("an uncertainty budget needs at least one contribution");
        }
        InputChecks.nonNegative("combinedStandardUncertainty", combinedStandardUncertainty);
        InputChecks.degreesOfFreedom("effectiveDegreesOfFreedom", effectiveDegreesOfFreedom);
        InputChecks.probability("coverageProbability", coverageProbability);
        InputChecks.positive("coverageFactor", coverageFactor);
        InputChecks.nonNegative("expandedUncertainty", expandedUncertainty);
    }

    /** @return a builder for a budget, contributions added in order */
    public static Builder builder() {
        return new Builder();
    }

    /**
     * Evaluates a budget: u_c (GUM 5.1.2), ν_eff (GUM G.4.1), k = t_p(⌊ν_eff⌋) and U = k·u_c, see the class comment.
     * When every contribution is zero, u_c = U = 0 and ν_eff is reported as +∞ (nothing is uncertain; the
     * Welch–Satterthwaite ratio would be 0/0).
     *
     * @param contributions       at least one line
     * @param coverageProbability p, strictly between 0 and 1
     * @return the evaluated budget
     * @throws IllegalArgumentException when there is no contribution or p is not in (0, 1)
     */
    public static UncertaintyBudget of(List<UncertaintyContribution> contributions, double coverageProbability) {
        Objects.requireNonNull(contributions, "contributions");
        if (contributions.isEmpty()) {
            throw new IllegalArgumentException("an uncertainty budget needs at least one contribution");
        }
        InputChecks.probability("coverageProbability", coverageProbability);
        double largest = 0.0;
        for (UncertaintyContribution line : contributions) {
            largest = Math.max(largest, line.contribution());
        }
        if (largest == 0.0) {
            return new UncertaintyBudget(contributions, 0.0, Double.POSITIVE_INFINITY, coverageProbability,
                    CoverageFactor.forProbability(coverageProbability, Double.POSITIVE_INFINITY), 0.0);
        }
        // Sums of squares and fourth powers of ratios to the largest term: avoids overflow and underflow for
        // contributions far from 1 (u⁴ of 1e-90 is zero in double), without changing the result.
        double sumOfSquares = 0.0;
        for (UncertaintyContribution line : contributions) {
            double r = line.contribution() / largest;
            sumOfSquares += r * r;
        }
        double combined = largest * Math.sqrt(sumOfSquares);
        double denominator = 0.0;
        double fewestDegreesOfFreedom = Double.POSITIVE_INFINITY;
        for (UncertaintyContribution line : contributions) {
            double r = line.contribution() / largest;
            denominator += (r * r) * (r * r) / line.degreesOfFreedom(); // 0 when ν_i = +∞
            if (r > 0) {
                fewestDegreesOfFreedom = Math.min(fewestDegreesOfFreedom, line.degreesOfFreedom());
            }
        }
        // ν_eff ≥ min ν_i holds exactly; the clamp only absorbs rounding in the last bit
        double effective = denominator == 0.0 ? Double.POSITIVE_INFINITY
                : Math.max(fewestDegreesOfFreedom, (sumOfSquares * sumOfSquares) / denominator);
        double k = CoverageFactor.forProbability(coverageProbability, effective);
        return new UncertaintyBudget(contributions, combined, effective, coverageProbability, k, k * combined);
    }

    /** @return whether ν_eff is infinite, i.e. every contribution with a non-zero share has ν_i = +∞ */
    public boolean hasInfiniteDegreesOfFreedom() {
        return effectiveDegreesOfFreedom == Double.POSITIVE_INFINITY;
    }

    /**
     * Builds a budget line by line. Every method adds one contribution with sensitivity coefficient 1, except
     * {@link #sensitivity(double)} which sets it on the line added last. A builder is not thread-safe.
     */
    public static final class Builder {

        private final List<UncertaintyContribution> lines = new ArrayList<>();

        private Builder() {
        }

        /** Adds a prepared line. */
        public Builder add(UncertaintyContribution contribution) {
            lines.add(Objects.requireNonNull(contribution, "contribution"));
            return this;
        }

        /** Type A from repeated readings: u = s/√n, ν = n − 1 (GUM 4.2). */
        public Builder typeA(String name, double... readings) {
            return add(UncertaintyContribution.typeA(name, readings));
        }

        /** Type B, half-width a with the given distribution, ν = +∞ (GUM 4.3.7, 4.3.9). */
        public Builder halfWidth(String name, double halfWidth, Distribution distribution) {
            return add(UncertaintyContribution.halfWidth(name, halfWidth, distribution));
        }

        /** Type B, rectangular: u = a/√3, ν = +∞ (GUM 4.3.7). */
        public Builder rectangular(String name, double halfWidth) {
            return halfWidth(name, halfWidth, Distribution.RECTANGULAR);
        }

        /** Type B, triangular: u = a/√6, ν = +∞ (GUM 4.3.9). */
        public Builder triangular(String name, double halfWidth) {
            return halfWidth(name, halfWidth, Distribution.TRIANGULAR);
        }

        /** Type B, U-shaped: u = a/√2, ν = +∞ (EA-4/02). */
        public Builder uShaped(String name, double halfWidth) {
            return halfWidth(name, halfWidth, Distribution.U_SHAPED);
        }

        /**
         * The resolution δ of a digital indication: rectangular with half-width δ/2, u = δ/(2√3), ν = +∞
         * (GUM F.2.2.1).
         */
        public Builder resolution(String name, double resolution) {
            return rectangular(name, InputChecks.nonNegative("resolution", resolution) / 2.0);
        }

        /** Type B from an expanded uncertainty U with coverage factor k: u = U/k, ν = +∞ (GUM 4.3.3). */
        public Builder expanded(String name, double expandedUncertainty, double coverageFactor) {
            return add(UncertaintyContribution.expanded(name, expandedUncertainty, coverageFactor));
        }

        /** A standard uncertainty stated directly, ν = +∞. */
        public Builder standard(String name, double standardUncertainty) {
            return standard(name, standardUncertainty, Double.POSITIVE_INFINITY);
        }

        /** A standard uncertainty stated directly with its degrees of freedom ν ≥ 1 (or +∞). */
        public Builder standard(String name, double standardUncertainty, double degreesOfFreedom) {
            return add(UncertaintyContribution.standard(name, standardUncertainty, degreesOfFreedom));
        }

        /**
         * Sets the sensitivity coefficient c = ∂f/∂x of the line added last (GUM 5.1.3).
         *
         * @throws IllegalStateException    when no line has been added yet
         * @throws IllegalArgumentException when c is NaN or infinite
         */
        public Builder sensitivity(double sensitivityCoefficient) {
            if (lines.isEmpty()) {
                throw new IllegalStateException("add a contribution before setting its sensitivity coefficient");
            }
            int last = lines.size() - 1;
            lines.set(last, lines.get(last).withSensitivityCoefficient(sensitivityCoefficient));
            return this;
        }

        /** @return the lines added so far (a copy) */
        public List<UncertaintyContribution> contributions() {
            return List.copyOf(lines);
        }

        /**
         * Evaluates the budget at coverage probability p, see {@link UncertaintyBudget#of(List, double)}.
         *
         * @throws IllegalArgumentException when no line was added or p is not in (0, 1)
         */
        public UncertaintyBudget evaluate(double coverageProbability) {
            return UncertaintyBudget.of(lines, coverageProbability);
        }
    }
}
