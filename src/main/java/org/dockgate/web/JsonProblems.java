package org.dockgate.web;

import java.util.Arrays;
import java.util.stream.Collectors;
import org.springframework.http.converter.HttpMessageNotReadableException;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.DatabindException;
import tools.jackson.databind.exc.InvalidFormatException;
import tools.jackson.databind.exc.MismatchedInputException;

/** Plain-language descriptions of unreadable JSON: which field, what was expected. */
final class JsonProblems {

    private JsonProblems() {
    }

    static String describe(HttpMessageNotReadableException e) {
        Throwable cause = e.getCause();
        for (Throwable t = cause; t != null; t = t.getCause()) {
            // A value type refused its content (e.g. a specification with a unit mismatch): its message is for people.
            if (t instanceof IllegalArgumentException refused && refused.getMessage() != null) {
                return refused.getMessage();
            }
        }
        if (cause instanceof InvalidFormatException invalid) {
            return "Field '" + path(invalid) + "' has the value '" + invalid.getValue() + "', which is not "
                    + expected(invalid.getTargetType()) + ".";
        }
        if (cause instanceof MismatchedInputException mismatched && !mismatched.getPath().isEmpty()) {
            return "Field '" + path(mismatched) + "' is not "
                    + (mismatched.getTargetType() == null ? "of the expected type" : expected(mismatched.getTargetType()))
                    + ".";
        }
        if (cause instanceof JacksonException jackson) {
            String message = jackson.getOriginalMessage();
            if (message != null && message.contains("Non-standard token")) {
                return "The request contains NaN or Infinity; JSON numbers must be finite.";
            }
            return "The request body is not valid JSON: " + (message == null ? "unreadable" : firstLine(message));
        }
        return "The request body is missing or is not valid JSON.";
    }

    static String expected(Class<?> type) {
        if (type.isEnum()) {
            return "one of " + Arrays.stream(type.getEnumConstants()).map(String::valueOf)
                    .collect(Collectors.joining(", "));
        }
        if (type == Double.class || type == double.class || type == Float.class || type == float.class) {
            return "a number";
        }
        if (type == Integer.class || type == int.class || type == Long.class || type == long.class) {
            return "a whole number";
        }
        if (type == Boolean.class || type == boolean.class) {
            return "true or false";
        }
        return "a " + type.getSimpleName();
    }

    private static String path(DatabindException e) {
        return e.getPath().stream()
                .map(ref -> ref.getPropertyName() != null ? ref.getPropertyName() : "[" + ref.getIndex() + "]")
                .collect(Collectors.joining(".")).replace(".[", "[");
    }

    private static String firstLine(String message) {
        int cut = message.indexOf('\n');
        return cut < 0 ? message : message.substring(0, cut);
    }
}
