package org.dockgate.core.evaluation;

import org.dockgate.core.InputChecks;

/**
 * The excitation of an excited sensor (a bridge's supply, an RTD's measuring current): its certificate's
 * relative standard uncertainty u(V)/V at the excitation used, or a statement that the measurement cancels it.
 *
 * <p>How it enters: a bridge's output is proportional to its excitation, so a relative excitation error is a
 * scale error of every reading (y·u(V)/V): it acts on the sensitivity, the offset and the accuracy, not on
 * figures in %FSO of the same readings (nonlinearity, hysteresis, repeatability), which scale with it. A
 * ratiometric measurement (output in mV/V, the readout referencing the same excitation) cancels it entirely.
 *
 * @param name        the instrument and its certificate in force, as budget lines name it
 * @param relativeStandardUncertainty u(V)/V, ≥ 0 (0 when {@code cancelled})
 * @param cancelled   true when the measurement cancels the excitation's error
 * @param why         the reason in words, for the budget line (e.g. "ratiometric measurement, output in mV/V")
 */
public record ExcitationSupply(String name, double relativeStandardUncertainty, boolean cancelled, String why) {

    /**
     * Validates the fields.
     *
     * @throws IllegalArgumentException for a blank name or a negative or non-finite uncertainty
     */
    public ExcitationSupply {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("An excitation supply needs a name");
        }
        InputChecks.nonNegative("relative uncertainty of excitation " + name, relativeStandardUncertainty);
        why = why == null ? "" : why;
    }
}
