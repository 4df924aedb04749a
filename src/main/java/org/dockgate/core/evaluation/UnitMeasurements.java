package org.dockgate.core.evaluation;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.dockgate.core.InputChecks;
import org.dockgate.core.metrics.FrequencyPoint;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.CalibrationSeries;
import org.dockgate.core.series.Direction;

/**
 * Everything recorded for one unit so far: the static calibration readings, the zero-input noise samples,
 * the frequency-response points, and the measurement context (reference certificates, readout resolution,
 * environment). Any list may be empty while readings are still to come.
 *
 * <p>Units: static inputs are in the specification's input unit and outputs (static readings and noise
 * samples) in its output unit; frequencies in hertz, sweep amplitudes in any one unit (only their ratios
 * are used). The data-acquisition parser ({@code org.dockgate.core.acquisition}) converts to these units.
 * Static inputs are the values the reference applied and each reading's nominal is the procedure's set point
 * it belongs to (a nominal within 10⁻⁶ of the span of a planned point counts for it, which absorbs
 * unit-conversion rounding); see {@link CalibrationPoint}.
 *
 * @param staticPoints     static readings (input, output, direction, cycle ≥ 1), in the order taken
 * @param noiseSamples     output samples at zero input, in the order taken
 * @param sweepPoints      measured amplitude response, one point per frequency
 * @param context          the Type B context
 */
public record UnitMeasurements(List<CalibrationPoint> staticPoints, List<Double> noiseSamples,
        List<FrequencyPoint> sweepPoints, MeasurementContext context) {

    /**
     * Copies the lists and validates them.
     *
     * @throws IllegalArgumentException when a list or the context is null, a list holds a null, or a noise
     *                                  sample is not finite
     */
    public UnitMeasurements {
        if (staticPoints == null || noiseSamples == null || sweepPoints == null || context == null) {
            throw new IllegalArgumentException("Unit measurements need their (possibly empty) lists and a context");
        }
        if (staticPoints.stream().anyMatch(Objects::isNull) || sweepPoints.stream().anyMatch(Objects::isNull)) {
            throw new IllegalArgumentException("Unit measurements must not contain empty (null) readings");
        }
        for (int i = 0; i < noiseSamples.size(); i++) {
            Double v = noiseSamples.get(i);
            if (v == null) {
                throw new IllegalArgumentException("Noise sample " + (i + 1) + " is empty");
            }
            InputChecks.finite("noise sample " + (i + 1), v);
        }
        staticPoints = List.copyOf(staticPoints);
        noiseSamples = List.copyOf(noiseSamples);
        sweepPoints = List.copyOf(sweepPoints);
    }

    /**
     * A unit with a complete static series only.
     *
     * @param series  the static readings
     * @param context the context
     * @return the measurements
     */
    public static UnitMeasurements of(CalibrationSeries series, MeasurementContext context) {
        return new UnitMeasurements(series.points(), List.of(), List.of(), context);
    }

    /** @return a builder, for adding readings one at a time as they arrive */
    public static Builder builder() {
        return new Builder();
    }

    /** @return the noise samples as an array */
    public double[] noiseSampleArray() {
        return noiseSamples.stream().mapToDouble(Double::doubleValue).toArray();
    }

    /** Collects readings one at a time. Not thread-safe. */
    public static final class Builder {
        private final List<CalibrationPoint> statics = new ArrayList<>();
        private final List<Double> noise = new ArrayList<>();
        private final List<FrequencyPoint> sweep = new ArrayList<>();
        private MeasurementContext context = MeasurementContext.empty();

        private Builder() {
        }

        /** Adds a static reading. */
        public Builder staticReading(double input, double output, Direction direction, int cycle) {
            statics.add(new CalibrationPoint(input, output, direction, cycle));
            return this;
        }

        /** Adds a static reading whose applied input differs from its nominal set point. */
        public Builder staticReading(double applied, double output, Direction direction, int cycle, double nominal) {
            statics.add(new CalibrationPoint(applied, output, direction, cycle, nominal));
            return this;
        }

        /** Adds a prepared static reading. */
        public Builder staticReading(CalibrationPoint point) {
            statics.add(Objects.requireNonNull(point, "point"));
            return this;
        }

        /** Adds a zero-input noise sample (output units). */
        public Builder noiseSample(double value) {
            noise.add(InputChecks.finite("noise sample", value));
            return this;
        }

        /** Adds a frequency-response point. */
        public Builder sweepPoint(double frequencyHz, double amplitude) {
            sweep.add(new FrequencyPoint(frequencyHz, amplitude));
            return this;
        }

        /** Sets the context. */
        public Builder context(MeasurementContext measurementContext) {
            context = Objects.requireNonNull(measurementContext, "context");
            return this;
        }

        /** @return the measurements collected so far */
        public UnitMeasurements build() {
            return new UnitMeasurements(statics, noise, sweep, context);
        }
    }
}
