package org.dockgate.accounts;

/** A refused account change, with the form field it concerns (or null) and a message for the page. */
public class AccountException extends IllegalArgumentException {

    private final String field;

    public AccountException(String field, String message) {
        super(message);
        this.field = field;
    }

    public String field() {
        return field;
    }
}
