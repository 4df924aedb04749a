package org.dockgate.evaluation;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.dockgate.bench.Reading;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.evaluation.ReferenceUncertainty;
import org.dockgate.instruments.CalibrationRecord;
import org.dockgate.instruments.InstrumentView;
import org.dockgate.instruments.OutsideCalibratedRangeException;

/**
 * The reference a group of readings (a unit's static readings, or its sweep) was taken with, built from the
 * calibration record of each reading's instrument that was in force when the reading was recorded
 * ({@link InstrumentView#calibrationInForce}), never from the instrument's current record.
 *
 * <p>Usually every reading of the group used one record: the reference is that record's U(x) with its k, and
 * its name carries the certificate number ("RI-PRS-01, certificate C-123"), so every budget line names it.
 * When the readings span several records (a recalibration entered between two readings, or two instruments),
 * U(x) at a set point is the largest standard uncertainty u = U/k among the records of the readings taken at
 * that point (among all records of the group for any other input, e.g. a sweep amplitude), expressed with
 * the k of the last record used: the budget keeps the worst certificate that served the point
 * (conservative; common practice).
 *
 * <p>A static reading whose point lies outside the range the record in force was calibrated over is not used:
 * it is named in the problems (the result is incomplete), and a metric that needs U there is not evaluable.
 */
final class ReferencesInForce {

    private ReferencesInForce() {
    }

    private record Use(InstrumentView instrument, CalibrationRecord record, double point) {
    }

    /**
     * @param readings      the readings of one group
     * @param register      the register entries, looked up once per instrument for the whole evaluation
     * @param inputUnit     the unit U(x) is wanted in
     * @param matchByPoint  true when the core asks for U at the readings' own points (static), false when at
     *                      another input (the sweep amplitude)
     * @param used          collects the records used, keyed by instrument and certificate
     * @param problems      collects a line per reading whose instrument had no calibration in force
     * @return the reference, empty when no reading has an instrument with a calibration in force
     */
    static Optional<ReferenceUncertainty> of(List<Reading> readings, Function<String, Optional<InstrumentView>> register,
                                             String inputUnit, boolean matchByPoint,
                                             Map<String, UnitEvaluationView.CalibrationUsed> used, List<String> problems) {
        List<Use> uses = new ArrayList<>();
        for (Reading r : readings) {
            Optional<InstrumentView> instrument = register.apply(r.instrument());
            Optional<CalibrationRecord> record = instrument.flatMap(v -> v.calibrationInForce(r.recordedAt()));
            if (record.isEmpty()) {
                problems.add("The reading at " + r.point() + " (" + r.test() + ") was taken with " + r.instrument()
                        + " on " + r.recordedAt() + ", when the register held no calibration of it in force: correct"
                        + " the reading with an instrument that was in calibration.");
                continue;
            }
            if (matchByPoint && !instrument.get().inCalibratedRange(record.get(), r.applied(), inputUnit)) {
                // The certificate says nothing about that point: the instrument cannot serve it.
                problems.add("The reading at " + r.applied() + " " + inputUnit + " (" + r.test() + ") was taken with "
                        + r.instrument() + ", calibrated over " + instrument.get().calibratedRange(record.get())
                        + " only (certificate " + record.get().certificateNumber() + "): the point lies outside the"
                        + " range of the reference in force; correct the reading with an instrument calibrated there.");
                continue;
            }
            uses.add(new Use(instrument.get(), record.get(), r.applied()));
        }
        if (uses.isEmpty()) {
            return Optional.empty();
        }
        Map<String, Use> distinct = new LinkedHashMap<>();
        for (Use u : uses) {
            String key = u.instrument().identifier() + "\u0000" + u.record().certificateNumber();
            distinct.putIfAbsent(key, u);
            used.putIfAbsent(key, new UnitEvaluationView.CalibrationUsed(u.instrument().identifier(),
                    u.record().certificateNumber(), u.record().calibratedOn(), u.record().dueOn(),
                    u.record().coverageFactor()));
        }
        String name = distinct.values().stream()
                .map(u -> u.instrument().identifier() + ", certificate " + u.record().certificateNumber())
                .collect(Collectors.joining("; "));
        if (distinct.size() == 1) {
            Use only = distinct.values().iterator().next();
            return Optional.of(new ReferenceUncertainty(name,
                    x -> uncertaintyAt(only, x, inputUnit),
                    only.record().coverageFactor()));
        }
        Use last = uses.stream().max((a, b) -> a.record().recordedAt().compareTo(b.record().recordedAt())).orElseThrow();
        double k = last.record().coverageFactor();
        List<Use> all = List.copyOf(distinct.values());
        return Optional.of(new ReferenceUncertainty(name, x -> {
            List<Use> atPoint = matchByPoint ? uses.stream().filter(u -> samePoint(u.point(), x)).toList() : List.of();
            double u = 0;
            for (Use use : atPoint.isEmpty() ? all : atPoint) {
                u = Math.max(u, uncertaintyAt(use, x, inputUnit) / use.record().coverageFactor());
            }
            return u * k;
        }, k));
    }

    /** U of a record at x; a point outside its calibrated range leaves the metric not evaluable, with the reason. */
    private static double uncertaintyAt(Use use, double x, String inputUnit) {
        try {
            return use.instrument().expandedUncertaintyAt(use.record(), x, inputUnit);
        } catch (OutsideCalibratedRangeException e) {
            throw new UnevaluableException(e.getMessage());
        }
    }

    private static boolean samePoint(double a, double b) {
        return Math.abs(a - b) <= 1e-9 * Math.max(1.0, Math.max(Math.abs(a), Math.abs(b)));
    }
}
