package org.dockgate.receiving;

/** Input receiving refuses, with a message for people and the field it concerns (null: the whole form). */
public class ReceivingException extends IllegalArgumentException {

    private final String field;

    public ReceivingException(String field, String message) {
        super(message);
        this.field = field;
    }

    /** The form field the message belongs to, or null. */
    public String field() {
        return field;
    }
}
