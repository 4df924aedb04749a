package org.dockgate.core.rtd;

import org.dockgate.core.UnevaluableException;
import org.dockgate.core.metrics.TransferFunction;

/**
 * The Callendar–Van Dusen equation of a platinum resistance thermometer (IEC 60751:2008, also
 * in the 2022 edition as far as checked; reference sheet §6.1 and check case A8):
 * <ul>
 *   <li>−200 °C ≤ t &lt; 0 °C: R(t) = R₀[1 + A·t + B·t² + C·(t − 100 °C)·t³];</li>
 *   <li>0 °C ≤ t ≤ 850 °C: R(t) = R₀[1 + A·t + B·t²];</li>
 *   <li>A = 3.9083×10⁻³ °C⁻¹, B = −5.775×10⁻⁷ °C⁻², C = −4.183×10⁻¹² °C⁻⁴ (IEC 60751 values for
 *       industrial platinum thermometers, any R₀: Pt100, Pt500, Pt1000).</li>
 * </ul>
 * Other coefficients (from an individual calibration) may be given; the same equations apply.
 *
 * @param r0Ohm resistance at 0 °C in ohms, finite and greater than 0
 * @param a     coefficient A in °C⁻¹, finite and greater than 0
 * @param b     coefficient B in °C⁻², finite
 * @param c     coefficient C in °C⁻⁴, finite (used below 0 °C only)
 */
public record CallendarVanDusen(double r0Ohm, double a, double b, double c) {

    /** IEC 60751 coefficient A, °C⁻¹. */
    public static final double IEC_A = 3.9083e-3;
    /** IEC 60751 coefficient B, °C⁻². */
    public static final double IEC_B = -5.775e-7;
    /** IEC 60751 coefficient C, °C⁻⁴ (below 0 °C). */
    public static final double IEC_C = -4.183e-12;
    /** Lowest temperature of the IEC 60751 equation, °C. */
    public static final double MIN_TEMPERATURE_C = -200.0;
    /** Highest temperature of the IEC 60751 equation, °C. */
    public static final double MAX_TEMPERATURE_C = 850.0;

    private static final int MAX_NEWTON_ITERATIONS = 50;

    /**
     * Validates the coefficients.
     *
     * @throws IllegalArgumentException when R₀ is not a finite positive number, A is not a finite
     *                                  positive number, or B or C is not finite
     */
    public CallendarVanDusen {
        if (!Double.isFinite(r0Ohm) || !(r0Ohm > 0)) {
            throw new IllegalArgumentException("R0 must be a finite resistance in ohms greater than 0, got " + r0Ohm);
        }
        if (!Double.isFinite(a) || !(a > 0) || !Double.isFinite(b) || !Double.isFinite(c)) {
            throw new IllegalArgumentException("Callendar–Van Dusen coefficients must be finite, with A greater than 0");
        }
    }

    /**
     * The IEC 60751 equation for a sensor of nominal resistance R₀ (100 Ω for Pt100, 1000 Ω for Pt1000).
     *
     * @param r0Ohm R₀ in ohms
     * @return the equation with the IEC coefficients
     * @throws IllegalArgumentException when R₀ is not a finite positive number
     */
    public static CallendarVanDusen iec60751(double r0Ohm) {
        return new CallendarVanDusen(r0Ohm, IEC_A, IEC_B, IEC_C);
    }

    /**
     * Resistance at a temperature (equations in the class description).
     *
     * @param temperatureC t in °C, −200 … 850
     * @return R(t) in ohms
     * @throws IllegalArgumentException when t is not finite
     * @throws UnevaluableException     when t lies outside −200 … 850 °C (the equation's range)
     */
    public double resistanceOhm(double temperatureC) {
        requireTemperature(temperatureC);
        return r0Ohm * ratio(temperatureC);
    }

    /**
     * Local sensitivity dR/dt at a temperature:
     * R₀(A + 2B·t) for t ≥ 0 °C and R₀[A + 2B·t + C(4t³ − 300·t²)] below 0 °C
     * (the derivative of the equations in the class description; both agree at 0 °C).
     *
     * @param temperatureC t in °C, −200 … 850
     * @return dR/dt in Ω/°C
     * @throws IllegalArgumentException when t is not finite
     * @throws UnevaluableException     when t lies outside −200 … 850 °C
     */
    public double sensitivityOhmPerC(double temperatureC) {
        requireTemperature(temperatureC);
        return r0Ohm * slope(temperatureC);
    }

    /**
     * Temperature at a resistance, the inverse of {@link #resistanceOhm(double)}.
     *
     * <p>For R ≥ R₀ (t ≥ 0 °C) the quadratic is solved in closed form, written as
     * t = 2(W − 1) / (A + √(A² + 4B(W − 1))) with W = R/R₀ — algebraically the textbook
     * [−A + √(A² − 4B(1 − W))]/(2B), rearranged to avoid cancellation near 0 °C. Below R₀ the
     * quartic has no convenient closed form: Newton's iteration tₖ₊₁ = tₖ − (R(tₖ) − R)/R'(tₖ),
     * started from the quadratic's solution, runs until the step is below 1e-12 °C (it converges
     * in a few steps because the C term is small).
     *
     * @param resistanceOhm R in ohms, within R(−200 °C) … R(850 °C)
     * @return t in °C
     * @throws IllegalArgumentException when R is not finite
     * @throws UnevaluableException     when R lies outside the equation's range
     */
    public double temperatureC(double resistanceOhm) {
        if (!Double.isFinite(resistanceOhm)) {
            throw new IllegalArgumentException("A resistance must be a finite number of ohms, got " + resistanceOhm);
        }
        double rMin = resistanceOhm(MIN_TEMPERATURE_C);
        double rMax = resistanceOhm(MAX_TEMPERATURE_C);
        if (resistanceOhm < rMin || resistanceOhm > rMax) {
            throw new UnevaluableException("The resistance " + resistanceOhm + " Ω lies outside the range of the "
                    + "Callendar–Van Dusen equation for R0 = " + r0Ohm + " Ω (" + rMin + " … " + rMax
                    + " Ω, that is −200 … 850 °C)");
        }
        double w = resistanceOhm / r0Ohm;
        double t = quadraticRoot(w);
        if (resistanceOhm >= r0Ohm) {
            return t;
        }
        for (int k = 0; k < MAX_NEWTON_ITERATIONS; k++) {
            double step = (ratio(t) - w) / slope(t);
            t -= step;
            if (Math.abs(step) < 1e-12) {
                break;
            }
        }
        return Math.max(MIN_TEMPERATURE_C, Math.min(0.0, t));
    }

    /**
     * This equation as a transfer function (input °C, output Ω) for accuracy evaluations.
     *
     * @return a view using {@link #resistanceOhm}, {@link #temperatureC} and {@link #sensitivityOhmPerC}
     */
    public TransferFunction asTransferFunction() {
        return new TransferFunction() {
            @Override
            public double output(double input) {
                return resistanceOhm(input);
            }

            @Override
            public double input(double output) {
                return temperatureC(output);
            }

            @Override
            public double sensitivityAt(double input) {
                return sensitivityOhmPerC(input);
            }
        };
    }

    private double ratio(double t) {
        if (t < 0) {
            return 1 + a * t + b * t * t + c * (t - 100.0) * t * t * t;
        }
        return 1 + a * t + b * t * t;
    }

    private double slope(double t) {
        if (t < 0) {
            return a + 2 * b * t + c * (4 * t * t * t - 300.0 * t * t);
        }
        return a + 2 * b * t;
    }

    private double quadraticRoot(double w) {
        double discriminant = a * a + 4 * b * (w - 1);
        if (discriminant < 0) {
            throw new UnevaluableException("The resistance ratio " + w + " has no real solution of the "
                    + "Callendar–Van Dusen quadratic");
        }
        return 2 * (w - 1) / (a + Math.sqrt(discriminant));
    }

    private static void requireTemperature(double temperatureC) {
        if (!Double.isFinite(temperatureC)) {
            throw new IllegalArgumentException("A temperature must be a finite number of °C, got " + temperatureC);
        }
        if (temperatureC < MIN_TEMPERATURE_C || temperatureC > MAX_TEMPERATURE_C) {
            throw new UnevaluableException("The temperature " + temperatureC + " °C lies outside the range of the "
                    + "IEC 60751 Callendar–Van Dusen equation (−200 … 850 °C)");
        }
    }
}
