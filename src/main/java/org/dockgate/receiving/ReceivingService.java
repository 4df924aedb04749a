package org.dockgate.receiving;

import org.dockgate.platform.CurrentActor;
import org.dockgate.platform.Role;

import java.security.SecureRandom;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Clock;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.UUID;
import org.dockgate.audit.AuditEvent;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.SensorModelView;
import org.dockgate.catalogue.SupplierStatus;
import org.dockgate.catalogue.SupplierView;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.CodeLetter;
import org.dockgate.core.sampling.Disposition;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.core.sampling.LotResult;
import org.dockgate.core.sampling.SamplingPlan;
import org.dockgate.core.sampling.Scheme;
import org.dockgate.core.sampling.Severity;
import org.dockgate.core.sampling.SingleSamplingPlans;
import org.dockgate.core.sampling.SwitchingDecision;
import org.dockgate.core.sampling.SwitchingRules;
import org.dockgate.core.sampling.SwitchingState;
import org.springframework.beans.factory.ObjectProvider;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.support.GeneratedKeyHolder;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * The receiving module's face: record receipts and their lots, fix each lot's specification and
 * procedure revisions, compute its ISO 2859-1 plan from the switching state for its supplier and
 * model, draw the sample with a recorded seed, and record a lot's result (disposition and switching
 * state in one transaction).
 */
@Service
public class ReceivingService {

    /**
     * The serial alphabet: ASCII letters, digits, '-', '_' and '.'. A serial is part of its unit's page
     * address (/bench/lots/{id}/units/{serial}), and the firewall refuses encoded '/' and ';'; spaces
     * are refused too, since scanners and links lose or split them.
     */
    static final java.util.regex.Pattern SERIAL_ALPHABET = java.util.regex.Pattern.compile("[A-Za-z0-9._-]+");

    private static final String LOT_COLUMNS = "id, receipt_id, supplier_id, model_id, quantity, serials,"
            + " specification_revision_id, procedure_revision_id, procedure_label, aql, inspection_level, scheme,"
            + " code_letter, plan_code_letter, sample_size, accept_number, reject_number, severity, full_inspection,"
            + " sample_seed, sampled_serials, state, nonconforming, disposition, version, created_at";

    private final JdbcTemplate jdbc;
    private final CatalogueService catalogue;
    private final ObjectProvider<ProcedureLookup> procedures;
    private final ApplicationEventPublisher events;
    private final Clock clock;
    private final SecureRandom seeds = new SecureRandom();

    ReceivingService(JdbcTemplate jdbc, CatalogueService catalogue, ObjectProvider<ProcedureLookup> procedures,
                     ApplicationEventPublisher events, Clock clock) {
        this.jdbc = jdbc;
        this.catalogue = catalogue;
        this.procedures = procedures;
        this.events = events;
        this.clock = clock;
    }

    // ---- receipts

    /**
     * Records a receipt and its lots, each with its plan and drawn sample, or refuses the whole receipt
     * with a {@link ReceivingException} naming the problem (nothing is saved). A receipt whose client
     * token was already used is returned as saved (a second submit of the same form).
     */
    @Transactional
    public ReceiptView receive(NewReceipt draft) {
        if (draft == null) {
            throw new ReceivingException(null, "The receipt is empty.");
        }
        String token = draft.clientToken() == null || draft.clientToken().isBlank()
                ? UUID.randomUUID().toString() : draft.clientToken().trim();
        if (token.length() > 64) {
            throw new ReceivingException("clientToken", "The client token is longer than 64 characters.");
        }
        List<Long> existing = jdbc.queryForList("select id from receipt where client_token = ?", Long.class, token);
        if (!existing.isEmpty()) {
            if (!sameReceipt(existing.get(0), draft)) {
                throw new IllegalStateException("The client token '" + token + "' was already used for a different"
                        + " receipt; nothing of this one was saved. Send a new client token for a new receipt.");
            }
            return receipt(existing.get(0)).orElseThrow();
        }
        String po = text(draft.purchaseOrder(), "purchaseOrder", "the purchase-order number");
        String note = text(draft.deliveryNote(), "deliveryNote", "the delivery note");
        LocalDate receivedOn = draft.receivedOn();
        if (receivedOn == null) {
            throw new ReceivingException("receivedOn", "Enter the date received.");
        }
        if (receivedOn.isAfter(LocalDate.now(clock))) {
            throw new ReceivingException("receivedOn", "The date received " + receivedOn + " is in the future.");
        }
        if (draft.supplierId() == null) {
            throw new ReceivingException("supplierId", "Choose the supplier.");
        }
        SupplierView supplier = catalogue.supplier(draft.supplierId())
                .orElseThrow(() -> new ReceivingException("supplierId", "There is no supplier " + draft.supplierId() + "."));
        if (supplier.status() == SupplierStatus.DISQUALIFIED) {
            throw new ReceivingException("supplierId", "Supplier " + supplier.code()
                    + " is disqualified: lots from it cannot be received.");
        }
        if (draft.lots() == null || draft.lots().isEmpty()) {
            throw new ReceivingException("lots", "A receipt needs at least one lot.");
        }
        List<PreparedLot> prepared = new ArrayList<>();
        Map<String, Integer> seenInReceipt = new HashMap<>();
        for (int i = 0; i < draft.lots().size(); i++) {
            PreparedLot lot = prepare(draft.lots().get(i), supplier, draft.lots().size() > 1 ? "Lot " + (i + 1) + ": " : "");
            for (String serial : lot.serials()) {
                Integer other = seenInReceipt.putIfAbsent(lot.model().id() + "\u0000" + serial, i + 1);
                if (other != null) {
                    throw new ReceivingException("serials", "Serial " + serial + " appears in lot " + other
                            + " and lot " + (i + 1) + " of this receipt.");
                }
            }
            prepared.add(lot);
        }
        // Two lots of one receipt for the same model share a switching state: the plan of both is the current one.
        String who = CurrentActor.username();
        var now = OffsetDateTime.now(clock).withOffsetSameInstant(ZoneOffset.UTC);
        long receiptId = insert("insert into receipt (purchase_order, delivery_note, received_on, received_by,"
                + " supplier_id, client_token, created_at) values (?, ?, ?, ?, ?, ?, ?)", po, note, receivedOn, who,
                supplier.id(), token, now);
        events.publishEvent(AuditEvent.of("RECEIPT", receiptId, "CREATE", "Receipt " + receiptId + " from "
                + supplier.code() + ", PO " + po + ", delivery note " + note)
                .withChanges(List.of(FieldChange.of("purchaseOrder", null, po), FieldChange.of("deliveryNote", null, note),
                        FieldChange.of("receivedOn", null, receivedOn), FieldChange.of("supplier", null, supplier.code()))));
        for (PreparedLot lot : prepared) {
            long seed = seeds.nextLong();
            SamplingPlan plan = lot.plan();
            List<String> sample = SampleDraw.draw(lot.serials(), plan.sampleSize(), seed);
            long lotId = insert("insert into receiving_lot (receipt_id, supplier_id, model_id, quantity, serials,"
                    + " specification_revision_id, procedure_revision_id, procedure_label, aql, inspection_level, scheme,"
                    + " code_letter, plan_code_letter, sample_size, accept_number, reject_number, severity,"
                    + " full_inspection, sample_seed, sampled_serials, state, version, created_at)"
                    + " values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, 0, ?)",
                    receiptId, supplier.id(), lot.model().id(), lot.serials().size(), String.join("\n", lot.serials()),
                    lot.model().latest().id(), lot.procedure().procedureRevisionId(), lot.procedure().label(),
                    plan.aql().name(), lot.procedure().level().name(), plan.scheme().name(), plan.codeLetter().name(),
                    plan.planCodeLetter().name(), plan.sampleSize(), plan.acceptNumber(), plan.rejectNumber(),
                    plan.severity().name(), plan.fullInspection(), seed, String.join("\n", sample),
                    LotState.AWAITING_MEASUREMENT.name(), now);
            events.publishEvent(AuditEvent.of("LOT", lotId, "RECEIVE", "Lot " + lotId + ": " + lot.serials().size()
                    + " x " + lot.model().partNumber() + " from " + supplier.code() + "; " + planText(plan)
                    + "; sample drawn with seed " + seed)
                    .withChanges(List.of(FieldChange.of("quantity", null, lot.serials().size()),
                            FieldChange.of("specificationRevisionId", null, lot.model().latest().id()),
                            FieldChange.of("procedureRevisionId", null, lot.procedure().procedureRevisionId()),
                            FieldChange.of("plan", null, planText(plan)),
                            FieldChange.of("sampleSeed", null, seed),
                            FieldChange.of("sampledSerials", null, String.join(", ", sample)))));
            // The pair's switching state exists from its first receipt, so a supervisor can decide on reduced
            // inspection (clause 9.3.3 c) before the first disposition.
            ensureSwitching(supplier.id(), lot.model().id());
        }
        return receipt(receiptId).orElseThrow();
    }

    /**
     * Whether a repeated submit carries what the receipt saved under its client token holds: same user,
     * purchase order, delivery note, date, supplier, and the same lots (model, quantity, serials in order).
     */
    private boolean sameReceipt(long receiptId, NewReceipt draft) {
        Map<String, Object> saved = jdbc.queryForMap("select purchase_order, delivery_note, received_on, received_by,"
                + " supplier_id from receipt where id = ?", receiptId);
        if (!Objects.equals(saved.get("received_by"), CurrentActor.username())
                || !Objects.equals(saved.get("purchase_order"), trimmed(draft.purchaseOrder()))
                || !Objects.equals(saved.get("delivery_note"), trimmed(draft.deliveryNote()))
                || draft.receivedOn() == null
                || !draft.receivedOn().equals(localDate(saved.get("received_on")))
                || draft.supplierId() == null
                || draft.supplierId() != ((Number) saved.get("supplier_id")).longValue()) {
            return false;
        }
        List<Map<String, Object>> lots = jdbc.queryForList("select model_id, quantity, serials from receiving_lot"
                + " where receipt_id = ? order by id", receiptId);
        if (draft.lots() == null || draft.lots().size() != lots.size()) {
            return false;
        }
        for (int i = 0; i < lots.size(); i++) {
            NewLot lot = draft.lots().get(i);
            Map<String, Object> row = lots.get(i);
            if (lot == null || lot.modelId() == null || lot.quantity() == null || lot.serials() == null
                    || lot.modelId() != ((Number) row.get("model_id")).longValue()
                    || lot.quantity() != ((Number) row.get("quantity")).intValue()
                    || !String.join("\n", lot.serials().stream().map(s -> s == null ? "" : s.trim()).toList())
                    .equals(row.get("serials"))) {
                return false;
            }
        }
        return true;
    }

    private static LocalDate localDate(Object value) {
        return value instanceof java.sql.Date d ? d.toLocalDate()
                : value instanceof LocalDate l ? l : LocalDate.parse(String.valueOf(value));
    }

    private static String trimmed(String value) {
        return value == null ? null : value.trim();
    }

    private record PreparedLot(SensorModelView model, List<String> serials, LotProcedure procedure, SamplingPlan plan) {
    }

    private PreparedLot prepare(NewLot lot, SupplierView supplier, String prefix) {
        if (lot == null || lot.modelId() == null) {
            throw new ReceivingException("modelId", prefix + "Choose the sensor model.");
        }
        SensorModelView model = catalogue.model(lot.modelId())
                .orElseThrow(() -> new ReceivingException("modelId", prefix + "There is no sensor model " + lot.modelId() + "."));
        if (model.suppliers().stream().noneMatch(s -> s.id() == supplier.id())) {
            throw new ReceivingException("modelId", prefix + "Supplier " + supplier.code() + " does not supply "
                    + model.partNumber() + ".");
        }
        if (lot.quantity() == null || lot.quantity() < 1) {
            throw new ReceivingException("quantity", prefix + "Enter the quantity received (at least 1).");
        }
        List<String> serials = lot.serials() == null ? List.of() : lot.serials().stream()
                .map(s -> s == null ? "" : s.trim()).toList();
        List<Integer> blank = new ArrayList<>();
        Map<String, List<Integer>> lines = new LinkedHashMap<>();
        for (int i = 0; i < serials.size(); i++) {
            if (serials.get(i).isEmpty()) {
                blank.add(i + 1);
            } else {
                lines.computeIfAbsent(serials.get(i), k -> new ArrayList<>()).add(i + 1);
            }
            if (serials.get(i).length() > 64) {
                throw new ReceivingException("serials", prefix + "The serial on line " + (i + 1)
                        + " is longer than 64 characters.");
            }
            if (!serials.get(i).isEmpty() && !SERIAL_ALPHABET.matcher(serials.get(i)).matches()) {
                throw new ReceivingException("serials", prefix + "The serial \"" + serials.get(i) + "\" on line "
                        + (i + 1) + " has a character a serial may not hold: use letters A-Z or a-z, digits,"
                        + " '-', '_' or '.' (no spaces, '/', ';' or other signs).");
            }
        }
        if (!blank.isEmpty()) {
            throw new ReceivingException("serials", prefix + "Blank serial on line" + (blank.size() > 1 ? "s " : " ")
                    + join(blank) + ": enter one serial per line.");
        }
        List<String> duplicates = lines.entrySet().stream().filter(e -> e.getValue().size() > 1)
                .map(e -> e.getKey() + " (lines " + join(e.getValue()) + ")").toList();
        if (!duplicates.isEmpty()) {
            throw new ReceivingException("serials", prefix + "Duplicate serial" + (duplicates.size() > 1 ? "s " : " ")
                    + String.join(", ", duplicates) + ": each unit's serial must appear once.");
        }
        if (serials.size() != lot.quantity()) {
            throw new ReceivingException("serials", prefix + serials.size() + " serial" + (serials.size() == 1 ? "" : "s")
                    + " for a quantity of " + lot.quantity() + ".");
        }
        ProcedureLookup lookup = procedures.getIfAvailable();
        LotProcedure procedure = (lookup == null ? Optional.<LotProcedure>empty() : lookup.approvedFor(model.id()))
                .orElseThrow(() -> new ReceivingException("modelId", prefix + model.partNumber()
                        + " has no approved procedure: a procedure must be approved before its lots can be received."));
        SwitchingState state = switching(supplier.id(), model.id()).map(SwitchingView::state).orElse(SwitchingState.start());
        if (state.discontinued()) {
            throw new ReceivingException("modelId", prefix + "Inspection of " + model.partNumber() + " from "
                    + supplier.code() + " is discontinued (ISO 2859-1:1999 clause 9.4): no new lots until a supervisor"
                    + " lifts the block with a reason.");
        }
        SamplingPlan plan;
        try {
            plan = SingleSamplingPlans.plan(serials.size(), procedure.aql(), procedure.level(), state.severity(),
                    state.scheme());
        } catch (IllegalArgumentException e) {
            throw new ReceivingException("quantity", prefix + e.getMessage());
        }
        return new PreparedLot(model, serials, procedure, plan);
    }

    /** All receipts, newest first. */
    @Transactional(readOnly = true)
    public List<ReceiptView> receipts() {
        return jdbc.queryForList("select id from receipt order by id desc", Long.class).stream()
                .map(id -> receipt(id).orElseThrow()).toList();
    }

    /** One receipt with its lots. */
    @Transactional(readOnly = true)
    public Optional<ReceiptView> receipt(long id) {
        Names names = new Names();
        return jdbc.query("select id, purchase_order, delivery_note, received_on, received_by, supplier_id, created_at"
                + " from receipt where id = ?", (rs, n) -> new ReceiptView(rs.getLong(1), rs.getString(2), rs.getString(3),
                rs.getObject(4, LocalDate.class), rs.getString(5), rs.getLong(6), names.supplier(rs.getLong(6)),
                rs.getObject(7, OffsetDateTime.class).toInstant(),
                jdbc.query("select " + LOT_COLUMNS + " from receiving_lot where receipt_id = ? order by id",
                        (r, m) -> lot(r, names), id)), id).stream().findFirst();
    }

    // ---- lots

    /** One lot. */
    @Transactional(readOnly = true)
    public Optional<LotView> lot(long id) {
        Names names = new Names();
        return jdbc.query("select " + LOT_COLUMNS + " from receiving_lot where id = ?", (rs, n) -> lot(rs, names), id)
                .stream().findFirst();
    }

    /** Lots, newest first; only those in the given state when it is not null. */
    @Transactional(readOnly = true)
    public List<LotView> lots(LotState state) {
        Names names = new Names();
        return state == null
                ? jdbc.query("select " + LOT_COLUMNS + " from receiving_lot order by id desc", (rs, n) -> lot(rs, names))
                : jdbc.query("select " + LOT_COLUMNS + " from receiving_lot where state = ? order by id desc",
                        (rs, n) -> lot(rs, names), state.name());
    }

    /**
     * Re-draws the lot's sample from its stored serials (entry order), sample size and seed with
     * {@link SampleDraw#draw}: an auditor compares it with the stored sample.
     */
    @Transactional(readOnly = true)
    public List<String> redraw(long lotId) {
        LotView lot = lot(lotId).orElseThrow(() -> new ReceivingException(null, "There is no lot " + lotId + "."));
        return SampleDraw.draw(lot.serials(), lot.plan().sampleSize(), lot.sampleSeed());
    }

    /** True when {@link #redraw} gives exactly the stored sample, in the same order. */
    @Transactional(readOnly = true)
    public boolean sampleReproduces(long lotId) {
        LotView lot = lot(lotId).orElseThrow(() -> new ReceivingException(null, "There is no lot " + lotId + "."));
        return SampleDraw.draw(lot.serials(), lot.plan().sampleSize(), lot.sampleSeed()).equals(lot.sampledSerials());
    }

    /**
     * Records the result of a lot's sample with the lot's and the switching state's current versions.
     *
     * @see #recordLotResult(long, int, long, long)
     */
    @Transactional
    public LotResultView recordLotResult(long lotId, int nonconforming) {
        LotView lot = lot(lotId).orElseThrow(() -> new ReceivingException(null, "There is no lot " + lotId + "."));
        SwitchingView switching = ensureSwitching(lot.supplierId(), lot.modelId());
        return recordLotResult(lotId, nonconforming, lot.version(), switching.version());
    }

    /**
     * In one transaction: the lot's disposition from its plan (accept when d ≤ Ac, reject when d ≥ Re;
     * ISO 2859-1:1999 clause 11.2, {@link SingleSamplingPlans#disposition}), the lot's new state, and
     * the switching state for its supplier and model after the lot ({@link SwitchingRules#next}, clauses
     * 9.3–9.4), with the explanation in the audit trail. A stale version of either throws
     * {@link ObjectOptimisticLockingFailureException} and changes nothing. When the switching state
     * moved on since the lot was sampled (its severity differs, or inspection is discontinued), the lot
     * is still dispositioned under its own plan and the state is left as it is, which the explanation says.
     *
     * @throws ReceivingException when the lot is unknown or already dispositioned, or d is outside 0..n
     */
    @Transactional
    public LotResultView recordLotResult(long lotId, int nonconforming, long expectedLotVersion,
                                         long expectedSwitchingVersion) {
        LotView lot = lot(lotId).orElseThrow(() -> new ReceivingException(null, "There is no lot " + lotId + "."));
        if (lot.state() != LotState.AWAITING_MEASUREMENT) {
            throw new ReceivingException(null, "Lot " + lotId + " has already been dispositioned ("
                    + lot.disposition() + ").");
        }
        SamplingPlan plan = lot.plan().plan();
        Disposition disposition;
        try {
            disposition = SingleSamplingPlans.disposition(plan, nonconforming);
        } catch (IllegalArgumentException e) {
            throw new ReceivingException("nonconforming", e.getMessage());
        }
        LotState state = disposition.accepted() ? LotState.DISPOSITIONED_ACCEPTED : LotState.DISPOSITIONED_REJECTED;
        int updated = jdbc.update("update receiving_lot set state = ?, nonconforming = ?, disposition = ?,"
                + " version = version + 1 where id = ? and version = ?", state.name(), nonconforming, disposition.name(),
                lotId, expectedLotVersion);
        if (updated == 0) {
            throw new ObjectOptimisticLockingFailureException("Lot", lotId);
        }
        SwitchingView switching = ensureSwitching(lot.supplierId(), lot.modelId());
        SwitchingState before = switching.state();
        SwitchingState after;
        String explanation;
        if (before.discontinued()) {
            after = before;
            explanation = "Lot " + (disposition.accepted() ? "accepted" : "not accepted") + " under its own plan ("
                    + planText(plan) + "); inspection is discontinued (ISO 2859-1:1999 clause 9.4), so the switching"
                    + " state is unchanged.";
        } else if (before.severity() != plan.severity() || before.scheme() != plan.scheme()) {
            after = before;
            explanation = "Lot " + (disposition.accepted() ? "accepted" : "not accepted") + " under its own "
                    + plan.severity().name().toLowerCase() + " plan (" + planText(plan) + "); the switching state has"
                    + " since moved to " + before.severity().name().toLowerCase() + " inspection, so it is unchanged.";
        } else {
            // The responsible authority's approval in force (clause 9.3.3 c); it also confirms steady production (b).
            SwitchingDecision decision = SwitchingRules.next(before, LotResult.of(plan, nonconforming)
                    .withReducedInspectionApproved(reducedApproved(lot.supplierId(), lot.modelId())));
            after = decision.state();
            explanation = decision.explanation();
        }
        var now = OffsetDateTime.now(clock).withOffsetSameInstant(ZoneOffset.UTC);
        updated = jdbc.update("update switching_state set scheme = ?, severity = ?, discontinued = ?, recent_normal = ?,"
                + " switching_score = ?, consecutive_accepted_normal = ?, consecutive_accepted_tightened = ?,"
                + " not_accepted_tightened = ?, last_explanation = ?, version = version + 1, updated_at = ?"
                + " where id = ? and version = ?", after.scheme().name(), after.severity().name(), after.discontinued(),
                window(after.recentNormalLotsAccepted()), after.switchingScore(), after.consecutiveAcceptedOnNormal(),
                after.consecutiveAcceptedOnTightened(), after.notAcceptedOnTightened(), explanation, now,
                switching.id(), expectedSwitchingVersion);
        if (updated == 0) {
            throw new ObjectOptimisticLockingFailureException("Switching state", switching.id());
        }
        events.publishEvent(AuditEvent.of("LOT", lotId, "DISPOSITION", "Lot " + lotId + " "
                + (disposition.accepted() ? "accepted" : "rejected") + ": " + nonconforming + " nonconforming, "
                + planText(plan))
                .withChanges(List.of(FieldChange.of("state", lot.state(), state),
                        FieldChange.of("nonconforming", null, nonconforming),
                        FieldChange.of("disposition", null, disposition))));
        events.publishEvent(AuditEvent.of("SWITCHING", switching.id(), "SWITCH", explanation)
                .withChanges(List.of(FieldChange.of("state", label(before), label(after)))));
        return new LotResultView(lot(lotId).orElseThrow(), disposition,
                switching(lot.supplierId(), lot.modelId()).orElseThrow(), explanation);
    }

    // ---- switching

    /** The switching state for a supplier and model, if a lot of that pair was ever received. */
    @Transactional(readOnly = true)
    public Optional<SwitchingView> switching(long supplierId, long modelId) {
        Names names = new Names();
        return jdbc.query("select * from switching_state where supplier_id = ? and model_id = ?",
                (rs, n) -> switching(rs, names), supplierId, modelId).stream().findFirst();
    }

    /** One switching state by id. */
    @Transactional(readOnly = true)
    public Optional<SwitchingView> switchingById(long id) {
        Names names = new Names();
        return jdbc.query("select * from switching_state where id = ?", (rs, n) -> switching(rs, names), id)
                .stream().findFirst();
    }

    /** Every switching state, discontinued first. */
    @Transactional(readOnly = true)
    public List<SwitchingView> switchingStates() {
        Names names = new Names();
        return jdbc.query("select * from switching_state order by discontinued desc, id", (rs, n) -> switching(rs, names));
    }

    /**
     * Lifts a discontinued block: inspection resumes on tightened inspection
     * ({@link SwitchingRules#resume}, ISO 2859-1:1999 clause 9.4), recorded as LIFT_BLOCK with the reason.
     * The web layer lets only a SUPERVISOR reach this.
     */
    @Transactional
    public SwitchingView liftBlock(long switchingId, String reason, long expectedVersion) {
        SwitchingView current = switchingById(switchingId)
                .orElseThrow(() -> new ReceivingException(null, "There is no switching state " + switchingId + "."));
        if (reason == null || reason.isBlank()) {
            throw new ReceivingException("reason", "Give the reason for lifting the block (e.g. the corrective action agreed).");
        }
        if (current.version() != expectedVersion) {
            throw new ObjectOptimisticLockingFailureException("Switching state", switchingId);
        }
        SwitchingDecision decision;
        try {
            decision = SwitchingRules.resume(current.state(), reason);
        } catch (UnevaluableException e) {
            throw new ReceivingException(null, e.getMessage());
        }
        SwitchingState after = decision.state();
        int updated = jdbc.update("update switching_state set scheme = ?, severity = ?, discontinued = ?, recent_normal = ?,"
                + " switching_score = ?, consecutive_accepted_normal = ?, consecutive_accepted_tightened = ?,"
                + " not_accepted_tightened = ?, last_explanation = ?, version = version + 1, updated_at = ?"
                + " where id = ? and version = ?", after.scheme().name(), after.severity().name(), after.discontinued(),
                window(after.recentNormalLotsAccepted()), after.switchingScore(), after.consecutiveAcceptedOnNormal(),
                after.consecutiveAcceptedOnTightened(), after.notAcceptedOnTightened(), decision.explanation(),
                OffsetDateTime.now(clock).withOffsetSameInstant(ZoneOffset.UTC), switchingId, expectedVersion);
        if (updated == 0) {
            throw new ObjectOptimisticLockingFailureException("Switching state", switchingId);
        }
        events.publishEvent(AuditEvent.withReason("SWITCHING", switchingId, "LIFT_BLOCK", "Block lifted for "
                + current.partNumber() + " from " + current.supplierCode() + ": " + decision.explanation(), reason.trim())
                .withChanges(List.of(FieldChange.of("state", label(current.state()), label(after)))));
        return switchingById(switchingId).orElseThrow();
    }

    // ---- reduced inspection (the responsible authority's decision, ISO 2859-1:1999 clause 9.3.3 c)

    /** The decision in force on reduced inspection for the switching state's pair, and what is still missing. */
    @Transactional(readOnly = true)
    public ReducedInspectionStatus reducedInspection(SwitchingView switching) {
        Optional<ReducedInspectionDecision> latest = reducedDecisions(switching.supplierId(), switching.modelId())
                .stream().findFirst();
        boolean approved = latest.map(ReducedInspectionDecision::approved).orElse(false);
        return new ReducedInspectionStatus(latest, SwitchingRules.reducedReadiness(switching.state(), approved));
    }

    /** Every decision on reduced inspection for a supplier and model, newest first. */
    @Transactional(readOnly = true)
    public List<ReducedInspectionDecision> reducedDecisions(long supplierId, long modelId) {
        return jdbc.query("select id, supplier_id, model_id, approved, reason, decided_by, decided_at"
                + " from reduced_inspection_decision where supplier_id = ? and model_id = ? order by id desc",
                (rs, n) -> new ReducedInspectionDecision(rs.getLong(1), rs.getLong(2), rs.getLong(3), rs.getBoolean(4),
                        rs.getString(5), rs.getString(6), CurrentActor.instant(rs.getObject(7))), supplierId, modelId);
    }

    private boolean reducedApproved(long supplierId, long modelId) {
        return reducedDecisions(supplierId, modelId).stream().findFirst()
                .map(ReducedInspectionDecision::approved).orElse(false);
    }

    /**
     * A SUPERVISOR, as the responsible authority, approves reduced inspection for the switching state's
     * supplier and model (ISO 2859-1:1999 clause 9.3.3 c) and confirms that production is at a steady
     * rate (9.3.3 b). The approval stays in force until withdrawn. When the switching score has already
     * reached 30 on normal inspection, reduced inspection applies from the next lot
     * ({@link SwitchingRules#approvalGiven}); otherwise the lots to come reach it. Audited as
     * APPROVE_REDUCED with the reason; a stale version throws {@link ObjectOptimisticLockingFailureException}.
     *
     * @throws ReceivingException naming the field when the reason is blank, steady production is not
     *     confirmed, the state is unknown or an approval is already in force
     * @throws AccessDeniedException when the signed-in person is not a SUPERVISOR
     */
    @Transactional
    public SwitchingView approveReducedInspection(long switchingId, String reason, boolean productionSteady,
                                                  long expectedVersion) {
        SwitchingView current = requireDecisionInput(switchingId, reason, expectedVersion);
        if (!productionSteady) {
            throw new ReceivingException("productionSteady", "Reduced inspection also needs production at a steady rate"
                    + " (ISO 2859-1:1999 clause 9.3.3 b): confirm it, or do not approve yet.");
        }
        if (reducedApproved(current.supplierId(), current.modelId())) {
            throw new ReceivingException(null, "Reduced inspection is already approved for " + current.partNumber()
                    + " from " + current.supplierCode() + ".");
        }
        SwitchingDecision decision = SwitchingRules.approvalGiven(current.state(), true);
        return recordReducedDecision(current, true, reason.trim(), decision, expectedVersion);
    }

    /**
     * A SUPERVISOR withdraws the approval of reduced inspection, with the reason. On reduced inspection,
     * normal inspection is reinstated from the next lot because other conditions warrant it (ISO
     * 2859-1:1999 clause 9.3.4 b or c: irregular production or the authority's own judgement); on other
     * severities the state is unchanged and normal inspection no longer switches to reduced. Audited as
     * WITHDRAW_REDUCED with the reason.
     *
     * @throws ReceivingException naming the field when the reason is blank, the state is unknown or no
     *     approval is in force
     * @throws AccessDeniedException when the signed-in person is not a SUPERVISOR
     */
    @Transactional
    public SwitchingView withdrawReducedInspection(long switchingId, String reason, long expectedVersion) {
        SwitchingView current = requireDecisionInput(switchingId, reason, expectedVersion);
        if (!reducedApproved(current.supplierId(), current.modelId())) {
            throw new ReceivingException(null, "Reduced inspection is not approved for " + current.partNumber()
                    + " from " + current.supplierCode() + "; there is nothing to withdraw.");
        }
        SwitchingState state = current.state();
        SwitchingDecision decision = !state.discontinued() && state.severity() == Severity.REDUCED
                ? SwitchingRules.reinstateNormal(state, "approval of reduced inspection withdrawn: " + reason.trim())
                : new SwitchingDecision(state, state, "Approval of reduced inspection withdrawn; "
                        + current.label().toLowerCase() + " inspection continues and normal inspection will not switch"
                        + " to reduced (ISO 2859-1:1999 clause 9.3.3 c).");
        return recordReducedDecision(current, false, reason.trim(), decision, expectedVersion);
    }

    private SwitchingView requireDecisionInput(long switchingId, String reason, long expectedVersion) {
        // Checked here too, not only by the URL rule: the decision is the responsible authority's (9.3.3 c).
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        if (auth == null || auth.getAuthorities().stream().noneMatch(a -> Role.SUPERVISOR.authority().equals(a.getAuthority()))) {
            throw new AccessDeniedException("Only a SUPERVISOR, as the responsible authority, decides on reduced"
                    + " inspection.");
        }
        SwitchingView current = switchingById(switchingId)
                .orElseThrow(() -> new ReceivingException(null, "There is no switching state " + switchingId + "."));
        if (reason == null || reason.isBlank()) {
            throw new ReceivingException("reason", "Give the reason for the decision on reduced inspection.");
        }
        if (reason.trim().length() > 2000) {
            throw new ReceivingException("reason", "The reason is longer than 2000 characters.");
        }
        if (current.version() != expectedVersion) {
            throw new ObjectOptimisticLockingFailureException("Switching state", switchingId);
        }
        return current;
    }

    private SwitchingView recordReducedDecision(SwitchingView current, boolean approved, String reason,
                                                SwitchingDecision decision, long expectedVersion) {
        var now = OffsetDateTime.now(clock).withOffsetSameInstant(ZoneOffset.UTC);
        SwitchingState after = decision.state();
        int updated = jdbc.update("update switching_state set scheme = ?, severity = ?, discontinued = ?, recent_normal = ?,"
                + " switching_score = ?, consecutive_accepted_normal = ?, consecutive_accepted_tightened = ?,"
                + " not_accepted_tightened = ?, last_explanation = ?, version = version + 1, updated_at = ?"
                + " where id = ? and version = ?", after.scheme().name(), after.severity().name(), after.discontinued(),
                window(after.recentNormalLotsAccepted()), after.switchingScore(), after.consecutiveAcceptedOnNormal(),
                after.consecutiveAcceptedOnTightened(), after.notAcceptedOnTightened(), decision.explanation(), now,
                current.id(), expectedVersion);
        if (updated == 0) {
            throw new ObjectOptimisticLockingFailureException("Switching state", current.id());
        }
        jdbc.update("insert into reduced_inspection_decision (supplier_id, model_id, approved, reason, decided_by,"
                + " decided_at) values (?, ?, ?, ?, ?, ?)", current.supplierId(), current.modelId(), approved, reason,
                CurrentActor.username(), now);
        List<FieldChange> changes = new ArrayList<>();
        changes.add(FieldChange.of("reducedInspectionApproved", !approved, approved));
        if (decision.transition()) {
            changes.add(FieldChange.of("state", label(current.state()), label(after)));
        }
        events.publishEvent(AuditEvent.withReason("SWITCHING", current.id(), approved ? "APPROVE_REDUCED"
                : "WITHDRAW_REDUCED", (approved ? "Reduced inspection approved" : "Approval of reduced inspection"
                + " withdrawn") + " for " + current.partNumber() + " from " + current.supplierCode() + ": "
                + decision.explanation(), reason).withChanges(changes));
        return switchingById(current.id()).orElseThrow();
    }

    private SwitchingView ensureSwitching(long supplierId, long modelId) {
        Optional<SwitchingView> found = switching(supplierId, modelId);
        if (found.isPresent()) {
            return found.get();
        }
        SwitchingState start = SwitchingState.start();
        jdbc.update("insert into switching_state (supplier_id, model_id, scheme, severity, discontinued, recent_normal,"
                + " switching_score, consecutive_accepted_normal, consecutive_accepted_tightened, not_accepted_tightened,"
                + " last_explanation, version, updated_at) values (?, ?, ?, ?, false, '', 0, 0, 0, 0, ?, 0, ?)",
                supplierId, modelId, start.scheme().name(), start.severity().name(),
                "Normal inspection at the start (ISO 2859-1:1999 clause 9.2).",
                OffsetDateTime.now(clock).withOffsetSameInstant(ZoneOffset.UTC));
        return switching(supplierId, modelId).orElseThrow();
    }

    // ---- mapping

    /** Supplier codes and part numbers looked up once per call. */
    private final class Names {
        private final Map<Long, String> suppliers = new HashMap<>();
        private final Map<Long, String> models = new HashMap<>();

        String supplier(long id) {
            return suppliers.computeIfAbsent(id, k -> catalogue.supplier(k).map(SupplierView::code).orElse("#" + k));
        }

        String model(long id) {
            return models.computeIfAbsent(id, k -> catalogue.model(k).map(SensorModelView::partNumber).orElse("#" + k));
        }
    }

    private static LotView lot(ResultSet rs, Names names) throws SQLException {
        PlanView plan = new PlanView(CodeLetter.valueOf(rs.getString("code_letter")),
                CodeLetter.valueOf(rs.getString("plan_code_letter")), rs.getInt("sample_size"), rs.getInt("accept_number"),
                rs.getInt("reject_number"), Severity.valueOf(rs.getString("severity")), rs.getBoolean("full_inspection"),
                Aql.valueOf(rs.getString("aql")), InspectionLevel.valueOf(rs.getString("inspection_level")),
                Scheme.valueOf(rs.getString("scheme")));
        Integer nonconforming = rs.getObject("nonconforming") == null ? null : rs.getInt("nonconforming");
        return new LotView(rs.getLong("id"), rs.getLong("receipt_id"), rs.getLong("supplier_id"),
                names.supplier(rs.getLong("supplier_id")), rs.getLong("model_id"), names.model(rs.getLong("model_id")),
                rs.getInt("quantity"), lines(rs.getString("serials")), lines(rs.getString("sampled_serials")),
                rs.getLong("sample_seed"), plan, rs.getLong("procedure_revision_id"), rs.getString("procedure_label"),
                rs.getLong("specification_revision_id"), LotState.valueOf(rs.getString("state")), nonconforming,
                rs.getString("disposition"), rs.getObject("created_at", OffsetDateTime.class).toInstant(),
                rs.getLong("version"));
    }

    private static SwitchingView switching(ResultSet rs, Names names) throws SQLException {
        List<Boolean> window = new ArrayList<>();
        for (char c : rs.getString("recent_normal").toCharArray()) {
            window.add(c == 'A');
        }
        SwitchingState state = new SwitchingState(Scheme.valueOf(rs.getString("scheme")),
                Severity.valueOf(rs.getString("severity")), rs.getBoolean("discontinued"), window,
                rs.getInt("switching_score"), rs.getInt("consecutive_accepted_normal"),
                rs.getInt("consecutive_accepted_tightened"), rs.getInt("not_accepted_tightened"));
        return new SwitchingView(rs.getLong("id"), rs.getLong("supplier_id"), names.supplier(rs.getLong("supplier_id")),
                rs.getLong("model_id"), names.model(rs.getLong("model_id")), state, rs.getString("last_explanation"),
                rs.getObject("updated_at", OffsetDateTime.class).toInstant(), rs.getLong("version"));
    }

    /** The normal-inspection window as text: A accepted, R not accepted, oldest first. */
    private static String window(List<Boolean> accepted) {
        StringBuilder s = new StringBuilder();
        accepted.forEach(a -> s.append(a ? 'A' : 'R'));
        return s.toString();
    }

    private static String label(SwitchingState state) {
        return state.discontinued() ? "DISCONTINUED" : state.severity().name();
    }

    private static List<String> lines(String text) {
        return text == null || text.isEmpty() ? List.of() : Arrays.asList(text.split("\n"));
    }

    static String planText(SamplingPlan plan) {
        return plan.severity().name().toLowerCase() + " inspection, code letter " + plan.planCodeLetter() + ", AQL "
                + plan.aql().label() + ", n " + plan.sampleSize() + ", Ac " + plan.acceptNumber() + ", Re "
                + plan.rejectNumber() + (plan.fullInspection() ? " (100 % inspection)" : "");
    }

    private long insert(String sql, Object... args) {
        GeneratedKeyHolder keys = new GeneratedKeyHolder();
        jdbc.update(connection -> {
            PreparedStatement statement = connection.prepareStatement(sql, new String[] {"id"});
            for (int i = 0; i < args.length; i++) {
                statement.setObject(i + 1, args[i]);
            }
            return statement;
        }, keys);
        return keys.getKey().longValue();
    }

    private static String text(String value, String field, String what) {
        if (value == null || value.isBlank()) {
            throw new ReceivingException(field, "Enter " + what + ".");
        }
        if (value.trim().length() > 64) {
            throw new ReceivingException(field, "The " + what.replace("the ", "") + " is longer than 64 characters.");
        }
        return value.trim();
    }

    private static String join(List<Integer> numbers) {
        return String.join(", ", numbers.stream().map(String::valueOf).toList());
    }


}
