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

    /** The instrument roles of a measurement chain. */
    public enum InstrumentRole {
        /** The reference that applies the input (pressure standard, shaker system, load frame, dry block). */
        STIMULUS,
        /** The instrument that reads the sensor's output (multimeter, DAQ channel, resistance bridge). */
        READOUT,
        /** The supply that excites the sensor (bridge supply; an RTD's measuring current comes from its readout). */
        EXCITATION
    }

    /**
     * The instruments each static test needs, by role, in the words a procedure uses (common practice of test
     * labs): every kind needs its stimulus reference and a readout; a bridge sensor (pressure transducer, load
     * cell) needs its excitation supply; an RTD's measuring current comes from the readout or bridge; an IEPE
     * accelerometer's constant-current supply is not modelled.
     *
     * @return role → what serves in it, in order
     */
    public java.util.Map<InstrumentRole, String> instrumentRoles() {
        java.util.Map<InstrumentRole, String> roles = new java.util.EnumMap<>(InstrumentRole.class);
        roles.put(InstrumentRole.STIMULUS, switch (this) {
            case PRESSURE_TRANSDUCER -> "pressure standard (piston gauge or pressure controller)";
            case ACCELEROMETER -> "reference accelerometer or shaker system";
            case LOAD_CELL -> "load frame with its reference load cell";
            case RTD, THERMOCOUPLE -> "dry block or bath with its reference thermometer";
            case LIGHT_SENSOR -> "reference lamp and photometer";
            case OTHER -> "the stimulus reference";
        });
        roles.put(InstrumentRole.READOUT, switch (this) {
            case RTD -> "resistance bridge or multimeter (4-wire), which also supplies the measuring current";
            case LOAD_CELL -> "ratiometric bridge indicator or DAQ channel";
            default -> "multimeter or DAQ channel";
        });
        if (this == PRESSURE_TRANSDUCER || this == LOAD_CELL) {
            roles.put(InstrumentRole.EXCITATION, "excitation supply (a ratiometric readout cancels its error)");
        }
        return roles;
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
