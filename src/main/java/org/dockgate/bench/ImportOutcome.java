package org.dockgate.bench;

import java.util.List;

/**
 * What an import of a data-acquisition file did, or would do (preview).
 *
 * @param preview          true when nothing was meant to be saved
 * @param saved            whether the readings were saved (a commit of a valid file)
 * @param importId         the saved import's number, when saved
 * @param rowsRead         data rows read
 * @param validRows        rows that passed every check
 * @param errors           the problems, each naming its line and column ("line 17, column 'value': …")
 * @param errorCount       how many problems in all (errors lists the first ones)
 * @param fileSha256       the file's SHA-256, hex
 * @param firstRows        the first valid rows, for a preview table
 */
public record ImportOutcome(boolean preview, boolean saved, Long importId, long rowsRead, long validRows,
                            List<String> errors, long errorCount, String fileSha256, List<PreviewRow> firstRows) {

    public ImportOutcome {
        errors = List.copyOf(errors);
        firstRows = List.copyOf(firstRows);
    }

    /** @return whether the file had no problem */
    public boolean valid() {
        return errorCount == 0;
    }

    /** One valid row as it will be saved. */
    public record PreviewRow(long line, String serial, ReadingTest test, String point, double value, String unit) {
    }
}
