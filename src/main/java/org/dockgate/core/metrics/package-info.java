/**
 * Sensor metrics from operator measurements: static characteristics (sensitivity, FSO,
 * nonlinearity, hysteresis, repeatability), accuracy against a nominal transfer function, local
 * sensitivity, noise and resolution, and frequency response (bandwidth, flatness).
 */
package org.dockgate.core.metrics;
