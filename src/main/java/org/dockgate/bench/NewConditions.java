package org.dockgate.bench;

/**
 * Environmental conditions as entered (page, API or companion CSV), not yet checked.
 *
 * @param ambientC                ambient temperature, °C (required)
 * @param relativeHumidityPercent relative humidity, % RH (required)
 * @param pressureKPa             barometric pressure, kPa (optional)
 * @param deviationReason         required when a value lies outside the procedure's limits: why the unit is
 *                                measured anyway; must be empty otherwise
 */
public record NewConditions(Double ambientC, Double relativeHumidityPercent, Double pressureKPa,
                            String deviationReason) {

    /** Ambient and humidity only. */
    public static NewConditions of(double ambientC, double relativeHumidityPercent) {
        return new NewConditions(ambientC, relativeHumidityPercent, null, null);
    }
}
