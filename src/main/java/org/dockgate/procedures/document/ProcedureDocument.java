package org.dockgate.procedures.document;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.dockgate.core.procedure.KindPractice;
import org.dockgate.core.procedure.ProcedureProposal;

/**
 * Everything the printed procedure shows, gathered by the procedures module from its revision, the
 * specification it was derived from and the reference-instrument register. {@link ProcedurePdf} only
 * lays it out: it looks nothing up and computes nothing but the step order.
 *
 * @param labName               the lab's name ({@code dockgate.lab.name})
 * @param labAddress            the lab's address ({@code dockgate.lab.address})
 * @param procedureNumber       the procedure's identifier, e.g. "QP-250"
 * @param revision              the procedure revision number, at least 1
 * @param status                the revision's status as printed, e.g. "APPROVED" or "DRAFT"
 * @param partNumber            the sensor model's part number
 * @param modelName             the sensor model's name
 * @param sensorKind            the kind in words, e.g. "Pressure transducer"
 * @param specificationRevision the label of the specification revision the procedure was derived from,
 *                              e.g. "Specification rev 3 (datasheet 2025-11)"
 * @param aql                   the AQL as printed, e.g. "1.0"
 * @param inspectionLevel       the inspection level as printed, e.g. "II"
 * @param decisionRule          the decision rule in words, e.g. "Guard-banded acceptance: a result passes only
 *                              inside the tolerance narrowed by w = 1 × U on each side (ILAC G8:2019)"
 * @param proposal              the procedure's tests, limits, plans, conditions and cautions (as edited and
 *                              approved, not necessarily as first derived)
 * @param referenceInstruments  the instruments the procedure uses, as registered
 * @param turJustification      the recorded justification for a TUR below 4:1, when there is one
 * @param author                who wrote the revision
 * @param approval              who approved it and when; empty for a draft
 * @param history               the procedure's revisions, oldest first
 * @param practice              the kind's preparation items and cautions ({@link KindPractice}); null prints none
 * @param edits                 the engineer's edits to the derived proposal in this revision, in order
 */
public record ProcedureDocument(String labName, String labAddress, String procedureNumber, int revision,
                                String status, String partNumber, String modelName, String sensorKind,
                                String specificationRevision, String aql, String inspectionLevel,
                                String decisionRule, ProcedureProposal proposal,
                                List<ReferenceInstrument> referenceInstruments, Optional<String> turJustification,
                                String author, Optional<Approval> approval, List<RevisionEntry> history,
                                KindPractice.Practice practice, List<EditEntry> edits) {

    /** A document without edits, with the kind's practice (null prints none). */
    public ProcedureDocument(String labName, String labAddress, String procedureNumber, int revision,
                             String status, String partNumber, String modelName, String sensorKind,
                             String specificationRevision, String aql, String inspectionLevel,
                             String decisionRule, ProcedureProposal proposal,
                             List<ReferenceInstrument> referenceInstruments, Optional<String> turJustification,
                             String author, Optional<Approval> approval, List<RevisionEntry> history,
                             KindPractice.Practice practice) {
        this(labName, labAddress, procedureNumber, revision, status, partNumber, modelName, sensorKind,
                specificationRevision, aql, inspectionLevel, decisionRule, proposal, referenceInstruments,
                turJustification, author, approval, history, practice, List.of());
    }

    /** A document without kind practice and without edits (documents built before either was printed). */
    public ProcedureDocument(String labName, String labAddress, String procedureNumber, int revision,
                             String status, String partNumber, String modelName, String sensorKind,
                             String specificationRevision, String aql, String inspectionLevel,
                             String decisionRule, ProcedureProposal proposal,
                             List<ReferenceInstrument> referenceInstruments, Optional<String> turJustification,
                             String author, Optional<Approval> approval, List<RevisionEntry> history) {
        this(labName, labAddress, procedureNumber, revision, status, partNumber, modelName, sensorKind,
                specificationRevision, aql, inspectionLevel, decisionRule, proposal, referenceInstruments,
                turJustification, author, approval, history, null, List.of());
    }

    /**
     * Validates the document: every text that is printed must be present (a blank procedure number or
     * lab name would make an unidentifiable controlled copy).
     *
     * @throws IllegalArgumentException naming every missing field
     */
    public ProcedureDocument {
        List<String> missing = new ArrayList<>();
        required(missing, "lab name", labName);
        required(missing, "lab address", labAddress);
        required(missing, "procedure number", procedureNumber);
        required(missing, "status", status);
        required(missing, "part number", partNumber);
        required(missing, "model name", modelName);
        required(missing, "sensor kind", sensorKind);
        required(missing, "specification revision", specificationRevision);
        required(missing, "AQL", aql);
        required(missing, "inspection level", inspectionLevel);
        required(missing, "decision rule", decisionRule);
        required(missing, "author", author);
        if (proposal == null) {
            missing.add("procedure proposal");
        }
        if (!missing.isEmpty()) {
            throw new IllegalArgumentException("A procedure document needs its " + String.join(", ", missing) + ".");
        }
        if (revision < 1) {
            throw new IllegalArgumentException("A procedure revision is numbered from 1 (got " + revision + ").");
        }
        referenceInstruments = referenceInstruments == null ? List.of() : List.copyOf(referenceInstruments);
        history = history == null ? List.of() : List.copyOf(history);
        edits = edits == null ? List.of() : List.copyOf(edits);
        turJustification = Objects.requireNonNullElse(turJustification, Optional.<String>empty())
                .filter(text -> !text.isBlank());
        approval = Objects.requireNonNullElse(approval, Optional.empty());
    }

    /** "QP-250 rev 2", as the header of every page shows it. */
    public String identification() {
        return procedureNumber + " rev " + revision;
    }

    /**
     * A reference instrument as the register holds it.
     *
     * @param identifier        the register's identifier, as the proposal names it
     * @param description       what it is, e.g. "Pressure controller 0–20 bar"
     * @param certificateNumber its calibration certificate number
     * @param dueDate           its calibration due date
     */
    public record ReferenceInstrument(String identifier, String description, String certificateNumber,
                                      LocalDate dueDate) {
        /** @throws IllegalArgumentException when a field is missing */
        public ReferenceInstrument {
            List<String> missing = new ArrayList<>();
            required(missing, "identifier", identifier);
            required(missing, "description", description);
            required(missing, "certificate number", certificateNumber);
            if (dueDate == null) {
                missing.add("due date");
            }
            if (!missing.isEmpty()) {
                throw new IllegalArgumentException("A reference instrument needs its " + String.join(", ", missing) + ".");
            }
        }
    }

    /**
     * Who approved the revision and when.
     *
     * @param approver   the approver's display name
     * @param approvedAt the approval instant (printed in UTC)
     */
    public record Approval(String approver, Instant approvedAt) {
        /** @throws IllegalArgumentException when a field is missing */
        public Approval {
            if (approver == null || approver.isBlank() || approvedAt == null) {
                throw new IllegalArgumentException("An approval needs the approver and the time of approval.");
            }
        }
    }

    /**
     * One line of the revision history.
     *
     * @param revision the revision number
     * @param status   its status, e.g. "SUPERSEDED"
     * @param at       when the line's event happened (printed as a UTC date)
     * @param who      who did it
     * @param reason   why (e.g. "Specification rev 3: new hysteresis limit"); may be blank for the first draft
     */
    public record RevisionEntry(int revision, String status, Instant at, String who, String reason) {
        /** @throws IllegalArgumentException when the revision, status, time or person is missing */
        public RevisionEntry {
            if (revision < 1 || status == null || status.isBlank() || at == null || who == null || who.isBlank()) {
                throw new IllegalArgumentException(
                        "A revision history line needs its revision number, status, date and who.");
            }
            reason = reason == null ? "" : reason;
        }
    }

    /**
     * One edit of a proposed value, as recorded with its reason.
     *
     * @param field    the edited value's key, e.g. "static.cycles"
     * @param oldValue the value before, or "derived" when the derived value was replaced
     * @param newValue the value after
     * @param reason   why
     * @param who      who edited it
     * @param at       when (printed in UTC)
     */
    public record EditEntry(String field, String oldValue, String newValue, String reason, String who, Instant at) {
        /** @throws IllegalArgumentException when a part is missing */
        public EditEntry {
            if (field == null || newValue == null || reason == null || who == null || at == null) {
                throw new IllegalArgumentException("An edit needs its field, new value, reason, who and when.");
            }
            oldValue = oldValue == null ? "derived" : oldValue;
        }
    }

    private static void required(List<String> missing, String what, String value) {
        if (value == null || value.isBlank()) {
            missing.add(what);
        }
    }
}
