package org.dockgate.evaluation;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.dockgate.bench.Reading;
import org.dockgate.core.evaluation.ExcitationSupply;
import org.dockgate.core.evaluation.MeasurementContext;
import org.dockgate.core.evaluation.ReadoutInstrument;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.quantity.Units;
import org.dockgate.instruments.CalibrationRecord;
import org.dockgate.instruments.InstrumentView;

/**
 * The readout and excitation instruments of a unit's readings (issue 11, item 3), each with the calibration record
 * in force when the reading was taken ({@link InstrumentView#calibrationInForce}), added to the measurement context.
 *
 * <ul>
 *   <li>Readout: U(y) at each reading from its band, in output units; when the readings used several readouts or
 *       records, the largest standard uncertainty u = U/k among them at y, with the k of the first (conservative,
 *       common practice, as for the stimulus). Its resolution is the register's, converted to the output unit;
 *       with several readouts the coarsest. Readings that name none: "readout not recorded".</li>
 *   <li>Excitation: cancelled for a ratiometric output (mV/V, read against the same excitation) and for an RTD
 *       (the measuring current belongs to the readout's resistance measurement); otherwise u(V)/V at the supply's
 *       set voltage, taken as the top of its range.</li>
 * </ul>
 */
final class ChainInForce {

    private ChainInForce() {
    }

    private record Use(InstrumentView instrument, CalibrationRecord record) {
        String name() {
            return instrument.identifier() + ", certificate " + record.certificateNumber();
        }
    }

    /**
     * @param context  the context with the stimulus
     * @param readings the unit's static and noise readings
     * @param register the register look-up of the evaluation
     * @param spec     the specification (output unit, sensor kind)
     * @param used     collects the records used
     * @param problems collects what keeps the result incomplete
     * @return the context with the readout (or "not recorded") and the excitation
     */
    static MeasurementContext apply(MeasurementContext context, List<Reading> readings,
                                    Function<String, Optional<InstrumentView>> register, SensorSpecification spec,
                                    Map<String, UnitEvaluationView.CalibrationUsed> used, List<String> problems) {
        String out = spec.outputUnit();
        List<Reading> withReadout = readings.stream().filter(r -> r.readout().isPresent()).toList();
        MeasurementContext result = context;
        if (withReadout.isEmpty()) {
            result = readings.isEmpty() ? result : result.withReadoutNotRecorded();
        } else {
            if (withReadout.size() < readings.size()) {
                problems.add((readings.size() - withReadout.size()) + " of " + readings.size() + " readings name no"
                        + " readout: correct them or record them again with the readout used.");
            }
            Map<String, Use> uses = inForce(withReadout, Reading::readout, register, "readout", used, problems);
            List<Use> fitting = new ArrayList<>();
            for (Use u : uses.values()) {
                if (!Units.isCompatible(u.instrument().unit(), out)) {
                    problems.add("The readout " + u.instrument().identifier() + " reads in " + u.instrument().unit()
                            + "; the output is in " + out + ", so it cannot have been the readout.");
                    continue;
                }
                boolean inRange = withReadout.stream().filter(r -> r.readout().get().equals(u.instrument().identifier()))
                        .allMatch(r -> covers(u.instrument(), u.record(), r.value(), out));
                if (!inRange) {
                    problems.add("A reading lies outside the range of the readout " + u.instrument().identifier()
                            + " (" + u.instrument().rangeMin() + " to " + u.instrument().rangeMax() + " "
                            + u.instrument().unit() + ").");
                    continue;
                }
                fitting.add(u);
            }
            if (!fitting.isEmpty()) {
                String name = fitting.stream().map(Use::name).distinct().collect(Collectors.joining("; "));
                double k = fitting.get(0).record().coverageFactor();
                List<Use> all = List.copyOf(fitting);
                OptionalDouble resolution = OptionalDouble.empty();
                boolean allHave = true;
                for (Use u : all) {
                    OptionalDouble d = u.instrument().resolution();
                    if (d.isEmpty()) {
                        allHave = false;
                        continue;
                    }
                    double inOut = Math.abs(Units.convert(d.getAsDouble(), u.instrument().unit(), out)
                            - Units.convert(0.0, u.instrument().unit(), out));
                    resolution = OptionalDouble.of(Math.max(resolution.orElse(0), inOut));
                }
                ReadoutInstrument readout = new ReadoutInstrument(name, y -> {
                    double worst = 0;
                    for (Use u : all) {
                        worst = Math.max(worst, u.instrument().expandedUncertaintyAt(u.record(), y, out)
                                / u.record().coverageFactor());
                    }
                    return worst * k;
                }, k, allHave ? resolution : OptionalDouble.empty());
                result = result.withReadout(readout);
            }
        }
        List<Reading> withExcitation = readings.stream().filter(r -> r.excitation().isPresent()).toList();
        if (!withExcitation.isEmpty()) {
            Map<String, Use> uses = inForce(withExcitation, Reading::excitation, register, "excitation", used, problems);
            if (!uses.isEmpty()) {
                String name = uses.values().stream().map(Use::name).distinct().collect(Collectors.joining("; "));
                boolean ratio = Units.isCompatible(out, "1");
                if (ratio) {
                    result = result.withExcitation(new ExcitationSupply(name, 0, true,
                            "ratiometric measurement (output in " + out + " against the same excitation)"));
                } else if (spec.kind() == SensorKind.RTD) {
                    result = result.withExcitation(new ExcitationSupply(name, 0, true,
                            "the measuring current is part of the readout's resistance measurement, which its"
                                    + " calibration covers"));
                } else {
                    double relative = 0;
                    for (Use u : uses.values()) {
                        double v = u.instrument().rangeMax();
                        relative = Math.max(relative, u.instrument().expandedUncertaintyAt(u.record(), v,
                                u.instrument().unit()) / u.record().coverageFactor() / Math.abs(v));
                    }
                    result = result.withExcitation(new ExcitationSupply(name, relative, false,
                            "at the set voltage (the top of the supply's range)"));
                }
            }
        }
        return result;
    }

    private static boolean covers(InstrumentView v, CalibrationRecord record, double value, String unit) {
        try {
            v.expandedUncertaintyAt(record, value, unit);
            return true;
        } catch (IllegalArgumentException e) {
            return false;
        }
    }

    private static Map<String, Use> inForce(List<Reading> readings, Function<Reading, Optional<String>> role,
                                            Function<String, Optional<InstrumentView>> register, String roleName,
                                            Map<String, UnitEvaluationView.CalibrationUsed> used, List<String> problems) {
        Map<String, Use> uses = new LinkedHashMap<>();
        for (Reading r : readings) {
            String id = role.apply(r).orElseThrow();
            Optional<InstrumentView> instrument = register.apply(id);
            Optional<CalibrationRecord> record = instrument.flatMap(v -> v.calibrationInForce(r.recordedAt()));
            if (record.isEmpty()) {
                problems.add("The reading at " + r.point() + " (" + r.test() + ") was taken with the " + roleName + " "
                        + id + " on " + r.recordedAt() + ", when the register held no calibration of it in force.");
                continue;
            }
            String key = id + "\u0000" + record.get().certificateNumber();
            if (uses.putIfAbsent(key, new Use(instrument.get(), record.get())) == null) {
                used.putIfAbsent(key, new UnitEvaluationView.CalibrationUsed(id, record.get().certificateNumber(),
                        record.get().calibratedOn(), record.get().dueOn(), record.get().coverageFactor()));
            }
        }
        return uses;
    }
}
