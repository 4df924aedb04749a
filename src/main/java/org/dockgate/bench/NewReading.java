package org.dockgate.bench;

import org.dockgate.core.series.Direction;

/**
 * A reading as entered at the bench or sent by a client. Boxed fields: a missing one is refused with
 * its name.
 *
 * @param serial      the unit's serial number (one of the lot's sampled serials)
 * @param test        STATIC, NOISE or SWEEP
 * @param point       STATIC: set point in the procedure's input unit; NOISE: sample index; SWEEP: frequency in Hz
 * @param direction   STATIC: UP or DOWN; null otherwise
 * @param cycle       STATIC: cycle from 1; null otherwise
 * @param value       the value as read
 * @param unit        its unit (converted to the procedure's output unit); null means the output unit
 * @param instrument  the reference instrument's identifier (must be in calibration today)
 * @param clientToken chosen by the client once per reading, so a repeated submit is recognised; may be null
 * @param applied     STATIC: the value the reference actually applied, in the procedure's input unit; null means
 *                    the set point. It must lie within the procedure's window around the set point
 * @param readout     the readout instrument's identifier (multimeter, DAQ, bridge); null when not recorded
 * @param excitation  the excitation supply's identifier; null when not recorded
 */
public record NewReading(String serial, ReadingTest test, Double point, Direction direction, Integer cycle,
                         Double value, String unit, String instrument, String clientToken, Double applied,
                         String readout, String excitation) {

    /** A reading taken at its set point, with the stimulus only. */
    public NewReading(String serial, ReadingTest test, Double point, Direction direction, Integer cycle,
                      Double value, String unit, String instrument, String clientToken) {
        this(serial, test, point, direction, cycle, value, unit, instrument, clientToken, null, null, null);
    }
}
