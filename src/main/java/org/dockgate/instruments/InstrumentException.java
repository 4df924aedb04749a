package org.dockgate.instruments;

/**
 * A refused register change, with the input field it concerns (or null) and a message for people. The
 * field names are those of {@link NewInstrument} and {@link NewCalibration}, bands as
 * {@code bands[i].upTo} / {@code bands[i].expandedUncertainty}.
 */
public class InstrumentException extends IllegalArgumentException {

    private final String field;

    public InstrumentException(String field, String message) {
        super(message);
        this.field = field;
    }

    /** @return the input field the refusal concerns, or null */
    public String field() {
        return field;
    }
}
