package org.dockgate.evaluation;

import org.dockgate.platform.CurrentActor;

import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.dockgate.audit.AuditEvent;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.Reading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.decision.Verdict;
import org.dockgate.core.evaluation.ConditionalCounting;
import org.dockgate.core.evaluation.Environment;
import org.dockgate.core.evaluation.LotTally;
import org.dockgate.core.evaluation.MeasurementContext;
import org.dockgate.core.evaluation.MetricResult;
import org.dockgate.core.evaluation.ReferenceUncertainty;
import org.dockgate.core.evaluation.UnitEvaluation;
import org.dockgate.core.evaluation.UnitMeasurements;
import org.dockgate.core.evaluation.UnitResult;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.sampling.SingleSamplingPlans;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.instruments.InstrumentView;
import org.dockgate.procedures.ApprovedProcedure;
import org.dockgate.procedures.ProcedureService;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.ReceivingService;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.databind.json.JsonMapper;

/**
 * The evaluation module's face: each sampled unit's metrics, budgets and verdicts computed by the core
 * from the stored readings as they arrive, the lot's count of nonconforming units, and the lot
 * disposition — lot state, switching state, nonconformance report and the frozen unit results in one
 * transaction.
 */
@Service
public class EvaluationService {

    /** The lab's reference temperature for the environment's contribution (common practice: 23 °C). */
    static final double REFERENCE_TEMPERATURE_C = 23.0;

    private final ReceivingService receiving;
    private final BenchService bench;
    private final ProcedureService procedures;
    private final CatalogueService catalogue;
    private final InstrumentService instruments;
    private final JdbcTemplate jdbc;
    private final ApplicationEventPublisher events;
    private final Clock clock;
    private final JsonMapper json;
    private final org.dockgate.accounts.AccountService accounts;
    private final tools.jackson.databind.ObjectReader unitReader;
    private final tools.jackson.databind.ObjectReader resultReader;

    EvaluationService(ReceivingService receiving, BenchService bench, ProcedureService procedures,
                      CatalogueService catalogue, InstrumentService instruments, JdbcTemplate jdbc,
                      ApplicationEventPublisher events, Clock clock, JsonMapper json,
                      org.dockgate.accounts.AccountService accounts) {
        this.accounts = accounts;
        this.receiving = receiving;
        this.bench = bench;
        this.procedures = procedures;
        this.catalogue = catalogue;
        this.instruments = instruments;
        this.jdbc = jdbc;
        this.events = events;
        this.clock = clock;
        this.json = json;
        // Readers built once: frozen records are read back on every look at a dispositioned lot.
        this.unitReader = org.dockgate.platform.StoredJson.reader(json, UnitEvaluationView.class);
        this.resultReader = org.dockgate.platform.StoredJson.reader(json, UnitResult.class);
    }

    /** Evaluates one unit from its current readings (superseded readings are left out). */
    @Transactional(readOnly = true)
    public UnitEvaluationView unit(long lotId, String serial) {
        LotView lot = lot(lotId);
        if (!lot.sampled(serial)) {
            throw new IllegalArgumentException("The unit " + serial + " is not in the sample of lot " + lotId + ".");
        }
        Optional<UnitEvaluationView> frozen = frozen(lotId, serial);
        if (frozen.isPresent()) {
            return frozen.get();
        }
        ApprovedProcedure procedure = procedures.revision(lot.procedureRevisionId()).orElseThrow();
        return evaluate(lot, procedure, spec(procedure), serial, bench.currentReadings(lotId, serial), register());
    }

    /**
     * The lot's evaluation. Once the lot is dispositioned it is the record frozen then (every unit's values,
     * U, k, ν_eff, limits, p_c, verdicts and calibration records), never a recomputation: a later
     * calibration, correction or change in the database does not alter it. Before, each unit is computed
     * from its current readings with the calibrations in force when they were taken.
     */
    @Transactional(readOnly = true)
    public LotEvaluationView lotEvaluation(long lotId) {
        LotView lot = lot(lotId);
        ApprovedProcedure procedure = procedures.revision(lot.procedureRevisionId()).orElseThrow();
        Map<String, UnitEvaluationView> frozen = frozenUnits(lotId);
        List<UnitEvaluationView> units = frozen.isEmpty() ? recompute(lot, procedure) : new ArrayList<>(frozen.values());
        return lotView(lot, procedure, units);
    }

    /**
     * Recomputes a dispositioned lot's unit results from the stored readings (and the calibration records in
     * force when they were taken) and compares them, figure by figure, with the results frozen at disposition.
     * Anyone who may read the lot may run it; it changes nothing.
     *
     * @throws IllegalArgumentException for an unknown lot
     * @throws IllegalStateException    for a lot not yet dispositioned (nothing frozen to compare)
     */
    @Transactional(readOnly = true)
    public Recheck recheck(long lotId) {
        LotView lot = lot(lotId);
        Map<String, UnitEvaluationView> frozen = frozenUnits(lotId);
        if (frozen.isEmpty()) {
            throw new IllegalStateException("Lot " + lotId + " is not dispositioned yet: there are no frozen results to"
                    + " compare with.");
        }
        ApprovedProcedure procedure = procedures.revision(lot.procedureRevisionId()).orElseThrow();
        Map<String, UnitEvaluationView> now = new java.util.LinkedHashMap<>();
        recompute(lot, procedure).forEach(u -> now.put(u.serial(), u));
        List<Recheck.Difference> differences = new ArrayList<>();
        Set<String> serials = new java.util.TreeSet<>(frozen.keySet());
        serials.addAll(now.keySet());
        for (String serial : serials) {
            differences.addAll(Rechecks.compare(serial, frozen.get(serial), now.get(serial), this::canonicalJson));
        }
        return new Recheck(lotId, differences.isEmpty(), differences);
    }

    /**
     * Every sampled unit computed from its readings: the lot's current readings in one query, each instrument's
     * register entry once for the whole lot.
     */
    private List<UnitEvaluationView> recompute(LotView lot, ApprovedProcedure procedure) {
        SensorSpecification spec = spec(procedure);
        Function<String, Optional<InstrumentView>> register = register();
        Map<String, List<Reading>> readings = bench.currentReadingsByUnit(lot.id());
        List<UnitEvaluationView> units = new ArrayList<>();
        for (String serial : lot.sampledSerials()) {
            units.add(evaluate(lot, procedure, spec, serial, readings.getOrDefault(serial, List.of()), register));
        }
        return units;
    }

    private LotEvaluationView lotView(LotView lot, ApprovedProcedure procedure, List<UnitEvaluationView> units) {
        long lotId = lot.id();
        boolean complete = units.stream().allMatch(UnitEvaluationView::complete);
        // The procedure revision's own counting of conditional verdicts (a setting since V10_9; DEFAULT before).
        ConditionalCounting counting = procedure.settings().conditionalCounting();
        int nonconforming = LotTally.count(units.stream().map(u -> u.result().unitVerdict().orElse(Verdict.PASS)).toList(),
                counting);
        Optional<Boolean> wouldAccept = complete
                ? Optional.of(SingleSamplingPlans.disposition(lot.plan().plan(), nonconforming).accepted())
                : Optional.empty();
        return new LotEvaluationView(lot, procedure, units, complete, nonconforming, wouldAccept, nonconformance(lotId));
    }

    /**
     * Dispositions a lot whose sample is complete, in one transaction: the lot's result from Ac/Re and the
     * switching state (receiving), each unit's result frozen, and for a rejected lot a nonconformance
     * report with its action. A concession (use as is) waits for a SUPERVISOR's approval. The person must
     * not be the only one who recorded the readings (separation of duties), unless nobody else can.
     */
    @Transactional
    public LotEvaluationView disposition(long lotId, DispositionAction actionIfRejected, String notes,
                                         boolean correctiveActionRequested, LocalDate correctiveActionDue,
                                         long expectedLotVersion) {
        LotView current = lot(lotId);
        LotEvaluationView evaluation = lotView(current, procedures.revision(current.procedureRevisionId()).orElseThrow(),
                recompute(current, procedures.revision(current.procedureRevisionId()).orElseThrow()));
        LotView lot = evaluation.lot();
        if (lot.version() != expectedLotVersion) {
            throw new org.springframework.orm.ObjectOptimisticLockingFailureException("Lot", lotId);
        }
        if (lot.state() != LotState.AWAITING_MEASUREMENT) {
            throw new IllegalStateException("Lot " + lotId + " is already dispositioned.");
        }
        if (!evaluation.complete()) {
            throw new IllegalStateException("The sample of lot " + lotId + " is not complete: "
                    + evaluation.units().stream().filter(u -> !u.complete()).map(UnitEvaluationView::serial)
                    .collect(Collectors.joining(", ")) + " still need readings.");
        }
        // Conditions are part of the record (ISO/IEC 17025:2017 7.5.1, from memory, asks for the records to allow repeating
        // the measurement under conditions as close as possible to the original).
        List<String> withoutConditions = bench.unitsWithoutConditions(lotId, lot.sampledSerials());
        if (!withoutConditions.isEmpty()) {
            throw new IllegalStateException("Lot " + lotId + " cannot be dispositioned: no environmental conditions are"
                    + " recorded for " + String.join(", ", withoutConditions) + ". Record them at the bench first.");
        }
        boolean accepted = evaluation.wouldAccept().orElseThrow();
        if (!accepted && actionIfRejected == null) {
            throw new IllegalArgumentException("The lot is rejected: choose what happens to it (return, screening,"
                    + " concession or scrap).");
        }
        if (!accepted && correctiveActionRequested && correctiveActionDue == null) {
            throw new IllegalArgumentException("Give the due date of the corrective-action request.");
        }
        // The lot's version was checked above; receiving checks it again, with the switching state's, in this transaction.
        var result = receiving.recordLotResult(lotId, evaluation.nonconforming());
        OffsetDateTime now = clock.instant().atOffset(ZoneOffset.UTC);
        for (UnitEvaluationView u : evaluation.units()) {
            jdbc.update("insert into unit_evaluation_snapshot (lot_id, serial, unit_verdict, result_json, operators,"
                            + " instruments, evaluated_at, unit_json) values (?, ?, ?, ?, ?, ?, ?, ?)", lotId, u.serial(),
                    u.result().unitVerdict().orElseThrow().name(), json.writeValueAsString(u.result()),
                    String.join(",", u.operators()), String.join(",", u.instruments()), now,
                    json.writeValueAsString(u));
        }
        if (!result.disposition().accepted()) {
            String failing = evaluation.units().stream()
                    .filter(u -> !u.result().unitVerdict().orElseThrow().isConforming()
                            || u.result().unitVerdict().orElseThrow() == Verdict.CONDITIONAL_FAIL)
                    .map(u -> u.serial() + ": " + u.result().metrics().stream()
                            .filter(m -> m.verdict() != Verdict.PASS)
                            .map(m -> m.metric().name() + " " + m.verdict()).collect(Collectors.joining(", ")))
                    .collect(Collectors.joining("; "));
            String number = nextReportNumber();
            jdbc.update("insert into nonconformance_report (report_number, lot_id, action, failing, notes, corrective_action,"
                            + " corrective_action_due, created_by, created_at) values (?, ?, ?, ?, ?, ?, ?, ?, ?)", number,
                    lotId, actionIfRejected.name(), failing, notes == null ? "" : notes.trim(), correctiveActionRequested,
                    correctiveActionRequested ? correctiveActionDue : null, CurrentActor.username(), now);
            events.publishEvent(AuditEvent.of("NONCONFORMANCE", number, "OPEN", "Nonconformance report " + number
                            + " for lot " + lotId + ": " + actionIfRejected)
                    .withChanges(List.of(FieldChange.of("failing", null, failing),
                            FieldChange.of("action", null, actionIfRejected),
                            FieldChange.of("correctiveActionRequested", null, correctiveActionRequested))));
        }
        return lotEvaluation(lotId);
    }

    /** A SUPERVISOR approves a use-as-is concession, with the reason. */
    @Transactional
    public NonconformanceReport approveConcession(long lotId, String reason) {
        NonconformanceReport report = nonconformance(lotId)
                .orElseThrow(() -> new IllegalArgumentException("Lot " + lotId + " has no nonconformance report."));
        if (report.action() != DispositionAction.USE_AS_IS_CONCESSION) {
            throw new IllegalStateException("Report " + report.number() + " does not ask for a concession.");
        }
        if (report.concessionApprovedBy().isPresent()) {
            throw new IllegalStateException("The concession of " + report.number() + " is already approved.");
        }
        if (reason == null || reason.isBlank()) {
            throw new IllegalArgumentException("Give the reason for the concession.");
        }
        boolean supervisor = accounts.byUsername(CurrentActor.username()).map(p -> p.has(org.dockgate.platform.Role.SUPERVISOR))
                .orElse(false);
        if (!supervisor) {
            throw new IllegalStateException("A concession needs a SUPERVISOR's approval.");
        }
        jdbc.update("insert into concession_approval (report_id, approved_by, reason, approved_at) values (?, ?, ?, ?)",
                report.id(), CurrentActor.username(), reason.trim(), clock.instant().atOffset(ZoneOffset.UTC));
        events.publishEvent(AuditEvent.withReason("NONCONFORMANCE", report.number(), "CONCESSION",
                "Concession approved for lot " + lotId + " (" + report.number() + ")", reason.trim()));
        return nonconformance(lotId).orElseThrow();
    }

    @Transactional(readOnly = true)
    public Optional<NonconformanceReport> nonconformance(long lotId) {
        var rows = jdbc.queryForList("select r.*, c.approved_by, c.reason as concession_reason, c.approved_at"
                + " from nonconformance_report r left join concession_approval c on c.report_id = r.id where r.lot_id = ?", lotId);
        if (rows.isEmpty()) {
            return Optional.empty();
        }
        Map<String, Object> r = rows.get(0);
        Object due = r.get("corrective_action_due");
        return Optional.of(new NonconformanceReport(((Number) r.get("id")).longValue(), (String) r.get("report_number"),
                lotId, DispositionAction.valueOf((String) r.get("action")), (String) r.get("failing"), (String) r.get("notes"),
                (Boolean) r.get("corrective_action"),
                Optional.ofNullable(due == null ? null : due instanceof java.sql.Date d ? d.toLocalDate() : (LocalDate) due),
                (String) r.get("created_by"), CurrentActor.instant(r.get("created_at")), Optional.ofNullable((String) r.get("approved_by")),
                Optional.ofNullable((String) r.get("concession_reason")),
                Optional.ofNullable(r.get("approved_at")).map(CurrentActor::instant)));
    }

    /** The unit results frozen at disposition, as JSON, keyed by serial (for certificates and recomputation checks). */
    @Transactional(readOnly = true)
    public Map<String, String> snapshots(long lotId) {
        Map<String, String> out = new java.util.LinkedHashMap<>();
        jdbc.query("select serial, result_json from unit_evaluation_snapshot where lot_id = ? order by serial",
                rs -> {
                    out.put(rs.getString(1), rs.getString(2));
                }, lotId);
        return out;
    }

    /** Serialises a unit result the way snapshots store it, to compare a recomputation with the frozen record. */
    public String canonical(UnitResult result) {
        return json.writeValueAsString(result);
    }

    private String canonicalJson(Object value) {
        return json.writeValueAsString(value);
    }

    /** The frozen record of one unit, if the lot is dispositioned (only its own row is read). */
    private Optional<UnitEvaluationView> frozen(long lotId, String serial) {
        return Optional.ofNullable(frozenUnits(lotId, serial).get(serial));
    }

    /**
     * The unit results frozen at disposition, in the order of the sample, read back from the snapshot rows.
     * Rows frozen before the whole unit was kept ({@code unit_json} null) give their stored result with the
     * operators and instruments of the row; their chart points and calibration records were not frozen.
     */
    private Map<String, UnitEvaluationView> frozenUnits(long lotId) {
        return frozenUnits(lotId, null);
    }

    /** As {@link #frozenUnits(long)}, only the row of {@code serial} when it is given. */
    private Map<String, UnitEvaluationView> frozenUnits(long lotId, String serial) {
        Map<String, UnitEvaluationView> out = new java.util.LinkedHashMap<>();
        String sql = "select serial, result_json, unit_json, operators, instruments from unit_evaluation_snapshot"
                + " where lot_id = ?" + (serial == null ? "" : " and serial = ?") + " order by id";
        Object[] args = serial == null ? new Object[] {lotId} : new Object[] {lotId, serial};
        jdbc.query(sql, rs -> {
                    String unitJson = rs.getString(3);
                    UnitEvaluationView view;
                    if (unitJson != null) {
                        view = unitReader.readValue(unitJson);
                    } else {
                        UnitResult result = resultReader.readValue(rs.getString(2));
                        view = new UnitEvaluationView(rs.getString(1), result, 0, split(rs.getString(4)),
                                split(rs.getString(5)), Optional.empty(), Optional.empty(), List.of(), List.of(), List.of(), true,
                                Optional.empty());
                    }
                    out.put(rs.getString(1), view.asFrozen());
                }, args);
        return out;
    }

    private static Set<String> split(String joined) {
        return joined == null || joined.isBlank() ? Set.of()
                : java.util.Arrays.stream(joined.split(",")).collect(Collectors.toCollection(LinkedHashSet::new));
    }

    /** One look-up of each instrument's register entry (with all its calibration records) per evaluation. */
    private Function<String, Optional<InstrumentView>> register() {
        Map<String, Optional<InstrumentView>> cache = new java.util.HashMap<>();
        return id -> cache.computeIfAbsent(id, instruments::find);
    }

    private UnitEvaluationView evaluate(LotView lot, ApprovedProcedure procedure, SensorSpecification spec, String serial,
                                        List<Reading> readings, Function<String, Optional<InstrumentView>> register) {
        UnitMeasurements.Builder m = UnitMeasurements.builder();
        List<UnitEvaluationView.StaticPoint> statics = new ArrayList<>();
        List<UnitEvaluationView.SweepPoint> sweep = new ArrayList<>();
        List<Reading> staticReadings = new ArrayList<>();
        List<Reading> sweepReadings = new ArrayList<>();
        List<Reading> readoutReadings = new ArrayList<>();
        for (Reading r : readings) {
            switch (r.test()) {
                case STATIC -> {
                    var direction = r.direction().orElse(org.dockgate.core.series.Direction.UP);
                    int cycle = r.cycle().orElse(1);
                    // the applied value is the input; the set point groups the reading (issue 11)
                    m.staticReading(r.applied(), r.value(), direction, cycle, r.point());
                    statics.add(new UnitEvaluationView.StaticPoint(r.applied(), r.value(), direction.name(), cycle));
                    staticReadings.add(r);
                    readoutReadings.add(r);
                }
                case NOISE -> {
                    m.noiseSample(r.value());
                    readoutReadings.add(r);
                }
                case SWEEP -> {
                    m.sweepPoint(r.point(), r.value());
                    sweep.add(new UnitEvaluationView.SweepPoint(r.point(), r.value()));
                    sweepReadings.add(r);
                }
            }
        }
        List<String> problems = new ArrayList<>();
        Map<String, UnitEvaluationView.CalibrationUsed> used = new java.util.LinkedHashMap<>();
        // The sweep's reference applies its U at the sweep amplitude, not at the reading's frequency.
        Optional<ReferenceUncertainty> staticRef = ReferencesInForce.of(staticReadings, register, spec.inputUnit(), true,
                used, problems);
        Optional<ReferenceUncertainty> sweepRef = ReferencesInForce.of(sweepReadings, register, spec.inputUnit(), false,
                used, problems);
        var conditions = bench.conditions(lot.id(), serial);
        // The readout's resolution comes from the register (never from the decimals typed); readings that name
        // no readout are evaluated and say "readout not recorded".
        MeasurementContext context = ChainInForce.apply(new MeasurementContext(staticRef, sweepRef,
                OptionalDouble.empty(), conditions.map(c -> Environment.fromAmbient(c.ambientC(), REFERENCE_TEMPERATURE_C))),
                readoutReadings, register, spec, used, problems);
        UnitResult result = UnitEvaluation.evaluate(spec, procedure.content(), procedure.settings().policy(),
                m.context(context).build());
        if (!problems.isEmpty()) {
            List<String> missing = new ArrayList<>(result.missing());
            missing.addAll(problems);
            result = new UnitResult(result.metrics(), result.unitVerdict(), false, missing);
        }
        Set<String> instrumentsUsed = new LinkedHashSet<>();
        staticReadings.forEach(r -> instrumentsUsed.add(r.instrument()));
        sweepReadings.forEach(r -> instrumentsUsed.add(r.instrument()));
        readoutReadings.forEach(r -> {
            r.readout().ifPresent(instrumentsUsed::add);
            r.excitation().ifPresent(instrumentsUsed::add);
        });
        Set<String> operators = readings.stream().map(Reading::recordedBy).collect(Collectors.toCollection(LinkedHashSet::new));
        return new UnitEvaluationView(serial, result, readings.size(), operators, instrumentsUsed,
                conditions.map(c -> c.ambientC()), conditions.map(c -> c.relativeHumidityPercent()), statics, sweep,
                List.copyOf(used.values()), false, conditions.flatMap(c -> c.deviationText()));
    }

    private LotView lot(long lotId) {
        return receiving.lot(lotId).orElseThrow(() -> new IllegalArgumentException("There is no lot " + lotId + "."));
    }

    private SensorSpecification spec(ApprovedProcedure procedure) {
        return catalogue.revision(procedure.specificationRevisionId()).orElseThrow().specification();
    }

    private String nextReportNumber() {
        int year = clock.instant().atOffset(ZoneOffset.UTC).getYear();
        Integer count = jdbc.queryForObject("select count(*) from nonconformance_report where report_number like ?",
                Integer.class, "NCR-" + year + "-%");
        return String.format("NCR-%d-%04d", year, (count == null ? 0 : count) + 1);
    }



    /** For pages: the metrics of a unit that did not pass. */
    public static List<MetricResult> notPassing(UnitResult result) {
        return result.metrics().stream().filter(m -> m.verdict() != Verdict.PASS).toList();
    }
}
