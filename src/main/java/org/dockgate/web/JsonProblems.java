package org.dockgate.web;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.springframework.http.converter.HttpMessageNotReadableException;
import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonParser;
import tools.jackson.core.TokenStreamContext;
import tools.jackson.core.TokenStreamLocation;
import tools.jackson.core.exc.InputCoercionException;
import tools.jackson.core.exc.StreamConstraintsException;
import tools.jackson.core.exc.StreamReadException;
import tools.jackson.core.exc.UnexpectedEndOfInputException;
import tools.jackson.databind.exc.InvalidFormatException;
import tools.jackson.databind.exc.MismatchedInputException;
import tools.jackson.databind.exc.UnrecognizedPropertyException;

/**
 * Plain-language descriptions of unreadable JSON: which field (as a dotted path such as
 * {@code points[2].value} and as an RFC 6901 pointer), what was expected. The parser's own messages
 * name Java types and its settings, so they are never passed on.
 */
final class JsonProblems {

    /** What a refusal of the body says; {@code field} and {@code pointer} are null when no field applies. */
    record Refusal(String detail, String field, String pointer) {
    }

    /** Java, parser or framework vocabulary that must not reach a person. */
    private static final Pattern TECHNICAL = Pattern.compile(
            "`|\\b(?:java|javax|jakarta|sun|org|com|tools)\\.[a-z]\\w*|Exception\\b|\\bclass [A-Z]|\\$[A-Z]");

    private JsonProblems() {
    }

    /** True when a message quotes Java types, packages or exceptions and must not be shown as it is. */
    static boolean technical(String message) {
        return message != null && TECHNICAL.matcher(message).find();
    }

    static Refusal describe(HttpMessageNotReadableException e) {
        JacksonException outer = null;
        JacksonException inner = null;
        for (Throwable t = e.getCause(); t != null; t = t.getCause()) {
            // A value type refused its content (e.g. a specification with a unit mismatch): its message is for people.
            if (t instanceof IllegalArgumentException refused && refused.getMessage() != null
                    && !technical(refused.getMessage())) {
                List<String> steps = outer == null ? List.of() : steps(outer);
                return refusal(refused.getMessage(), steps);
            }
            if (t instanceof JacksonException jackson) {
                outer = outer == null ? jackson : outer;
                inner = jackson;
            }
        }
        if (inner == null) {
            return new Refusal("The request body is missing or is not valid JSON.", null, null);
        }
        List<String> steps = steps(outer);
        if (steps.isEmpty()) {
            steps = steps(inner);
        }
        if (inner instanceof StreamReadException read) {
            // A syntax error is found by the parser between properties, so the path the mapper adds stops at
            // the enclosing object; the parser knows the field it was reading.
            List<String> parser = whereTheParserWas(read);
            if (parser.size() >= steps.size()) {
                steps = parser;
            }
        }
        return refusal(sentence(inner, steps), steps);
    }

    private static Refusal refusal(String detail, List<String> steps) {
        return steps.isEmpty() ? new Refusal(detail, null, null) : new Refusal(detail, path(steps), pointer(steps));
    }

    private static String sentence(JacksonException e, List<String> steps) {
        String field = steps.isEmpty() ? null : "Field '" + path(steps) + "'";
        String message = e.getOriginalMessage() == null ? "" : e.getOriginalMessage();
        if (e instanceof FiniteNumbersModule.NotFiniteException notFinite) {
            return (field == null ? "A number" : "'" + path(steps) + "'") + " must be a finite number; '"
                    + shorten(notFinite.getValue()) + "' is not (NaN, Infinity and numbers beyond ±1.8e308 are refused).";
        }
        if (e instanceof StreamConstraintsException) {
            String what = message.contains("Number value length") ? " has a number with more digits than the 1000 accepted"
                    : message.contains("String value length") ? " has a text longer than accepted"
                    : message.contains("nesting depth") ? " is nested deeper than accepted"
                    : " is larger than accepted";
            return (field == null ? "The request body" : field) + what + ".";
        }
        if (e instanceof InputCoercionException coercion) {
            return (field == null ? "A number" : field) + " is out of range: "
                    + (coercion.getTargetType() == null ? "a smaller number" : expectedInRange(coercion.getTargetType()))
                    + " was expected.";
        }
        if (e instanceof UnexpectedEndOfInputException) {
            return "The request body is not valid JSON: it ends before the JSON is complete" + at(e) + ".";
        }
        if (e instanceof StreamReadException) {
            if (message.contains("Non-standard token") || message.contains("NaN") || message.contains("Infinity")) {
                return field == null ? "The request contains NaN or Infinity; JSON numbers must be finite."
                        : field + " is NaN or Infinity, which JSON does not allow: send a finite number.";
            }
            String reason = firstLine(message);
            return "The request body is not valid JSON" + at(e)
                    + (reason.isEmpty() || technical(reason) ? "." : ": " + reason + ".");
        }
        if (e instanceof UnrecognizedPropertyException) {
            return field + " is not a field of this request.";
        }
        if (e instanceof InvalidFormatException invalid) {
            return (field == null ? "The request body" : field) + " has the value '" + shorten(invalid.getValue())
                    + "', which is not " + expected(invalid.getTargetType()) + ".";
        }
        if (e instanceof MismatchedInputException mismatched) {
            if (message.startsWith("Trailing token")) {
                return "The request body holds more than one JSON value: send a single object.";
            }
            if (field == null) {
                return "The request body must be " + (mismatched.getTargetType() == null ? "a JSON object"
                        : expected(mismatched.getTargetType())) + ".";
            }
            String expected = mismatched.getTargetType() == null ? "a value of another kind" : expected(mismatched.getTargetType());
            if (message.contains("null") || message.contains("Missing")) {
                return field + " is required: " + expected + " was expected.";
            }
            return field + " is not " + expected + ".";
        }
        return field == null ? "The request body could not be read." : field + " could not be read.";
    }

    /** A type in words: never its Java name. */
    static String expected(Class<?> type) {
        if (type == null) {
            return "a value of another kind";
        }
        if (type.isEnum()) {
            return "one of " + Arrays.stream(type.getEnumConstants()).map(String::valueOf)
                    .collect(Collectors.joining(", "));
        }
        if (type == Double.class || type == double.class || type == Float.class || type == float.class
                || type == java.math.BigDecimal.class) {
            return "a number";
        }
        if (type == Integer.class || type == int.class || type == Long.class || type == long.class
                || type == Short.class || type == short.class || type == java.math.BigInteger.class) {
            return "a whole number";
        }
        if (type == Boolean.class || type == boolean.class) {
            return "true or false";
        }
        if (CharSequence.class.isAssignableFrom(type) || type == Character.class || type == char.class) {
            return "a text";
        }
        if (type.isArray() || Collection.class.isAssignableFrom(type)) {
            return "a list in square brackets";
        }
        if (Map.class.isAssignableFrom(type)) {
            return "an object of named values in braces";
        }
        if (type.getPackageName().startsWith("java.time")) {
            return "a date or time in ISO 8601 form";
        }
        return "a JSON object in braces";
    }

    private static String expectedInRange(Class<?> type) {
        if (type == Integer.class || type == int.class) {
            return "a whole number from " + Integer.MIN_VALUE + " to " + Integer.MAX_VALUE;
        }
        if (type == Long.class || type == long.class) {
            return "a whole number from " + Long.MIN_VALUE + " to " + Long.MAX_VALUE;
        }
        return expected(type);
    }

    private static List<String> steps(JacksonException e) {
        List<String> steps = new ArrayList<>();
        for (JacksonException.Reference ref : e.getPath()) {
            if (ref.getPropertyName() != null) {
                steps.add(ref.getPropertyName());
            } else if (ref.getIndex() >= 0) {
                steps.add("[" + ref.getIndex() + "]");
            }
        }
        return steps;
    }

    /** For a syntax error the path is where the parser stood: the field whose value it was reading. */
    private static List<String> whereTheParserWas(StreamReadException e) {
        List<String> steps = new ArrayList<>();
        JsonParser parser = e.processor();
        if (parser == null) {
            return steps;
        }
        for (TokenStreamContext c = parser.streamReadContext(); c != null && !c.inRoot(); c = c.getParent()) {
            if (c.inObject() && c.currentName() != null) {
                steps.add(0, c.currentName());
            } else if (c.inArray()) {
                steps.add(0, "[" + Math.max(0, c.getCurrentIndex()) + "]");
            }
        }
        return steps;
    }

    /** {@code points[2].value}: the way the API documentation and other refusals name fields. */
    static String path(List<String> steps) {
        return String.join(".", steps).replace(".[", "[");
    }

    /** RFC 6901: {@code /points/2/value}. */
    static String pointer(List<String> steps) {
        return steps.stream()
                .map(s -> s.startsWith("[") && s.endsWith("]") ? s.substring(1, s.length() - 1)
                        : s.replace("~", "~0").replace("/", "~1"))
                .collect(Collectors.joining("/", "/", ""));
    }

    private static String at(JacksonException e) {
        TokenStreamLocation where = e.getLocation();
        if (where == null || where.getLineNr() < 1) {
            return "";
        }
        return " (line " + where.getLineNr() + ", column " + where.getColumnNr() + ")";
    }

    private static String shorten(Object value) {
        String text = String.valueOf(value);
        return text.length() <= 40 ? text : text.substring(0, 40) + "…";
    }

    private static String firstLine(String message) {
        int cut = message.indexOf('\n');
        String line = cut < 0 ? message : message.substring(0, cut);
        return line.endsWith(".") ? line.substring(0, line.length() - 1) : line;
    }
}
