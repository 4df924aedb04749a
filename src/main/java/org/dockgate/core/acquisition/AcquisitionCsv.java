package org.dockgate.core.acquisition;

import java.io.FilterReader;
import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.function.Consumer;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.dockgate.core.quantity.Units;
import org.dockgate.core.series.Direction;

/**
 * A streaming parser of the data-acquisition CSV format (DEVELOPERS.md, "Data-acquisition CSV format"):
 *
 * <pre>
 * serial,test,point,direction,cycle,value,unit
 * SN-0001,STATIC,0,UP,1,0.052,mV
 * SN-0001,STATIC,29.0075 psi,UP,1,20.11,mV
 * SN-0001,NOISE,0,,,0.0012,mV
 * SN-0001,SWEEP,160,,,100.2,mV
 * </pre>
 *
 * <p>Each row is validated on its own and every problem is reported with its line and column; parsing never
 * stops at a bad row (only at a wrong header or broken quoting, after which the columns cannot be trusted).
 * Valid rows go to the consumer one at a time, so memory does not grow with the file: the caller decides
 * whether to keep, store or count them (an all-or-nothing import stages them and commits only a valid file).
 * Blank lines, and rows whose fields are all empty (spreadsheet exports), are skipped; a leading byte-order
 * mark is ignored; fields may be quoted (RFC 4180, Commons CSV).
 *
 * <p>After the seven columns the header may name the optional columns {@value #APPLIED} (STATIC rows: the value
 * the reference applied, a number with an optional unit like {@code point}; empty → the set point),
 * {@value #READOUT} and {@value #EXCITATION} (the identifiers of the readout and the excitation supply; empty →
 * not recorded), each at most once, in any order. Files without them import as before.
 *
 * <p>Numbers are plain decimals with an optional exponent ({@code -1.5}, {@code 2e-3}); NaN, infinities,
 * numbers too large for double precision, decimal commas and hexadecimal are refused.
 */
public final class AcquisitionCsv {

    /** The header row, exactly. */
    public static final String HEADER = "serial,test,point,direction,cycle,value,unit";

    /** The columns in order. */
    public static final List<String> COLUMNS = List.of(HEADER.split(","));

    /** Optional column: the value the reference applied (STATIC). */
    public static final String APPLIED = "applied";
    /** Optional column: the readout instrument. */
    public static final String READOUT = "readout";
    /** Optional column: the excitation supply. */
    public static final String EXCITATION = "excitation";
    /** The optional columns that may follow the seven. */
    public static final List<String> OPTIONAL_COLUMNS = List.of(APPLIED, READOUT, EXCITATION);
    /** The longest instrument identifier accepted in the optional columns. */
    public static final int MAX_INSTRUMENT_LENGTH = 40;

    /** At most this many errors are listed; the rest are counted. */
    public static final int MAX_LISTED_ERRORS = 200;

    /** Progress is reported every this many data rows unless told otherwise. */
    public static final int DEFAULT_PROGRESS_EVERY = 10_000;

    /** The longest serial number accepted. */
    public static final int MAX_SERIAL_LENGTH = 100;

    private static final Pattern COLUMN_PREFIX = Pattern.compile("column '([a-z]+)': ");
    private static final Pattern NOT_FINITE = Pattern.compile("[+-]?(nan|inf|infinity|∞)", Pattern.CASE_INSENSITIVE);

    private static final CSVFormat FORMAT = CSVFormat.DEFAULT.builder()
            .setIgnoreEmptyLines(false) // blank lines are skipped here, so that line numbers stay true
            .setIgnoreSurroundingSpaces(true)
            .get();

    private final ExpectedUnits units;
    private final Consumer<AcquiredReading> consumer;
    /** target unit → (unit as written → {@link Conversion} or the error message), filled as units appear. */
    private final Map<String, Map<String, Object>> conversions = new HashMap<>();
    private final List<RowError> errors = new ArrayList<>();
    private long errorsNotListed;
    /** The header's optional column → its index; set when the header is read. */
    private final Map<String, Integer> optional = new HashMap<>();
    private int width = COLUMNS.size();

    private AcquisitionCsv(ExpectedUnits units, Consumer<AcquiredReading> consumer) {
        this.units = units;
        this.consumer = consumer;
    }

    /**
     * Parses a file, reporting progress every {@value #DEFAULT_PROGRESS_EVERY} rows.
     *
     * @param reader   the file's characters; the caller opens and closes it (the parser does not close it)
     * @param units    the units to convert to
     * @param consumer receives each valid reading in file order; it may refuse one by throwing
     *                 {@link RefusedReading} (filed under its column) or any {@link IllegalArgumentException},
     *                 whose message becomes that line's error (under a column when it starts "column 'name': ")
     * @param progress told the progress
     * @return the report: rows read, readings accepted, errors
     * @throws IllegalArgumentException when an argument is null
     * @throws UncheckedIOException     when reading fails (not for malformed content, which is reported)
     */
    public static AcquisitionReport parse(Reader reader, ExpectedUnits units, Consumer<AcquiredReading> consumer,
            ProgressListener progress) {
        return parse(reader, units, consumer, progress, DEFAULT_PROGRESS_EVERY);
    }

    /**
     * Parses a file (format in the class description).
     *
     * @param reader        the file's characters
     * @param units         the units to convert to
     * @param consumer      receives each valid reading, see {@link #parse(Reader, ExpectedUnits, Consumer, ProgressListener)}
     * @param progress      told the progress every {@code progressEvery} rows and at the end
     * @param progressEvery rows between progress reports, at least 1
     * @return the report
     * @throws IllegalArgumentException when an argument is null or progressEvery &lt; 1
     * @throws UncheckedIOException     when reading fails
     */
    public static AcquisitionReport parse(Reader reader, ExpectedUnits units, Consumer<AcquiredReading> consumer,
            ProgressListener progress, int progressEvery) {
        if (reader == null || units == null || consumer == null || progress == null) {
            throw new IllegalArgumentException("Parsing a data-acquisition file needs a reader, the expected units, a"
                    + " consumer and a progress listener");
        }
        if (progressEvery < 1) {
            throw new IllegalArgumentException("Progress must be reported every 1 row or more, got " + progressEvery);
        }
        return new AcquisitionCsv(units, consumer).run(new CountingReader(reader), progress, progressEvery);
    }

    private AcquisitionReport run(CountingReader input, ProgressListener progress, int progressEvery) {
        long[] rows = {0};
        long[] accepted = {0};
        CsvWalk.walk(input, FORMAT, new CsvWalk.Visitor() {
            @Override
            public boolean header(long line, CSVRecord record) {
                Optional<String> problem = headerProblem(record);
                problem.ifPresent(p -> error(line, null, p));
                return problem.isEmpty();
            }

            @Override
            public boolean row(long line, CSVRecord record) {
                rows[0]++;
                AcquiredReading reading = AcquisitionCsv.this.row(line, record);
                if (reading != null) {
                    try {
                        consumer.accept(reading);
                        accepted[0]++;
                    } catch (RefusedReading refused) {
                        error(line, refused.column().orElse(null), refused.getMessage());
                    } catch (IllegalArgumentException refused) {
                        refusal(line, refused.getMessage());
                    }
                }
                if (rows[0] % progressEvery == 0) {
                    progress.progress(rows[0], input.count);
                }
                return true;
            }

            @Override
            public void malformed(long line, String problem) {
                error(line, null, "the CSV is malformed here (" + problem
                        + "); a quoted field may be missing its closing quote. Nothing after this line was read");
            }

            @Override
            public void empty() {
                error(1, null, "the file is empty: it must start with the header row '" + HEADER + "'");
            }
        });
        return report(rows[0], accepted[0], progress, input);
    }

    private AcquisitionReport report(long rows, long accepted, ProgressListener progress, CountingReader input) {
        progress.progress(rows, input.count);
        return new AcquisitionReport(rows, accepted, errors, errorsNotListed);
    }

    private Optional<String> headerProblem(CSVRecord record) {
        List<String> names = new ArrayList<>();
        for (String field : record) {
            names.add(field.strip());
        }
        if (!names.isEmpty()) {
            names.set(0, stripBom(names.get(0)));
        }
        if (names.size() > COLUMNS.size() && names.subList(0, COLUMNS.size()).equals(COLUMNS)) {
            for (int i = COLUMNS.size(); i < names.size(); i++) {
                String name = names.get(i);
                if (!OPTIONAL_COLUMNS.contains(name) || optional.containsKey(name)) {
                    optional.clear();
                    return Optional.of("the header's column " + (i + 1) + " is '" + name + "': after '" + HEADER
                            + "' only the optional columns " + String.join(", ", OPTIONAL_COLUMNS)
                            + " may follow, each once");
                }
                optional.put(name, i);
            }
            width = names.size();
            return Optional.empty();
        }
        if (names.equals(COLUMNS)) {
            return Optional.empty();
        }
        String found = String.join(",", names);
        if (names.size() == COLUMNS.size() && testOf(names.get(1)) != null) {
            return Optional.of("the header row is missing: the first line must be exactly '" + HEADER
                    + "', found the data row '" + found + "'");
        }
        String hint = found.contains(";") ? " (the separator must be a comma)" : "";
        return Optional.of("the header row must be exactly '" + HEADER + "', found '" + found + "'" + hint);
    }

    private static String stripBom(String s) {
        return s.startsWith("\uFEFF") ? s.substring(1).strip() : s;
    }

    /** Validates one data row; returns null after recording its errors. */
    private AcquiredReading row(long line, CSVRecord record) {
        if (record.size() != width) {
            error(line, null, record.size() + " fields, expected " + width + " (" + HEADER
                    + (optional.isEmpty() ? "" : " and the header's optional columns") + ")");
            return null;
        }
        long before = errorsSeen();
        String serial = record.get(0).strip();
        if (serial.isEmpty()) {
            error(line, "serial", "is empty; the unit's serial number is needed");
        } else if (serial.length() > MAX_SERIAL_LENGTH) {
            error(line, "serial", "is " + serial.length() + " characters long, at most " + MAX_SERIAL_LENGTH
                    + " are accepted");
        }
        String testText = record.get(1).strip();
        AcquisitionTest test = testOf(testText);
        if (test == null) {
            error(line, "test", (testText.isEmpty() ? "is empty" : "'" + testText + "' is not a test")
                    + "; expected STATIC, NOISE or SWEEP");
        }
        String pointText = record.get(2).strip();
        String directionText = record.get(3).strip();
        String cycleText = record.get(4).strip();
        double point = Double.NaN;
        Optional<Direction> direction = Optional.empty();
        OptionalInt cycle = OptionalInt.empty();
        if (test == AcquisitionTest.STATIC) {
            point = quantity(line, "point", pointText, units.inputUnit(), false);
            direction = direction(line, directionText);
            cycle = cycle(line, cycleText);
        } else if (test != null) {
            point = test == AcquisitionTest.NOISE ? sampleIndex(line, pointText)
                    : quantity(line, "point", pointText, "Hz", true);
            mustBeEmpty(line, "direction", directionText, test);
            mustBeEmpty(line, "cycle", cycleText, test);
        }
        String valueText = record.get(5).strip();
        String unitText = record.get(6).strip();
        double recorded = number(line, "value", valueText);
        String target = test == AcquisitionTest.SWEEP ? units.sweepUnit() : units.outputUnit();
        Conversion conversion = conversion(line, "unit", unitText, target);
        double value = Double.NaN;
        if (conversion != null && !Double.isNaN(recorded)) {
            value = conversion.apply(recorded);
            if (!Double.isFinite(value)) {
                error(line, "value", "'" + valueText + "' " + unitText + " is too large in " + target);
            } else if (test == AcquisitionTest.SWEEP && !(value > 0)) {
                error(line, "value", "'" + valueText + "' is not an amplitude; a sweep value must be greater than 0");
            }
        }
        double applied = point;
        String appliedText = optionalField(record, APPLIED);
        if (!appliedText.isEmpty()) {
            if (test == AcquisitionTest.STATIC) {
                applied = quantity(line, APPLIED, appliedText, units.inputUnit(), false);
            } else if (test != null) {
                mustBeEmpty(line, APPLIED, appliedText, test);
            }
        }
        Optional<String> readout = instrument(line, READOUT, optionalField(record, READOUT));
        Optional<String> excitation = instrument(line, EXCITATION, optionalField(record, EXCITATION));
        if (errorsSeen() > before || test == null) {
            return null;
        }
        return new AcquiredReading(line, serial, test, point, direction, cycle, value, pointText, recorded, unitText,
                applied, readout, excitation);
    }

    private String optionalField(CSVRecord record, String column) {
        Integer index = optional.get(column);
        return index == null ? "" : record.get(index).strip();
    }

    private Optional<String> instrument(long line, String column, String text) {
        if (text.isEmpty()) {
            return Optional.empty();
        }
        if (text.length() > MAX_INSTRUMENT_LENGTH) {
            error(line, column, "is " + text.length() + " characters long, an instrument identifier has at most "
                    + MAX_INSTRUMENT_LENGTH);
            return Optional.empty();
        }
        return Optional.of(text);
    }

    private static AcquisitionTest testOf(String text) {
        for (AcquisitionTest t : AcquisitionTest.values()) {
            if (t.name().equalsIgnoreCase(text.strip())) {
                return t;
            }
        }
        return null;
    }

    private Optional<Direction> direction(long line, String text) {
        if (text.equalsIgnoreCase("UP")) {
            return Optional.of(Direction.UP);
        }
        if (text.equalsIgnoreCase("DOWN")) {
            return Optional.of(Direction.DOWN);
        }
        error(line, "direction", (text.isEmpty() ? "is empty" : "'" + text + "' is not a direction")
                + "; a STATIC row needs UP or DOWN");
        return Optional.empty();
    }

    private OptionalInt cycle(long line, String text) {
        int c = wholeNumber(text);
        if (c >= 1) {
            return OptionalInt.of(c);
        }
        error(line, "cycle", (text.isEmpty() ? "is empty" : "'" + text + "' is not a cycle")
                + "; a STATIC row needs a whole number of 1 or more");
        return OptionalInt.empty();
    }

    private double sampleIndex(long line, String text) {
        int index = wholeNumber(text);
        if (index >= 0) {
            return index;
        }
        error(line, "point", (text.isEmpty() ? "is empty" : "'" + text + "' is not a sample index")
                + "; a NOISE row's point is a whole number of 0 or more");
        return Double.NaN;
    }

    /** A whole number of at most nine digits (an optional '+' before it), or −1. */
    private static int wholeNumber(String text) {
        int start = text.startsWith("+") ? 1 : 0;
        int length = text.length() - start;
        if (length < 1 || length > 9) {
            return -1;
        }
        int value = 0;
        for (int i = start; i < text.length(); i++) {
            char ch = text.charAt(i);
            if (!isDigit(ch)) {
                return -1;
            }
            value = value * 10 + (ch - '0');
        }
        return value;
    }

    private void mustBeEmpty(long line, String column, String text, AcquisitionTest test) {
        if (!text.isEmpty()) {
            error(line, column, "must be empty for a " + test + " row, found '" + text + "'");
        }
    }

    /** A number with an optional unit after it, converted to the target unit; NaN after an error. */
    private double quantity(long line, String column, String text, String target, boolean positive) {
        if (text.isEmpty()) {
            error(line, column, "is empty; a number is expected (in " + target + " or a compatible unit)");
            return Double.NaN;
        }
        int end = numberLength(text);
        if (end == 0) {
            error(line, column, notANumber(text));
            return Double.NaN;
        }
        double raw = finite(line, column, text.substring(0, end), text);
        if (Double.isNaN(raw)) {
            return raw;
        }
        String unit = text.substring(end).strip();
        double converted = raw;
        if (!unit.isEmpty()) {
            Conversion conversion = conversion(line, column, unit, target);
            if (conversion == null) {
                return Double.NaN;
            }
            converted = conversion.apply(raw);
        }
        if (!Double.isFinite(converted)) {
            error(line, column, "'" + text + "' is too large in " + target);
            return Double.NaN;
        }
        if (positive && !(converted > 0)) {
            error(line, column, "'" + text + "' is not a frequency; it must be greater than 0");
            return Double.NaN;
        }
        return converted;
    }

    /** A plain number; NaN after an error. */
    private double number(long line, String column, String text) {
        if (text.isEmpty()) {
            error(line, column, "is empty; a number is expected");
            return Double.NaN;
        }
        if (numberLength(text) != text.length()) {
            error(line, column, notANumber(text));
            return Double.NaN;
        }
        return finite(line, column, text, text);
    }

    private double finite(long line, String column, String number, String text) {
        double v = Double.parseDouble(number);
        if (!Double.isFinite(v)) {
            error(line, column, "'" + text + "' is too large for a number");
            return Double.NaN;
        }
        return v;
    }

    private static String notANumber(String text) {
        if (NOT_FINITE.matcher(text).matches()) {
            return "'" + text + "' is not a finite number";
        }
        if (text.matches("[+-]?\\d+,\\d+.*")) {
            return "'" + text + "' is not a number (write the decimal separator as a point)";
        }
        return "'" + text + "' is not a number";
    }

    /**
     * The length of the plain decimal number at the start of the text — [+-]digits[.digits][(e|E)[+-]digits],
     * at least one digit before or after the point — or 0 when the text does not start with one. A hand-written
     * scan: a regular expression per field costs more than the rest of the row's checks.
     */
    static int numberLength(String text) {
        int i = 0;
        int n = text.length();
        if (i < n && (text.charAt(i) == '+' || text.charAt(i) == '-')) {
            i++;
        }
        int digits = 0;
        while (i < n && isDigit(text.charAt(i))) {
            i++;
            digits++;
        }
        if (i < n && text.charAt(i) == '.') {
            i++;
            while (i < n && isDigit(text.charAt(i))) {
                i++;
                digits++;
            }
        }
        if (digits == 0) {
            return 0;
        }
        if (i < n && (text.charAt(i) == 'e' || text.charAt(i) == 'E')) {
            int j = i + 1;
            if (j < n && (text.charAt(j) == '+' || text.charAt(j) == '-')) {
                j++;
            }
            int exponentDigits = 0;
            while (j < n && isDigit(text.charAt(j))) {
                j++;
                exponentDigits++;
            }
            if (exponentDigits > 0) {
                i = j;
            }
        }
        return i;
    }

    private static boolean isDigit(char c) {
        return c >= '0' && c <= '9';
    }

    /** The cached conversion from a unit as written to a target unit; null after recording an error. */
    private Conversion conversion(long line, String column, String unit, String target) {
        if (unit.isEmpty()) {
            error(line, column, "is empty; the unit is needed (" + target + " or a compatible unit)");
            return null;
        }
        Object cached = conversions.computeIfAbsent(target, t -> new HashMap<>())
                .computeIfAbsent(unit, u -> lookUp(u, target));
        if (cached instanceof Conversion c) {
            return c;
        }
        error(line, column, (String) cached);
        return null;
    }

    /**
     * A unit conversion as y = factor·x + offset. Every unit the core knows converts linearly (affinely for
     * temperatures), so two evaluations of the units library's converter give it exactly; applying it in double
     * arithmetic is a thousand times faster than the library's exact rational arithmetic per value.
     */
    private record Conversion(double factor, double offset) {
        static final Conversion IDENTITY = new Conversion(1.0, 0.0);

        double apply(double value) {
            return this == IDENTITY ? value : factor * value + offset;
        }
    }

    private static Object lookUp(String unit, String target) {
        try {
            Units.requireWellFormed(unit);
        } catch (IllegalArgumentException e) {
            return e.getMessage(); // names the character or length, with the text made printable
        }
        try {
            Units.parse(unit);
        } catch (IllegalArgumentException e) {
            return "'" + unit + "' is not a unit Dockgate knows";
        }
        if (!Units.isCompatible(unit, target)) {
            return "'" + unit + "' is not compatible with " + target + " (" + article(Units.dimensionName(target))
                    + " was expected, '" + unit + "' is " + article(Units.dimensionName(unit)) + ")";
        }
        if (Units.toUcum(unit).equals(Units.toUcum(target))) {
            return Conversion.IDENTITY;
        }
        try {
            double offset = Units.convert(0.0, unit, target);
            return new Conversion(Units.convert(1.0, unit, target) - offset, offset);
        } catch (RuntimeException e) {
            return "'" + unit + "' cannot be converted to " + target;
        }
    }

    private static String article(String noun) {
        return ("aeiou".indexOf(Character.toLowerCase(noun.charAt(0))) >= 0 ? "an " : "a ") + noun;
    }

    private long errorsSeen() {
        return errors.size() + errorsNotListed;
    }

    /** A plain refusal; a message that starts "column 'name': " is filed under that column. */
    private void refusal(long line, String message) {
        String text = message == null ? "refused" : message;
        Matcher m = COLUMN_PREFIX.matcher(text);
        if (m.lookingAt() && (COLUMNS.contains(m.group(1)) || OPTIONAL_COLUMNS.contains(m.group(1)))) {
            error(line, m.group(1), text.substring(m.end()));
        } else {
            error(line, null, text);
        }
    }

    private void error(long line, String column, String message) {
        if (errors.size() < MAX_LISTED_ERRORS) {
            errors.add(new RowError(line, Optional.ofNullable(column), message));
        } else {
            errorsNotListed++;
        }
    }

    /** Counts the characters read, drops a leading byte-order mark, and leaves closing to the caller. */
    private static final class CountingReader extends FilterReader {
        long count;
        private boolean first = true;

        CountingReader(Reader in) {
            super(in);
        }

        @Override
        public int read() throws IOException {
            char[] one = new char[1];
            int n = read(one, 0, 1);
            return n < 0 ? -1 : one[0];
        }

        @Override
        public int read(char[] buffer, int offset, int length) throws IOException {
            int n = super.read(buffer, offset, length);
            if (n > 0) {
                count += n;
                if (first) {
                    first = false;
                    if (buffer[offset] == '\uFEFF') {
                        System.arraycopy(buffer, offset + 1, buffer, offset, n - 1);
                        n--;
                        if (n == 0) {
                            return read(buffer, offset, length);
                        }
                    }
                }
            }
            return n;
        }

        @Override
        public void close() {
            // the caller's reader: the caller closes it
        }
    }
}
