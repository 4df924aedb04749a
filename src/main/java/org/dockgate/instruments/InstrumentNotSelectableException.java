package org.dockgate.instruments;

import java.time.LocalDate;

/**
 * An instrument was chosen for a day on which no calibration of it was in force (expired, or not yet
 * calibrated then). The web layer answers 409 (API) or a refusal page.
 */
public class InstrumentNotSelectableException extends IllegalStateException {

    private final String identifier;
    private final LocalDate day;

    public InstrumentNotSelectableException(String identifier, LocalDate day, String message) {
        super(message);
        this.identifier = identifier;
        this.day = day;
    }

    /** @return the instrument's identifier */
    public String identifier() {
        return identifier;
    }

    /** @return the day it was wanted for */
    public LocalDate day() {
        return day;
    }
}
