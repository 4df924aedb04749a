package org.dockgate.instruments;

/**
 * A value lies outside the range an instrument's calibration covers: the instrument cannot serve that value
 * (its certificate says nothing about it). The message names the instrument, its calibrated range and the value.
 */
public class OutsideCalibratedRangeException extends IllegalArgumentException {

    public OutsideCalibratedRangeException(String message) {
        super(message);
    }
}
