package org.dockgate.instruments;

import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.dockgate.audit.AuditEvent;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.dockgate.core.decision.ExpandedUncertainty;
import org.dockgate.core.quantity.Units;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.dao.DataIntegrityViolationException;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * The instruments module's face: the reference-instrument register. Everyone reads it; ADMIN adds
 * instruments and records calibrations (enforced by the URL rules in {@code InstrumentsAccess}).
 * Calibration records are append-only: a recalibration adds a record and keeps the earlier ones.
 *
 * <p>Status comes from the application {@link Clock} (UTC date): see {@link CalibrationStatus}. Other
 * modules find instruments with {@link #qualifying}, check a choice with {@link #requireSelectable}
 * and take U from {@link #expandedUncertaintyAt} / {@link #uncertaintyAt}.
 */
@Service
public class InstrumentService {

    /** Audit entity type of register entries; the entity id is the instrument's identifier. */
    public static final String ENTITY_TYPE = "REFERENCE_INSTRUMENT";

    private static final Pattern IDENTIFIER = Pattern.compile("[A-Z0-9][A-Z0-9._-]{0,39}");
    private static final Comparator<InstrumentCalibration> NEWEST_FIRST = Comparator
            .comparing((InstrumentCalibration c) -> c.toRecord().calibratedOn())
            .thenComparingInt(c -> c.toRecord().sequenceNo()).reversed();

    private final ReferenceInstrumentRepository instruments;
    private final InstrumentCalibrationRepository calibrations;
    private final ApplicationEventPublisher events;
    private final Clock clock;

    InstrumentService(ReferenceInstrumentRepository instruments, InstrumentCalibrationRepository calibrations,
                      ApplicationEventPublisher events, Clock clock) {
        this.instruments = instruments;
        this.calibrations = calibrations;
        this.events = events;
        this.clock = clock;
    }

    /** @return today's date in UTC from the application clock, the day statuses are computed for */
    public LocalDate today() {
        return LocalDate.now(clock);
    }

    /**
     * Every instrument, ordered by the due date of its current calibration (expired first, then the
     * soonest due), then by identifier.
     *
     * @return the register, status as of {@link #today()}
     */
    @Transactional(readOnly = true)
    public List<InstrumentView> all() {
        LocalDate today = today();
        Map<Long, List<InstrumentCalibration>> byInstrument = calibrations.findAll().stream()
                .collect(Collectors.groupingBy(InstrumentCalibration::getInstrumentId));
        return instruments.findAll().stream()
                .map(i -> view(i, byInstrument.getOrDefault(i.getId(), List.of()), today))
                .sorted(BY_DUE_DATE).toList();
    }

    /**
     * The register filtered by quantity and status, ordered as {@link #all()}.
     *
     * @param quantity a {@link Quantity} label, or null/blank for every quantity
     * @param status   a status, or null for every status
     * @return the matching instruments
     * @throws IllegalArgumentException when the quantity is not a known one
     */
    @Transactional(readOnly = true)
    public List<InstrumentView> list(String quantity, CalibrationStatus status) {
        String wanted = quantity == null || quantity.isBlank() ? null : Quantity.of(quantity).label();
        return all().stream().filter(v -> wanted == null || v.quantity().equals(wanted))
                .filter(v -> status == null || v.status() == status).toList();
    }

    /**
     * One instrument with its calibration history (newest first).
     *
     * @param identifier its identifier, any case
     * @return the instrument, or empty when the register has none of that identifier
     */
    @Transactional(readOnly = true)
    public Optional<InstrumentView> find(String identifier) {
        if (identifier == null || identifier.isBlank()) {
            return Optional.empty();
        }
        return instruments.findByIdentifier(normalise(identifier))
                .map(i -> view(i, calibrations.findByInstrumentId(i.getId()), today()));
    }

    /**
     * The instruments that may serve a test over a range today: of the quantity, in calibration or due
     * soon (never expired), whose range covers [rangeMin, rangeMax] after conversion of the wanted range
     * to the instrument's unit ({@link InstrumentView#covers}, through {@link Units}). Ordered by the
     * instrument's span in the wanted unit, narrowest first (usually the finest resolution), then by
     * identifier. The TUR against a tolerance is the caller's business: see {@link #expandedUncertaintyAt}.
     *
     * @param quantity a {@link Quantity} label, e.g. "pressure"
     * @param rangeMin lower end of the range to cover
     * @param rangeMax upper end, ≥ rangeMin
     * @param unit     their unit, of the quantity's kind (e.g. psi for a pressure)
     * @return the qualifying instruments, possibly none
     * @throws IllegalArgumentException when the quantity or unit is unknown, the unit does not fit the
     *                                  quantity, a number is not finite, or rangeMin &gt; rangeMax
     */
    @Transactional(readOnly = true)
    public List<InstrumentView> qualifying(String quantity, double rangeMin, double rangeMax, String unit) {
        Quantity q = Quantity.of(quantity);
        q.requireUnit(unit);
        if (!Double.isFinite(rangeMin) || !Double.isFinite(rangeMax)) {
            throw new IllegalArgumentException("The range to cover must be given by finite numbers.");
        }
        if (rangeMin > rangeMax) {
            throw new IllegalArgumentException("The range to cover starts above its end: " + Numbers.plain(rangeMin)
                    + " > " + Numbers.plain(rangeMax) + " " + unit + ".");
        }
        return list(q.label(), null).stream()
                .filter(InstrumentView::selectable)
                .filter(v -> v.covers(rangeMin, rangeMax, unit))
                .sorted(Comparator.comparingDouble((InstrumentView v) -> Math.abs(
                                Units.convert(v.rangeMax(), v.unit(), unit) - Units.convert(v.rangeMin(), v.unit(), unit)))
                        .thenComparing(InstrumentView::identifier))
                .toList();
    }

    /**
     * The expanded uncertainty U of an instrument's current calibration at a value, in the value's unit
     * (see {@link InstrumentView#expandedUncertaintyAt} for the band rule and the conversion). Its
     * coverage factor is {@code find(identifier).get().current().coverageFactor()}, or use {@link #uncertaintyAt}.
     *
     * @param identifier the instrument
     * @param value      the value, finite
     * @param unit       the value's unit, of the instrument's kind
     * @return U in {@code unit}
     * @throws IllegalArgumentException when the instrument is unknown, the unit does not fit, or the value lies outside its range
     */
    @Transactional(readOnly = true)
    public double expandedUncertaintyAt(String identifier, double value, String unit) {
        return require(identifier).expandedUncertaintyAt(value, unit);
    }

    /**
     * U and k of an instrument's current calibration at a value, as the core's decision rules take them.
     *
     * @param identifier the instrument
     * @param value      the value
     * @param unit       the value's unit
     * @return U in {@code unit}, with the certificate's k
     * @throws IllegalArgumentException as {@link #expandedUncertaintyAt}
     */
    @Transactional(readOnly = true)
    public ExpandedUncertainty uncertaintyAt(String identifier, double value, String unit) {
        return require(identifier).uncertaintyAt(value, unit);
    }

    /**
     * Requires an instrument to be usable today. See {@link #requireSelectable(String, LocalDate)}.
     *
     * @param identifier the instrument
     * @return the instrument
     */
    @Transactional(readOnly = true)
    public InstrumentView requireSelectable(String identifier) {
        return requireSelectable(identifier, today());
    }

    /**
     * Requires an instrument to have had a calibration in force on a day (calibrated on or before it,
     * due after it), e.g. the day a procedure is approved or a reading is taken. Every module that lets a
     * person choose an instrument calls this before saving the choice.
     *
     * @param identifier the instrument
     * @param on         the day
     * @return the instrument (status as of today)
     * @throws IllegalArgumentException         when the register has no such instrument
     * @throws InstrumentNotSelectableException (an {@link IllegalStateException}) when no calibration was in
     *                                          force that day, e.g. "RI-PRS-02 is out of calibration since
     *                                          2026-11-17 and cannot be selected"
     */
    @Transactional(readOnly = true)
    public InstrumentView requireSelectable(String identifier, LocalDate on) {
        if (on == null) {
            throw new IllegalArgumentException("Say for which day the instrument is wanted.");
        }
        InstrumentView view = require(identifier);
        if (view.calibrationOn(on).isPresent()) {
            return view;
        }
        Optional<CalibrationRecord> before = view.calibrations().stream()
                .filter(c -> !on.isBefore(c.calibratedOn())).findFirst();
        String message = before
                .map(c -> view.identifier() + " is out of calibration since " + c.dueOn()
                        + " and cannot be selected" + (on.equals(today()) ? "" : " for " + on) + ".")
                .orElseGet(() -> view.identifier() + " had no calibration in force on " + on
                        + " (first calibrated " + view.calibrations().get(view.calibrations().size() - 1).calibratedOn()
                        + ") and cannot be selected for that day.");
        throw new InstrumentNotSelectableException(view.identifier(), on, message);
    }

    /**
     * Adds an instrument to the register with its first calibration; publishes a {@code CREATE} audit event.
     *
     * @param input the instrument and its calibration
     * @return the new register entry
     * @throws InstrumentException (an {@link IllegalArgumentException}) naming the field, for malformed
     *                             input, a unit that does not fit the quantity, a duplicate identifier,
     *                             dates out of order or bands that do not fit the range
     */
    @Transactional
    public InstrumentView create(NewInstrument input) {
        if (input == null) {
            throw new InstrumentException(null, "Nothing to add.");
        }
        String identifier = input.identifier() == null ? "" : normalise(input.identifier());
        if (!IDENTIFIER.matcher(identifier).matches()) {
            throw new InstrumentException("identifier", "An identifier is 1 to 40 letters, digits, '.', '_' or '-',"
                    + " starting with a letter or digit, e.g. RI-PRS-01.");
        }
        if (instruments.existsByIdentifier(identifier)) {
            throw duplicate(identifier);
        }
        String description = text(input.description(), "description", "Describe the instrument.", 500);
        Quantity quantity = field("quantity", () -> Quantity.of(input.quantity()));
        String unit = text(input.unit(), "unit", "Enter the unit of the range, e.g. bar.", 32);
        field("unit", () -> {
            quantity.requireUnit(unit);
            return null;
        });
        double min = finite(input.rangeMin(), "rangeMin", "The lower end of the range");
        double max = finite(input.rangeMax(), "rangeMax", "The upper end of the range");
        if (max <= min) {
            throw new InstrumentException("rangeMax", "The upper end of the range (" + Numbers.plain(max)
                    + ") must be above its lower end (" + Numbers.plain(min) + ").");
        }
        NewCalibration calibration = checkCalibration(input.calibration(), min, max, unit, null);
        ReferenceInstrument entry = new ReferenceInstrument(identifier, description, quantity.label(), min, max,
                unit, clock.instant());
        if (input.resolution() != null) {
            if (!(input.resolution() > 0 && Double.isFinite(input.resolution()))) {
                throw new InstrumentException("resolution", "A readout's resolution is a positive number in " + unit
                        + " (the digit of the range used), got " + input.resolution() + ".");
            }
            entry.setResolution(input.resolution());
        }
        int sequence = entry.nextCalibration();
        try {
            entry = instruments.saveAndFlush(entry);
        } catch (DataIntegrityViolationException e) {
            throw duplicate(identifier);
        }
        InstrumentCalibration saved = calibrations.saveAndFlush(
                new InstrumentCalibration(entry.getId(), sequence, calibration, clock.instant()));
        List<FieldChange> changes = new ArrayList<>(List.of(
                FieldChange.of("identifier", null, identifier),
                FieldChange.of("description", null, description),
                FieldChange.of("quantity", null, quantity.label()),
                FieldChange.of("range", null, range(min, max, unit))));
        changes.addAll(calibrationChanges(null, saved.toRecord(), unit));
        events.publishEvent(AuditEvent.of(ENTITY_TYPE, identifier, "CREATE",
                "Reference instrument " + identifier + " added, calibrated on " + calibration.calibratedOn()
                        + " (certificate " + calibration.certificateNumber() + "), due " + calibration.dueOn())
                .withChanges(changes));
        return view(entry, List.of(saved), today());
    }

    /**
     * Records a new calibration of an instrument: a new record (new certificate number and dates), the
     * earlier ones kept unchanged; publishes a {@code CALIBRATE} audit event with the changed values.
     *
     * @param identifier      the instrument
     * @param calibration     the new calibration; dated no earlier than the current one, with a certificate
     *                        number the instrument has not had before
     * @param expectedVersion the version the person saw
     * @return the instrument with its new current calibration
     * @throws IllegalArgumentException                when the instrument is unknown
     * @throws InstrumentException                     naming the field, for malformed or inconsistent input
     * @throws ObjectOptimisticLockingFailureException when the entry changed since {@code expectedVersion}
     */
    @Transactional
    public InstrumentView recordCalibration(String identifier, NewCalibration calibration, long expectedVersion) {
        ReferenceInstrument entry = instruments.findByIdentifier(normalise(identifier == null ? "" : identifier))
                .orElseThrow(() -> unknown(identifier));
        if (entry.getVersion() != expectedVersion) {
            throw new ObjectOptimisticLockingFailureException(ReferenceInstrument.class, entry.getIdentifier());
        }
        List<InstrumentCalibration> history = new ArrayList<>(calibrations.findByInstrumentId(entry.getId()));
        history.sort(NEWEST_FIRST);
        CalibrationRecord current = history.get(0).toRecord();
        NewCalibration checked = checkCalibration(calibration, entry.getRangeMin(), entry.getRangeMax(),
                entry.getUnit(), current);
        for (InstrumentCalibration earlier : history) {
            if (earlier.toRecord().certificateNumber().equalsIgnoreCase(checked.certificateNumber())) {
                throw new InstrumentException("certificateNumber", "Certificate " + checked.certificateNumber()
                        + " is already recorded for " + entry.getIdentifier() + " (calibration of "
                        + earlier.toRecord().calibratedOn() + "); a new calibration has a new certificate.");
            }
        }
        int sequence = entry.nextCalibration();
        instruments.flush();
        InstrumentCalibration saved = calibrations.saveAndFlush(
                new InstrumentCalibration(entry.getId(), sequence, checked, clock.instant()));
        history.add(0, saved);
        events.publishEvent(AuditEvent.of(ENTITY_TYPE, entry.getIdentifier(), "CALIBRATE",
                        "Calibration of " + entry.getIdentifier() + " recorded: " + checked.calibratedOn()
                                + ", certificate " + checked.certificateNumber() + ", due " + checked.dueOn())
                .withChanges(calibrationChanges(current, saved.toRecord(), entry.getUnit())));
        return view(entry, history, today());
    }

    private NewCalibration checkCalibration(NewCalibration c, double min, double max, String unit,
                                            CalibrationRecord current) {
        if (c == null) {
            throw new InstrumentException("certificateNumber", "Enter the calibration: certificate, dates and uncertainty.");
        }
        String certificate = text(c.certificateNumber(), "certificateNumber",
                "Enter the calibration certificate's number.", 100);
        LocalDate today = today();
        if (c.calibratedOn() == null) {
            throw new InstrumentException("calibratedOn", "Enter the calibration date (YYYY-MM-DD).");
        }
        if (c.calibratedOn().isAfter(today)) {
            throw new InstrumentException("calibratedOn", "The calibration date " + c.calibratedOn()
                    + " is in the future (today is " + today + ").");
        }
        if (c.dueOn() == null) {
            throw new InstrumentException("dueOn", "Enter the due date (YYYY-MM-DD).");
        }
        if (!c.dueOn().isAfter(c.calibratedOn())) {
            throw new InstrumentException("dueOn", "The due date " + c.dueOn() + " must come after the calibration"
                    + " date " + c.calibratedOn() + ".");
        }
        if (current != null && c.calibratedOn().isBefore(current.calibratedOn())) {
            throw new InstrumentException("calibratedOn", "The current calibration is of " + current.calibratedOn()
                    + " (certificate " + current.certificateNumber() + "); a new calibration cannot be dated earlier.");
        }
        if (!Double.isFinite(c.coverageFactor()) || c.coverageFactor() <= 0) {
            throw new InstrumentException("coverageFactor", "The coverage factor k must be a number greater than"
                    + " zero (commonly 2).");
        }
        checkBands(c.bands(), min, max, unit);
        checkCalibratedRange(c, min, max, unit);
        if (c.uncertaintyFloor() != null && (!Double.isFinite(c.uncertaintyFloor()) || c.uncertaintyFloor() <= 0)) {
            throw new InstrumentException("uncertaintyFloor", "The smallest U (floor) must be a number greater than"
                    + " zero in " + unit + ", or left empty; was " + Numbers.plain(c.uncertaintyFloor()) + ".");
        }
        return new NewCalibration(certificate, c.calibratedOn(), c.dueOn(), c.coverageFactor(), c.bands(),
                c.calibratedMin(), c.calibratedMax(), c.uncertaintyFloor());
    }

    /** The calibrated range, when stated, lies inside the instrument's range and has its ends in order. */
    private static void checkCalibratedRange(NewCalibration c, double min, double max, String unit) {
        double slack = 1e-9 * Math.max(max - min, Math.max(Math.abs(min), Math.abs(max)));
        if (c.calibratedMin() != null && (!Double.isFinite(c.calibratedMin()) || c.calibratedMin() < min - slack
                || c.calibratedMin() >= max)) {
            throw new InstrumentException("calibratedMin", "The calibrated range must start inside the instrument's"
                    + " range (" + range(min, max, unit) + "); " + Numbers.plain(c.calibratedMin()) + " " + unit
                    + " does not.");
        }
        if (c.calibratedMax() != null && (!Double.isFinite(c.calibratedMax()) || c.calibratedMax() > max + slack
                || c.calibratedMax() <= min)) {
            throw new InstrumentException("calibratedMax", "The calibrated range must end inside the instrument's"
                    + " range (" + range(min, max, unit) + "); " + Numbers.plain(c.calibratedMax()) + " " + unit
                    + " does not.");
        }
        double low = c.calibratedMin() == null ? min : c.calibratedMin();
        double high = c.calibratedMax() == null ? max : c.calibratedMax();
        if (high <= low) {
            throw new InstrumentException("calibratedMax", "The upper end of the calibrated range ("
                    + Numbers.plain(high) + " " + unit + ") must be above its lower end (" + Numbers.plain(low)
                    + " " + unit + ").");
        }
    }

    private static void checkBands(List<UncertaintyBand> bands, double min, double max, String unit) {
        if (bands.isEmpty()) {
            throw new InstrumentException("expandedUncertainty", "Enter the expanded uncertainty U.");
        }
        double slack = 1e-9 * Math.max(max - min, Math.max(Math.abs(min), Math.abs(max)));
        double previous = min;
        for (int i = 0; i < bands.size(); i++) {
            UncertaintyBand band = bands.get(i);
            String at = "bands[" + i + "].";
            if (band.upTo() <= previous) {
                throw new InstrumentException(at + "upTo", "Each range segment must end above "
                        + (i == 0 ? "the lower end of the range" : "the previous one") + " (" + Numbers.plain(previous)
                        + " " + unit + "); this one ends at " + Numbers.plain(band.upTo()) + " " + unit + ".");
            }
            if (band.upTo() > max + slack) {
                throw new InstrumentException(at + "upTo", "A range segment ends at " + Numbers.plain(band.upTo())
                        + " " + unit + ", beyond the range (up to " + Numbers.plain(max) + " " + unit + ").");
            }
            if (band.mode() != UncertaintyMode.ABSOLUTE && band.expandedUncertainty() > 100) {
                throw new InstrumentException(at + "expandedUncertainty", "An uncertainty of "
                        + Numbers.plain(band.expandedUncertainty()) + " % cannot be right: it exceeds 100 %.");
            }
            previous = band.upTo();
        }
        if (previous < max - slack) {
            throw new InstrumentException("bands[" + (bands.size() - 1) + "].upTo", "The uncertainty must be stated"
                    + " up to the top of the range (" + Numbers.plain(max) + " " + unit + "); the last segment ends at "
                    + Numbers.plain(previous) + " " + unit + ".");
        }
    }

    private static List<FieldChange> calibrationChanges(CalibrationRecord before, CalibrationRecord after, String unit) {
        List<FieldChange> changes = new ArrayList<>();
        changes.add(FieldChange.of("certificateNumber", before == null ? null : before.certificateNumber(),
                after.certificateNumber()));
        changes.add(FieldChange.of("calibratedOn", before == null ? null : before.calibratedOn(), after.calibratedOn()));
        changes.add(FieldChange.of("dueOn", before == null ? null : before.dueOn(), after.dueOn()));
        changes.add(FieldChange.of("expandedUncertainty", before == null ? null : uncertainty(before, unit),
                uncertainty(after, unit)));
        changes.add(FieldChange.of("coverageFactor", before == null ? null : Numbers.plain(before.coverageFactor()),
                Numbers.plain(after.coverageFactor())));
        changes.add(FieldChange.of("calibratedRange", before == null ? null : statedRange(before, unit),
                statedRange(after, unit)));
        changes.add(FieldChange.of("uncertaintyFloor", before == null ? null : statedFloor(before, unit),
                statedFloor(after, unit)));
        return changes;
    }

    private static String uncertainty(CalibrationRecord c, String unit) {
        return c.bands().stream().map(b -> b.describe(unit)).collect(Collectors.joining("; "));
    }

    private static String statedRange(CalibrationRecord c, String unit) {
        if (c.calibratedMin() == null && c.calibratedMax() == null) {
            return "the instrument's range";
        }
        return (c.calibratedMin() == null ? "range minimum" : Numbers.plain(c.calibratedMin())) + " to "
                + (c.calibratedMax() == null ? "range maximum" : Numbers.plain(c.calibratedMax()) + " " + unit);
    }

    private static String statedFloor(CalibrationRecord c, String unit) {
        return c.uncertaintyFloor() == null ? "not stated (derived)" : Numbers.plain(c.uncertaintyFloor()) + " " + unit;
    }

    private static String range(double min, double max, String unit) {
        return Numbers.plain(min) + " to " + Numbers.plain(max) + " " + unit;
    }

    private InstrumentView require(String identifier) {
        return find(identifier).orElseThrow(() -> unknown(identifier));
    }

    private static IllegalArgumentException unknown(String identifier) {
        return new IllegalArgumentException("There is no reference instrument '" + (identifier == null ? "" : identifier.strip())
                + "' in the register.");
    }

    private static InstrumentException duplicate(String identifier) {
        return new InstrumentException("identifier", identifier + " is already in the register. To enter its new"
                + " certificate, record a new calibration on its page.");
    }

    private static InstrumentView view(ReferenceInstrument i, List<InstrumentCalibration> records, LocalDate today) {
        List<InstrumentCalibration> sorted = new ArrayList<>(records);
        sorted.sort(NEWEST_FIRST);
        return InstrumentView.of(i.getIdentifier(), i.getDescription(), i.getQuantity(), i.getRangeMin(),
                i.getRangeMax(), i.getUnit(), sorted.stream().map(InstrumentCalibration::toRecord).toList(), today,
                i.getVersion(), i.getResolution() == null ? java.util.OptionalDouble.empty()
                        : java.util.OptionalDouble.of(i.getResolution()));
    }

    private static final Comparator<InstrumentView> BY_DUE_DATE = Comparator
            .comparing((InstrumentView v) -> v.current().dueOn()).thenComparing(InstrumentView::identifier);

    static String normalise(String identifier) {
        return identifier.strip().toUpperCase(Locale.ROOT);
    }

    private static String text(String value, String field, String whenEmpty, int maxLength) {
        if (value == null || value.isBlank()) {
            throw new InstrumentException(field, whenEmpty);
        }
        String stripped = value.strip();
        if (stripped.length() > maxLength) {
            throw new InstrumentException(field, "At most " + maxLength + " characters, please (this has "
                    + stripped.length() + ").");
        }
        return stripped;
    }

    private static double finite(double value, String field, String what) {
        if (!Double.isFinite(value)) {
            throw new InstrumentException(field, what + " must be a finite number.");
        }
        return value;
    }

    private static <T> T field(String field, java.util.function.Supplier<T> check) {
        try {
            return check.get();
        } catch (InstrumentException e) {
            throw e;
        } catch (IllegalArgumentException e) {
            throw new InstrumentException(field, e.getMessage());
        }
    }
}
