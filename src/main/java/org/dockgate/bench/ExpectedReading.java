package org.dockgate.bench;

import java.util.Optional;
import java.util.OptionalInt;
import org.dockgate.core.series.Direction;

/**
 * One reading a procedure expects from each unit, at its place in the procedure's order.
 *
 * @param slot      position in the unit's order (0 first)
 * @param test      the test
 * @param point     set point (input unit), sample index or frequency (Hz)
 * @param pointUnit the point's unit ("" for a sample index)
 * @param direction STATIC: UP or DOWN
 * @param cycle     STATIC: cycle from 1
 */
public record ExpectedReading(int slot, ReadingTest test, double point, String pointUnit,
                              Optional<Direction> direction, OptionalInt cycle) {
}
