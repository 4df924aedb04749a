package org.dockgate.core.acquisition;

/** Told how far a parse has come, every N data rows and once at the end. */
@FunctionalInterface
public interface ProgressListener {

    /** A listener that ignores progress. */
    ProgressListener NONE = (rows, characters) -> { };

    /**
     * Progress so far.
     *
     * @param rowsRead       data rows read (valid or not, blank lines excluded)
     * @param charactersRead characters read from the file so far (slightly ahead of the rows, by the parser's
     *                       buffer); against the file's size this gives a percentage
     */
    void progress(long rowsRead, long charactersRead);
}
