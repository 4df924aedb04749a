package org.dockgate.instruments.web;

import org.dockgate.instruments.InstrumentView;
import org.dockgate.instruments.UncertaintyBand;

/** The new-calibration form, as typed, with the version of the register entry the person saw. */
record CalibrationForm(Long version, String certificateNumber, String calibratedOn, String dueOn,
                       String expandedUncertainty, String uncertaintyMode, String coverageFactor,
                       String band1UpTo, String band1U, String band1Mode,
                       String band2UpTo, String band2U, String band2Mode,
                       String band3UpTo, String band3U, String band3Mode,
                       String calibratedMin, String calibratedMax, String uncertaintyFloor) implements CalibrationInput {

    /** An empty form, with the uncertainty of the current calibration proposed (certificates often repeat it). */
    static CalibrationForm proposedFor(InstrumentView view) {
        var bands = view.current().bands();
        String[][] rows = new String[3][];
        for (int i = 0; i < 3; i++) {
            rows[i] = i < bands.size() - 1 ? row(bands.get(i)) : new String[] {"", "", "PERCENT_OF_READING"};
        }
        UncertaintyBand top = bands.get(bands.size() - 1);
        return new CalibrationForm(view.version(), "", "", "", PlainNumbers.text(top.expandedUncertainty()),
                top.mode().name(), PlainNumbers.text(view.current().coverageFactor()),
                rows[0][0], rows[0][1], rows[0][2], rows[1][0], rows[1][1], rows[1][2], rows[2][0], rows[2][1], rows[2][2],
                PlainNumbers.text(view.calibratedMin(view.current())), PlainNumbers.text(view.calibratedMax(view.current())),
                view.current().uncertaintyFloor() == null ? "" : PlainNumbers.text(view.current().uncertaintyFloor()));
    }

    CalibrationForm withVersion(long current) {
        return new CalibrationForm(current, certificateNumber, calibratedOn, dueOn, expandedUncertainty,
                uncertaintyMode, coverageFactor, band1UpTo, band1U, band1Mode, band2UpTo, band2U, band2Mode,
                band3UpTo, band3U, band3Mode, calibratedMin, calibratedMax, uncertaintyFloor);
    }

    private static String[] row(UncertaintyBand band) {
        return new String[] {PlainNumbers.text(band.upTo()), PlainNumbers.text(band.expandedUncertainty()),
            band.mode().name()};
    }
}
