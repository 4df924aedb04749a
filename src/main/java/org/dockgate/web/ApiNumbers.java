package org.dockgate.web;

import java.util.OptionalDouble;

/** JSON has no NaN or infinity: the API writes an absent or infinite value as null. */
public final class ApiNumbers {

    private ApiNumbers() {
    }

    public static Double finiteOrNull(double value) {
        return Double.isFinite(value) ? value : null;
    }

    public static Double finiteOrNull(OptionalDouble value) {
        return value.isPresent() ? finiteOrNull(value.getAsDouble()) : null;
    }

    /** Refuses NaN and infinities in a request with a message naming the field. */
    public static double requireFinite(Double value, String field) {
        if (value == null) {
            throw new org.dockgate.platform.RefusedField(field, "'" + field + "' is required.");
        }
        if (!Double.isFinite(value)) {
            throw new org.dockgate.platform.RefusedField(field, "'" + field + "' must be a finite number.");
        }
        return value;
    }
}
