package org.dockgate.core.metrics;

import org.dockgate.core.UnevaluableException;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.CalibrationSeries;

/**
 * Accuracy (measured error) of a sensor against its nominal transfer function: the largest error
 * of any single reading, expressed in input units and in percent of the input span.
 *
 * <p>Reading i's error in output units is eᵧ = yᵢ − y_nom(xᵢ). Expressed in input units it is
 * either, by {@link ErrorConversion#INVERSE_CURVE}, e_x = x_nom⁻¹(yᵢ) − xᵢ (the input the nominal
 * curve would indicate, minus the applied input; exact for any monotonic curve), or, by
 * {@link ErrorConversion#LOCAL_SENSITIVITY}, e_x = eᵧ / S(xᵢ) with S the local nominal sensitivity
 * (the first-order approximation commonly used with thermometer tables). For a straight nominal
 * line both are equal. The percentage is |e_x| / (rangeMax − rangeMin) × 100, accuracy as a
 * percent of span in the sense of ANSI/ISA-51.1 (from memory), with the span in input units.
 *
 * @param worstReading            the reading with the largest |e_x|
 * @param maxErrorInput           its error in input units (signed: positive reads high)
 * @param maxErrorOutput          its error in output units, yᵢ − y_nom(xᵢ) (signed)
 * @param maxErrorPercentSpan     |maxErrorInput| / (rangeMax − rangeMin) × 100
 * @param conversion              how output errors were expressed in input units
 */
public record Accuracy(
        CalibrationPoint worstReading,
        double maxErrorInput,
        double maxErrorOutput,
        double maxErrorPercentSpan,
        ErrorConversion conversion) {

    /** How an output error is expressed in input units. */
    public enum ErrorConversion {
        /** e_x = x_nom⁻¹(y) − x, through the inverse of the nominal curve. */
        INVERSE_CURVE,
        /** e_x = (y − y_nom(x)) / S(x), through the local nominal sensitivity at the applied input. */
        LOCAL_SENSITIVITY
    }

    /**
     * Checks the components.
     *
     * @throws IllegalArgumentException when the reading or the conversion is null or a value is not finite
     */
    public Accuracy {
        if (worstReading == null || conversion == null) {
            throw new IllegalArgumentException("An accuracy result needs its reading and conversion");
        }
        if (!Double.isFinite(maxErrorInput) || !Double.isFinite(maxErrorOutput)
                || !Double.isFinite(maxErrorPercentSpan)) {
            throw new IllegalArgumentException("Accuracy errors must be finite numbers");
        }
    }

    /**
     * Evaluates accuracy with the inverse nominal curve (see the class description).
     *
     * @param series   the readings
     * @param nominal  the nominal transfer function
     * @param rangeMin lower range value (input units)
     * @param rangeMax upper range value (input units)
     * @return the largest error
     * @throws IllegalArgumentException as {@link #of(CalibrationSeries, TransferFunction, double, double, ErrorConversion)}
     * @throws UnevaluableException     as {@link #of(CalibrationSeries, TransferFunction, double, double, ErrorConversion)}
     */
    public static Accuracy of(CalibrationSeries series, TransferFunction nominal, double rangeMin, double rangeMax) {
        return of(series, nominal, rangeMin, rangeMax, ErrorConversion.INVERSE_CURVE);
    }

    /**
     * Evaluates accuracy (formulas in the class description).
     *
     * <p>Edge cases: ties keep the first reading in series order; a reading whose output lies
     * outside the nominal curve's range cannot be converted by the inverse curve.
     *
     * @param series     the readings
     * @param nominal    the nominal transfer function
     * @param rangeMin   lower range value (input units), finite
     * @param rangeMax   upper range value (input units), finite, not below rangeMin
     * @param conversion how output errors are expressed in input units
     * @return the largest error
     * @throws IllegalArgumentException when an argument is null, a range value is not finite or
     *                                  rangeMax &lt; rangeMin
     * @throws UnevaluableException     when the span is zero, the local sensitivity is zero, or a
     *                                  reading lies outside the nominal curve
     */
    public static Accuracy of(CalibrationSeries series, TransferFunction nominal, double rangeMin, double rangeMax,
            ErrorConversion conversion) {
        if (series == null || nominal == null || conversion == null) {
            throw new IllegalArgumentException("Accuracy needs a series, a nominal transfer function and a conversion");
        }
        if (!Double.isFinite(rangeMin) || !Double.isFinite(rangeMax)) {
            throw new IllegalArgumentException("The range limits must be finite numbers, got " + rangeMin + " … "
                    + rangeMax);
        }
        if (rangeMax < rangeMin) {
            throw new IllegalArgumentException("The range maximum " + rangeMax + " is below the range minimum "
                    + rangeMin);
        }
        if (rangeMax == rangeMin) {
            throw new UnevaluableException("The range has zero span; accuracy in percent of span cannot be evaluated");
        }
        CalibrationPoint worst = null;
        double worstInput = 0;
        double worstOutput = 0;
        for (CalibrationPoint p : series.points()) {
            double errorOutput = p.output() - nominal.output(p.input());
            double errorInput;
            if (conversion == ErrorConversion.INVERSE_CURVE) {
                errorInput = nominal.input(p.output()) - p.input();
            } else {
                double s = nominal.sensitivityAt(p.input());
                if (s == 0 || !Double.isFinite(s)) {
                    throw new UnevaluableException("The nominal sensitivity at input " + p.input() + " is " + s
                            + "; the error cannot be expressed in input units");
                }
                errorInput = errorOutput / s;
            }
            if (worst == null || Math.abs(errorInput) > Math.abs(worstInput)) {
                worst = p;
                worstInput = errorInput;
                worstOutput = errorOutput;
            }
        }
        return new Accuracy(worst, worstInput, worstOutput, Math.abs(worstInput) / (rangeMax - rangeMin) * 100.0,
                conversion);
    }
}
