package org.dockgate.instruments.web;

import java.math.BigDecimal;

/** Numbers on the register's pages as people write them (20, not 20.0); in the model as {@code num}. */
public final class PlainNumbers {

    static final PlainNumbers INSTANCE = new PlainNumbers();

    private PlainNumbers() {
    }

    /** @return the value without trailing zeros or exponent, e.g. "0.0001", "20" */
    public String plain(double value) {
        return text(value);
    }

    static String text(double value) {
        return Double.isFinite(value) ? BigDecimal.valueOf(value).stripTrailingZeros().toPlainString()
                : String.valueOf(value);
    }
}
