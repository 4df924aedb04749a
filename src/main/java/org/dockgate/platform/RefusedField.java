package org.dockgate.platform;

/**
 * Input refused because of one field, named the way the request names it (a JSON path such as
 * {@code overrides.static.cycles} or a form field). The API adds it to the problem document as
 * {@code field}; pages show the message beside that field.
 */
public class RefusedField extends IllegalArgumentException {

    private final String field;

    public RefusedField(String field, String message) {
        super(message);
        this.field = field;
    }

    /** @return the field the refusal concerns */
    public String field() {
        return field;
    }
}
