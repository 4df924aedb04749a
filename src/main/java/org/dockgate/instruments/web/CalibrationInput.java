package org.dockgate.instruments.web;

/**
 * The calibration fields shared by the new-instrument and the new-calibration forms, as typed (text), so
 * that a value that is not a number is shown back with its error instead of being lost. Up to three
 * range segments (bandN…) may state a different U below the top of the range; the main U applies above
 * the last segment up to the range maximum.
 */
interface CalibrationInput {

    String certificateNumber();

    String calibratedOn();

    String dueOn();

    String expandedUncertainty();

    String uncertaintyMode();

    String coverageFactor();

    /** Lower end of the calibrated range; blank: the instrument's range minimum. */
    String calibratedMin();

    /** Upper end of the calibrated range; blank: the instrument's range maximum. */
    String calibratedMax();

    /** The smallest U anywhere in the range; blank: derived (see InstrumentView#uncertaintyFloor). */
    String uncertaintyFloor();

    String band1UpTo();

    String band1U();

    String band1Mode();

    String band2UpTo();

    String band2U();

    String band2Mode();

    String band3UpTo();

    String band3U();

    String band3Mode();

    default String[] bandRow(int row) {
        return switch (row) {
            case 1 -> new String[] {band1UpTo(), band1U(), band1Mode()};
            case 2 -> new String[] {band2UpTo(), band2U(), band2Mode()};
            case 3 -> new String[] {band3UpTo(), band3U(), band3Mode()};
            default -> throw new IllegalArgumentException("There are three segment rows, not " + row);
        };
    }
}
