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
 */
public record NewCalibration(String certificateNumber, LocalDate calibratedOn, LocalDate dueOn,
                             double coverageFactor, List<UncertaintyBand> bands) {

    public NewCalibration {
        bands = bands == null ? List.of() : List.copyOf(bands);
    }

    /** A calibration with one uncertainty for the whole range (its band ends at {@code rangeMax}). */
    public static NewCalibration uniform(String certificateNumber, LocalDate calibratedOn, LocalDate dueOn,
                                         double expandedUncertainty, UncertaintyMode mode, double coverageFactor,
                                         double rangeMax) {
        return new NewCalibration(certificateNumber, calibratedOn, dueOn, coverageFactor,
                List.of(new UncertaintyBand(rangeMax, expandedUncertainty, mode)));
    }
}
