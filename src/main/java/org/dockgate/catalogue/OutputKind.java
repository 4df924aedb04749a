package org.dockgate.catalogue;

/** What the sensor's output is, electrically. */
public enum OutputKind { VOLTAGE, CURRENT_LOOP, RESISTANCE, CHARGE, DIGITAL }
