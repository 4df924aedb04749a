package org.dockgate.core.series;

/**
 * The direction from which a calibration point was approached during a traverse.
 *
 * <p>IEC 61298-2 style calibrations traverse the range upscale and downscale over several
 * cycles; hysteresis compares the two directions at the same input.
 */
public enum Direction {
    /** Approached from a lower input (upscale traverse). */
    UP,
    /** Approached from a higher input (downscale traverse). */
    DOWN
}
