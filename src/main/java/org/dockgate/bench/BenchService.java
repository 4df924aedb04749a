package org.dockgate.bench;

import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Types;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.ConcurrentHashMap;
import org.dockgate.audit.AuditEvent;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.acquisition.AmbientConditions;
import org.dockgate.core.acquisition.ConditionsCsv;
import org.dockgate.core.acquisition.RowError;
import org.dockgate.core.procedure.EnvironmentalLimits;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.quantity.Units;
import org.dockgate.core.series.Direction;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.instruments.InstrumentView;
import org.dockgate.procedures.ApprovedProcedure;
import org.dockgate.procedures.ProcedureService;
import org.springframework.beans.factory.ObjectProvider;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.dao.DuplicateKeyException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.core.RowMapper;
import org.springframework.jdbc.support.GeneratedKeyHolder;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The bench: readings recorded point by point or in batches, corrections, environmental conditions,
 * and what evaluation reads back. Readings are append-only (the database refuses changes too); a
 * correction is a new reading that supersedes an old one. Each change publishes an audit event in
 * its transaction.
 *
 * <p>Transactions are run here with a {@link TransactionTemplate} rather than annotations, because a
 * repeated submit is recognised after its transaction failed on the unique client token (PostgreSQL
 * cannot go on inside a failed transaction).
 */
@Service
public class BenchService {

    /** Audit entity types. */
    public static final String READING = "READING";
    public static final String LOT = "LOT";

    static final String COLUMNS = "id, lot_id, serial, test, point, direction, cycle_no, slot_no, revision_no,"
            + " reading_value, unit, entered_value, entered_unit, instrument, recorded_by, recorded_at, client_token,"
            + " supersedes_id, correction_reason, import_id, applied, readout, excitation,"
            + " (select s.id from bench_reading s where s.supersedes_id = r.id) as superseded_by";

    /** {@link #COLUMNS} for readings known to be current (none supersedes them): no per-row subquery. */
    static final String CURRENT_COLUMNS = COLUMNS.replace(
            "(select s.id from bench_reading s where s.supersedes_id = r.id) as superseded_by",
            "cast(null as bigint) as superseded_by");

    static final String INSERT = "insert into bench_reading (lot_id, serial, test, point, direction, cycle_no,"
            + " slot_no, revision_no, reading_value, unit, entered_value, entered_unit, instrument, recorded_by,"
            + " recorded_at, client_token, supersedes_id, correction_reason, import_id, applied, readout, excitation)"
            + " values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)";

    private static final int MAX_TOKEN = 80;

    private final JdbcTemplate jdbc;
    private final TransactionTemplate tx;
    private final ObjectProvider<LotSource> lots;
    private final ProcedureService procedures;
    private final CatalogueService catalogue;
    private final InstrumentService instruments;
    private final ApplicationEventPublisher events;
    private final Clock clock;
    private final Map<Long, BenchPlan> plans = new ConcurrentHashMap<>();
    private final TransactionTemplate ownRow;

    BenchService(JdbcTemplate jdbc, PlatformTransactionManager transactions, ObjectProvider<LotSource> lots,
                 ProcedureService procedures, CatalogueService catalogue, InstrumentService instruments,
                 ApplicationEventPublisher events, Clock clock) {
        this.jdbc = jdbc;
        this.tx = new TransactionTemplate(transactions);
        this.ownRow = new TransactionTemplate(transactions);
        this.ownRow.setPropagationBehavior(org.springframework.transaction.TransactionDefinition.PROPAGATION_REQUIRES_NEW);
        this.lots = lots;
        this.procedures = procedures;
        this.catalogue = catalogue;
        this.instruments = instruments;
        this.events = events;
        this.clock = clock;
    }

    // ---- lots and plans

    /** @return the lot as the bench sees it, if there is one */
    public Optional<BenchLot> lot(long lotId) {
        LotSource source = lots.getIfAvailable();
        return source == null ? Optional.empty() : source.lot(lotId);
    }

    /** @return the lots waiting for measurement */
    public List<BenchLot> lotsAwaitingMeasurement() {
        LotSource source = lots.getIfAvailable();
        return source == null ? List.of() : source.awaitingMeasurement();
    }

    /**
     * What the lot's procedure revision expects from each unit, in order. Procedure revisions never
     * change, so plans are kept once built.
     *
     * @param procedureRevisionId the approved revision
     * @return the plan
     * @throws IllegalArgumentException when there is no such revision
     */
    public BenchPlan plan(long procedureRevisionId) {
        return plans.computeIfAbsent(procedureRevisionId, id -> {
            ApprovedProcedure p = procedures.revision(id).orElseThrow(
                    () -> new IllegalArgumentException("There is no approved procedure revision " + id + "."));
            SensorSpecification spec = catalogue.revision(p.specificationRevisionId()).orElseThrow(
                    () -> new IllegalArgumentException("Procedure " + p.label() + " names specification revision "
                            + p.specificationRevisionId() + ", which does not exist.")).specification();
            double window = p.content().staticCalibration() == null ? Double.POSITIVE_INFINITY
                    : p.content().staticCalibration().appliedWindowFor(spec);
            return BenchPlan.of(id, p.label(), p.content(), spec.outputUnit(), spec.kind().inputDimension(), window);
        });
    }

    /** The lot's plan. */
    public BenchPlan planFor(BenchLot lot) {
        return plan(lot.procedureRevisionId());
    }

    /**
     * The instruments a technician may choose for the lot today: of the procedure's input quantity, in
     * calibration, covering the static points.
     */
    public List<InstrumentView> selectableInstruments(BenchPlan plan) {
        if (plan.quantity() == null) {
            return instruments.all().stream().filter(InstrumentView::selectable).toList();
        }
        return instruments.qualifying(plan.quantity(), plan.rangeMin(), plan.rangeMax(), plan.inputUnit());
    }

    /** The instruments in calibration today that may serve as readout or excitation supply. */
    public List<InstrumentView> chainInstruments() {
        return instruments.all().stream().filter(InstrumentView::selectable).toList();
    }

    // ---- recording

    /**
     * Records one reading. A reading whose client token was already used is not stored again: the
     * saved one is returned.
     *
     * @param lotId the lot
     * @param input the reading
     * @return the saved reading
     * @throws IllegalArgumentException when the lot, the unit, the point, the value, the unit or the
     *                                  instrument is not right (the message names which)
     * @throws IllegalStateException    when the lot is closed, the instrument is out of calibration today
     *                                  ({@code InstrumentNotSelectableException}), or the point already has
     *                                  a reading (someone recorded it meanwhile: correct it instead)
     */
    public Reading record(long lotId, NewReading input) {
        return recordMany(lotId, List.of(input)).get(0);
    }

    /**
     * Records several readings in one transaction: all are saved or none. Readings whose client token
     * was already used are returned as saved.
     *
     * @param lotId  the lot
     * @param inputs the readings
     * @return the saved readings, in the order given
     * @throws IllegalArgumentException as {@link #record}, prefixed with the reading's position when more than one
     * @throws IllegalStateException    as {@link #record}
     */
    public List<Reading> recordMany(long lotId, List<NewReading> inputs) {
        if (inputs == null || inputs.isEmpty()) {
            throw new IllegalArgumentException("Send at least one reading.");
        }
        try {
            return tx.execute(status -> recordInTransaction(lotId, inputs));
        } catch (DuplicateKeyException e) {
            // A concurrent submit of the same tokens won, or someone filled one of these points meanwhile.
            List<Reading> saved = new ArrayList<>();
            String who = currentUser();
            for (int i = 0; i < inputs.size(); i++) {
                NewReading in = inputs.get(i);
                String token = in == null ? null : token(in.clientToken());
                Optional<Reading> existing = byToken(token);
                if (existing.isEmpty()) {
                    throw new IllegalStateException("A reading for one of these points was recorded by someone else"
                            + " while you were entering it. Reload the unit and correct it if needed; nothing of"
                            + " this submit was saved.");
                }
                requireSameReading(existing.get(), lotId, in, token, who, inputs.size() > 1 ? "Reading " + (i + 1) + ": " : "",
                        planOfLot(lotId));
                saved.add(existing.get());
            }
            return saved;
        }
    }

    private List<Reading> recordInTransaction(long lotId, List<NewReading> inputs) {
        BenchLot lot = openLot(lotId);
        BenchPlan plan = planFor(lot);
        String who = currentUser();
        Instant now = clock.instant();
        LocalDate today = LocalDate.ofInstant(now, ZoneOffset.UTC);
        Map<String, InstrumentView> checked = new java.util.HashMap<>();
        Map<String, Integer> newSlots = new java.util.TreeMap<>();
        List<Reading> saved = new ArrayList<>();
        for (int i = 0; i < inputs.size(); i++) {
            NewReading in = inputs.get(i);
            String where = inputs.size() > 1 ? "Reading " + (i + 1) + ": " : "";
            try {
                if (in == null) {
                    throw new IllegalArgumentException("the reading is empty.");
                }
                String token = token(in.clientToken());
                if (token != null) {
                    Optional<Reading> existing = byToken(token);
                    if (existing.isPresent()) {
                        requireSameReading(existing.get(), lotId, in, token, who, where, plan);
                        saved.add(existing.get());
                        continue;
                    }
                }
                String serial = requireSampled(lot, in.serial());
                if (in.point() == null) {
                    throw new IllegalArgumentException("'point' is missing.");
                }
                ExpectedReading slot = plan.slotOf(in.test(), in.point(), in.direction(), in.cycle());
                double entered = finite(in.value(), "value");
                String enteredUnit = in.unit() == null || in.unit().isBlank() ? plan.outputUnit() : in.unit().strip();
                double value = toOutputUnit(entered, enteredUnit, plan.outputUnit());
                String instrument = in.instrument() == null ? null : in.instrument().strip();
                if (instrument == null || instrument.isEmpty()) {
                    throw new IllegalArgumentException("'instrument' is missing: name the reference instrument used.");
                }
                InstrumentView iv = checked.get(instrument);
                if (iv == null) {
                    iv = instruments.requireSelectable(instrument, today);
                    requireFits(plan, iv);
                    checked.put(instrument, iv);
                }
                double applied = plan.appliedAt(slot, in.applied());
                String readout = chainInstrument(in.readout(), "readout", today, checked);
                String excitation = chainInstrument(in.excitation(), "excitation", today, checked);
                long id = insert(lotId, serial, slot, 0, value, plan.outputUnit(), entered, enteredUnit, iv.identifier(),
                        who, now, token, null, null, applied, readout, excitation);
                newSlots.merge(serial, 1, Integer::sum);
                events.publishEvent(AuditEvent.of(READING, id, "RECORD", lot.label() + ", " + serial + ", "
                        + plan.describe(slot.slot()) + ": " + Plain.number(value) + " " + plan.outputUnit()
                        + (enteredUnit.equals(plan.outputUnit()) ? "" : " (entered " + Plain.number(entered) + " "
                        + enteredUnit + ")") + (applied == slot.point() ? "" : ", applied " + Plain.number(applied)
                        + " " + plan.inputUnit()) + " with " + iv.identifier()
                        + (readout == null ? "" : ", readout " + readout)
                        + (excitation == null ? "" : ", excitation " + excitation)));
                saved.add(reading(id).orElseThrow());
            } catch (IllegalArgumentException e) {
                throw new IllegalArgumentException(where + e.getMessage(), e);
            }
        }
        newSlots.forEach((serial, n) -> addProgress(lotId, serial, n));
        return saved;
    }

    /**
     * A readout or excitation instrument named for a reading: it must be in the register and in calibration at
     * the reading's time (today), like the stimulus.
     *
     * @return its identifier, or null when none was named
     */
    String chainInstrument(String identifier, String role, LocalDate today, Map<String, InstrumentView> checked) {
        if (identifier == null || identifier.isBlank()) {
            return null;
        }
        String id = identifier.strip();
        InstrumentView iv = checked.get(id);
        if (iv == null) {
            try {
                iv = instruments.requireSelectable(id, today);
            } catch (IllegalStateException | IllegalArgumentException e) {
                throw withRole(e, "The " + role + " instrument " + id + ": ");
            }
            checked.put(id, iv);
        }
        return iv.identifier();
    }

    private static RuntimeException withRole(RuntimeException e, String prefix) {
        String message = prefix + e.getMessage();
        if (e instanceof org.dockgate.instruments.InstrumentNotSelectableException n) {
            return new org.dockgate.instruments.InstrumentNotSelectableException(n.identifier(), n.day(), message);
        }
        return e instanceof IllegalArgumentException ? new IllegalArgumentException(message, e)
                : new IllegalStateException(message, e);
    }

    /**
     * A repeated client token is a repeated submit only when it carries what was saved under it: the same
     * user, lot, unit, test point and value as entered. Anything else would silently drop the new data, so
     * it is refused as a conflict (409) naming the token.
     */
    private void requireSameReading(Reading saved, long lotId, NewReading in, String token, String who, String where,
                                    BenchPlan plan) {
        boolean same = saved.recordedBy().equals(who)
                && saved.lotId() == lotId
                && in.serial() != null && saved.serial().equals(in.serial().strip())
                && in.point() != null && sameSlot(plan, in, saved.slot())
                && in.value() != null && Double.compare(saved.enteredValue(), in.value()) == 0
                && (in.unit() == null || in.unit().isBlank() ? saved.enteredUnit().equals(plan.outputUnit())
                    : saved.enteredUnit().equals(in.unit().strip()))
                && in.instrument() != null && saved.instrument().equals(in.instrument().strip())
                && (in.applied() == null ? saved.applied() == saved.point() : Double.compare(saved.applied(), in.applied()) == 0)
                && sameOptional(saved.readout(), in.readout()) && sameOptional(saved.excitation(), in.excitation());
        if (!same) {
            throw new IllegalStateException(where + "The client token '" + token + "' was already used for a different"
                    + " reading; nothing of this submit was saved. Send a new client token for a new reading.");
        }
    }

    private static boolean sameOptional(Optional<String> saved, String given) {
        String g = given == null || given.isBlank() ? null : given.strip();
        return saved.orElse(null) == null ? g == null : saved.get().equals(g);
    }

    private BenchPlan planOfLot(long lotId) {
        return planFor(lot(lotId).orElseThrow(() -> new IllegalArgumentException("There is no lot " + lotId + ".")));
    }

    private static boolean sameSlot(BenchPlan plan, NewReading in, int slot) {
        try {
            return plan.slotOf(in.test(), in.point(), in.direction(), in.cycle()).slot() == slot;
        } catch (IllegalArgumentException e) {
            return false;
        }
    }

    /**
     * Corrects a reading: saves a new reading at the same point that supersedes it, with the reason and
     * the signed-in user as author. The original stays, marked superseded.
     *
     * @param readingId the reading to correct (the current one at its point)
     * @param newValue  the right value
     * @param unit      its unit (null: the output unit)
     * @param reason    why, required
     * @return the correcting reading
     * @throws IllegalArgumentException when the reading does not exist, the value or unit is wrong, or the reason is missing
     * @throws ObjectOptimisticLockingFailureException when the reading was corrected meanwhile ("this changed while you were editing")
     * @throws IllegalStateException when the lot is no longer awaiting measurement
     */
    public Reading correct(long readingId, Double newValue, String unit, String reason) {
        try {
            return tx.execute(status -> {
                Reading old = reading(readingId).orElseThrow(
                        () -> new IllegalArgumentException("There is no reading " + readingId + "."));
                if (old.superseded()) {
                    throw new ObjectOptimisticLockingFailureException(Reading.class, readingId);
                }
                if (reason == null || reason.isBlank()) {
                    throw new IllegalArgumentException("A correction needs its reason.");
                }
                BenchLot lot = openLot(old.lotId());
                BenchPlan plan = planFor(lot);
                double entered = finite(newValue, "value");
                String enteredUnit = unit == null || unit.isBlank() ? plan.outputUnit() : unit.strip();
                double value = toOutputUnit(entered, enteredUnit, plan.outputUnit());
                int revision = jdbc.queryForObject("select max(revision_no) from bench_reading where lot_id = ?"
                        + " and serial = ? and slot_no = ?", Integer.class, old.lotId(), old.serial(), old.slot()) + 1;
                long id = insert(old.lotId(), old.serial(), plan.expected(old.slot()), revision, value, plan.outputUnit(),
                        entered, enteredUnit, old.instrument(), currentUser(), clock.instant(), null, old.id(),
                        reason.strip(), old.applied(), old.readout().orElse(null), old.excitation().orElse(null));
                events.publishEvent(AuditEvent.withReason(READING, id, "CORRECT", lot.label() + ", " + old.serial()
                                + ", " + plan.describe(old.slot()) + ": reading " + old.id() + " corrected by reading " + id,
                        reason.strip()).withChanges(List.of(FieldChange.of("value",
                        Plain.number(old.value()) + " " + old.unit(), Plain.number(value) + " " + plan.outputUnit()))));
                return reading(id).orElseThrow();
            });
        } catch (DuplicateKeyException e) {
            throw new ObjectOptimisticLockingFailureException(Reading.class, readingId);
        }
    }

    /** The longest deviation reason kept. */
    public static final int MAX_DEVIATION_REASON = 2000;

    /** Records conditions within the procedure's limits, without pressure; see {@link #recordConditions(long, String, NewConditions)}. */
    public Conditions recordConditions(long lotId, String serial, Double ambientC, Double rhPct) {
        return recordConditions(lotId, serial, new NewConditions(ambientC, rhPct, null, null));
    }

    /**
     * Records the environmental conditions of a unit's session (append-only; the latest applies). They are
     * checked against the limits of the lot's procedure revision ({@link EnvironmentalLimits}): outside them
     * the entry is refused, unless it comes with a deviation reason, which is kept beside the departure and
     * printed on the certificate. Physically impossible values (not finite, below absolute zero, humidity
     * outside 0 … 100 %, negative pressure) are always refused.
     *
     * @param lotId  the lot, awaiting measurement
     * @param serial a sampled unit
     * @param input  the conditions as entered
     * @return the saved conditions
     * @throws IllegalArgumentException when a value is missing or impossible, lies outside the limits without a
     *                                  deviation reason (the message names the value and the limit), a reason is
     *                                  given for conditions within the limits, or the unit is not sampled
     * @throws IllegalStateException    when the lot is closed
     */
    public Conditions recordConditions(long lotId, String serial, NewConditions input) {
        return tx.execute(status -> {
            BenchLot lot = openLot(lotId);
            CheckedConditions checked = checkConditions(lot, limitsOf(lot), serial, input);
            return insertConditions(lot, checked);
        });
    }

    /**
     * Imports a conditions file (the companion of a data-acquisition CSV, format in {@link ConditionsCsv}):
     * every row checked as {@link #recordConditions(long, String, NewConditions)} checks one, then all saved in
     * one transaction, or nothing when any row is wrong.
     *
     * @param lotId   the lot, awaiting measurement
     * @param file    the file's characters (UTF-8); the caller closes it
     * @param preview check only, save nothing
     * @return rows read, rows saved, every error by line (and column)
     * @throws IllegalStateException when the lot is closed
     */
    public ConditionsImport importConditions(long lotId, java.io.Reader file, boolean preview) {
        return tx.execute(status -> {
            BenchLot lot = openLot(lotId);
            EnvironmentalLimits limits = limitsOf(lot);
            ConditionsCsv.Report report = ConditionsCsv.parse(file);
            List<RowError> errors = new ArrayList<>(report.errors());
            List<CheckedConditions> checked = new ArrayList<>();
            for (ConditionsCsv.ConditionsRow row : report.rows()) {
                AmbientConditions c = row.conditions();
                try {
                    checked.add(checkConditions(lot, limits, row.serial(), new NewConditions(c.ambientC(),
                            c.relativeHumidityPercent(), c.pressureKPa().isPresent() ? c.pressureKPa().getAsDouble() : null,
                            row.deviationReason().orElse(null))));
                } catch (IllegalArgumentException e) {
                    errors.add(new RowError(row.line(), Optional.empty(), e.getMessage()));
                }
            }
            errors.sort(java.util.Comparator.comparingLong(RowError::line));
            int rows = (int) report.rowsRead();
            if (preview || !errors.isEmpty()) {
                return new ConditionsImport(preview, false, rows, checked.size(),
                        errors.stream().map(RowError::toString).toList());
            }
            checked.forEach(c -> insertConditions(lot, c));
            return new ConditionsImport(false, true, rows, checked.size(), List.of());
        });
    }

    /** Conditions checked against physics and the procedure's limits, ready to save. */
    private record CheckedConditions(String serial, AmbientConditions conditions, String departure, String reason) {
    }

    /** The environmental limits of the lot's procedure revision, as the bench checks them. */
    public EnvironmentalLimits limitsOf(BenchLot lot) {
        return procedures.revision(lot.procedureRevisionId()).orElseThrow(
                () -> new IllegalArgumentException("The lot's procedure revision does not exist."))
                .content().environmentalLimits();
    }

    private CheckedConditions checkConditions(BenchLot lot, EnvironmentalLimits limits, String serial,
                                              NewConditions input) {
        String unit = requireSampled(lot, serial);
        if (input == null) {
            throw new IllegalArgumentException("Send the conditions: 'ambientC' and 'relativeHumidityPercent'.");
        }
        if (input.ambientC() == null) {
            throw new IllegalArgumentException("'ambientC' is missing: the ambient temperature in °C.");
        }
        if (input.relativeHumidityPercent() == null) {
            throw new IllegalArgumentException("'relativeHumidityPercent' is missing: the relative humidity in %.");
        }
        AmbientConditions c = new AmbientConditions(input.ambientC(), input.relativeHumidityPercent(),
                input.pressureKPa() == null ? OptionalDouble.empty() : OptionalDouble.of(input.pressureKPa()));
        List<String> departures = limits.departures(c);
        String reason = input.deviationReason() == null || input.deviationReason().isBlank() ? null
                : input.deviationReason().strip();
        String departure = departures.isEmpty() ? null : String.join("; ", departures);
        if (departure != null && reason == null) {
            throw new IllegalArgumentException(unit + ": " + departure + ". Nothing was saved: bring the bench within"
                    + " the limits of " + lot.label() + ", or record these conditions as a deviation from the"
                    + " procedure with its reason ('deviationReason').");
        }
        if (departure == null && reason != null) {
            throw new IllegalArgumentException("'deviationReason': these conditions lie within the procedure's limits ("
                    + limits.ambientText() + ", " + limits.humidityText() + "), so there is no deviation to record;"
                    + " leave the reason empty.");
        }
        if (reason != null && reason.length() > MAX_DEVIATION_REASON) {
            throw new IllegalArgumentException("'deviationReason' is " + reason.length() + " characters long, at most "
                    + MAX_DEVIATION_REASON + " are kept.");
        }
        return new CheckedConditions(unit, c, departure, reason);
    }

    private Conditions insertConditions(BenchLot lot, CheckedConditions checked) {
        AmbientConditions c = checked.conditions();
        Instant now = clock.instant();
        jdbc.update(con -> {
            PreparedStatement ps = con.prepareStatement("insert into bench_conditions (lot_id, serial, ambient_c,"
                    + " relative_humidity_percent, pressure_kpa, departure, deviation_reason, recorded_by, recorded_at)"
                    + " values (?, ?, ?, ?, ?, ?, ?, ?, ?)");
            ps.setLong(1, lot.id());
            ps.setString(2, checked.serial());
            ps.setDouble(3, c.ambientC());
            ps.setDouble(4, c.relativeHumidityPercent());
            if (c.pressureKPa().isPresent()) {
                ps.setDouble(5, c.pressureKPa().getAsDouble());
            } else {
                ps.setNull(5, Types.DOUBLE);
            }
            ps.setString(6, checked.departure());
            ps.setString(7, checked.reason());
            ps.setString(8, currentUser());
            ps.setObject(9, OffsetDateTime.ofInstant(now, ZoneOffset.UTC));
            return ps;
        });
        String summary = lot.label() + ", " + checked.serial() + ": ambient " + Plain.number(c.ambientC()) + " °C, RH "
                + Plain.number(c.relativeHumidityPercent()) + " %"
                + (c.pressureKPa().isPresent() ? ", " + Plain.number(c.pressureKPa().getAsDouble()) + " kPa" : "");
        events.publishEvent(checked.reason() == null ? AuditEvent.of(LOT, lot.id(), "CONDITIONS", summary)
                : AuditEvent.withReason(LOT, lot.id(), "CONDITIONS_DEVIATION", summary + " (deviation from the procedure: "
                        + checked.departure() + ")", checked.reason()));
        return conditions(lot.id(), checked.serial()).orElseThrow();
    }

    /**
     * The sampled units of a lot that have no conditions recorded, in the sample's order (a unit cannot be
     * dispositioned without them).
     */
    public List<String> unitsWithoutConditions(long lotId, List<String> sampledSerials) {
        Set<String> recorded = new java.util.HashSet<>(jdbc.queryForList(
                "select distinct serial from bench_conditions where lot_id = ?", String.class, lotId));
        return sampledSerials.stream().filter(s -> !recorded.contains(s)).toList();
    }

    // ---- reading back (evaluation)

    /** The readings that count for a unit: superseded ones excluded, in the procedure's order. */
    public List<Reading> currentReadings(long lotId, String serial) {
        return jdbc.query("select " + COLUMNS + " from bench_reading r where lot_id = ? and serial = ?"
                + " and not exists (select 1 from bench_reading s where s.supersedes_id = r.id)"
                + " order by slot_no, revision_no", MAPPER, lotId, serial);
    }

    /** Every reading of a unit, corrections and the readings they superseded included, in the procedure's order. */
    public List<Reading> history(long lotId, String serial) {
        return jdbc.query("select " + COLUMNS + " from bench_reading r where lot_id = ? and serial = ?"
                + " order by slot_no, revision_no", MAPPER, lotId, serial);
    }

    /** The latest conditions recorded for a unit, if any. */
    public Optional<Conditions> conditions(long lotId, String serial) {
        return jdbc.query("select id, lot_id, serial, ambient_c, relative_humidity_percent, recorded_by, recorded_at,"
                        + " pressure_kpa, departure, deviation_reason"
                        + " from bench_conditions where lot_id = ? and serial = ? order by id desc fetch first 1 rows only",
                (rs, n) -> {
                    double p = rs.getDouble(8);
                    Optional<Double> pressure = rs.wasNull() ? Optional.empty() : Optional.of(p);
                    return new Conditions(rs.getLong(1), rs.getLong(2), rs.getString(3), rs.getDouble(4),
                            rs.getDouble(5), pressure, Optional.ofNullable(rs.getString(9)),
                            Optional.ofNullable(rs.getString(10)), rs.getString(6),
                            rs.getObject(7, OffsetDateTime.class).toInstant());
                }, lotId, serial)
                .stream().findFirst();
    }

    /** The reference instruments of a unit's current readings. */
    public Set<String> instrumentsUsed(long lotId, String serial) {
        return new TreeSet<>(jdbc.queryForList("select distinct instrument from bench_reading r where lot_id = ?"
                + " and serial = ? and not exists (select 1 from bench_reading s where s.supersedes_id = r.id)",
                String.class, lotId, serial));
    }

    /**
     * The readings that count for every unit of a lot, in one query, by serial (each in the procedure's order):
     * what {@link #currentReadings} gives per unit, for evaluating a whole lot. The columns are those of
     * {@link #COLUMNS} without its per-row subquery for {@code superseded_by}, which is always empty here.
     */
    public Map<String, List<Reading>> currentReadingsByUnit(long lotId) {
        Map<String, List<Reading>> out = new java.util.LinkedHashMap<>();
        jdbc.query("select " + CURRENT_COLUMNS + " from bench_reading r where lot_id = ?"
                        + " and not exists (select 1 from bench_reading s where s.supersedes_id = r.id)"
                        + " order by serial, slot_no, revision_no",
                rs -> {
                    Reading reading = MAPPER.mapRow(rs, 0);
                    out.computeIfAbsent(reading.serial(), k -> new ArrayList<>()).add(reading);
                }, lotId);
        return out;
    }

    /** Everyone who recorded or corrected a reading of the lot (for separation of duties). */
    public Set<String> operators(long lotId) {
        return new TreeSet<>(jdbc.queryForList("select distinct recorded_by from bench_reading where lot_id = ?",
                String.class, lotId));
    }

    /**
     * Number of points of each unit that have a reading, by serial: read from {@code bench_unit_progress},
     * which the transactions saving readings keep up to date (one row per unit, no count over the readings).
     */
    public Map<String, Integer> progress(long lotId) {
        Map<String, Integer> done = new java.util.HashMap<>();
        jdbc.query("select serial, slots_done from bench_unit_progress where lot_id = ?",
                rs -> {
                    done.put(rs.getString(1), rs.getInt(2));
                }, lotId);
        return done;
    }

    /** Points of one unit that have a reading. */
    public int progress(long lotId, String serial) {
        List<Integer> done = jdbc.queryForList("select slots_done from bench_unit_progress where lot_id = ? and serial = ?",
                Integer.class, lotId, serial);
        return done.isEmpty() ? 0 : done.get(0);
    }

    /**
     * Adds newly filled points to a unit's progress, inside the caller's transaction (a rollback takes the
     * count back with the readings). The unit's row is created on first use in a transaction of its own,
     * so two first readings of one unit saved at the same time do not collide on it.
     */
    void addProgress(long lotId, String serial, int newSlots) {
        if (newSlots <= 0) {
            return;
        }
        String update = "update bench_unit_progress set slots_done = slots_done + ? where lot_id = ? and serial = ?";
        if (jdbc.update(update, newSlots, lotId, serial) == 0) {
            ownRow.executeWithoutResult(status -> {
                try {
                    jdbc.update("insert into bench_unit_progress (lot_id, serial, slots_done) values (?, ?, 0)",
                            lotId, serial);
                } catch (DuplicateKeyException alreadyThere) {
                    // created meanwhile by another transaction: fine
                }
            });
            jdbc.update(update, newSlots, lotId, serial);
        }
    }

    /** The current readings of a unit's keyed points (static and sweep), without the noise samples. */
    public List<Reading> currentKeyedReadings(long lotId, String serial, int keyedSlots) {
        return jdbc.query("select " + COLUMNS + " from bench_reading r where lot_id = ? and serial = ? and slot_no < ?"
                + " and not exists (select 1 from bench_reading s where s.supersedes_id = r.id)"
                + " order by slot_no, revision_no", MAPPER, lotId, serial, keyedSlots);
    }

    /** Current readings of one test of a unit. */
    public long currentCount(long lotId, String serial, ReadingTest test) {
        return jdbc.queryForObject("select count(*) from bench_reading r where lot_id = ? and serial = ? and test = ?"
                + " and not exists (select 1 from bench_reading s where s.supersedes_id = r.id)", Long.class,
                lotId, serial, test.name());
    }

    /** Count, min, max, mean and sample standard deviation of each test's current readings of a unit. */
    public List<SeriesSummary> summaries(long lotId, String serial) {
        return jdbc.query("select test, count(*), min(reading_value), max(reading_value), avg(reading_value),"
                + " stddev_samp(reading_value), max(unit) from bench_reading r where lot_id = ? and serial = ?"
                + " and not exists (select 1 from bench_reading s where s.supersedes_id = r.id)"
                + " group by test order by test", (rs, n) -> {
                    double sd = rs.getDouble(6);
                    boolean hasSd = !rs.wasNull() && rs.getLong(2) > 1;
                    return new SeriesSummary(ReadingTest.valueOf(rs.getString(1)), rs.getLong(2), rs.getDouble(3),
                            rs.getDouble(4), rs.getDouble(5), hasSd ? java.util.OptionalDouble.of(sd)
                            : java.util.OptionalDouble.empty(), rs.getString(7));
                }, lotId, serial);
    }

    /** Every reading of a unit counted, corrections and superseded readings included. */
    public long historyCount(long lotId, String serial) {
        return jdbc.queryForObject("select count(*) from bench_reading where lot_id = ? and serial = ?", Long.class,
                lotId, serial);
    }

    /** One page of {@link #history}: {@code limit} readings from position {@code offset} (0-based). */
    public List<Reading> history(long lotId, String serial, long offset, int limit) {
        return jdbc.query("select " + COLUMNS + " from bench_reading r where lot_id = ? and serial = ?"
                + " order by slot_no, revision_no limit ? offset ?", MAPPER, lotId, serial, limit, offset);
    }

    /** One reading by its number. */
    public Optional<Reading> reading(long id) {
        return jdbc.query("select " + COLUMNS + " from bench_reading r where id = ?", MAPPER, id).stream().findFirst();
    }

    Optional<Reading> byToken(String token) {
        if (token == null) {
            return Optional.empty();
        }
        return jdbc.query("select " + COLUMNS + " from bench_reading r where client_token = ?", MAPPER, token)
                .stream().findFirst();
    }

    // ---- shared with the import

    BenchLot openLot(long lotId) {
        BenchLot lot = lot(lotId).orElseThrow(() -> new IllegalArgumentException("There is no lot " + lotId + "."));
        if (!lot.awaitingMeasurement()) {
            throw new IllegalStateException(lot.label() + " is no longer awaiting measurement; its readings are closed.");
        }
        return lot;
    }

    static String requireSampled(BenchLot lot, String serial) {
        String s = serial == null ? "" : serial.strip();
        if (s.isEmpty()) {
            throw new IllegalArgumentException("'serial' is missing.");
        }
        if (!lot.sampledSerials().contains(s)) {
            throw new IllegalArgumentException(s + " is not one of the units sampled from " + lot.label() + ".");
        }
        return s;
    }

    static void requireFits(BenchPlan plan, InstrumentView instrument) {
        if (plan.quantity() != null && !plan.quantity().equals(instrument.quantity())) {
            throw new IllegalArgumentException(instrument.identifier() + " measures " + instrument.quantity()
                    + "; " + plan.procedureLabel() + " needs a " + plan.quantity() + " reference.");
        }
    }

    InstrumentView requireInstrument(BenchPlan plan, String identifier) {
        if (identifier == null || identifier.isBlank()) {
            throw new IllegalArgumentException("Name the reference instrument used.");
        }
        InstrumentView iv = instruments.requireSelectable(identifier.strip(), LocalDate.ofInstant(clock.instant(), ZoneOffset.UTC));
        requireFits(plan, iv);
        return iv;
    }

    static double toOutputUnit(double entered, String unit, String outputUnit) {
        try {
            return Units.convert(entered, unit, outputUnit);
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException("The unit '" + unit + "' cannot be converted to the procedure's output"
                    + " unit " + outputUnit + ".", e);
        }
    }

    static double finite(Double value, String field) {
        if (value == null) {
            throw new IllegalArgumentException("'" + field + "' is missing.");
        }
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("'" + field + "' must be a finite number.");
        }
        return value;
    }

    private static String token(String raw) {
        if (raw == null || raw.isBlank()) {
            return null;
        }
        String t = raw.strip();
        if (t.length() > MAX_TOKEN) {
            throw new IllegalArgumentException("The client token is longer than " + MAX_TOKEN + " characters.");
        }
        return t;
    }

    static String currentUser() {
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        return auth == null || auth.getName() == null ? "system" : auth.getName();
    }

    static Object[] row(long lotId, String serial, ExpectedReading slot, int revision, double value, String unit,
                        double entered, String enteredUnit, String instrument, String who, Instant at, String token,
                        Long supersedes, String reason, Long importId, double applied, String readout,
                        String excitation) {
        return new Object[] {lotId, serial, slot.test().name(), slot.point(),
            slot.direction().map(Direction::name).orElse("NONE"), slot.cycle().orElse(0), slot.slot(), revision, value,
            unit, entered, enteredUnit, instrument, who, OffsetDateTime.ofInstant(at, ZoneOffset.UTC), token, supersedes,
            reason, importId, applied, readout, excitation};
    }

    /** Binds a row of {@link #row} with explicit types, so nulls need no metadata round trip. */
    static void bind(PreparedStatement ps, Object[] v) throws SQLException {
        ps.setLong(1, (Long) v[0]);
        ps.setString(2, (String) v[1]);
        ps.setString(3, (String) v[2]);
        ps.setDouble(4, (Double) v[3]);
        ps.setString(5, (String) v[4]);
        ps.setInt(6, (Integer) v[5]);
        ps.setInt(7, (Integer) v[6]);
        ps.setInt(8, (Integer) v[7]);
        ps.setDouble(9, (Double) v[8]);
        ps.setString(10, (String) v[9]);
        ps.setDouble(11, (Double) v[10]);
        ps.setString(12, (String) v[11]);
        ps.setString(13, (String) v[12]);
        ps.setString(14, (String) v[13]);
        ps.setObject(15, v[14]);
        if (v[15] == null) {
            ps.setNull(16, Types.VARCHAR);
        } else {
            ps.setString(16, (String) v[15]);
        }
        if (v[16] == null) {
            ps.setNull(17, Types.BIGINT);
        } else {
            ps.setLong(17, (Long) v[16]);
        }
        if (v[17] == null) {
            ps.setNull(18, Types.VARCHAR);
        } else {
            ps.setString(18, (String) v[17]);
        }
        if (v[18] == null) {
            ps.setNull(19, Types.BIGINT);
        } else {
            ps.setLong(19, (Long) v[18]);
        }
        ps.setDouble(20, (Double) v[19]);
        for (int i = 20; i <= 21; i++) {
            if (v[i] == null) {
                ps.setNull(i + 1, Types.VARCHAR);
            } else {
                ps.setString(i + 1, (String) v[i]);
            }
        }
    }

    private long insert(long lotId, String serial, ExpectedReading slot, int revision, double value, String unit,
                        double entered, String enteredUnit, String instrument, String who, Instant at, String token,
                        Long supersedes, String reason, double applied, String readout, String excitation) {
        Object[] values = row(lotId, serial, slot, revision, value, unit, entered, enteredUnit, instrument, who, at,
                token, supersedes, reason, null, applied, readout, excitation);
        GeneratedKeyHolder keys = new GeneratedKeyHolder();
        jdbc.update(c -> {
            PreparedStatement ps = c.prepareStatement(INSERT, new String[] {"id"});
            bind(ps, values);
            return ps;
        }, keys);
        return keys.getKey().longValue();
    }

    static final RowMapper<Reading> MAPPER = BenchService::map;

    private static Reading map(ResultSet rs, int n) throws SQLException {
        String direction = rs.getString("direction");
        int cycle = rs.getInt("cycle_no");
        long supersedes = rs.getLong("supersedes_id");
        boolean hasSupersedes = !rs.wasNull();
        long supersededBy = rs.getLong("superseded_by");
        boolean hasSupersededBy = !rs.wasNull();
        long importId = rs.getLong("import_id");
        boolean hasImport = !rs.wasNull();
        double point = rs.getDouble("point");
        double applied = rs.getDouble("applied");
        if (rs.wasNull()) {
            applied = point; // saved before applied values were recorded: the set point
        }
        return new Reading(rs.getLong("id"), rs.getLong("lot_id"), rs.getString("serial"),
                ReadingTest.valueOf(rs.getString("test")), point,
                "NONE".equals(direction) ? Optional.empty() : Optional.of(Direction.valueOf(direction)),
                cycle == 0 ? OptionalInt.empty() : OptionalInt.of(cycle), rs.getInt("slot_no"),
                rs.getDouble("reading_value"), rs.getString("unit"), rs.getDouble("entered_value"),
                rs.getString("entered_unit"), rs.getString("instrument"), rs.getString("recorded_by"),
                rs.getObject("recorded_at", OffsetDateTime.class).toInstant(),
                Optional.ofNullable(rs.getString("client_token")),
                hasSupersedes ? Optional.of(supersedes) : Optional.empty(),
                Optional.ofNullable(rs.getString("correction_reason")),
                hasSupersededBy ? Optional.of(supersededBy) : Optional.empty(),
                hasImport ? Optional.of(importId) : Optional.empty(), applied,
                Optional.ofNullable(rs.getString("readout")), Optional.ofNullable(rs.getString("excitation")));
    }

    JdbcTemplate jdbc() {
        return jdbc;
    }

    TransactionTemplate transactions() {
        return tx;
    }

    ApplicationEventPublisher events() {
        return events;
    }

    Clock clock() {
        return clock;
    }
}
