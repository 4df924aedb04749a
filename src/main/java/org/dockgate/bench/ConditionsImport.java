package org.dockgate.bench;

import java.util.List;

/**
 * The outcome of importing a conditions file.
 *
 * @param preview   true when only checked
 * @param saved     true when every row was saved (one transaction); false when previewing or when any row is wrong
 * @param rowsRead  data rows read
 * @param validRows rows that passed every check
 * @param errors    every problem, "line 3, column 'ambientC': 'abc' is not a number", in line order
 */
public record ConditionsImport(boolean preview, boolean saved, int rowsRead, int validRows, List<String> errors) {

    public ConditionsImport {
        errors = List.copyOf(errors);
    }

    /** @return whether the file had no error */
    public boolean valid() {
        return errors.isEmpty();
    }
}
