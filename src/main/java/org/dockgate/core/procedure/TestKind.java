package org.dockgate.core.procedure;

/** The tests a procedure can contain. */
public enum TestKind {
    /** Points over the input range, ascending (and descending), in cycles. */
    STATIC_CALIBRATION,
    /** Samples of the output at zero input. */
    NOISE_CAPTURE,
    /** Output amplitude at a series of frequencies. */
    FREQUENCY_SWEEP
}
