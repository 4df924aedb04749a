package org.dockgate.instruments;

/**
 * How a certificate states an expanded uncertainty U.
 *
 * <ul>
 *   <li>{@link #ABSOLUTE}: U in the instrument's range unit, the same at every value of the band;</li>
 *   <li>{@link #PERCENT_OF_READING}: U = u% × |value| / 100;</li>
 *   <li>{@link #PERCENT_OF_FULL_SCALE}: U = u% × full scale / 100, with full scale the larger magnitude of
 *       the range limits, max(|min|, |max|) (common practice for an instrument's range; a span-based figure
 *       can be entered as ABSOLUTE).</li>
 * </ul>
 */
public enum UncertaintyMode {
    ABSOLUTE,
    PERCENT_OF_READING,
    PERCENT_OF_FULL_SCALE
}
