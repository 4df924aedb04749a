package org.dockgate.core.evaluation;

import java.util.Objects;
import java.util.OptionalDouble;
import java.util.function.DoubleUnaryOperator;
import org.dockgate.core.InputChecks;

/**
 * The readout of a unit's readings (multimeter, DAQ channel, resistance bridge, bridge indicator): what its
 * calibration certificate says about a reading y of the sensor's output, U(y) in output units with the
 * certificate's k (u = U/k, GUM 4.3.3), and its resolution δ as the register records it (the digit of the range
 * used), a rectangular contribution of half-width δ/2 (GUM F.2.2.1).
 *
 * <p>How its error enters each metric (the same model as the stimulus's): a readout error at a reading is common
 * to every reading of that set point, so it cancels in differences at the point (hysteresis, repeatability); it
 * enters the sensitivity as a scale error (U at the top reading over the top input) and the offset, nonlinearity
 * and accuracy as a point error. The resolution is independent at each reading.
 *
 * @param name                  the instrument and its certificate in force, as budget lines name it
 * @param expandedUncertaintyAt U(y) at a reading y, both in output units; must give a finite value ≥ 0
 * @param coverageFactor        k of the certificate, &gt; 0
 * @param resolution            δ in output units from the register, empty when the register has none
 */
public record ReadoutInstrument(String name, DoubleUnaryOperator expandedUncertaintyAt, double coverageFactor,
        OptionalDouble resolution) {

    /**
     * Validates the fields.
     *
     * @throws IllegalArgumentException for a blank name, a missing function, a bad k or a resolution ≤ 0
     */
    public ReadoutInstrument {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("A readout needs a name");
        }
        Objects.requireNonNull(expandedUncertaintyAt, "expandedUncertaintyAt");
        Objects.requireNonNull(resolution, "resolution");
        InputChecks.positive("coverage factor of readout " + name, coverageFactor);
        resolution.ifPresent(d -> InputChecks.positive("resolution of readout " + name, d));
    }

    /**
     * @param reading y in output units
     * @return U(y) in output units, finite and ≥ 0
     */
    public double expandedAt(double reading) {
        return InputChecks.nonNegative("expanded uncertainty of readout " + name + " at " + reading,
                expandedUncertaintyAt.applyAsDouble(reading));
    }
}
