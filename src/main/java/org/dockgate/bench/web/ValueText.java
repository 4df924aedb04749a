package org.dockgate.bench.web;

import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** A value as typed at the bench: a plain decimal, optionally followed by its unit ("20.11", "0.02011 V"). */
record ValueText(double value, String unit) {

    private static final Pattern TEXT = Pattern.compile(
            "\\s*([+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?)\\s*(\\S.*?)?\\s*");

    /**
     * @param text what was typed
     * @return the number and the unit (null: the procedure's output unit)
     * @throws IllegalArgumentException when it is not a number (a decimal comma is refused, not guessed)
     */
    static ValueText parse(String text) {
        if (text == null || text.isBlank()) {
            throw new IllegalArgumentException("Enter a value.");
        }
        Matcher m = TEXT.matcher(text);
        if (!m.matches()) {
            throw new IllegalArgumentException("'" + text.strip() + "' is not a number (use a decimal point, and"
                    + " optionally a unit after it, e.g. 20.11 mV).");
        }
        double v = Double.parseDouble(m.group(1));
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException("'" + text.strip() + "' is too large.");
        }
        return new ValueText(v, m.group(2));
    }

    static double number(String text, String what) {
        ValueText v = parse(text == null || text.isBlank() ? null : text);
        if (v.unit() != null && !v.unit().isBlank() && !v.unit().equals("°C") && !v.unit().equals("%")) {
            throw new IllegalArgumentException("Enter the " + what + " as a number.");
        }
        return v.value();
    }
}
