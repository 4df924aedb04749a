package org.dockgate.core.evaluation;

import java.util.Objects;
import java.util.OptionalDouble;
import org.dockgate.core.InputChecks;

/**
 * The environment of a measurement as far as the budget uses it: how far the ambient temperature was from
 * the reference conditions, and the sensor's temperature coefficients when the datasheet gives them.
 *
 * <p>An uncorrected temperature effect of known bound enters the budget as a rectangular distribution of
 * half-width a = |coefficient| × |ΔT| (GUM 4.3.7 for the rectangular model; treating the uncorrected effect
 * so is common practice). Without a coefficient the deviation is recorded but gives no contribution, and
 * the budget says so.
 *
 * @param temperatureDeviationC          ΔT = ambient − reference temperature, in kelvin (°C difference), finite
 * @param gainCoefficientPercentPerC     thermal sensitivity shift, % of reading per °C, if given (≥ 0)
 * @param zeroCoefficientPercentFsoPerC  thermal zero shift, % of full-scale output per °C, if given (≥ 0)
 */
public record Environment(double temperatureDeviationC, OptionalDouble gainCoefficientPercentPerC,
        OptionalDouble zeroCoefficientPercentFsoPerC) {

    /**
     * Validates the values.
     *
     * @throws IllegalArgumentException when ΔT is not finite or a coefficient is negative or not finite
     */
    public Environment {
        InputChecks.finite("temperature deviation", temperatureDeviationC);
        Objects.requireNonNull(gainCoefficientPercentPerC, "gainCoefficientPercentPerC");
        Objects.requireNonNull(zeroCoefficientPercentFsoPerC, "zeroCoefficientPercentFsoPerC");
        gainCoefficientPercentPerC.ifPresent(c -> InputChecks.nonNegative("gain temperature coefficient", c));
        zeroCoefficientPercentFsoPerC.ifPresent(c -> InputChecks.nonNegative("zero temperature coefficient", c));
    }

    /**
     * An environment recorded from the ambient temperature, without temperature coefficients.
     *
     * @param ambientC   the ambient temperature recorded at the bench, °C
     * @param referenceC the reference temperature of the datasheet (23 °C in the lab unless stated), °C
     * @return the environment with ΔT = ambient − reference
     */
    public static Environment fromAmbient(double ambientC, double referenceC) {
        return new Environment(InputChecks.finite("ambient temperature", ambientC)
                - InputChecks.finite("reference temperature", referenceC), OptionalDouble.empty(),
                OptionalDouble.empty());
    }

    /** @return a copy with the thermal sensitivity (gain) shift in % of reading per °C */
    public Environment withGainCoefficient(double percentPerC) {
        return new Environment(temperatureDeviationC, OptionalDouble.of(percentPerC), zeroCoefficientPercentFsoPerC);
    }

    /** @return a copy with the thermal zero shift in % of full-scale output per °C */
    public Environment withZeroCoefficient(double percentFsoPerC) {
        return new Environment(temperatureDeviationC, gainCoefficientPercentPerC, OptionalDouble.of(percentFsoPerC));
    }
}
