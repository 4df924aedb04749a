package org.dockgate.instruments.web;

import java.math.BigDecimal;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;

/** Numbers and times on the register's pages as people write them (20, not 20.0); in the model as {@code num}. */
public final class PlainNumbers {

    static final PlainNumbers INSTANCE = new PlainNumbers();

    private PlainNumbers() {
    }

    /** @return the value without trailing zeros or exponent, e.g. "0.0001", "20" */
    public String plain(double value) {
        return text(value);
    }

    /** @return an instant to the second, in UTC, e.g. "2026-12-02 01:39:12 UTC" */
    public String utc(Instant instant) {
        return instant == null ? "" : UTC.format(instant) + " UTC";
    }

    private static final DateTimeFormatter UTC = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss")
            .withZone(ZoneOffset.UTC);

    static String text(double value) {
        return Double.isFinite(value) ? BigDecimal.valueOf(value).stripTrailingZeros().toPlainString()
                : String.valueOf(value);
    }
}
