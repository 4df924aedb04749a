package org.dockgate.instruments;

/**
 * A reference instrument to add to the register, with its first calibration. Checked by
 * {@link InstrumentService#create}.
 *
 * @param identifier  unique, 1–40 letters, digits, '.', '_' or '-' (stored in upper case), e.g. RI-PRS-01
 * @param description what it is, not empty
 * @param quantity    a {@link Quantity} label, e.g. "pressure"
 * @param rangeMin    lower end of the range, finite
 * @param rangeMax    upper end of the range, finite, &gt; rangeMin
 * @param unit        the range unit, of the quantity's kind (e.g. bar, psi, kPa for a pressure)
 * @param calibration its current calibration
 * @param resolution  for a readout (multimeter, DAQ, bridge): its resolution in {@code unit}, the digit of the range
 *                    used (GUM F.2.2.1); null when the instrument is no readout or it is not recorded
 */
public record NewInstrument(String identifier, String description, String quantity, double rangeMin,
                            double rangeMax, String unit, NewCalibration calibration, Double resolution) {

    /** An instrument without a recorded resolution. */
    public NewInstrument(String identifier, String description, String quantity, double rangeMin, double rangeMax,
                         String unit, NewCalibration calibration) {
        this(identifier, description, quantity, rangeMin, rangeMax, unit, calibration, null);
    }
}
