package org.dockgate.core.acquisition;

import java.util.List;

/**
 * The outcome of parsing a data-acquisition file.
 *
 * @param rowsRead         data rows read (blank lines excluded)
 * @param readingsAccepted rows handed to the consumer
 * @param errors           the first errors, at most {@link AcquisitionCsv#MAX_LISTED_ERRORS}, in file order
 * @param errorsNotListed  how many more errors there were beyond the listed ones
 */
public record AcquisitionReport(long rowsRead, long readingsAccepted, List<RowError> errors, long errorsNotListed) {

    /** Copies the error list. */
    public AcquisitionReport {
        errors = List.copyOf(errors);
    }

    /** @return whether the file had no error at all */
    public boolean valid() {
        return errors.isEmpty();
    }

    /** @return the number of errors, listed or not */
    public long errorCount() {
        return errors.size() + errorsNotListed;
    }

    /** @return the listed errors as readable lines, and a last line counting the rest if any */
    public List<String> messages() {
        List<String> lines = new java.util.ArrayList<>(errors.stream().map(RowError::toString).toList());
        if (errorsNotListed > 0) {
            lines.add("… and " + errorsNotListed + " more errors");
        }
        return lines;
    }
}
