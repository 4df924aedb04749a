package org.dockgate.evaluation;

import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.dockgate.core.evaluation.UnitResult;

/**
 * One sampled unit's evaluation: the core's result (metrics, budgets, verdicts, what is missing), with
 * who recorded it, which reference instruments served, the calibration record of each that was in force
 * when its readings were taken, and the recorded conditions.
 *
 * @param calibrations the calibration records the readings were evaluated with, one per instrument and
 *                     certificate (an instrument recalibrated between two readings of the unit appears twice)
 * @param frozen       true when this is the result frozen at disposition (the record), false when computed
 *                     now from the stored readings
 * @param conditionsDeviation when the unit's conditions lay outside the procedure's limits: the departure and
 *                     the reason it was measured anyway (a deviation from the procedure, stated on the certificate)
 */
public record UnitEvaluationView(String serial, UnitResult result, int readings, Set<String> operators,
                                 Set<String> instruments, Optional<Double> ambientC, Optional<Double> humidityPercent,
                                 List<StaticPoint> staticPoints, List<SweepPoint> sweepPoints,
                                 List<CalibrationUsed> calibrations, boolean frozen,
                                 Optional<String> conditionsDeviation) {

    public UnitEvaluationView {
        calibrations = calibrations == null ? List.of() : List.copyOf(calibrations);
        // Results frozen before deviations were recorded have none.
        conditionsDeviation = conditionsDeviation == null ? Optional.empty() : conditionsDeviation;
    }

    /** A static reading, for the calibration-curve chart. */
    public record StaticPoint(double input, double output, String direction, int cycle) {
    }

    /** A sweep reading, for the frequency-response chart. */
    public record SweepPoint(double frequencyHz, double amplitude) {
    }

    /**
     * A calibration record of a reference instrument that served the unit's readings: the one in force
     * when they were taken (entered in the register by then, calibrated on or before that day, not yet due).
     */
    public record CalibrationUsed(String instrument, String certificateNumber, LocalDate calibratedOn,
                                  LocalDate dueOn, double coverageFactor) {
    }

    /** @return the same evaluation marked as the frozen record */
    UnitEvaluationView asFrozen() {
        return new UnitEvaluationView(serial, result, readings, operators, instruments, ambientC, humidityPercent,
                staticPoints, sweepPoints, calibrations, true, conditionsDeviation);
    }

    public boolean complete() {
        return result.complete();
    }
}
