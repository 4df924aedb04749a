package org.dockgate.bench;

/** The test a reading belongs to, as the data-acquisition format names it. */
public enum ReadingTest {
    /** Static calibration: the point is the set point in the procedure's input unit, with direction and cycle. */
    STATIC,
    /** Noise capture at zero input: the point is the sample index (0, 1, 2 …). */
    NOISE,
    /** Frequency sweep: the point is the frequency in Hz. */
    SWEEP;

    /**
     * The test named by text, ignoring case and surrounding blanks.
     *
     * @param text e.g. "static"
     * @return the test
     * @throws IllegalArgumentException when the text names no test
     */
    public static ReadingTest of(String text) {
        if (text != null) {
            for (ReadingTest t : values()) {
                if (t.name().equalsIgnoreCase(text.strip())) {
                    return t;
                }
            }
        }
        throw new IllegalArgumentException("'" + text + "' is not a test; expected STATIC, NOISE or SWEEP.");
    }
}
