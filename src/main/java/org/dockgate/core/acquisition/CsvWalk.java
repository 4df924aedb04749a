package org.dockgate.core.acquisition;

import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.util.Iterator;
import java.util.NoSuchElementException;
import org.apache.commons.csv.CSVException;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * The record loop the lab's CSV files share (readings, conditions): blank lines skipped, the first non-blank
 * line handed over as the header, every line numbered as a text editor counts it, and a malformed line
 * (an unclosed quote) reported at its line instead of thrown. Commons CSV reports a malformed line as an
 * exception from the iterator, which is why the loop is written out once here.
 */
final class CsvWalk {

    /** What a file's reader does with each part of the walk. */
    interface Visitor {
        /**
         * The header row.
         *
         * @return false to stop reading (the header is wrong)
         */
        boolean header(long line, CSVRecord record);

        /**
         * A data row.
         *
         * @return false to stop reading
         */
        boolean row(long line, CSVRecord record);

        /** A line Commons CSV could not read; nothing after it is read. */
        void malformed(long line, String problem);

        /** The file had no non-blank line at all. */
        void empty();
    }

    private CsvWalk() {
    }

    /**
     * Walks a file.
     *
     * @param reader  the characters; the caller closes it
     * @param format  the CSV dialect
     * @param visitor what to do with each part
     * @throws UncheckedIOException when reading fails for another reason than malformed content
     */
    static void walk(Reader reader, CSVFormat format, Visitor visitor) {
        long line = 1;
        try (CSVParser parser = CSVParser.parse(reader, format)) {
            Iterator<CSVRecord> records = parser.iterator();
            boolean headerSeen = false;
            while (true) {
                line = parser.getCurrentLineNumber() + 1;
                CSVRecord record;
                try {
                    record = records.next();
                } catch (NoSuchElementException end) {
                    break;
                }
                if (blank(record)) {
                    continue;
                }
                if (!headerSeen) {
                    if (!visitor.header(line, record)) {
                        return;
                    }
                    headerSeen = true;
                    continue;
                }
                if (!visitor.row(line, record)) {
                    return;
                }
            }
            if (!headerSeen) {
                visitor.empty();
            }
        } catch (UncheckedIOException e) {
            if (!(e.getCause() instanceof CSVException)) {
                throw e;
            }
            visitor.malformed(line, e.getCause().getMessage());
        } catch (IOException e) {
            if (!(e instanceof CSVException)) {
                throw new UncheckedIOException(e);
            }
            visitor.malformed(line, e.getMessage());
        }
    }

    /** @return whether every field of the record is blank (an empty line, or one of commas only) */
    static boolean blank(CSVRecord record) {
        for (String field : record) {
            if (!field.isBlank()) {
                return false;
            }
        }
        return true;
    }
}
