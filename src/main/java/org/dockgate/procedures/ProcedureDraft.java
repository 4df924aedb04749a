package org.dockgate.procedures;

import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.dockgate.core.procedure.ProcedureProposal;

/** A draft procedure with its current proposal (derived, then the engineer's edits applied). */
public record ProcedureDraft(long id, long modelId, String partNumber, long specificationRevisionId,
                             int specificationRevisionNo, ProcedureSettings settings, Map<String, String> overrides,
                             ProcedureProposal proposal, String justification, String author, Instant createdAt,
                             String status, Long approvedRevisionId, List<Edit> edits, long version) {

    /** One recorded edit of a proposed value. */
    public record Edit(String field, String oldValue, String newValue, String reason, String editedBy, Instant editedAt) {
    }

    public boolean open() {
        return "OPEN".equals(status);
    }
}
