package org.dockgate.core.quantity;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.measure.Dimension;
import javax.measure.IncommensurableException;
import javax.measure.UnconvertibleException;
import javax.measure.Unit;
import javax.measure.UnitConverter;
import javax.measure.format.MeasurementParseException;
import systems.uom.ucum.format.UCUMFormat;

/**
 * Unit symbols as engineers write them, parsed through UCUM (the Unified Code for Units of
 * Measure) into JSR 385 units (Indriya), with dimension checks and cached conversions.
 *
 * <p>Accepted spellings, besides plain case-sensitive UCUM codes: {@code m/s2}, {@code m/s²};
 * {@code g}, {@code mg}, {@code µg}/{@code ug} for standard gravity and its fractions
 * (1 g = 9.80665 m/s², CGPM 1901; <b>in Dockgate a bare "g" is an acceleration</b>, write
 * {@code gram} for the mass); {@code psi}; {@code °C}, {@code ℃}, {@code degC}; {@code °F},
 * {@code degF}; {@code Ω}, {@code ohm}, {@code kΩ}, {@code kohm}, {@code MΩ}; {@code µ} or {@code μ}
 * for micro; {@code ·}, {@code *} or {@code .} for a product; {@code ppm}; {@code mmHg}; {@code lbf}.
 * Everything else (Pa, kPa, MPa, bar, mbar, N, kN, K, lx, V, mV, mA, pC, Hz, s, mV/V, %…) is
 * UCUM already.
 *
 * <p>Conversions between temperature units are of absolute temperatures (affine: 0 °C = 273.15 K).
 */
public final class Units {

    private static final UCUMFormat UCUM = UCUMFormat.getInstance(UCUMFormat.Variant.CASE_SENSITIVE);
    private static final Pattern ATOM = Pattern.compile("([^./()\\d+-]+)([+-]?\\d+)?");
    private static final Map<String, String> FRIENDLY_ATOMS = Map.ofEntries(
            Map.entry("g", "[g]"),
            Map.entry("mg", "m[g]"),
            Map.entry("ug", "u[g]"),
            Map.entry("gn", "[g]"),
            Map.entry("gram", "g"),
            Map.entry("psi", "[psi]"),
            Map.entry("degC", "Cel"),
            Map.entry("°C", "Cel"),
            Map.entry("℃", "Cel"),
            Map.entry("degF", "[degF]"),
            Map.entry("°F", "[degF]"),
            Map.entry("℉", "[degF]"),
            Map.entry("ohm", "Ohm"),
            Map.entry("Ω", "Ohm"),
            Map.entry("kohm", "kOhm"),
            Map.entry("kΩ", "kOhm"),
            Map.entry("Mohm", "MOhm"),
            Map.entry("MΩ", "MOhm"),
            Map.entry("mohm", "mOhm"),
            Map.entry("mΩ", "mOhm"),
            Map.entry("ppm", "[ppm]"),
            Map.entry("mmHg", "mm[Hg]"),
            Map.entry("lbf", "[lbf_av]"));
    /** Named dimensions, for readable messages ("a pressure was expected"). */
    private static final Map<String, String> DIMENSION_NAMES;

    static {
        Map<String, String> names = new LinkedHashMap<>();
        names.put("Pa", "pressure");
        names.put("m/s2", "acceleration");
        names.put("N", "force");
        names.put("K", "temperature");
        names.put("V", "voltage");
        names.put("A", "electric current");
        names.put("Ohm", "resistance");
        names.put("C", "electric charge");
        names.put("lx", "illuminance");
        names.put("Hz", "frequency");
        names.put("s", "time");
        names.put("m", "length");
        names.put("m/s", "velocity");
        names.put("kg", "mass");
        names.put("N.m", "torque or energy");
        names.put("W", "power");
        names.put("1", "dimensionless ratio");
        DIMENSION_NAMES = names;
    }

    private static final Map<String, Unit<?>> PARSED = new ConcurrentHashMap<>();
    private static final Map<String, UnitConverter> CONVERTERS = new ConcurrentHashMap<>();
    /**
     * The caches keep at most this many entries: a lab uses a few dozen units, while a file with a
     * different nonsense unit on every row must not fill the heap. Beyond it, units are parsed each time.
     */
    static final int CACHE_LIMIT = 512;
    /** The longest unit text accepted; the longest in use ("mV/V", "m/s2", "[psi]"…) is far shorter. */
    public static final int MAX_SYMBOL_LENGTH = 32;
    /**
     * Characters a unit may contain: ASCII letters and digits, UCUM's operators and brackets, and the
     * engineer's spellings listed in the class description. Anything else (accented letters, currency
     * signs, byte-order marks, replacement characters, direction overrides, UCUM's {annotations}) is
     * refused before the parser sees it: the UCUM parser answers some of them with a
     * {@code java.lang.Error} instead of a parse exception.
     */
    private static final String ALLOWED_NON_ASCII = "²³⁻¹·×µμ°℃℉Ω";
    /** Exponents and factors longer than this many digits make the parser recurse (mV6000: stack overflow). */
    private static final int MAX_DIGIT_RUN = 2;

    private Units() {
    }

    /**
     * Translates an engineer's unit symbol into its UCUM code (see the class description):
     * each atom (a name with an optional integer exponent, between '.', '/', '(' and ')') is
     * looked up in the table of friendly spellings; superscript digits become plain digits.
     *
     * @param symbol the symbol, e.g. "m/s²", "mV/g", "°C"
     * @return the UCUM code, e.g. "m/s2", "mV/[g]", "Cel"
     * @throws IllegalArgumentException when the symbol is null or blank
     */
    public static String toUcum(String symbol) {
        if (symbol == null || symbol.isBlank()) {
            throw new IllegalArgumentException("A unit symbol must not be empty");
        }
        requireWellFormed(symbol);
        String s = symbol.strip()
                .replace('²', '2').replace('³', '3').replace("⁻", "-").replace('¹', '1')
                .replace('·', '.').replace('*', '.').replace('×', '.')
                .replace('µ', 'u').replace('μ', 'u')
                .replace(" ", "");
        if (s.startsWith("[") || s.contains("[")) {
            return s; // already written in UCUM's bracket notation
        }
        StringBuilder out = new StringBuilder();
        Matcher m = ATOM.matcher(s);
        int last = 0;
        while (m.find()) {
            out.append(s, last, m.start());
            String name = m.group(1);
            String mapped = FRIENDLY_ATOMS.get(name);
            out.append(mapped != null ? mapped : name);
            if (m.group(2) != null) {
                out.append(m.group(2));
            }
            last = m.end();
        }
        out.append(s.substring(last));
        return out.toString();
    }

    /**
     * Parses a unit symbol (engineer's spelling or UCUM code).
     *
     * @param symbol the symbol
     * @return the unit
     * @throws IllegalArgumentException when the symbol is empty or not a known unit
     */
    public static Unit<?> parse(String symbol) {
        String ucum = toUcum(symbol);
        Unit<?> cached = PARSED.get(ucum);
        if (cached != null) {
            return cached;
        }
        Unit<?> parsed = parseUcum(ucum, symbol);
        if (PARSED.size() < CACHE_LIMIT) {
            PARSED.putIfAbsent(ucum, parsed);
        }
        return parsed;
    }

    private static Unit<?> parseUcum(String code, String symbol) {
        try {
            return UCUM.parse(code);
        } catch (MeasurementParseException e) {
            throw unknown(symbol, e);
        } catch (RuntimeException e) {
            // The UCUM parser reports some malformed codes with its own unchecked exceptions.
            throw unknown(symbol, e);
        } catch (StackOverflowError e) {
            throw unknown(symbol, e);
        } catch (VirtualMachineError e) {
            throw e; // out of memory and the like are not about the unit
        } catch (Error e) {
            // The parser's token manager throws an Error (TokenMgrError) on characters it has no rule for.
            throw unknown(symbol, e);
        }
    }

    private static IllegalArgumentException unknown(String symbol, Throwable cause) {
        return new IllegalArgumentException("Unknown unit '" + printable(symbol) + "'", cause);
    }

    /**
     * Refuses unit text that is too long, holds a character no unit needs, has unbalanced brackets or
     * a run of more than two digits, with a message that names the problem.
     *
     * @param symbol the unit text as typed
     * @throws IllegalArgumentException when the text cannot be a unit
     */
    public static void requireWellFormed(String symbol) {
        if (symbol.length() > MAX_SYMBOL_LENGTH) {
            throw new IllegalArgumentException("A unit must be at most " + MAX_SYMBOL_LENGTH
                    + " characters long, got " + symbol.length());
        }
        int depth = 0;
        int digits = 0;
        for (int i = 0; i < symbol.length(); i++) {
            char c = symbol.charAt(i);
            boolean ascii = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9')
                    || "./()[]+-%*_ '".indexOf(c) >= 0;
            if (!ascii && ALLOWED_NON_ASCII.indexOf(c) < 0) {
                throw new IllegalArgumentException("Unit '" + printable(symbol) + "' contains a character that is"
                        + " not allowed in a unit: " + String.format("U+%04X", (int) c));
            }
            digits = Character.isDigit(c) ? digits + 1 : 0;
            if (digits > MAX_DIGIT_RUN) {
                throw new IllegalArgumentException("Unit '" + printable(symbol) + "' has a number of more than "
                        + MAX_DIGIT_RUN + " digits; exponents are small integers such as 2 or -1");
            }
            if (c == '[' || c == '(') {
                depth++;
            } else if (c == ']' || c == ')') {
                depth--;
                if (depth < 0) {
                    break;
                }
            }
        }
        if (depth != 0) {
            throw new IllegalArgumentException("Unit '" + printable(symbol) + "' has unbalanced brackets");
        }
    }

    /** The text with characters that would garble a message (controls, direction overrides) escaped. */
    private static String printable(String text) {
        StringBuilder out = new StringBuilder();
        text.codePoints().limit(MAX_SYMBOL_LENGTH + 8L).forEach(cp -> {
            if (Character.isISOControl(cp) || Character.getType(cp) == Character.FORMAT
                    || cp == 0xFFFD || Character.getType(cp) == Character.UNASSIGNED) {
                out.append(String.format("\\u%04X", cp));
            } else {
                out.appendCodePoint(cp);
            }
        });
        return out.toString();
    }

    /**
     * Whether two units measure the same kind of quantity (equal dimensions, so one converts to
     * the other).
     *
     * @param unit  a unit symbol
     * @param other another unit symbol
     * @return true when compatible
     * @throws IllegalArgumentException when a symbol is not a known unit
     */
    public static boolean isCompatible(String unit, String other) {
        return parse(unit).isCompatible(parse(other));
    }

    /**
     * Requires a unit to be compatible with an expected one, e.g. that a reading said to be a
     * pressure really is in a pressure unit.
     *
     * @param unit     the unit given
     * @param expected a unit of the expected kind
     * @throws IllegalArgumentException when a symbol is unknown or the dimensions differ; the
     *                                  message names both units and the expected kind
     */
    public static void requireCompatible(String unit, String expected) {
        Unit<?> given = parse(unit);
        Unit<?> wanted = parse(expected);
        if (!given.isCompatible(wanted)) {
            throw new IllegalArgumentException("Unit '" + unit + "' is not compatible with '" + expected + "': "
                    + article(describe(wanted.getDimension())) + " was expected, but '" + unit + "' is "
                    + article(describe(given.getDimension())));
        }
    }

    /**
     * Converts a value between compatible units, value × (factor) [+ offset for temperatures],
     * through a converter that is built once per pair and cached.
     *
     * @param value the value, finite
     * @param from  the value's unit
     * @param to    the wanted unit
     * @return the value in the wanted unit
     * @throws IllegalArgumentException when the value is not finite, a symbol is unknown, or the
     *                                  units are not compatible
     */
    public static double convert(double value, String from, String to) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("A value to convert must be a finite number, got " + value);
        }
        return converter(from, to).convert(value);
    }

    /**
     * The cached converter between two compatible units.
     *
     * @param from source unit symbol
     * @param to   target unit symbol
     * @return the converter
     * @throws IllegalArgumentException when a symbol is unknown or the units are not compatible
     */
    public static UnitConverter converter(String from, String to) {
        String key = toUcum(from) + "\u0000" + toUcum(to);
        UnitConverter cached = CONVERTERS.get(key);
        if (cached != null) {
            return cached;
        }
        requireCompatible(from, to);
        UnitConverter built;
        try {
            built = parse(from).getConverterToAny(parse(to));
        } catch (IncommensurableException | UnconvertibleException e) {
            throw new IllegalArgumentException("Unit '" + from + "' cannot be converted to '" + to + "'", e);
        }
        if (CONVERTERS.size() < CACHE_LIMIT) {
            CONVERTERS.putIfAbsent(key, built);
        }
        return built;
    }

    /**
     * A readable name of a unit's dimension: "pressure", "acceleration"…, or the dimension in
     * base quantities ("[L]·[M]/([T]·[I])") when it has no common name.
     *
     * @param symbol a unit symbol
     * @return the description
     * @throws IllegalArgumentException when the symbol is not a known unit
     */
    public static String dimensionName(String symbol) {
        return describe(parse(symbol).getDimension());
    }

    /** How many parsed units and converters are cached (for the test of the bound). */
    static int cachedEntries() {
        return PARSED.size() + CONVERTERS.size();
    }

    private static String describe(Dimension dimension) {
        for (Map.Entry<String, String> e : DIMENSION_NAMES.entrySet()) {
            if (parse(e.getKey()).getDimension().equals(dimension)) {
                return e.getValue();
            }
        }
        return "quantity of dimension " + dimension;
    }

    private static String article(String noun) {
        return ("aeiou".indexOf(Character.toLowerCase(noun.charAt(0))) >= 0 ? "an " : "a ") + noun;
    }
}
