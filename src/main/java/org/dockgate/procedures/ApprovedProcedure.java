package org.dockgate.procedures;

import java.time.Instant;
import org.dockgate.core.procedure.ProcedureProposal;

/**
 * One immutable, approved procedure revision: what receiving fixes on a lot, what the bench follows and
 * what evaluation judges against.
 */
public record ApprovedProcedure(long id, long modelId, String partNumber, long specificationRevisionId,
                                int specificationRevisionNo, int revisionNo, ProcedureSettings settings,
                                ProcedureProposal content, String justification, String author, String approvedBy,
                                Instant approvedAt, boolean superseded) {

    /** "QP-250 procedure rev 2". */
    public String label() {
        return partNumber + " procedure rev " + revisionNo;
    }

    public String status() {
        return superseded ? "SUPERSEDED" : "APPROVED";
    }
}
