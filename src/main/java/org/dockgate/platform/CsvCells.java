package org.dockgate.platform;

import java.io.IOException;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVPrinter;

/**
 * The one way the application writes CSV rows: every cell is made safe to open in a spreadsheet.
 * A text cell starting with {@code =}, {@code +}, {@code -}, {@code @}, tab or carriage return is
 * read by spreadsheet programs as a formula (CSV or "formula" injection, OWASP's CSV Injection page,
 * from memory); such a cell gets a leading apostrophe, which spreadsheets show as plain text.
 *
 * <p>Numbers are data, not formulas: a cell whose value is a Java {@link Number}, or text that is a
 * plain decimal number such as {@code -0.5} or {@code +1.2E-3}, is written unchanged. A plain number
 * cannot call a function or reference a cell, and prefixing it would turn every negative reading into
 * text for whoever analyses the export. Anything else starting with a sign ({@code -1+2}, {@code -A1})
 * is neutralised.
 */
public final class CsvCells {

    private static final Pattern PLAIN_NUMBER = Pattern.compile("[+-]?(\\d+(\\.\\d*)?|\\.\\d+)([eE][+-]?\\d+)?");

    private CsvCells() {
    }

    /** The value to write for one cell: unchanged unless a spreadsheet would read it as a formula. */
    public static Object safe(Object value) {
        if (value == null || value instanceof Number) {
            return value;
        }
        String text = value.toString();
        if (text.isEmpty() || PLAIN_NUMBER.matcher(text).matches()) {
            return text;
        }
        char first = text.charAt(0);
        return first == '=' || first == '+' || first == '-' || first == '@' || first == '\t' || first == '\r'
                ? "'" + text : text;
    }

    /** Prints one record with every cell passed through {@link #safe(Object)}. */
    public static void printRecord(CSVPrinter printer, Object... values) throws IOException {
        Object[] cells = new Object[values.length];
        for (int i = 0; i < values.length; i++) {
            cells[i] = safe(values[i]);
        }
        printer.printRecord(cells);
    }
}
