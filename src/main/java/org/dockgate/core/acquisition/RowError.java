package org.dockgate.core.acquisition;

import java.util.Objects;
import java.util.Optional;

/**
 * A problem with one line of a data-acquisition file.
 *
 * @param line    the file line (1 is the header)
 * @param column  the column's header name, when the problem is in one column
 * @param message what is wrong, for people ("'abc' is not a number")
 */
public record RowError(long line, Optional<String> column, String message) {

    /** Checks the fields are present. */
    public RowError {
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(message, "message");
    }

    /** @return "line 17, column 'value': 'abc' is not a number", or "line 3: …" without a column */
    @Override
    public String toString() {
        return "line " + line + column.map(c -> ", column '" + c + "'").orElse("") + ": " + message;
    }
}
