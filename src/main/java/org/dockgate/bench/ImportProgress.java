package org.dockgate.bench;

/** Told how far an import has come. */
@FunctionalInterface
public interface ImportProgress {

    ImportProgress NONE = (rows, characters) -> { };

    /**
     * @param rowsRead       data rows read so far
     * @param charactersRead characters of the file read so far
     */
    void progress(long rowsRead, long charactersRead);
}
