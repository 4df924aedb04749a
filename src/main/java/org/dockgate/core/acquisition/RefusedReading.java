package org.dockgate.core.acquisition;

import java.util.Optional;

/**
 * Thrown by a parse's consumer to refuse a valid row (a serial not in the lot, a point already recorded);
 * the parser records it as that line's error, in the column named here.
 */
public class RefusedReading extends IllegalArgumentException {

    private final String column;

    /**
     * @param column  the column the problem is in (a header name such as "serial"), or null for the whole row
     * @param message what is wrong, for people
     */
    public RefusedReading(String column, String message) {
        super(message);
        this.column = column;
    }

    /** @return the column, absent for the whole row */
    public Optional<String> column() {
        return Optional.ofNullable(column);
    }
}
