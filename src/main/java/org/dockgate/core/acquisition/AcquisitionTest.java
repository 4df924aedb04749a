package org.dockgate.core.acquisition;

import org.dockgate.core.procedure.TestKind;

/** The {@code test} column of a data-acquisition row. */
public enum AcquisitionTest {
    /** A static calibration reading: point = set point (input units), with direction and cycle. */
    STATIC(TestKind.STATIC_CALIBRATION),
    /** A zero-input noise sample: point = sample index. */
    NOISE(TestKind.NOISE_CAPTURE),
    /** A frequency-response amplitude: point = frequency. */
    SWEEP(TestKind.FREQUENCY_SWEEP);

    private final TestKind kind;

    AcquisitionTest(TestKind kind) {
        this.kind = kind;
    }

    /** @return the procedure's test this row belongs to */
    public TestKind testKind() {
        return kind;
    }
}
