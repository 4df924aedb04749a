package org.dockgate.core.metrics;

import java.util.OptionalDouble;
import org.apache.commons.math3.stat.StatUtils;
import org.dockgate.core.UnevaluableException;

/**
 * Noise, resolution and dynamic range from output samples recorded at zero input.
 *
 * <p>Definitions:
 * <ul>
 *   <li>mean v̄ = Σv/n (the zero-input output, not part of the noise);</li>
 *   <li>RMS noise = the sample standard deviation √(Σ(v − v̄)²/(n − 1)) (AC noise about the mean;
 *       Dockgate's fixed convention, the n − 1 form of JCGM 100:2008 4.2.2);</li>
 *   <li>peak-to-peak = max v − min v of the record (no Gaussian multiplier is implied);</li>
 *   <li>resolution = RMS noise / |sensitivity|, in input units (noise-limited threshold, the
 *       reference sheet's §1.2 convention);</li>
 *   <li>minimum detectable input = k × RMS noise / |sensitivity| with k = 3 by default
 *       (common practice: a signal about three times the noise floor is detectable, as the
 *       3·s_blank limit of detection);</li>
 *   <li>dynamic range = 20·log₁₀(full-scale input / minimum detectable input) dB (amplitude
 *       quantities).</li>
 * </ul>
 *
 * @param n                     number of samples, 2 or more
 * @param mean                  v̄ (output units)
 * @param rmsNoise              sample standard deviation (output units)
 * @param peakToPeak            max − min (output units)
 * @param resolution            rmsNoise / |sensitivity| (input units)
 * @param minimumDetectable     k·rmsNoise / |sensitivity| (input units)
 * @param detectionMultiplier   k
 * @param dynamicRangeDb        20·log₁₀(fullScaleInput / minimumDetectable); absent without a
 *                              full-scale input, and absent when the noise is exactly zero (the
 *                              range would be infinite)
 */
public record NoiseAnalysis(
        int n,
        double mean,
        double rmsNoise,
        double peakToPeak,
        double resolution,
        double minimumDetectable,
        double detectionMultiplier,
        OptionalDouble dynamicRangeDb) {

    /** Default multiplier k of the minimum detectable input (common practice: three times the noise). */
    public static final double DEFAULT_DETECTION_MULTIPLIER = 3.0;

    /**
     * Checks the optional is given.
     *
     * @throws IllegalArgumentException when dynamicRangeDb is null
     */
    public NoiseAnalysis {
        if (dynamicRangeDb == null) {
            throw new IllegalArgumentException("The dynamic range must be given (possibly empty)");
        }
    }

    /**
     * Analyses zero-input samples without a full-scale input (no dynamic range).
     *
     * @param samples     zero-input output samples
     * @param sensitivity the sensor's sensitivity (output units per input unit)
     * @return the analysis
     * @throws IllegalArgumentException as {@link #of(double[], double, OptionalDouble, double)}
     * @throws UnevaluableException     as {@link #of(double[], double, OptionalDouble, double)}
     */
    public static NoiseAnalysis of(double[] samples, double sensitivity) {
        return of(samples, sensitivity, OptionalDouble.empty(), DEFAULT_DETECTION_MULTIPLIER);
    }

    /**
     * Analyses zero-input samples with the default multiplier k = 3.
     *
     * @param samples        zero-input output samples
     * @param sensitivity    the sensor's sensitivity (output units per input unit)
     * @param fullScaleInput the full-scale input (input units), if known
     * @return the analysis
     * @throws IllegalArgumentException as {@link #of(double[], double, OptionalDouble, double)}
     * @throws UnevaluableException     as {@link #of(double[], double, OptionalDouble, double)}
     */
    public static NoiseAnalysis of(double[] samples, double sensitivity, OptionalDouble fullScaleInput) {
        return of(samples, sensitivity, fullScaleInput, DEFAULT_DETECTION_MULTIPLIER);
    }

    /**
     * Analyses zero-input samples (definitions in the class description).
     *
     * <p>Edge cases: a record with no variation gives RMS noise, resolution and minimum
     * detectable input 0 and no dynamic range (infinite, reported absent).
     *
     * @param samples             zero-input output samples, finite, at least two
     * @param sensitivity         sensitivity, finite and not zero (its sign is ignored)
     * @param fullScaleInput      full-scale input, finite and greater than 0, if known
     * @param detectionMultiplier k, finite and greater than 0
     * @return the analysis
     * @throws IllegalArgumentException for no samples, a non-finite sample, a zero or non-finite
     *                                  sensitivity, a non-positive full scale or multiplier
     * @throws UnevaluableException     for a single sample (no standard deviation)
     */
    public static NoiseAnalysis of(double[] samples, double sensitivity, OptionalDouble fullScaleInput,
            double detectionMultiplier) {
        if (samples == null || samples.length == 0) {
            throw new IllegalArgumentException("A noise analysis needs samples; none were given");
        }
        for (int i = 0; i < samples.length; i++) {
            if (!Double.isFinite(samples[i])) {
                throw new IllegalArgumentException("Sample " + (i + 1) + " is not a finite number: " + samples[i]);
            }
        }
        if (!Double.isFinite(sensitivity) || sensitivity == 0) {
            throw new IllegalArgumentException("The sensitivity must be a finite, non-zero number, got " + sensitivity);
        }
        if (fullScaleInput == null) {
            throw new IllegalArgumentException("The full-scale input must be given (possibly empty)");
        }
        if (fullScaleInput.isPresent()
                && (!Double.isFinite(fullScaleInput.getAsDouble()) || !(fullScaleInput.getAsDouble() > 0))) {
            throw new IllegalArgumentException("The full-scale input must be a finite number greater than 0, got "
                    + fullScaleInput.getAsDouble());
        }
        if (!Double.isFinite(detectionMultiplier) || !(detectionMultiplier > 0)) {
            throw new IllegalArgumentException("The detection multiplier must be a finite number greater than 0, got "
                    + detectionMultiplier);
        }
        if (samples.length < 2) {
            throw new UnevaluableException("RMS noise (a sample standard deviation) needs at least two samples, got 1");
        }
        double mean = StatUtils.mean(samples);
        // Commons Math's Variance is the bias-corrected (n − 1) two-pass estimate.
        double rms = Math.sqrt(StatUtils.variance(samples, mean));
        double peakToPeak = StatUtils.max(samples) - StatUtils.min(samples);
        if (!Double.isFinite(mean) || !Double.isFinite(rms) || !Double.isFinite(peakToPeak)) {
            throw new UnevaluableException("The samples are too large to analyse in double precision");
        }
        double resolution = rms / Math.abs(sensitivity);
        double minimumDetectable = detectionMultiplier * resolution;
        OptionalDouble dynamicRange = OptionalDouble.empty();
        if (fullScaleInput.isPresent() && minimumDetectable > 0) {
            double db = 20.0 * Math.log10(fullScaleInput.getAsDouble() / minimumDetectable);
            if (Double.isFinite(db)) {
                dynamicRange = OptionalDouble.of(db);
            }
        }
        return new NoiseAnalysis(samples.length, mean, rms, peakToPeak, resolution, minimumDetectable,
                detectionMultiplier, dynamicRange);
    }
}
