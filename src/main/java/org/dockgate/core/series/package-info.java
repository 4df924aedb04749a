/**
 * Calibration series: readings (input, output, direction, cycle) and the grouping helpers the
 * static-characteristics evaluation needs (means per input, per input and direction).
 */
package org.dockgate.core.series;
