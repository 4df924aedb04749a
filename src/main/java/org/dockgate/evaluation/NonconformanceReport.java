package org.dockgate.evaluation;

import java.time.Instant;
import java.time.LocalDate;
import java.util.Optional;

/** A nonconformance report opened for a rejected lot. */
public record NonconformanceReport(long id, String number, long lotId, DispositionAction action, String failing,
                                   String notes, boolean correctiveActionRequested, Optional<LocalDate> correctiveActionDue,
                                   String createdBy, Instant createdAt, Optional<String> concessionApprovedBy,
                                   Optional<String> concessionReason, Optional<Instant> concessionApprovedAt) {

    /** Whether the lot's disposition still waits for a supervisor (a concession not yet approved). */
    public boolean awaitingConcession() {
        return action == DispositionAction.USE_AS_IS_CONCESSION && concessionApprovedBy.isEmpty();
    }
}
