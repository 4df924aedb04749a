package org.dockgate.procedures;

import org.dockgate.platform.CurrentActor;

import java.time.Clock;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.dockgate.accounts.AccountService;
import org.dockgate.accounts.Person;
import org.dockgate.audit.AuditEvent;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.SpecificationRevision;
import org.dockgate.core.decision.DecisionRule;
import org.dockgate.core.evaluation.ConditionalCounting;
import org.dockgate.core.procedure.DerivationOptions;
import org.dockgate.core.procedure.ProcedureDerivation;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.procedure.ReferenceCandidate;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.TestKind;
import org.dockgate.core.quantity.Units;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.instruments.InstrumentView;
import org.dockgate.platform.Role;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.core.type.TypeReference;
import tools.jackson.databind.json.JsonMapper;

/**
 * The procedures module's face: derive a proposal from a specification revision with the register's
 * instruments, keep a draft whose every edit is recorded with its reason, approve it into an immutable
 * revision (superseding the previous one), and hand approved revisions to receiving and evaluation.
 */
@Service
public class ProcedureService {

    private final JdbcTemplate jdbc;
    private final CatalogueService catalogue;
    private final InstrumentService instruments;
    private final AccountService accounts;
    private final ApplicationEventPublisher events;
    private final Clock clock;
    private final JsonMapper json;

    ProcedureService(JdbcTemplate jdbc, CatalogueService catalogue, InstrumentService instruments,
                     AccountService accounts, ApplicationEventPublisher events, Clock clock, JsonMapper json) {
        this.jdbc = jdbc;
        this.catalogue = catalogue;
        this.instruments = instruments;
        this.accounts = accounts;
        this.events = events;
        this.clock = clock;
        this.json = json;
    }

    /** Proposes a procedure without saving anything (the derive API and the draft page use it). */
    @Transactional(readOnly = true)
    public ProcedureProposal propose(long specificationRevisionId, ProcedureSettings settings, Map<String, String> overrides) {
        SpecificationRevision revision = catalogue.revision(specificationRevisionId)
                .orElseThrow(() -> new IllegalArgumentException("There is no specification revision " + specificationRevisionId + "."));
        SensorSpecification spec = revision.specification();
        Map<String, String> edits = overrides == null ? Map.of() : overrides;
        List<ReferenceCandidate> candidates = candidates(spec, edits.get("static.instrument"), edits.get("sweep.instrument"));
        ProcedureProposal derived = ProcedureDerivation.derive(spec,
                new DerivationOptions(settings.aql(), settings.level(), settings.policy(), null), candidates);
        return ProposalEditor.apply(derived, spec, edits);
    }

    /**
     * The register's instruments as the core's candidates: those of the measurand's quantity, in
     * calibration today, with the range their current calibration covers, converted to the specification's
     * input unit. A chosen instrument replaces the
     * candidates of its test; it must itself qualify.
     */
    List<ReferenceCandidate> candidates(SensorSpecification spec, String staticChoice, String sweepChoice) {
        String quantity = spec.kind().inputDimension();
        if (quantity == null) {
            return List.of();
        }
        List<ReferenceCandidate> all = new ArrayList<>();
        String unit = spec.inputUnit();
        for (InstrumentView v : instruments.list(quantity, null)) {
            if (!v.selectable()) {
                continue;
            }
            // The range its current calibration covers: outside it the instrument cannot serve a point.
            double min = Units.convert(v.calibratedMin(v.current()), v.unit(), unit);
            double max = Units.convert(v.calibratedMax(v.current()), v.unit(), unit);
            double k = v.current().coverageFactor();
            String id = v.identifier();
            java.util.function.DoubleUnaryOperator u = x -> instruments.expandedUncertaintyAt(id, x, unit);
            if (staticChoice == null || staticChoice.equals(id)) {
                all.add(new ReferenceCandidate(id, TestKind.STATIC_CALIBRATION, Math.min(min, max), Math.max(min, max), u, k));
            }
            if (spec.bandwidth() != null && (sweepChoice == null || sweepChoice.equals(id))) {
                all.add(new ReferenceCandidate(id, TestKind.FREQUENCY_SWEEP, Math.min(min, max), Math.max(min, max), u, k));
            }
        }
        for (String choice : new String[] {staticChoice, sweepChoice}) {
            if (choice != null && all.stream().noneMatch(c -> c.identifier().equals(choice))) {
                instruments.requireSelectable(choice);
                throw new IllegalArgumentException("The instrument " + choice + " does not measure " + quantity
                        + " and cannot serve this procedure.");
            }
        }
        return all;
    }

    @Transactional
    public long createDraft(long specificationRevisionId, ProcedureSettings settings) {
        SpecificationRevision revision = catalogue.revision(specificationRevisionId)
                .orElseThrow(() -> new IllegalArgumentException("There is no specification revision " + specificationRevisionId + "."));
        propose(specificationRevisionId, settings, Map.of()); // refuses settings that cannot be derived
        var keys = new org.springframework.jdbc.support.GeneratedKeyHolder();
        jdbc.update(con -> {
            var ps = con.prepareStatement("insert into procedure_draft (model_id, specification_revision_id, aql,"
                    + " inspection_level, decision_rule, guard_band_factor, max_false_accept_risk, overrides_json, author,"
                    + " created_at, status, version, conditional_counting) values (?, ?, ?, ?, ?, ?, ?, '{}', ?, ?, 'OPEN', 0, ?)",
                    new String[] {"id"});
            ps.setLong(1, revision.modelId());
            ps.setLong(2, specificationRevisionId);
            ps.setString(3, settings.aql().name());
            ps.setString(4, settings.level().name());
            ps.setString(5, settings.rule().name());
            ps.setDouble(6, settings.guardBandFactor());
            ps.setDouble(7, settings.maxFalseAcceptRisk());
            ps.setString(8, CurrentActor.username());
            ps.setObject(9, now());
            ps.setString(10, settings.conditionalCounting().key());
            return ps;
        }, keys);
        long id = keys.getKey().longValue();
        events.publishEvent(AuditEvent.of("PROCEDURE_DRAFT", id, "CREATE", "Procedure draft for " + revision.label())
                .withChanges(List.of(FieldChange.of("specificationRevision", null, revision.label()),
                        FieldChange.of("aql", null, settings.aql().label()), FieldChange.of("level", null, settings.level()),
                        FieldChange.of("decisionRule", null, settings.rule()),
                        FieldChange.of("conditionalCounting", null, settings.conditionalCounting().key()))));
        return id;
    }

    @Transactional(readOnly = true)
    public ProcedureDraft draft(long id) {
        var row = jdbc.queryForList("select * from procedure_draft where id = ?", id);
        if (row.isEmpty()) {
            throw new IllegalArgumentException("There is no procedure draft " + id + ".");
        }
        var r = row.get(0);
        long specId = ((Number) r.get("specification_revision_id")).longValue();
        SpecificationRevision revision = catalogue.revision(specId).orElseThrow();
        ProcedureSettings settings = settings(r);
        Map<String, String> overrides = org.dockgate.platform.StoredJson.reader(json, new TypeReference<LinkedHashMap<String, String>>() { }).readValue((String) r.get("overrides_json"));
        List<ProcedureDraft.Edit> edits = editsOfDraft(id);
        Number approved = (Number) r.get("approved_revision_id");
        return new ProcedureDraft(id, revision.modelId(), revision.partNumber(), specId, revision.revisionNo(), settings,
                overrides, propose(specId, settings, overrides), (String) r.get("justification"), (String) r.get("author"),
                CurrentActor.instant(r.get("created_at")), (String) r.get("status"), approved == null ? null : approved.longValue(), edits,
                ((Number) r.get("version")).longValue());
    }

    private List<ProcedureDraft.Edit> editsOfDraft(long draftId) {
        return jdbc.query("select field, old_value, new_value, reason, edited_by, edited_at"
                + " from procedure_edit where draft_id = ? order by id", (rs, i) -> new ProcedureDraft.Edit(rs.getString(1),
                rs.getString(2), rs.getString(3), rs.getString(4), rs.getString(5),
                rs.getObject(6, OffsetDateTime.class).toInstant()), draftId);
    }

    /** The edits, with their reasons, of the draft an approved revision was made from, in order. */
    @Transactional(readOnly = true)
    public List<ProcedureDraft.Edit> edits(ApprovedProcedure revision) {
        List<Long> drafts = jdbc.queryForList("select draft_id from procedure_revision where id = ? and draft_id is not null",
                Long.class, revision.id());
        return drafts.isEmpty() ? List.of() : editsOfDraft(drafts.get(0));
    }

    @Transactional(readOnly = true)
    public List<ProcedureDraft> openDrafts(long modelId) {
        return jdbc.queryForList("select id from procedure_draft where model_id = ? and status = 'OPEN' order by id",
                Long.class, modelId).stream().map(this::draft).toList();
    }

    /** Changes one proposed value; the old and new values and the reason are recorded. */
    @Transactional
    public ProcedureDraft edit(long draftId, String field, String newValue, String reason, long expectedVersion) {
        ProposalEditor.requireKnown(field);
        if (reason == null || reason.isBlank()) {
            throw new IllegalArgumentException("Give the reason for changing " + field + ".");
        }
        if (newValue == null || newValue.isBlank()) {
            throw new IllegalArgumentException("Enter the new value of " + field + ".");
        }
        ProcedureDraft draft = draft(draftId);
        requireOpen(draft, expectedVersion);
        Map<String, String> overrides = new LinkedHashMap<>(draft.overrides());
        String old = overrides.get(field);
        overrides.put(field, newValue.trim());
        propose(draft.specificationRevisionId(), draft.settings(), overrides); // refuses an unacceptable value
        bump(draftId, expectedVersion, "overrides_json = ?", json.writeValueAsString(overrides));
        jdbc.update("insert into procedure_edit (draft_id, field, old_value, new_value, reason, edited_by, edited_at)"
                + " values (?, ?, ?, ?, ?, ?, ?)", draftId, field, old, newValue.trim(), reason.trim(), CurrentActor.username(), now());
        events.publishEvent(new AuditEvent("PROCEDURE_DRAFT", String.valueOf(draftId), "EDIT_WITH_REASON",
                List.of(FieldChange.of(field, old == null ? "(derived)" : old, newValue.trim())),
                "Changed " + field + " of the " + draft.partNumber() + " procedure draft", reason.trim(), null));
        return draft(draftId);
    }

    /** Records why the procedure may be approved although a TUR stays below 4:1. */
    @Transactional
    public ProcedureDraft justify(long draftId, String justification, long expectedVersion) {
        if (justification == null || justification.isBlank()) {
            throw new IllegalArgumentException("Write the justification.");
        }
        ProcedureDraft draft = draft(draftId);
        requireOpen(draft, expectedVersion);
        bump(draftId, expectedVersion, "justification = ?", justification.trim());
        events.publishEvent(new AuditEvent("PROCEDURE_DRAFT", String.valueOf(draftId), "JUSTIFY",
                List.of(FieldChange.of("justification", draft.justification(), justification.trim())),
                "TUR justification for the " + draft.partNumber() + " procedure draft", justification.trim(), null));
        return draft(draftId);
    }

    /**
     * Approves a draft into the model's next immutable revision and supersedes the previous approved
     * one. Refused when: the approver is neither ENGINEER nor SUPERVISOR; the approver wrote the draft
     * and another engineer could approve it; a TUR below 4:1 has no justification; a planned reference
     * instrument is out of calibration.
     */
    @Transactional
    public ApprovedProcedure approve(long draftId, long expectedVersion) {
        ProcedureDraft draft = draft(draftId);
        requireOpen(draft, expectedVersion);
        String approver = CurrentActor.username();
        Person person = accounts.byUsername(approver)
                .orElseThrow(() -> new IllegalStateException("Only a signed-in ENGINEER or SUPERVISOR can approve."));
        if (!person.has(Role.ENGINEER) && !person.has(Role.SUPERVISOR)) {
            throw new IllegalStateException("Approving a procedure needs the role ENGINEER or SUPERVISOR.");
        }
        if (approver.equals(draft.author())) {
            boolean anotherEngineer = accounts.all().stream().anyMatch(p -> p.enabled() && !p.username().equals(approver)
                    && p.has(Role.ENGINEER));
            if (anotherEngineer) {
                throw new IllegalStateException("You wrote this draft: another engineer or a supervisor must approve it.");
            }
        }
        ProcedureProposal content = draft.proposal();
        if (!content.allTestUncertaintyRatiosAdequate() && (draft.justification() == null || draft.justification().isBlank())) {
            throw new IllegalStateException("A TUR stays below 4:1: record a justification before approving.");
        }
        for (String id : plannedInstruments(content)) {
            instruments.requireSelectable(id);
        }
        Integer last = jdbc.queryForObject("select max(revision_no) from procedure_revision where model_id = ?",
                Integer.class, draft.modelId());
        int number = last == null ? 1 : last + 1;
        Optional<ApprovedProcedure> previous = approvedFor(draft.modelId());
        var keys = new org.springframework.jdbc.support.GeneratedKeyHolder();
        ProcedureSettings s = draft.settings();
        String contentJson = json.writeValueAsString(content);
        jdbc.update(con -> {
            var ps = con.prepareStatement("insert into procedure_revision (model_id, specification_revision_id, draft_id,"
                    + " revision_no, aql, inspection_level, decision_rule, guard_band_factor, max_false_accept_risk,"
                    + " content_json, justification, author, approved_by, approved_at, conditional_counting) values"
                    + " (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)", new String[] {"id"});
            ps.setLong(1, draft.modelId());
            ps.setLong(2, draft.specificationRevisionId());
            ps.setLong(3, draftId);
            ps.setInt(4, number);
            ps.setString(5, s.aql().name());
            ps.setString(6, s.level().name());
            ps.setString(7, s.rule().name());
            ps.setDouble(8, s.guardBandFactor());
            ps.setDouble(9, s.maxFalseAcceptRisk());
            ps.setString(10, contentJson);
            ps.setString(11, draft.justification());
            ps.setString(12, draft.author());
            ps.setString(13, approver);
            ps.setObject(14, now());
            ps.setString(15, s.conditionalCounting().key());
            return ps;
        }, keys);
        long revisionId = keys.getKey().longValue();
        bump(draftId, expectedVersion, "status = 'APPROVED', approved_revision_id = ?", revisionId);
        events.publishEvent(AuditEvent.of("PROCEDURE_REVISION", revisionId, "APPROVE",
                        draft.partNumber() + " procedure rev " + number + " approved")
                .withChanges(List.of(FieldChange.of("status", "DRAFT", "APPROVED"),
                        FieldChange.of("specificationRevision", null, draft.partNumber() + " rev " + draft.specificationRevisionNo()),
                        FieldChange.of("author", null, draft.author()), FieldChange.of("approvedBy", null, approver))));
        previous.ifPresent(p -> {
            jdbc.update("insert into procedure_supersession (revision_id, superseded_by, superseded_at) values (?, ?, ?)",
                    p.id(), revisionId, now());
            events.publishEvent(AuditEvent.of("PROCEDURE_REVISION", p.id(), "SUPERSEDE",
                    p.label() + " superseded by rev " + number).withChanges(List.of(FieldChange.of("status", "APPROVED", "SUPERSEDED"))));
        });
        return revision(revisionId).orElseThrow();
    }

    /** The model's current approved procedure, if any. */
    @Transactional(readOnly = true)
    public Optional<ApprovedProcedure> approvedFor(long modelId) {
        return revisions(modelId).stream().filter(r -> !r.superseded()).findFirst();
    }

    /** All approved revisions of a model, newest first. */
    @Transactional(readOnly = true)
    public List<ApprovedProcedure> revisions(long modelId) {
        return jdbc.queryForList("select id from procedure_revision where model_id = ? order by revision_no desc",
                Long.class, modelId).stream().map(id -> revision(id).orElseThrow()).toList();
    }

    @Transactional(readOnly = true)
    public Optional<ApprovedProcedure> revision(long id) {
        var rows = jdbc.queryForList("select r.*, (select count(*) from procedure_supersession s where s.revision_id = r.id)"
                + " as superseded from procedure_revision r where r.id = ?", id);
        if (rows.isEmpty()) {
            return Optional.empty();
        }
        var r = rows.get(0);
        long specId = ((Number) r.get("specification_revision_id")).longValue();
        SpecificationRevision spec = catalogue.revision(specId).orElseThrow();
        return Optional.of(new ApprovedProcedure(id, spec.modelId(), spec.partNumber(), specId, spec.revisionNo(),
                ((Number) r.get("revision_no")).intValue(), settings(r),
                org.dockgate.platform.StoredJson.<ProcedureProposal>read(json, ProcedureProposal.class, (String) r.get("content_json")), (String) r.get("justification"),
                (String) r.get("author"), (String) r.get("approved_by"), CurrentActor.instant(r.get("approved_at")),
                ((Number) r.get("superseded")).longValue() > 0));
    }

    /** Whether a specification revision is used by any procedure (then it can only be followed by a new revision). */
    @Transactional(readOnly = true)
    public boolean specificationUsed(long specificationRevisionId) {
        Integer n = jdbc.queryForObject("select count(*) from procedure_draft where specification_revision_id = ?",
                Integer.class, specificationRevisionId);
        return n != null && n > 0;
    }

    static List<String> plannedInstruments(ProcedureProposal content) {
        List<String> ids = new ArrayList<>();
        if (content.staticCalibration().referenceInstrument() != null) {
            ids.add(content.staticCalibration().referenceInstrument());
        }
        if (content.frequencySweep() != null && content.frequencySweep().referenceInstrument() != null
                && !ids.contains(content.frequencySweep().referenceInstrument())) {
            ids.add(content.frequencySweep().referenceInstrument());
        }
        return ids;
    }

    private void requireOpen(ProcedureDraft draft, long expectedVersion) {
        if (!draft.open()) {
            throw new IllegalStateException("This draft was already " + draft.status().toLowerCase()
                    + ": an approved revision never changes. Start a new draft to change it.");
        }
        if (draft.version() != expectedVersion) {
            throw new ObjectOptimisticLockingFailureException("procedure_draft", draft.id());
        }
    }

    private void bump(long draftId, long expectedVersion, String set, Object value) {
        int n = jdbc.update("update procedure_draft set " + set + ", version = version + 1 where id = ? and version = ?",
                value, draftId, expectedVersion);
        if (n != 1) {
            throw new ObjectOptimisticLockingFailureException("procedure_draft", draftId);
        }
    }

    private static ProcedureSettings settings(Map<String, Object> r) {
        return new ProcedureSettings(Aql.valueOf((String) r.get("aql")), InspectionLevel.valueOf((String) r.get("inspection_level")),
                DecisionRule.valueOf((String) r.get("decision_rule")), ((Number) r.get("guard_band_factor")).doubleValue(),
                ((Number) r.get("max_false_accept_risk")).doubleValue(),
                ConditionalCounting.parse((String) r.get("conditional_counting")));
    }

    private OffsetDateTime now() {
        return clock.instant().atOffset(ZoneOffset.UTC);
    }


}
