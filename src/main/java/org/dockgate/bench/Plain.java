package org.dockgate.bench;

import java.math.BigDecimal;
import java.util.List;
import java.util.stream.Collectors;

/** Numbers as people write them in messages: no exponent, no trailing zeros. */
public final class Plain {

    private Plain() {
    }

    public static String number(double value) {
        if (!Double.isFinite(value)) {
            return String.valueOf(value);
        }
        if (value == Math.rint(value) && Math.abs(value) < 1e15) {
            return Long.toString((long) value);
        }
        return new BigDecimal(Double.toString(value)).stripTrailingZeros().toPlainString();
    }

    static String list(List<Double> values) {
        return values.stream().map(Plain::number).collect(Collectors.joining(", "));
    }
}
