package org.dockgate.instruments;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Optional;
import org.dockgate.core.decision.ExpandedUncertainty;
import org.dockgate.core.quantity.Units;

/**
 * A reference instrument as the register holds it, with its status on the day {@code asOf}. Immutable:
 * a snapshot for pages, the API and other modules ({@link InstrumentService} makes them).
 *
 * @param identifier   unique register identifier, e.g. {@code RI-PRS-01}
 * @param description  what the instrument is
 * @param quantity     what it measures or generates, as {@link Quantity#label()} (e.g. "pressure")
 * @param rangeMin     lower end of its range, in {@code unit}
 * @param rangeMax     upper end of its range, in {@code unit}, &gt; rangeMin
 * @param unit         the range unit as entered (e.g. "bar", "°C")
 * @param current      the calibration in force: the latest by calibration date
 * @param calibrations every calibration record, newest first (the current one first)
 * @param asOf         the day the status was computed for (from the application clock, UTC)
 * @param status       the status of the current calibration on {@code asOf}
 * @param daysUntilDue days from {@code asOf} to the current due date (0 or negative once expired)
 * @param version      the register entry's version, to send back with a change (optimistic locking)
 */
public record InstrumentView(String identifier, String description, String quantity, double rangeMin,
                             double rangeMax, String unit, CalibrationRecord current,
                             List<CalibrationRecord> calibrations, LocalDate asOf, CalibrationStatus status,
                             long daysUntilDue, long version, java.util.OptionalDouble resolution) {

    public InstrumentView {
        calibrations = List.copyOf(calibrations);
        resolution = resolution == null ? java.util.OptionalDouble.empty() : resolution;
    }

    static InstrumentView of(String identifier, String description, String quantity, double rangeMin,
                             double rangeMax, String unit, List<CalibrationRecord> newestFirst, LocalDate today,
                             long version) {
        return of(identifier, description, quantity, rangeMin, rangeMax, unit, newestFirst, today, version,
                java.util.OptionalDouble.empty());
    }

    /**
     * @param resolution a readout's resolution as the register records it (the digit of the range used, in
     *                   {@code unit}), empty when not recorded
     */
    static InstrumentView of(String identifier, String description, String quantity, double rangeMin,
                             double rangeMax, String unit, List<CalibrationRecord> newestFirst, LocalDate today,
                             long version, java.util.OptionalDouble resolution) {
        CalibrationRecord current = newestFirst.get(0);
        return new InstrumentView(identifier, description, quantity, rangeMin, rangeMax, unit, current, newestFirst,
                today, CalibrationStatus.of(current.dueOn(), today),
                ChronoUnit.DAYS.between(today, current.dueOn()), version, resolution);
    }

    /** @return whether the instrument is due within {@value CalibrationStatus#DUE_SOON_DAYS} days (flag it) */
    public boolean dueSoon() {
        return status == CalibrationStatus.DUE_SOON;
    }

    /** @return whether it may be chosen for a test on {@code asOf} (not expired) */
    public boolean selectable() {
        return status.selectable();
    }

    /** @return the day it went out of calibration (its due date), when expired */
    public Optional<LocalDate> expiredSince() {
        return status == CalibrationStatus.EXPIRED ? Optional.of(current.dueOn()) : Optional.empty();
    }

    /** @return max(|rangeMin|, |rangeMax|), the full scale that percent-of-full-scale figures refer to */
    public double fullScale() {
        return Math.max(Math.abs(rangeMin), Math.abs(rangeMax));
    }

    /** @return the calibration that was in force on a day (calibrated on or before it, due after it), if any */
    public Optional<CalibrationRecord> calibrationOn(LocalDate day) {
        return calibrations.stream().filter(c -> !day.isBefore(c.calibratedOn()))
                .findFirst()
                .filter(c -> c.covers(day));
    }

    /**
     * Whether the range [min, max], given in {@code rangeUnit}, lies inside the range the current calibration
     * covers ({@link #calibratedMin}, {@link #calibratedMax}; the instrument's range for a record that states
     * none) once converted to this instrument's unit ({@link Units#convert}, affine for temperatures). A
     * relative slack of 1e-9 of the range absorbs the rounding of the conversion (20 bar written as 290.0755 psi
     * still fits 0–20 bar).
     *
     * @param min       lower end wanted
     * @param max       upper end wanted, ≥ min
     * @param rangeUnit their unit, of this instrument's kind
     * @return whether the wanted range is covered
     * @throws IllegalArgumentException when a number is not finite, min &gt; max, or the unit is unknown or of another kind
     */
    public boolean covers(double min, double max, String rangeUnit) {
        if (!Double.isFinite(min) || !Double.isFinite(max)) {
            throw new IllegalArgumentException("The wanted range must be given by finite numbers.");
        }
        if (min > max) {
            throw new IllegalArgumentException("The wanted range starts above its end: " + min + " > " + max + ".");
        }
        double low = Units.convert(min, rangeUnit, unit);
        double high = Units.convert(max, rangeUnit, unit);
        double slack = slack();
        return Math.min(low, high) >= calibratedMin(current) - slack && Math.max(low, high) <= calibratedMax(current) + slack;
    }

    /** @return the lower end of the range a record's certificate covers, in {@code unit}: as stated, else {@code rangeMin} */
    public double calibratedMin(CalibrationRecord record) {
        return record.calibratedMin() == null ? rangeMin : record.calibratedMin();
    }

    /** @return the upper end of the range a record's certificate covers, in {@code unit}: as stated, else {@code rangeMax} */
    public double calibratedMax(CalibrationRecord record) {
        return record.calibratedMax() == null ? rangeMax : record.calibratedMax();
    }

    /**
     * Whether a value (in {@code valueUnit}) lies inside the range a record's certificate covers.
     *
     * @throws IllegalArgumentException when the value is not finite or the unit does not fit
     */
    public boolean inCalibratedRange(CalibrationRecord record, double value, String valueUnit) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("The value must be a finite number.");
        }
        double x = Units.convert(value, valueUnit, unit);
        double slack = slack();
        return x >= calibratedMin(record) - slack && x <= calibratedMax(record) + slack;
    }

    /** @return a record's calibrated range in words, e.g. "0.2 … 20 bar" */
    public String calibratedRange(CalibrationRecord record) {
        return Numbers.plain(calibratedMin(record)) + " … " + Numbers.plain(calibratedMax(record)) + " " + unit;
    }

    /**
     * The floor of a record's U, in {@code unit}: U(x) = max(floor, band figure at x) everywhere, so no band
     * gives U = 0 (a percent-of-reading band at zero input). As stated on the record; for a record that states
     * none (entered before the floor was asked for), derived: the smallest figure its percent-of-reading bands
     * give at 10 % of full scale, b/100 × 0.1 × full scale ("of reading, not less than of 10 % of the range" is
     * how such certificates are commonly limited, common practice); 0 when it has no percent-of-reading band
     * (absolute and full-scale figures are &gt; 0 already).
     *
     * @param record one of this instrument's records
     * @return the floor, ≥ 0, &gt; 0 whenever a band is stated in percent of reading
     */
    public double uncertaintyFloor(CalibrationRecord record) {
        if (record.uncertaintyFloor() != null) {
            return record.uncertaintyFloor();
        }
        return record.bands().stream().filter(b -> b.mode() == UncertaintyMode.PERCENT_OF_READING)
                .mapToDouble(b -> b.expandedUncertainty() / 100.0 * 0.1 * fullScale()).min().orElse(0.0);
    }

    /** @return whether a record's floor was derived (the record states none) rather than stated */
    public boolean uncertaintyFloorDerived(CalibrationRecord record) {
        return record.uncertaintyFloor() == null;
    }

    /**
     * The expanded uncertainty U of the current calibration at a value, in the value's unit: the value is
     * converted to the range unit, its band found (first band whose {@code upTo} ≥ value), U computed
     * there as max(floor, band figure) ({@link #uncertaintyFloor}, {@link UncertaintyBand#expandedUncertaintyAt})
     * and converted back as a difference (so 0.03 °C
     * is 0.03 K, not 273.18 K). The coverage factor is {@code current().coverageFactor()}. The instrument's
     * status is not checked here: use {@link InstrumentService#requireSelectable} for that.
     *
     * @param value     the value, finite
     * @param valueUnit its unit, of this instrument's kind
     * @return U in {@code valueUnit}
     * @throws IllegalArgumentException when the value is not finite or the unit does not fit;
     *                                  {@link OutsideCalibratedRangeException} when it lies outside the calibrated range
     */
    public double expandedUncertaintyAt(double value, String valueUnit) {
        return expandedUncertaintyAt(current, value, valueUnit);
    }

    /**
     * The calibration in force for a reading taken at an instant: among the records already entered in the
     * register at that instant ({@code recordedAt} ≤ {@code at}), those calibrated on or before the reading's
     * day (UTC) and not yet due on it, the latest (by calibration date, then by sequence number). A record
     * entered later never changes the readings taken before it was entered, even when it is dated earlier.
     *
     * @param at when the reading was recorded
     * @return the record in force, or empty when the instrument had none then
     */
    public Optional<CalibrationRecord> calibrationInForce(java.time.Instant at) {
        LocalDate day = at.atZone(java.time.ZoneOffset.UTC).toLocalDate();
        return calibrations.stream()
                .filter(c -> !c.recordedAt().isAfter(at))
                .filter(c -> c.covers(day))
                .max(java.util.Comparator.comparing(CalibrationRecord::calibratedOn)
                        .thenComparingInt(CalibrationRecord::sequenceNo));
    }

    /**
     * The expanded uncertainty U of a given calibration record of this instrument at a value, in the value's
     * unit, computed as {@link #expandedUncertaintyAt(double, String)} does for the current one.
     *
     * @param record    one of this instrument's calibration records
     * @param value     the value, finite
     * @param valueUnit its unit, of this instrument's kind
     * @return U in {@code valueUnit}
     * @throws IllegalArgumentException as {@link #expandedUncertaintyAt(double, String)}
     */
    public double expandedUncertaintyAt(CalibrationRecord record, double value, String valueUnit) {
        double inRangeUnit = Units.convert(value, valueUnit, unit);
        double slack = slack();
        if (!inCalibratedRange(record, value, valueUnit)) {
            throw new OutsideCalibratedRangeException(identifier + " is calibrated over " + calibratedRange(record)
                    + " (certificate " + record.certificateNumber() + "); " + Numbers.plain(value) + " "
                    + valueUnit.strip() + " lies outside it.");
        }
        UncertaintyBand band = record.bands().stream().filter(b -> inRangeUnit <= b.upTo() + slack).findFirst()
                .orElse(record.bands().get(record.bands().size() - 1));
        // U = max(floor, a + b·|x|): the band's figure, never below the record's floor.
        double u = Math.max(uncertaintyFloor(record), band.expandedUncertaintyAt(inRangeUnit, fullScale()));
        // An uncertainty is a difference: convert it without the offset of affine (temperature) units.
        return Units.convert(u, unit, valueUnit) - Units.convert(0.0, unit, valueUnit);
    }

    /**
     * U and k of the current calibration at a value, as the core's decision rules take them.
     *
     * @param value     the value
     * @param valueUnit its unit
     * @return U (in {@code valueUnit}) with the certificate's k
     * @throws IllegalArgumentException as {@link #expandedUncertaintyAt}
     */
    public ExpandedUncertainty uncertaintyAt(double value, String valueUnit) {
        return ExpandedUncertainty.of(expandedUncertaintyAt(value, valueUnit), current.coverageFactor());
    }

    private double slack() {
        return 1e-9 * Math.max(rangeMax - rangeMin, Math.max(Math.abs(rangeMin), Math.abs(rangeMax)));
    }
}
