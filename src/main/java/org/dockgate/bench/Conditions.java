package org.dockgate.bench;

import java.time.Instant;
import java.util.Optional;

/**
 * The environmental conditions recorded for a unit's bench session. Append-only: a new record replaces
 * the previous one for what follows, the old one stays.
 *
 * @param id                      the record's number
 * @param lotId                   the lot
 * @param serial                  the unit
 * @param ambientC                ambient temperature in °C
 * @param relativeHumidityPercent relative humidity in %
 * @param pressureKPa             barometric pressure in kPa, when recorded
 * @param departure               for conditions outside the procedure's limits: each value and the limit it
 *                                lies beyond, as checked when saved
 * @param deviationReason         for conditions outside the limits: why the unit was measured anyway (a
 *                                deviation from the procedure, stated on the certificate)
 * @param recordedBy              who
 * @param recordedAt              when (UTC)
 */
public record Conditions(long id, long lotId, String serial, double ambientC, double relativeHumidityPercent,
                         Optional<Double> pressureKPa, Optional<String> departure, Optional<String> deviationReason,
                         String recordedBy, Instant recordedAt) {

    /** @return whether these conditions are a recorded deviation from the procedure */
    public boolean deviation() {
        return deviationReason.isPresent();
    }

    /** @return "ambient temperature 30 °C lies above … — reason: …", when a deviation */
    public Optional<String> deviationText() {
        return deviationReason.map(r -> departure.orElse("outside the procedure's limits") + "; reason: " + r);
    }
}
