package org.dockgate.audit;

import java.time.LocalDate;

/** Filters of the audit viewer; any of them may be blank. Dates are UTC days, both inclusive. */
public record AuditFilter(String actor, String entityType, String entityId, String action, LocalDate from,
                          LocalDate to) {

    public static AuditFilter none() {
        return new AuditFilter(null, null, null, null, null, null);
    }

    public AuditFilter {
        actor = blankToNull(actor);
        entityType = blankToNull(entityType);
        entityId = blankToNull(entityId);
        action = blankToNull(action);
        if (from != null && to != null && to.isBefore(from)) {
            throw new IllegalArgumentException("The end date " + to + " is before the start date " + from + ".");
        }
    }

    private static String blankToNull(String value) {
        return value == null || value.isBlank() ? null : value.trim();
    }
}
