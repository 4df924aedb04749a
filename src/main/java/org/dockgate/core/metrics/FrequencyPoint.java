package org.dockgate.core.metrics;

/**
 * One point of a measured frequency response: the excitation frequency and the amplitude of the
 * sensor's response (sensitivity magnitude or output amplitude at constant excitation).
 *
 * @param frequencyHz frequency in hertz, finite and greater than 0 (it is placed on a log scale)
 * @param amplitude   response amplitude, finite and greater than 0 (it is expressed in dB)
 */
public record FrequencyPoint(double frequencyHz, double amplitude) {

    /**
     * Validates the point.
     *
     * @throws IllegalArgumentException when the frequency or the amplitude is not a finite
     *                                  number greater than 0
     */
    public FrequencyPoint {
        if (!Double.isFinite(frequencyHz) || !(frequencyHz > 0)) {
            throw new IllegalArgumentException("A frequency must be a finite number of hertz greater than 0, got "
                    + frequencyHz);
        }
        if (!Double.isFinite(amplitude) || !(amplitude > 0)) {
            throw new IllegalArgumentException("An amplitude must be a finite number greater than 0 (it is expressed "
                    + "in dB), got " + amplitude + " at " + frequencyHz + " Hz");
        }
    }
}
