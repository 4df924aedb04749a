package org.dockgate.core.procedure;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import org.dockgate.core.acquisition.AmbientConditions;

/**
 * The environmental conditions a procedure allows while a unit is measured: an ambient temperature range
 * and a relative-humidity range, both inclusive. A recording outside them is refused, or kept as a
 * deviation from the procedure with its reason (ISO/IEC 17025:2017 7.8.2.1 n: the report states
 * deviations from the method).
 *
 * @param ambientMinC          lowest ambient temperature, °C
 * @param ambientMaxC          highest ambient temperature, °C (≥ the lowest)
 * @param humidityMinPercent   lowest relative humidity, % RH (0 … 100)
 * @param humidityMaxPercent   highest relative humidity, % RH (≥ the lowest, ≤ 100)
 * @param basis                where the limits come from, for people ("common practice for …", or the engineer's edit)
 */
public record EnvironmentalLimits(double ambientMinC, double ambientMaxC, double humidityMinPercent,
                                  double humidityMaxPercent, String basis) {

    /**
     * The lab's general limits: 23 ± 5 °C and 20 … 80 % RH (common practice for a laboratory in the
     * standard reference atmosphere of 23 °C; the same text the procedures stated before limits were checked).
     */
    public static final EnvironmentalLimits GENERAL = new EnvironmentalLimits(18, 28, 20, 80,
            "common practice for a laboratory at the reference temperature of 23 °C: 23 ± 5 °C, 20 … 80 % RH");

    /**
     * Validates the ranges.
     *
     * @throws IllegalArgumentException when a bound is not finite, a range is reversed, the temperature lies
     *                                  below absolute zero or the humidity outside 0 … 100 %
     */
    public EnvironmentalLimits {
        for (double v : new double[] {ambientMinC, ambientMaxC, humidityMinPercent, humidityMaxPercent}) {
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException("Environmental limits must be finite numbers, got " + v + ".");
            }
        }
        if (ambientMinC > ambientMaxC) {
            throw new IllegalArgumentException("The lowest ambient temperature " + fmt(ambientMinC)
                    + " °C lies above the highest " + fmt(ambientMaxC) + " °C.");
        }
        if (ambientMinC < AmbientConditions.ABSOLUTE_ZERO_C) {
            throw new IllegalArgumentException("The lowest ambient temperature lies below absolute zero.");
        }
        if (humidityMinPercent < 0 || humidityMaxPercent > 100 || humidityMinPercent > humidityMaxPercent) {
            throw new IllegalArgumentException("The relative-humidity limits must satisfy 0 ≤ lowest ≤ highest ≤ 100 %,"
                    + " got " + fmt(humidityMinPercent) + " … " + fmt(humidityMaxPercent) + " %.");
        }
        basis = basis == null || basis.isBlank() ? "set by the engineer" : basis.strip();
    }

    /**
     * The limits a procedure for a kind of sensor starts from (common practice; the engineer may edit them).
     * Accelerometers keep the humidity at most 75 % RH, the upper humidity of the reference conditions of
     * vibration calibration (ISO 16063-21, from memory); every other kind the lab's {@link #GENERAL} limits.
     *
     * @param kind the sensor kind
     * @return the default limits
     */
    public static EnvironmentalLimits defaultFor(SensorKind kind) {
        if (kind == SensorKind.ACCELEROMETER) {
            return new EnvironmentalLimits(18, 28, 20, 75, "common practice for vibration calibration: 23 ± 5 °C,"
                    + " at most 75 % RH");
        }
        return GENERAL;
    }

    /**
     * Where recorded conditions lie outside these limits, one line per quantity, each naming the value and
     * the limit ("ambient temperature 30.5 °C lies above the procedure's limit of 28 °C (18 … 28 °C)").
     * Bounds are inclusive. Barometric pressure has no limit here: it is recorded, not judged.
     *
     * @param c the recorded conditions
     * @return the departures, empty when the conditions are within the limits
     */
    public List<String> departures(AmbientConditions c) {
        List<String> out = new ArrayList<>();
        if (c.ambientC() < ambientMinC || c.ambientC() > ambientMaxC) {
            boolean low = c.ambientC() < ambientMinC;
            out.add("ambient temperature " + fmt(c.ambientC()) + " °C lies " + (low ? "below" : "above")
                    + " the procedure's limit of " + fmt(low ? ambientMinC : ambientMaxC) + " °C (" + ambientText() + ")");
        }
        double h = c.relativeHumidityPercent();
        if (h < humidityMinPercent || h > humidityMaxPercent) {
            boolean low = h < humidityMinPercent;
            out.add("relative humidity " + fmt(h) + " % lies " + (low ? "below" : "above") + " the procedure's limit of "
                    + fmt(low ? humidityMinPercent : humidityMaxPercent) + " % RH (" + humidityText() + ")");
        }
        return out;
    }

    /** @return "18 … 28 °C" */
    public String ambientText() {
        return fmt(ambientMinC) + " … " + fmt(ambientMaxC) + " °C";
    }

    /** @return "20 … 80 % RH" */
    public String humidityText() {
        return fmt(humidityMinPercent) + " … " + fmt(humidityMaxPercent) + " % RH";
    }

    /** @return the limits in one sentence, as procedure pages and PDFs state them */
    public String describe() {
        return "Ambient temperature " + ambientText() + ", relative humidity " + humidityText() + " (" + basis
                + "). Conditions outside these limits are refused, or recorded as a deviation from the procedure"
                + " with its reason, which the certificate states.";
    }

    static String fmt(double v) {
        return new BigDecimal(Double.toString(v)).stripTrailingZeros().toPlainString();
    }
}
