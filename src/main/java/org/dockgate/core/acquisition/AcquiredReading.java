package org.dockgate.core.acquisition;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import org.dockgate.core.metrics.FrequencyPoint;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.Direction;

/**
 * One valid row of a data-acquisition file, converted to the expected units, with what was written.
 *
 * @param line          the file line the row starts on (1 is the header)
 * @param serial        the unit's serial number, as written (trimmed)
 * @param test          the test
 * @param point         STATIC: set point in the expected input unit; NOISE: sample index; SWEEP: frequency in Hz
 * @param direction     STATIC: UP or DOWN; empty otherwise
 * @param cycle         STATIC: cycle number ≥ 1; empty otherwise
 * @param value         the value in the expected unit (output unit, or sweep unit for SWEEP)
 * @param recordedPoint the point column as written
 * @param recordedValue the value as written, before conversion
 * @param recordedUnit  the unit column as written
 * @param applied       STATIC: the value the reference applied, in the expected input unit (the optional column
 *                      {@code applied}; the set point when absent); otherwise the point
 * @param readout       the optional column {@code readout}: the readout instrument's identifier, if written
 * @param excitation    the optional column {@code excitation}: the excitation supply's identifier, if written
 */
public record AcquiredReading(long line, String serial, AcquisitionTest test, double point,
        Optional<Direction> direction, OptionalInt cycle, double value, String recordedPoint, double recordedValue,
        String recordedUnit, double applied, Optional<String> readout, Optional<String> excitation) {

    /** Checks the fields are present and consistent with the test. */
    public AcquiredReading {
        Objects.requireNonNull(serial, "serial");
        Objects.requireNonNull(test, "test");
        Objects.requireNonNull(direction, "direction");
        Objects.requireNonNull(cycle, "cycle");
        Objects.requireNonNull(recordedPoint, "recordedPoint");
        Objects.requireNonNull(recordedUnit, "recordedUnit");
        Objects.requireNonNull(readout, "readout");
        Objects.requireNonNull(excitation, "excitation");
        if ((test == AcquisitionTest.STATIC) != (direction.isPresent() && cycle.isPresent())) {
            throw new IllegalArgumentException("A STATIC reading, and only a STATIC reading, has a direction and a cycle");
        }
    }

    /**
     * This STATIC reading as a calibration point.
     *
     * @return (applied, value, direction, cycle, set point)
     * @throws IllegalStateException when the reading is not STATIC
     */
    public CalibrationPoint toCalibrationPoint() {
        if (test != AcquisitionTest.STATIC) {
            throw new IllegalStateException("Line " + line + " is a " + test + " reading, not a static one");
        }
        return new CalibrationPoint(applied, value, direction.orElseThrow(), cycle.getAsInt(), point);
    }

    /**
     * This SWEEP reading as a frequency-response point.
     *
     * @return (frequency, amplitude)
     * @throws IllegalStateException when the reading is not SWEEP
     */
    public FrequencyPoint toFrequencyPoint() {
        if (test != AcquisitionTest.SWEEP) {
            throw new IllegalStateException("Line " + line + " is a " + test + " reading, not a sweep one");
        }
        return new FrequencyPoint(point, value);
    }

    /** @return whether the row wrote an applied value different from its set point */
    public boolean offNominal() {
        return applied != point;
    }
}
