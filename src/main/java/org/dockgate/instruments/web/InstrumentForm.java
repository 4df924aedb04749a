package org.dockgate.instruments.web;

/** The new-instrument form, as typed. */
record InstrumentForm(String identifier, String description, String quantity, String rangeMin, String rangeMax,
                      String unit, String certificateNumber, String calibratedOn, String dueOn,
                      String expandedUncertainty, String uncertaintyMode, String coverageFactor,
                      String band1UpTo, String band1U, String band1Mode,
                      String band2UpTo, String band2U, String band2Mode,
                      String band3UpTo, String band3U, String band3Mode,
                      String calibratedMin, String calibratedMax, String uncertaintyFloor) implements CalibrationInput {

    static InstrumentForm empty() {
        return new InstrumentForm("", "", "", "", "", "", "", "", "", "", "PERCENT_OF_READING", "2",
                "", "", "PERCENT_OF_READING", "", "", "PERCENT_OF_READING", "", "", "PERCENT_OF_READING", "", "", "");
    }
}
