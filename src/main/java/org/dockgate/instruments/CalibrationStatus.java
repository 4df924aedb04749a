package org.dockgate.instruments;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;

/**
 * Where an instrument stands against the due date of its current calibration, on a given day.
 *
 * <p>The due date is the day recalibration is due and the first day the instrument may no longer be
 * used (conservative reading: an auditor never has to argue about the due day itself). So, with
 * d = days from today to the due date: d ≤ 0 → {@link #EXPIRED} ("out of calibration since the due
 * date"); 1 ≤ d ≤ {@value #DUE_SOON_DAYS} → {@link #DUE_SOON}; d &gt; {@value #DUE_SOON_DAYS} →
 * {@link #IN_CALIBRATION}.
 */
public enum CalibrationStatus {
    IN_CALIBRATION,
    /** Still usable, but due within {@value #DUE_SOON_DAYS} days: flagged on pages and in the API. */
    DUE_SOON,
    /** Past its due date: cannot be selected anywhere. */
    EXPIRED;

    /** An instrument due within this many days is {@link #DUE_SOON}. */
    public static final int DUE_SOON_DAYS = 30;

    /**
     * The status of a calibration due on {@code dueOn}, seen on {@code today} (see the class description).
     *
     * @param dueOn the due date
     * @param today the day of the question
     * @return the status
     */
    public static CalibrationStatus of(LocalDate dueOn, LocalDate today) {
        long days = ChronoUnit.DAYS.between(today, dueOn);
        if (days <= 0) {
            return EXPIRED;
        }
        return days <= DUE_SOON_DAYS ? DUE_SOON : IN_CALIBRATION;
    }

    /** @return whether an instrument in this status may be chosen for a test */
    public boolean selectable() {
        return this != EXPIRED;
    }
}
