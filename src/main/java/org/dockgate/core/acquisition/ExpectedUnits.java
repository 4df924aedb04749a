package org.dockgate.core.acquisition;

import org.dockgate.core.quantity.Units;

/**
 * The units a file's readings are converted to: the procedure's input unit (STATIC points), its output unit
 * (STATIC and NOISE values) and the unit of sweep amplitudes (SWEEP values; usually the output unit).
 * Frequencies are converted to hertz.
 *
 * @param inputUnit  unit of static set points, e.g. "bar"
 * @param outputUnit unit of static readings and noise samples, e.g. "mV"
 * @param sweepUnit  unit of sweep amplitudes, e.g. "mV" or "mV/g"
 */
public record ExpectedUnits(String inputUnit, String outputUnit, String sweepUnit) {

    /**
     * Checks that the units are known.
     *
     * @throws IllegalArgumentException when a unit is missing or unknown
     */
    public ExpectedUnits {
        Units.parse(inputUnit);
        Units.parse(outputUnit);
        Units.parse(sweepUnit);
    }

    /**
     * Units for a procedure whose sweep amplitudes are in the output unit.
     *
     * @param inputUnit  the input unit
     * @param outputUnit the output unit
     * @return the expected units
     */
    public static ExpectedUnits of(String inputUnit, String outputUnit) {
        return new ExpectedUnits(inputUnit, outputUnit, outputUnit);
    }
}
