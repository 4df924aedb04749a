package org.dockgate.bench;

import java.time.Instant;
import java.util.Optional;
import java.util.OptionalInt;
import org.dockgate.core.series.Direction;

/**
 * One saved reading: one recorded value at one test point of one unit, with who, when and which
 * instrument. Never changed once saved; a correction is a new reading that {@link #supersedes()} it.
 *
 * @param id               the reading's number
 * @param lotId            the lot
 * @param serial           the unit's serial number
 * @param test             STATIC, NOISE or SWEEP
 * @param point            STATIC: set point in the procedure's input unit; NOISE: sample index; SWEEP: frequency in Hz
 * @param direction        STATIC: UP or DOWN; empty otherwise
 * @param cycle            STATIC: cycle number from 1; empty otherwise
 * @param slot             position of this test point in the procedure's order for the unit (0 first)
 * @param value            the value in the procedure's output unit
 * @param unit             the procedure's output unit
 * @param enteredValue     the value as entered
 * @param enteredUnit      the unit as entered
 * @param instrument       the reference instrument's identifier
 * @param recordedBy       the user name of who recorded it
 * @param recordedAt       when (UTC)
 * @param clientToken      the token the client sent, when it sent one (a repeated submit is recognised by it)
 * @param supersedes       the reading this one corrects, when it is a correction
 * @param correctionReason why, for a correction
 * @param supersededBy     the reading that corrects this one, when one does (then it no longer counts)
 * @param importId         the import this reading came with, if any
 * @param applied          STATIC: the value the reference applied, in the input unit (the set point when none was
 *                         recorded); the point otherwise
 * @param readout          the readout instrument, if recorded
 * @param excitation       the excitation supply, if recorded
 */
public record Reading(long id, long lotId, String serial, ReadingTest test, double point,
                      Optional<Direction> direction, OptionalInt cycle, int slot, double value, String unit,
                      double enteredValue, String enteredUnit, String instrument, String recordedBy,
                      Instant recordedAt, Optional<String> clientToken, Optional<Long> supersedes,
                      Optional<String> correctionReason, Optional<Long> supersededBy, Optional<Long> importId,
                      double applied, Optional<String> readout, Optional<String> excitation) {

    /** @return whether a later correction replaces this reading */
    public boolean superseded() {
        return supersededBy.isPresent();
    }

    /** @return whether this reading is a correction of an earlier one */
    public boolean correction() {
        return supersedes.isPresent();
    }
}
