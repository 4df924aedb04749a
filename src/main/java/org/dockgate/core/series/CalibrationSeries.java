package org.dockgate.core.series;

import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.NavigableMap;
import java.util.TreeMap;
import java.util.function.Predicate;
import org.apache.commons.math3.stat.StatUtils;

/**
 * An immutable calibration series: the readings of one unit, in the order they were taken,
 * with grouping helpers used by the static-characteristics evaluation.
 *
 * <p>Inputs are grouped by exact equality: a calibration applies the same nominal set point
 * on every traverse, so readings "at the same input" carry the same input value.
 */
public final class CalibrationSeries {

    private final List<CalibrationPoint> points;

    private CalibrationSeries(List<CalibrationPoint> points) {
        this.points = points;
    }

    /**
     * Creates a series from its readings.
     *
     * @param points the readings, at least one, none null
     * @return the series (an unmodifiable copy)
     * @throws IllegalArgumentException when the list is null, empty or holds a null
     */
    public static CalibrationSeries of(List<CalibrationPoint> points) {
        if (points == null || points.isEmpty()) {
            throw new IllegalArgumentException("A calibration series needs at least one point");
        }
        if (points.stream().anyMatch(p -> p == null)) {
            throw new IllegalArgumentException("A calibration series must not contain empty (null) points");
        }
        return new CalibrationSeries(List.copyOf(points));
    }

    /**
     * Creates a series from its readings.
     *
     * @param points the readings, at least one
     * @return the series
     * @throws IllegalArgumentException as {@link #of(List)}
     */
    public static CalibrationSeries of(CalibrationPoint... points) {
        if (points == null) {
            throw new IllegalArgumentException("A calibration series needs at least one point");
        }
        return of(java.util.Arrays.asList(points));
    }

    /**
     * The readings in their original order.
     *
     * @return an unmodifiable list
     */
    public List<CalibrationPoint> points() {
        return points;
    }

    /**
     * Number of readings.
     *
     * @return n, 1 or more
     */
    public int size() {
        return points.size();
    }

    /**
     * The inputs of all readings, in series order.
     *
     * @return a fresh array
     */
    public double[] inputs() {
        return points.stream().mapToDouble(CalibrationPoint::input).toArray();
    }

    /**
     * The outputs of all readings, in series order.
     *
     * @return a fresh array
     */
    public double[] outputs() {
        return points.stream().mapToDouble(CalibrationPoint::output).toArray();
    }

    /**
     * The distinct inputs, ascending.
     *
     * @return a fresh array, at least one element
     */
    public double[] distinctInputs() {
        return points.stream().mapToDouble(CalibrationPoint::input).distinct().sorted().toArray();
    }

    /**
     * Whether any reading was taken in the given direction.
     *
     * @param direction UP or DOWN
     * @return true when at least one reading has that direction
     */
    public boolean hasDirection(Direction direction) {
        return points.stream().anyMatch(p -> p.direction() == direction);
    }

    /**
     * Mean output at each distinct input over all readings there (both directions, all cycles):
     * ȳ(x) = Σ y / n over the readings with input x. This is the calibration curve from which
     * nonlinearity is evaluated.
     *
     * @return input → mean output, ascending by input, unmodifiable
     */
    public NavigableMap<Double, Double> meanOutputByInput() {
        return meansBy(p -> true);
    }

    /**
     * Mean output at each distinct input over the readings in one direction (all cycles):
     * ȳ_up(x) or ȳ_dn(x). Inputs never approached from that direction are absent from the map.
     *
     * @param direction UP or DOWN
     * @return input → mean output, ascending by input, unmodifiable (possibly empty)
     */
    public NavigableMap<Double, Double> meanOutputByInput(Direction direction) {
        return meansBy(p -> p.direction() == direction);
    }

    /**
     * The readings grouped by input and direction (the groups a repeatability evaluation
     * pools), ordered by input and then UP before DOWN.
     *
     * @return the groups, unmodifiable
     */
    public List<ReadingGroup> groupsByInputAndDirection() {
        Map<Direction, NavigableMap<Double, List<Double>>> byDirection = new java.util.EnumMap<>(Direction.class);
        for (CalibrationPoint p : points) {
            byDirection.computeIfAbsent(p.direction(), d -> new TreeMap<>())
                    .computeIfAbsent(p.input(), x -> new ArrayList<>())
                    .add(p.output());
        }
        List<ReadingGroup> groups = new ArrayList<>();
        byDirection.forEach((direction, byInput) -> byInput.forEach(
                (input, outputs) -> groups.add(new ReadingGroup(input, direction, outputs))));
        groups.sort(Comparator.comparingDouble(ReadingGroup::input).thenComparing(ReadingGroup::direction));
        return Collections.unmodifiableList(groups);
    }

    private NavigableMap<Double, Double> meansBy(Predicate<CalibrationPoint> filter) {
        NavigableMap<Double, List<Double>> byInput = new TreeMap<>();
        for (CalibrationPoint p : points) {
            if (filter.test(p)) {
                byInput.computeIfAbsent(p.input(), x -> new ArrayList<>()).add(p.output());
            }
        }
        NavigableMap<Double, Double> means = new TreeMap<>();
        byInput.forEach((input, outputs) ->
                means.put(input, StatUtils.mean(outputs.stream().mapToDouble(Double::doubleValue).toArray())));
        return Collections.unmodifiableNavigableMap(means);
    }

    @Override
    public boolean equals(Object other) {
        return other instanceof CalibrationSeries that && points.equals(that.points);
    }

    @Override
    public int hashCode() {
        return points.hashCode();
    }

    @Override
    public String toString() {
        return "CalibrationSeries" + points;
    }
}
