package org.dockgate.evaluation;

import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.dockgate.core.evaluation.UnitResult;

/**
 * One sampled unit's evaluation: the core's result (metrics, budgets, verdicts, what is missing), with
 * who recorded it, which reference instruments served and the recorded conditions.
 */
public record UnitEvaluationView(String serial, UnitResult result, int readings, Set<String> operators,
                                 Set<String> instruments, Optional<Double> ambientC, Optional<Double> humidityPercent,
                                 List<StaticPoint> staticPoints, List<SweepPoint> sweepPoints) {

    /** A static reading, for the calibration-curve chart. */
    public record StaticPoint(double input, double output, String direction, int cycle) {
    }

    /** A sweep reading, for the frequency-response chart. */
    public record SweepPoint(double frequencyHz, double amplitude) {
    }

    public boolean complete() {
        return result.complete();
    }
}
