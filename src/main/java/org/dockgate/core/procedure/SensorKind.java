package org.dockgate.core.procedure;

import java.util.List;

/** The kinds of sensor the lab receives, with the input dimension each must have and its bench habits. */
public enum SensorKind {
    ACCELEROMETER("acceleration", 5),
    PRESSURE_TRANSDUCER("pressure", 30),
    LOAD_CELL("force", 30),
    RTD("temperature", 300),
    THERMOCOUPLE("temperature", 300),
    LIGHT_SENSOR("illuminance", 10),
    OTHER(null, 10);

    private final String inputDimension;
    private final int settleSeconds;

    SensorKind(String inputDimension, int settleSeconds) {
        this.inputDimension = inputDimension;
        this.settleSeconds = settleSeconds;
    }

    /** The dimension name (as {@code Units.dimensionName} gives it) the input unit must have, or null for OTHER. */
    public String inputDimension() {
        return inputDimension;
    }

    /**
     * Settle time per static point (common practice: pressure and load need seconds to tens of seconds
     * for creep and thermal effects to die down; a thermometer in a dry block needs minutes to reach
     * equilibrium; an accelerometer on a shaker settles in seconds).
     */
    public int settleSeconds() {
        return settleSeconds;
    }

    /**
     * Safety cautions for the bench, by kind (common practice of test labs). Every procedure also
     * says that local codes and the lab's own safety rules govern.
     */
    public List<String> cautions() {
        return switch (this) {
            case PRESSURE_TRANSDUCER -> List.of(
                    "Pressurised fittings store energy: check fitting ratings against the test pressure, vent the"
                            + " system before connecting or disconnecting, and keep the transparent shield in place.",
                    "Never exceed the transducer's proof pressure; use the relief valve set for the range.");
            case LOAD_CELL -> List.of(
                    "Loaded frames store energy: keep hands clear of the load path and use the guard while loading.",
                    "Do not exceed the rated overload; align the load to avoid side loads that can eject the part.");
            case ACCELEROMETER -> List.of(
                    "Piezoelectric sensors can hold a charge after shocks or temperature changes: short the output"
                            + " before handling and connecting.",
                    "Mount on the shaker with the specified torque; a loose sensor can be thrown at high amplitude.");
            case RTD, THERMOCOUPLE -> List.of(
                    "Hot or cryogenic baths and dry blocks burn: wear gloves and face protection, let probes cool"
                            + " before handling, never put a wet probe into a hot bath.",
                    "Keep measuring current at the specified value to avoid self-heating.");
            case LIGHT_SENSOR -> List.of(
                    "Reference lamps get hot and some emit UV: use the enclosure and eye protection.");
            case OTHER -> List.of("Check the datasheet's ratings before applying stimulus or excitation.");
        };
    }
}
