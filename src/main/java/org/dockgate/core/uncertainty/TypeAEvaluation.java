package org.dockgate.core.uncertainty;

import org.apache.commons.math3.stat.StatUtils;
import org.dockgate.core.InputChecks;
import org.dockgate.core.UnevaluableException;

/**
 * Type A evaluation of repeated independent readings of one quantity (GUM 4.2): the arithmetic mean
 * q̄ = Σq_k/n (4.2.1), the experimental standard deviation s(q) = √(Σ(q_k − q̄)²/(n − 1)) (4.2.2), the
 * standard uncertainty of the mean u(q̄) = s(q)/√n (4.2.3) and its degrees of freedom ν = n − 1 (G.3.3).
 *
 * @param count                number of readings n, at least 2
 * @param mean                 arithmetic mean q̄
 * @param standardDeviation    experimental standard deviation s(q) of one reading
 * @param standardUncertainty  standard uncertainty of the mean u(q̄) = s/√n
 * @param degreesOfFreedom     ν = n − 1
 */
public record TypeAEvaluation(int count, double mean, double standardDeviation, double standardUncertainty,
        double degreesOfFreedom) {

    /**
     * Evaluates repeated readings. Identical readings give s = 0 and u = 0, which is a valid result: the
     * readout resolution (a Type B contribution) then carries the uncertainty, see GUM F.2.2.1.
     *
     * @param readings the readings, all finite
     * @return the evaluation
     * @throws IllegalArgumentException when there are no readings or one is NaN or infinite
     * @throws UnevaluableException     when there is only one reading (no standard deviation)
     */
    public static TypeAEvaluation of(double... readings) {
        if (readings == null || readings.length == 0) {
            throw new IllegalArgumentException("readings must not be empty");
        }
        for (int i = 0; i < readings.length; i++) {
            InputChecks.finite("readings[" + i + "]", readings[i]);
        }
        if (readings.length < 2) {
            throw new UnevaluableException(
                    "a Type A evaluation needs at least two readings, got " + readings.length);
        }
        int n = readings.length;
        double mean = StatUtils.mean(readings);
        double s = Math.sqrt(StatUtils.variance(readings, mean)); // bias-corrected, divisor n − 1
        return new TypeAEvaluation(n, mean, s, s / Math.sqrt(n), n - 1);
    }
}
