package org.dockgate.certificates.web;

import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import org.dockgate.certificates.CertificateQuery;

/** Turns the register's search parameters (as typed) into a query, with messages for people. */
final class RegisterQueries {

    private RegisterQueries() {
    }

    static CertificateQuery of(String number, String lot, String supplier, String serial, String from, String to,
                               Integer limit) {
        return new CertificateQuery(number, lot, supplier, serial, date(from, "from"), date(to, "to"), limit);
    }

    private static LocalDate date(String text, String field) {
        if (text == null || text.isBlank()) {
            return null;
        }
        try {
            return LocalDate.parse(text.strip());
        } catch (DateTimeParseException e) {
            throw new IllegalArgumentException("'" + field + "' has the value '" + text
                    + "', which is not a date (YYYY-MM-DD).");
        }
    }
}
