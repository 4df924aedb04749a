package org.dockgate.core.uncertainty;

import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.TDistribution;
import org.dockgate.core.InputChecks;

/** Coverage factors k_p for an expanded uncertainty U = k_p·u_c (GUM 6.2, G.3, G.6). */
public final class CoverageFactor {

    /**
     * Above this many degrees of freedom the normal quantile is used: t_p(ν) then differs from it by less than
     * (z³ + z)/(4ν) ≈ 8·10⁻⁶ even at p = 99.73 %, while the Student-t quantile of Commons Math 3.6.1 loses
     * accuracy beyond about 10⁸ degrees of freedom.
     */
    static final double NORMAL_ABOVE_DEGREES_OF_FREEDOM = 1.0e6;

    private static final NormalDistribution STANDARD_NORMAL = new NormalDistribution(null, 0.0, 1.0);

    /**
     * k_p by (p, ⌊ν⌋): a unit's evaluation asks for the same few ν hundreds of times (every point's budget), and the
     * Student-t quantile is an iterative solve. The value is a pure function of the key, so a cached k is the k a
     * fresh computation gives, bit for bit. Bounded: beyond this many keys new ones are computed, not kept.
     */
    static final int CACHE_LIMIT = 4096;

    private record Key(double coverageProbability, double degreesOfFreedom) {
    }

    private static final Map<Key, Double> CACHE = new ConcurrentHashMap<>();

    private CoverageFactor() {
    }

    /**
     * Coverage factor k_p = t_p(ν): the two-sided Student-t quantile with an interval −t_p … +t_p that holds the
     * fraction p of the distribution, i.e. the (1 + p)/2 quantile (GUM G.3.4, Table G.2). A non-integer ν is
     * truncated to the next lower integer first (GUM G.4.1 Note 1 and G.6.4 step 3), see
     * {@link #truncatedDegreesOfFreedom(double)}. For ν = +∞ (and above 10⁶) the normal quantile z_p is used
     * (GUM G.6.6: k = 2 for p = 95.45 %).
     *
     * @param coverageProbability p, strictly between 0 and 1 (e.g. 0.95, or 0.9544997 for k = 2 in the limit)
     * @param degreesOfFreedom    ν ≥ 1, or +∞
     * @return k_p, greater than zero
     * @throws IllegalArgumentException when p is not in (0, 1) or ν is NaN or below 1
     */
    public static double forProbability(double coverageProbability, double degreesOfFreedom) {
        InputChecks.probability("coverageProbability", coverageProbability);
        InputChecks.degreesOfFreedom("degreesOfFreedom", degreesOfFreedom);
        double nu = truncatedDegreesOfFreedom(degreesOfFreedom);
        Key key = new Key(coverageProbability, nu > NORMAL_ABOVE_DEGREES_OF_FREEDOM ? Double.POSITIVE_INFINITY : nu);
        Double cached = CACHE.get(key);
        if (cached != null) {
            return cached;
        }
        double quantile = (1.0 + coverageProbability) / 2.0;
        double k = nu > NORMAL_ABOVE_DEGREES_OF_FREEDOM ? STANDARD_NORMAL.inverseCumulativeProbability(quantile)
                : new TDistribution(null, nu).inverseCumulativeProbability(quantile);
        if (CACHE.size() < CACHE_LIMIT) {
            CACHE.putIfAbsent(key, k);
        }
        return k;
    }

    /**
     * ν truncated down to an integer (GUM G.4.1 Note 1). A value within 10⁻⁹ (relative) below an integer counts as
     * that integer, so that rounding in the Welch–Satterthwaite sum cannot drop a whole degree of freedom
     * (e.g. two equal contributions of ν = 10 give exactly 20, not 19.999999999999996 → 19). +∞ stays +∞.
     *
     * @param degreesOfFreedom ν ≥ 1 or +∞
     * @return ⌊ν⌋, at least 1
     * @throws IllegalArgumentException when ν is NaN or below 1
     */
    public static double truncatedDegreesOfFreedom(double degreesOfFreedom) {
        InputChecks.degreesOfFreedom("degreesOfFreedom", degreesOfFreedom);
        if (degreesOfFreedom == Double.POSITIVE_INFINITY) {
            return degreesOfFreedom;
        }
        return Math.max(1.0, Math.floor(degreesOfFreedom * (1.0 + 1.0e-9)));
    }

    /**
     * The coverage probability of ±k standard deviations of a normal distribution, p = 2Φ(k) − 1: 0.682689… for
     * k = 1, 0.954499… for k = 2, 0.997300… for k = 3 — the exact values behind the 68.27 %, 95.45 % and 99.73 %
     * columns of GUM Table G.2.
     *
     * @param coverageFactor k &gt; 0
     * @return p in (0, 1]
     * @throws IllegalArgumentException when k is NaN, infinite or not positive
     */
    public static double normalCoverageProbability(double coverageFactor) {
        InputChecks.positive("coverageFactor", coverageFactor);
        // 1 − 2Φ(−k) keeps the tail accurate where 2Φ(k) − 1 would cancel
        return 1.0 - 2.0 * STANDARD_NORMAL.cumulativeProbability(-coverageFactor);
    }
}
