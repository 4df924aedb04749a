package org.dockgate.certificates;

import java.time.LocalDate;

/**
 * A search of the register; every criterion is optional. Text criteria match case-insensitively as
 * "contains"; a serial matches any unit of the certificate; dates are UTC days, both inclusive.
 */
public record CertificateQuery(String number, String lot, String supplier, String serial, LocalDate from,
                               LocalDate to, Integer limit) {

    public static final int MAX_LIMIT = 500;

    public CertificateQuery {
        number = trim(number);
        lot = trim(lot);
        supplier = trim(supplier);
        serial = trim(serial);
        if (from != null && to != null && to.isBefore(from)) {
            throw new IllegalArgumentException("The date range ends (" + to + ") before it starts (" + from + ").");
        }
        if (limit != null && (limit < 1 || limit > MAX_LIMIT)) {
            throw new IllegalArgumentException("'limit' is between 1 and " + MAX_LIMIT + ".");
        }
    }

    public static CertificateQuery all() {
        return new CertificateQuery(null, null, null, null, null, null, null);
    }

    int effectiveLimit() {
        return limit == null ? 200 : limit;
    }

    private static String trim(String text) {
        return text == null || text.isBlank() ? null : text.strip();
    }
}
