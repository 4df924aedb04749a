package org.dockgate.core.spc;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.dockgate.core.InputChecks;
import org.dockgate.core.UnevaluableException;

/**
 * A point estimate and confidence interval for a proportion, e.g. rejected units among inspected units.
 *
 * @param estimate p̂ = x/n
 * @param lower    lower confidence limit, in [0, p̂]
 * @param upper    upper confidence limit, in [p̂, 1]
 */
public record ProportionInterval(double estimate, double lower, double upper) {

    private static final NormalDistribution STANDARD_NORMAL = new NormalDistribution(null, 0.0, 1.0);

    /** Checks 0 ≤ lower ≤ estimate ≤ upper ≤ 1. */
    public ProportionInterval {
        if (!(0.0 <= lower && lower <= estimate && estimate <= upper && upper <= 1.0)) {
            throw new IllegalArgumentException("a proportion interval needs 0 ≤ lower ≤ estimate ≤ upper ≤ 1, was "
                    + lower + " ≤ " + estimate + " ≤ " + upper);
        }
    }

    /**
     * Wilson score interval (Wilson 1927; recommended over the Wald interval by Newcombe 1998): with p̂ = x/n and
     * z = z_{(1+c)/2} the two-sided normal quantile for confidence c,
     * <pre>
     *   centre     = (p̂ + z²/(2n)) / (1 + z²/n)
     *   half-width = z·√(p̂(1 − p̂)/n + z²/(4n²)) / (1 + z²/n)
     * </pre>
     * The limits are the two proportions p for which the score statistic |p̂ − p|/√(p(1 − p)/n) equals z. They
     * stay inside [0, 1]; for x = 0 the lower limit is exactly 0 and for x = n the upper limit exactly 1
     * (where rounding would otherwise leave a trace).
     *
     * @param rejected   x ≥ 0
     * @param inspected  n ≥ x
     * @param confidence c, strictly between 0 and 1 (e.g. 0.95)
     * @return p̂ with its interval
     * @throws IllegalArgumentException when a count is negative, x &gt; n, or c is not in (0, 1)
     * @throws UnevaluableException     when n = 0 (nothing inspected, no proportion)
     */
    public static ProportionInterval wilson(long rejected, long inspected, double confidence) {
        if (rejected < 0 || inspected < 0) {
            throw new IllegalArgumentException("rejected and inspected must not be negative, were " + rejected
                    + " and " + inspected);
        }
        if (rejected > inspected) {
            throw new IllegalArgumentException("rejected (" + rejected + ") must not exceed inspected ("
                    + inspected + ")");
        }
        InputChecks.probability("confidence", confidence);
        if (inspected == 0) {
            throw new UnevaluableException("no units inspected: a reject proportion needs at least one");
        }
        double n = inspected;
        double p = rejected / n;
        double z = STANDARD_NORMAL.inverseCumulativeProbability((1.0 + confidence) / 2.0);
        double z2 = z * z;
        double denominator = 1.0 + z2 / n;
        double centre = (p + z2 / (2.0 * n)) / denominator;
        double halfWidth = z * Math.sqrt(p * (1.0 - p) / n + z2 / (4.0 * n * n)) / denominator;
        double lower = rejected == 0 ? 0.0 : Math.max(0.0, Math.min(p, centre - halfWidth));
        double upper = rejected == inspected ? 1.0 : Math.min(1.0, Math.max(p, centre + halfWidth));
        return new ProportionInterval(p, lower, upper);
    }
}
