package org.dockgate.core.procedure;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import org.dockgate.core.quantity.Units;

/**
 * One revision of a sensor model's datasheet: its kind, input range and units, and each metric with its
 * limit. Every metric is optional except those the kind needs; the compact constructor refuses a
 * specification that is inconsistent (unit mismatch, empty range, a metric the kind needs missing)
 * with a message for the engineer.
 *
 * @param kind        the sensor kind
 * @param inputUnit   unit of the measurand, e.g. "bar", "g", "°C"
 * @param rangeMin    lower end of the input range, in the input unit
 * @param rangeMax    upper end of the input range
 * @param outputUnit  unit of the sensor output, e.g. "mV", "mV/V", "Ω"
 */
public record SensorSpecification(SensorKind kind, String inputUnit, double rangeMin, double rangeMax,
                                  String outputUnit, Sensitivity sensitivity, ZeroOffset zeroOffset,
                                  Double accuracyPctFso, Double nonlinearityPctFso,
                                  NonlinearityReference nonlinearityReference, Double hysteresisPctFso,
                                  Double repeatabilityPctFso, NoiseFloor noiseFloor, Double resolution,
                                  Bandwidth bandwidth, RtdClass rtd) {

    /** Whether a sensitivity tolerance is absolute (in the sensitivity's unit) or a percentage of nominal. */
    public enum ToleranceMode { ABSOLUTE, PERCENT }

    /** Best-fit straight line (least squares) or terminal (end-point) nonlinearity. */
    public enum NonlinearityReference { BEST_FIT, TERMINAL }

    /** Whether a noise floor is given at the output (e.g. µV rms) or referred to the input (e.g. g rms). */
    public enum Referred { OUTPUT, INPUT }

    public record Sensitivity(double nominal, String unit, double tolerance, ToleranceMode mode) {
        /** The tolerance as a half-width in the sensitivity's unit. */
        public double halfWidth() {
            return mode == ToleranceMode.PERCENT ? Math.abs(nominal) * tolerance / 100.0 : tolerance;
        }
    }

    public record ZeroOffset(double nominal, double tolerance, String unit) {
    }

    public record NoiseFloor(double limit, String unit, Referred referred) {
    }

    /**
     * A −3 dB bandwidth ({@code minus3dBHz}: the response must stay above −3 dB up to it), or a flatness
     * band (within ±{@code flatnessPercent} of the reference up to {@code upToHz}); the reference
     * frequency defaults to the lowest of the sweep.
     */
    public record Bandwidth(Double minus3dBHz, Double flatnessPercent, Double upToHz, Double referenceHz) {
        public double upperHz() {
            return minus3dBHz != null ? minus3dBHz : upToHz;
        }
    }

    /**
     * A platinum RTD's R0, IEC 60751 tolerance class and element construction, which sets the class's
     * validity range (IEC 60751:2008 Table 3). A specification recorded before the construction was asked
     * for has none and reads as wire-wound, the only ranges modelled until then.
     */
    public record RtdClass(double r0Ohm, String toleranceClass, org.dockgate.core.rtd.RtdConstruction construction) {
        public RtdClass {
            if (construction == null) {
                construction = org.dockgate.core.rtd.RtdConstruction.WIRE_WOUND;
            }
        }

        /** A wire-wound element. */
        public RtdClass(double r0Ohm, String toleranceClass) {
            this(r0Ohm, toleranceClass, org.dockgate.core.rtd.RtdConstruction.WIRE_WOUND);
        }
    }

    public SensorSpecification {
        List<String> problems = new ArrayList<>();
        Objects.requireNonNull(kind, "kind");
        if (!Double.isFinite(rangeMin) || !Double.isFinite(rangeMax) || rangeMax <= rangeMin) {
            problems.add("The input range must be two finite numbers with the maximum above the minimum (got "
                    + rangeMin + " … " + rangeMax + ").");
        }
        checkUnit(problems, "input", inputUnit);
        checkUnit(problems, "output", outputUnit);
        if (problems.isEmpty() && kind.inputDimension() != null
                && !Units.dimensionName(inputUnit).equals(kind.inputDimension())) {
            problems.add("A " + label(kind) + " measures " + kind.inputDimension() + ", but the input unit '"
                    + inputUnit + "' is a unit of " + Units.dimensionName(inputUnit) + ".");
        }
        if (sensitivity != null && problems.isEmpty()) {
            String expected = "(" + outputUnit + ")/(" + inputUnit + ")";
            if (!isUnit(sensitivity.unit()) || !Units.isCompatible(sensitivity.unit(), Units.toUcum(expected))) {
                problems.add("The sensitivity unit '" + sensitivity.unit() + "' does not fit a " + label(kind)
                        + " with output in " + outputUnit + " and input in " + inputUnit + " (expected "
                        + outputUnit + "/" + inputUnit + " or an equivalent).");
            }
            if (!Double.isFinite(sensitivity.nominal()) || sensitivity.nominal() == 0) {
                problems.add("The nominal sensitivity must be a non-zero number.");
            }
            positive(problems, "sensitivity tolerance", sensitivity.tolerance());
        }
        if (zeroOffset != null && problems.isEmpty()) {
            if (!isUnit(zeroOffset.unit()) || !Units.isCompatible(zeroOffset.unit(), outputUnit)) {
                problems.add("The zero offset is an output value: its unit '" + zeroOffset.unit()
                        + "' must be compatible with the output unit " + outputUnit + ".");
            }
            positive(problems, "zero offset tolerance", zeroOffset.tolerance());
        }
        positiveIfGiven(problems, "accuracy (%FSO)", accuracyPctFso);
        positiveIfGiven(problems, "nonlinearity (%FSO)", nonlinearityPctFso);
        positiveIfGiven(problems, "hysteresis (%FSO)", hysteresisPctFso);
        positiveIfGiven(problems, "repeatability (%FSO)", repeatabilityPctFso);
        positiveIfGiven(problems, "resolution", resolution);
        if (nonlinearityPctFso != null && nonlinearityReference == null) {
            nonlinearityReference = NonlinearityReference.BEST_FIT;
        }
        if (noiseFloor != null && problems.isEmpty()) {
            positive(problems, "noise floor", noiseFloor.limit());
            String against = noiseFloor.referred() == Referred.INPUT ? inputUnit : outputUnit;
            if (!isUnit(noiseFloor.unit()) || !Units.isCompatible(noiseFloor.unit(), against)) {
                problems.add("A noise floor referred to the " + noiseFloor.referred().name().toLowerCase(Locale.ROOT)
                        + " must be in a unit of " + against + ", not '" + noiseFloor.unit() + "'.");
            }
        }
        if (bandwidth != null) {
            boolean minus3 = bandwidth.minus3dBHz() != null;
            boolean flat = bandwidth.flatnessPercent() != null || bandwidth.upToHz() != null;
            if (minus3 == flat) {
                problems.add("Give the bandwidth either as a −3 dB frequency or as a flatness band (± % up to a"
                        + " frequency), not both or neither.");
            } else if (minus3) {
                positive(problems, "−3 dB frequency", bandwidth.minus3dBHz());
            } else {
                positive(problems, "flatness band (%)", bandwidth.flatnessPercent() == null ? 0 : bandwidth.flatnessPercent());
                positive(problems, "flatness band frequency", bandwidth.upToHz() == null ? 0 : bandwidth.upToHz());
            }
            if (bandwidth.referenceHz() != null) {
                positive(problems, "reference frequency", bandwidth.referenceHz());
            }
        }
        if (rtd != null) {
            positive(problems, "R0", rtd.r0Ohm());
            try {
                org.dockgate.core.rtd.ToleranceClass.parse(rtd.toleranceClass());
            } catch (IllegalArgumentException e) {
                problems.add(e.getMessage());
            }
            if (problems.isEmpty() && !Units.isCompatible(outputUnit, "Ohm")) {
                problems.add("An RTD's output is a resistance; the output unit '" + outputUnit + "' is not.");
            }
        }
        switch (kind) {
            case ACCELEROMETER, LIGHT_SENSOR -> {
                if (sensitivity == null) {
                    problems.add("A " + label(kind) + " needs its sensitivity.");
                }
            }
            case PRESSURE_TRANSDUCER, LOAD_CELL -> {
                if (sensitivity == null && accuracyPctFso == null) {
                    problems.add("A " + label(kind) + " needs its sensitivity or its accuracy (%FSO).");
                }
            }
            case RTD -> {
                if (rtd == null) {
                    problems.add("An RTD needs its R0 and tolerance class.");
                }
            }
            case THERMOCOUPLE -> {
                if (accuracyPctFso == null) {
                    problems.add("A thermocouple needs its accuracy (%FSO).");
                }
            }
            case OTHER -> {
                if (sensitivity == null && accuracyPctFso == null && nonlinearityPctFso == null) {
                    problems.add("Give at least one metric with its limit.");
                }
            }
        }
        if (!problems.isEmpty()) {
            throw new IllegalArgumentException(String.join(" ", problems));
        }
    }

    public double span() {
        return rangeMax - rangeMin;
    }

    private static String label(SensorKind kind) {
        return kind.name().toLowerCase(Locale.ROOT).replace('_', ' ');
    }

    private static boolean isUnit(String unit) {
        try {
            Units.parse(unit);
            return true;
        } catch (RuntimeException e) {
            return false;
        }
    }

    private static void checkUnit(List<String> problems, String which, String unit) {
        if (unit == null || unit.isBlank()) {
            problems.add("The " + which + " unit is missing.");
        } else if (!isUnit(unit)) {
            problems.add("The " + which + " unit '" + unit + "' is not a unit Dockgate knows.");
        }
    }

    private static void positive(List<String> problems, String what, double value) {
        if (!Double.isFinite(value) || value <= 0) {
            problems.add("The " + what + " must be a positive number (got " + value + ").");
        }
    }

    private static void positiveIfGiven(List<String> problems, String what, Double value) {
        if (value != null) {
            positive(problems, what, value);
        }
    }
}
