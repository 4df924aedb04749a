package org.dockgate.core.spc;

import java.util.Objects;
import java.util.OptionalDouble;

import org.apache.commons.math3.stat.StatUtils;
import org.dockgate.core.InputChecks;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.decision.Tolerance;

/**
 * Process capability of one metric across units, with the sample standard deviation s of all values:
 * Cp = (USL − LSL)/(6s), Cpu = (USL − x̄)/(3s), Cpl = (x̄ − LSL)/(3s), Cpk = min(Cpu, Cpl) of the sides given
 * (ISO 22514-2; AIAG SPC manual). Because s is the overall standard deviation, not a within-subgroup σ, the AIAG
 * manual would call these Pp and Ppk; incoming units arrive without rational subgroups, so the overall s is the
 * estimate at hand.
 *
 * @param count             number of values n
 * @param mean              x̄
 * @param standardDeviation s (divisor n − 1)
 * @param cp                Cp, absent for a one-sided specification
 * @param cpu               Cpu, absent without an upper limit
 * @param cpl               Cpl, absent without a lower limit
 * @param cpk               Cpk = min of the one-sided indices present; negative when x̄ lies outside the limits
 */
public record ProcessCapability(int count, double mean, double standardDeviation, OptionalDouble cp,
        OptionalDouble cpu, OptionalDouble cpl, double cpk) {

    /**
     * Computes the indices, see the class comment.
     *
     * @param values        the metric's values, one per unit, all finite
     * @param specification the specification limits LSL and/or USL
     * @return the capability
     * @throws IllegalArgumentException when there are no values or one is NaN or infinite
     * @throws UnevaluableException     when there are fewer than two values, or all values are equal (s = 0: the
     *                                  indices would be infinite and say nothing about the process)
     */
    public static ProcessCapability of(double[] values, Tolerance specification) {
        Objects.requireNonNull(specification, "specification");
        if (values == null || values.length == 0) {
            throw new IllegalArgumentException("values must not be empty");
        }
        for (int i = 0; i < values.length; i++) {
            InputChecks.finite("values[" + i + "]", values[i]);
        }
        if (values.length < 2) {
            throw new UnevaluableException("process capability needs at least two values, got " + values.length);
        }
        double mean = StatUtils.mean(values);
        double s = Math.sqrt(StatUtils.variance(values, mean));
        if (s == 0.0) {
            throw new UnevaluableException("all " + values.length
                    + " values are equal: without variation the capability indices are undefined");
        }
        OptionalDouble cp = specification.width().isPresent()
                ? OptionalDouble.of(specification.width().getAsDouble() / (6.0 * s)) : OptionalDouble.empty();
        OptionalDouble cpu = specification.upper().isPresent()
                ? OptionalDouble.of((specification.upper().getAsDouble() - mean) / (3.0 * s)) : OptionalDouble.empty();
        OptionalDouble cpl = specification.lower().isPresent()
                ? OptionalDouble.of((mean - specification.lower().getAsDouble()) / (3.0 * s)) : OptionalDouble.empty();
        double cpk = Math.min(cpu.orElse(Double.POSITIVE_INFINITY), cpl.orElse(Double.POSITIVE_INFINITY));
        return new ProcessCapability(values.length, mean, s, cp, cpu, cpl, cpk);
    }
}
