package org.dockgate.core.procedure;

/** The datasheet metrics a procedure can verify, with how each is expressed. */
public enum Metric {
    SENSITIVITY("sensitivity unit"),
    ZERO_OFFSET("output unit"),
    ACCURACY("%FSO"),
    NONLINEARITY("%FSO"),
    HYSTERESIS("%FSO"),
    REPEATABILITY("%FSO"),
    NOISE("noise unit, rms"),
    RESOLUTION("input unit"),
    BANDWIDTH("Hz"),
    FLATNESS("% deviation from the reference amplitude"),
    RTD_TOLERANCE("°C");

    private final String expressedIn;

    Metric(String expressedIn) {
        this.expressedIn = expressedIn;
    }

    public String expressedIn() {
        return expressedIn;
    }
}
