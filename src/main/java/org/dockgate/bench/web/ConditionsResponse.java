package org.dockgate.bench.web;

import java.time.Instant;
import org.dockgate.bench.Conditions;

/**
 * Saved conditions as JSON; absent values are null. {@code departure} names each value outside the
 * procedure's limits and the limit, and is set exactly when {@code deviationReason} is.
 */
record ConditionsResponse(long id, long lotId, String serial, double ambientC, double relativeHumidityPercent,
                          Double pressureKPa, boolean deviation, String departure, String deviationReason,
                          String recordedBy, Instant recordedAt) {

    static ConditionsResponse of(Conditions c) {
        return new ConditionsResponse(c.id(), c.lotId(), c.serial(), c.ambientC(), c.relativeHumidityPercent(),
                c.pressureKPa().orElse(null), c.deviation(), c.departure().orElse(null), c.deviationReason().orElse(null),
                c.recordedBy(), c.recordedAt());
    }
}
