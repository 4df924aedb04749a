package org.dockgate.catalogue;

/** A refused catalogue change, with the form field it concerns (or null) and a message for the page. */
public class CatalogueException extends IllegalArgumentException {

    private final String field;

    public CatalogueException(String field, String message) {
        super(message);
        this.field = field;
    }

    public String field() {
        return field;
    }
}
