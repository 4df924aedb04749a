package org.dockgate.core.series;

import java.util.List;
import org.apache.commons.math3.stat.StatUtils;

/**
 * The readings of a series taken at one input from one direction (all cycles).
 *
 * @param input     the common input
 * @param direction the common direction
 * @param outputs   the outputs in series order; unmodifiable, at least one
 */
public record ReadingGroup(double input, Direction direction, List<Double> outputs) {

    /**
     * Copies the outputs into an unmodifiable list.
     *
     * @throws IllegalArgumentException when there are no outputs or the direction is null
     */
    public ReadingGroup {
        if (direction == null) {
            throw new IllegalArgumentException("A reading group needs a direction");
        }
        if (outputs == null || outputs.isEmpty()) {
            throw new IllegalArgumentException("A reading group needs at least one output");
        }
        outputs = List.copyOf(outputs);
    }

    /**
     * Number of readings in the group.
     *
     * @return n, 1 or more
     */
    public int count() {
        return outputs.size();
    }

    /**
     * Arithmetic mean of the outputs, ȳ = Σy/n (Commons Math {@code StatUtils.mean}, which adds
     * a second-pass correction for rounding).
     *
     * @return the mean output
     */
    public double mean() {
        return StatUtils.mean(values());
    }

    /**
     * Sample variance s² = Σ(y − ȳ)²/(n − 1) of the outputs (JCGM 100:2008, 4.2.2), computed
     * with the two-pass formula of Commons Math {@code StatUtils.variance}.
     *
     * <p>Edge case: a single reading has no sample variance; the result is then 0 by Commons
     * Math's convention, and callers that pool variances skip groups of one.
     *
     * @return s², 0 for a single reading
     */
    public double variance() {
        return StatUtils.variance(values());
    }

    private double[] values() {
        return outputs.stream().mapToDouble(Double::doubleValue).toArray();
    }
}
