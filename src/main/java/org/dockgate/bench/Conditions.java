package org.dockgate.bench;

import java.time.Instant;

/**
 * The environmental conditions recorded for a unit's bench session. Append-only: a new record replaces
 * the previous one for what follows, the old one stays.
 *
 * @param id                      the record's number
 * @param lotId                   the lot
 * @param serial                  the unit
 * @param ambientC                ambient temperature in °C
 * @param relativeHumidityPercent relative humidity in %
 * @param recordedBy              who
 * @param recordedAt              when (UTC)
 */
public record Conditions(long id, long lotId, String serial, double ambientC, double relativeHumidityPercent,
                         String recordedBy, Instant recordedAt) {
}
