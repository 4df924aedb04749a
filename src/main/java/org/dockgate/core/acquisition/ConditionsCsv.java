package org.dockgate.core.acquisition;

import java.io.Reader;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;

/**
 * The companion file of a data-acquisition CSV: the environmental conditions of each unit, one line per unit
 * (DEVELOPERS.md, "Data-acquisition CSV format", conditions file):
 *
 * <pre>
 * serial,ambientC,relativeHumidityPercent,pressureKPa,deviationReason
 * SN-0001,22.8,45,101.3,
 * SN-0002,29.1,46,,"Air conditioning failed; the line is waiting for the parts"
 * </pre>
 *
 * <p>The file is small (one line per sampled unit), so it is read whole. Every problem is reported with
 * its line and column, as in {@link AcquisitionCsv}; a serial that appears twice is an error on its second
 * line (which one applies would be a guess). Physical sense is checked here ({@link AmbientConditions});
 * the procedure's limits are checked by whoever saves the rows.
 */
public final class ConditionsCsv {

    /** The header row, exactly. */
    public static final String HEADER = "serial,ambientC,relativeHumidityPercent,pressureKPa,deviationReason";

    /** The columns in order. */
    public static final List<String> COLUMNS = List.of(HEADER.split(","));

    /** At most this many lines (a sample is far smaller). */
    public static final int MAX_ROWS = 10_000;

    private static final CSVFormat FORMAT = CSVFormat.DEFAULT.builder()
            .setIgnoreEmptyLines(false)
            .setIgnoreSurroundingSpaces(true)
            .get();

    private ConditionsCsv() {
    }

    /**
     * One unit's conditions from the file.
     *
     * @param line            the file line
     * @param serial          the unit
     * @param conditions      the values, physically sensible
     * @param deviationReason the reason given for conditions outside the procedure's limits, if any
     */
    public record ConditionsRow(long line, String serial, AmbientConditions conditions,
                                Optional<String> deviationReason) {
    }

    /**
     * The outcome of reading a conditions file.
     *
     * @param rowsRead data lines read (blank lines excluded)
     * @param rows     the valid rows, in file order
     * @param errors   every problem, in file order
     */
    public record Report(long rowsRead, List<ConditionsRow> rows, List<RowError> errors) {
        public Report {
            rows = List.copyOf(rows);
            errors = List.copyOf(errors);
        }

        /** @return whether the file had no error */
        public boolean valid() {
            return errors.isEmpty();
        }
    }

    /**
     * Reads a conditions file (format in the class description).
     *
     * @param reader the file's characters; the caller closes it
     * @return the valid rows and every error by line and column
     * @throws IllegalArgumentException when the reader is null
     * @throws UncheckedIOException     when reading fails (malformed content is reported, not thrown)
     */
    public static Report parse(Reader reader) {
        if (reader == null) {
            throw new IllegalArgumentException("Parsing a conditions file needs a reader");
        }
        List<ConditionsRow> rows = new ArrayList<>();
        List<RowError> errors = new ArrayList<>();
        Map<String, Long> seen = new HashMap<>();
        long[] read = {0};
        CsvWalk.walk(reader, FORMAT, new CsvWalk.Visitor() {
            @Override
            public boolean header(long line, CSVRecord record) {
                List<String> names = new ArrayList<>();
                record.forEach(f -> names.add(f.strip()));
                names.set(0, names.get(0).startsWith("\uFEFF") ? names.get(0).substring(1).strip() : names.get(0));
                if (!names.equals(COLUMNS)) {
                    errors.add(new RowError(line, Optional.empty(), "the header row must be exactly '" + HEADER
                            + "', found '" + String.join(",", names) + "'"));
                    return false;
                }
                return true;
            }

            @Override
            public boolean row(long line, CSVRecord record) {
                if (++read[0] > MAX_ROWS) {
                    errors.add(new RowError(line, Optional.empty(), "more than " + MAX_ROWS + " lines; a conditions file"
                            + " has one line per sampled unit"));
                    return false;
                }
                ConditionsRow row = ConditionsCsv.row(line, record, errors);
                if (row != null) {
                    Long first = seen.putIfAbsent(row.serial(), line);
                    if (first != null) {
                        errors.add(new RowError(line, Optional.of("serial"), "'" + row.serial()
                                + "' already has conditions on line " + first + "; give one line per unit"));
                    } else {
                        rows.add(row);
                    }
                }
                return true;
            }

            @Override
            public void malformed(long line, String problem) {
                errors.add(new RowError(line, Optional.empty(), "the CSV is malformed here (" + problem
                        + "); nothing after this line was read"));
            }

            @Override
            public void empty() {
                errors.add(new RowError(1, Optional.empty(), "the file is empty: it must start with the header row '"
                        + HEADER + "'"));
            }
        });
        return new Report(read[0], rows, errors);
    }

    private static ConditionsRow row(long line, CSVRecord record, List<RowError> errors) {
        if (record.size() != COLUMNS.size()) {
            errors.add(new RowError(line, Optional.empty(), record.size() + " fields, expected " + COLUMNS.size()
                    + " (" + HEADER + ")"));
            return null;
        }
        int before = errors.size();
        String serial = record.get(0).strip();
        if (serial.isEmpty()) {
            errors.add(new RowError(line, Optional.of("serial"), "is empty; the unit's serial number is needed"));
        } else if (serial.length() > AcquisitionCsv.MAX_SERIAL_LENGTH) {
            errors.add(new RowError(line, Optional.of("serial"), "is " + serial.length() + " characters long, at most "
                    + AcquisitionCsv.MAX_SERIAL_LENGTH + " are accepted"));
        }
        double ambient = number(line, "ambientC", record.get(1).strip(), true, errors);
        double humidity = number(line, "relativeHumidityPercent", record.get(2).strip(), true, errors);
        double pressure = number(line, "pressureKPa", record.get(3).strip(), false, errors);
        String reason = record.get(4).strip();
        if (errors.size() > before) {
            return null;
        }
        try {
            AmbientConditions c = new AmbientConditions(ambient, humidity,
                    Double.isNaN(pressure) ? OptionalDouble.empty() : OptionalDouble.of(pressure));
            return new ConditionsRow(line, serial, c, reason.isEmpty() ? Optional.empty() : Optional.of(reason));
        } catch (IllegalArgumentException e) {
            // The message starts with the field's name in quotes, which is the column's.
            String message = e.getMessage();
            String column = COLUMNS.stream().filter(c -> message.startsWith("'" + c + "'")).findFirst().orElse(null);
            errors.add(new RowError(line, Optional.ofNullable(column),
                    column == null ? message : message.substring(column.length() + 3)));
            return null;
        }
    }

    /** A plain decimal number; NaN when empty and optional, or after recording an error. */
    private static double number(long line, String column, String text, boolean required, List<RowError> errors) {
        if (text.isEmpty()) {
            if (required) {
                errors.add(new RowError(line, Optional.of(column), "is empty; a number is expected"));
            }
            return Double.NaN;
        }
        int end = AcquisitionCsv.numberLength(text);
        if (end != text.length()) {
            String hint = text.matches("[+-]?\\d+,\\d+") ? " (write the decimal separator as a point)" : "";
            errors.add(new RowError(line, Optional.of(column), "'" + text + "' is not a number" + hint));
            return Double.NaN;
        }
        double v = Double.parseDouble(text);
        if (!Double.isFinite(v)) {
            errors.add(new RowError(line, Optional.of(column), "'" + text + "' is too large for a number"));
            return Double.NaN;
        }
        return v;
    }
}
