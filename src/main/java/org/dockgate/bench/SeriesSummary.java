package org.dockgate.bench;

import java.util.OptionalDouble;

/**
 * The current readings of one test of a unit in figures: how many, smallest, largest, mean and sample
 * standard deviation (n − 1 in the denominator, common practice; absent below two readings).
 *
 * @param test   STATIC, NOISE or SWEEP
 * @param count  current readings (superseded ones left out)
 * @param min    smallest value, in {@code unit}
 * @param max    largest value
 * @param mean   arithmetic mean
 * @param stddev sample standard deviation
 * @param unit   the procedure's output unit
 */
public record SeriesSummary(ReadingTest test, long count, double min, double max, double mean, OptionalDouble stddev,
                            String unit) {
}
