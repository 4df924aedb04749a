package org.dockgate.instruments;

import java.time.LocalDate;
import java.util.List;

/**
 * A calibration to record, as on its certificate. Checked by {@link InstrumentService}.
 *
 * @param certificateNumber the certificate's number, unique for the instrument
 * @param calibratedOn      the calibration date, not in the future
 * @param dueOn             the due date, after {@code calibratedOn}
 * @param coverageFactor    k, finite and &gt; 0
 * @param bands             U by range segment, ascending; the last band ends at the range maximum
 * @param calibratedMin     lower end of the range the certificate covers, in the instrument's unit; null: the
 *                          instrument's range minimum
 * @param calibratedMax     upper end of that range, null: the instrument's range maximum
 * @param uncertaintyFloor  the smallest U the certificate gives anywhere, in the instrument's unit, &gt; 0; null:
 *                          not stated, derived (see {@link InstrumentView#uncertaintyFloor})
 */
public record NewCalibration(String certificateNumber, LocalDate calibratedOn, LocalDate dueOn,
                             double coverageFactor, List<UncertaintyBand> bands, Double calibratedMin,
                             Double calibratedMax, Double uncertaintyFloor) {

    public NewCalibration {
        bands = bands == null ? List.of() : List.copyOf(bands);
    }

    /** A calibration over the instrument's whole range with no stated floor. */
    public NewCalibration(String certificateNumber, LocalDate calibratedOn, LocalDate dueOn, double coverageFactor,
                          List<UncertaintyBand> bands) {
        this(certificateNumber, calibratedOn, dueOn, coverageFactor, bands, null, null, null);
    }

    /** This calibration with a stated calibrated range and floor (any may be null: not stated). */
    public NewCalibration over(Double min, Double max, Double floor) {
        return new NewCalibration(certificateNumber, calibratedOn, dueOn, coverageFactor, bands, min, max, floor);
    }

    /** A calibration with one uncertainty for the whole range (its band ends at {@code rangeMax}). */
    public static NewCalibration uniform(String certificateNumber, LocalDate calibratedOn, LocalDate dueOn,
                                         double expandedUncertainty, UncertaintyMode mode, double coverageFactor,
                                         double rangeMax) {
        return new NewCalibration(certificateNumber, calibratedOn, dueOn, coverageFactor,
                List.of(new UncertaintyBand(rangeMax, expandedUncertainty, mode)));
    }
}
