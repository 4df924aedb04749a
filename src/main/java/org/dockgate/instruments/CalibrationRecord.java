package org.dockgate.instruments;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;

/**
 * One calibration of a reference instrument, as its certificate states it. Calibration records are
 * append-only: a recalibration adds a record, it never changes an earlier one.
 *
 * @param sequenceNo        1 for the instrument's first calibration in the register, then 2, 3…
 * @param certificateNumber the calibration certificate's number
 * @param calibratedOn      the calibration date on the certificate
 * @param dueOn             the day recalibration is due (first day out of calibration, see {@link CalibrationStatus})
 * @param coverageFactor    k of the stated expanded uncertainty (commonly 2, about 95 %)
 * @param bands             the expanded uncertainty by range segment, ascending by {@code upTo}; the last
 *                          band ends at the range maximum
 * @param recordedAt        when the record was entered (UTC)
 * @param calibratedMin     lower end of the calibrated range as stated, in the instrument's unit; null for a
 *                          record that states none (the instrument's range applies: {@link InstrumentView#calibratedMin})
 * @param calibratedMax     upper end as stated, null when none is
 * @param uncertaintyFloor  the smallest U as stated, null when none is (derived: {@link InstrumentView#uncertaintyFloor})
 */
public record CalibrationRecord(int sequenceNo, String certificateNumber, LocalDate calibratedOn, LocalDate dueOn,
                                double coverageFactor, List<UncertaintyBand> bands, Instant recordedAt,
                                Double calibratedMin, Double calibratedMax, Double uncertaintyFloor) {

    public CalibrationRecord {
        bands = List.copyOf(bands);
    }

    /** A record over the instrument's whole range with no stated floor (as entered before V10_5). */
    public CalibrationRecord(int sequenceNo, String certificateNumber, LocalDate calibratedOn, LocalDate dueOn,
                             double coverageFactor, List<UncertaintyBand> bands, Instant recordedAt) {
        this(sequenceNo, certificateNumber, calibratedOn, dueOn, coverageFactor, bands, recordedAt, null, null, null);
    }

    /** @return whether this calibration was in force on a day: calibrated on or before it, due after it */
    public boolean covers(LocalDate day) {
        return !day.isBefore(calibratedOn) && day.isBefore(dueOn);
    }
}
