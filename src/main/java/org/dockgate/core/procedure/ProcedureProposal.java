package org.dockgate.core.procedure;

import java.util.List;
import java.util.OptionalDouble;
import org.dockgate.core.sampling.SamplingPlan;
import org.dockgate.core.series.Direction;

/**
 * A proposed inspection procedure: the tests with their parameters, the acceptance limits per metric
 * with guard bands and TURs, the sampling plans, what to record and what to beware of. Every derived
 * value carries the reasoning that produced it, for the engineer who reviews it.
 *
 * @param environmentalLimits the ambient temperature and humidity the bench must keep; a procedure stored
 *                            before limits were part of it reads as {@link EnvironmentalLimits#GENERAL}, the
 *                            limits its text already stated
 */
public record ProcedureProposal(StaticCalibration staticCalibration, NoiseCapture noiseCapture,
                                FrequencySweep frequencySweep, List<MetricAcceptance> acceptance,
                                List<SamplingRow> sampling, List<String> environment, List<String> cautions,
                                int estimatedBenchMinutes, List<String> reasoning,
                                EnvironmentalLimits environmentalLimits) {

    /** A proposal with the lab's general environmental limits. */
    public ProcedureProposal(StaticCalibration staticCalibration, NoiseCapture noiseCapture,
                             FrequencySweep frequencySweep, List<MetricAcceptance> acceptance,
                             List<SamplingRow> sampling, List<String> environment, List<String> cautions,
                             int estimatedBenchMinutes, List<String> reasoning) {
        this(staticCalibration, noiseCapture, frequencySweep, acceptance, sampling, environment, cautions,
                estimatedBenchMinutes, reasoning, EnvironmentalLimits.GENERAL);
    }

    public ProcedureProposal {
        environmentalLimits = environmentalLimits == null ? EnvironmentalLimits.GENERAL : environmentalLimits;
        acceptance = List.copyOf(acceptance);
        sampling = List.copyOf(sampling);
        environment = List.copyOf(environment);
        cautions = List.copyOf(cautions);
        reasoning = List.copyOf(reasoning);
    }

    /** Whether every metric with a TUR reaches 4:1; when not, approval needs a recorded justification. */
    public boolean allTestUncertaintyRatiosAdequate() {
        return acceptance.stream().allMatch(a -> a.testUncertaintyRatio().isEmpty() || a.turAdequate());
    }

    /** Test points in the input unit, visited in order for each cycle. */
    /**
     * The static calibration's plan.
     *
     * @param appliedWindow how far (±, in the input unit) the value the reference actually applied may lie from
     *                      its set point; null in procedures approved before it was a parameter, which then use
     *                      {@link #defaultAppliedWindow}
     */
    public record StaticCalibration(List<Double> pointsPercentOfSpan, List<Double> pointsInput, String inputUnit,
                                    List<Direction> directions, int cycles, int settleSeconds,
                                    String referenceInstrument, List<String> reasoning, Double appliedWindow) {
        public StaticCalibration {
            pointsPercentOfSpan = List.copyOf(pointsPercentOfSpan);
            pointsInput = List.copyOf(pointsInput);
            directions = List.copyOf(directions);
            reasoning = List.copyOf(reasoning);
            if (appliedWindow != null && !(appliedWindow > 0 && Double.isFinite(appliedWindow))) {
                throw new IllegalArgumentException("The window for applied values must be a positive number, got "
                        + appliedWindow);
            }
        }

        /** A plan without its own window for applied values (the default of the sensor kind applies). */
        public StaticCalibration(List<Double> pointsPercentOfSpan, List<Double> pointsInput, String inputUnit,
                                 List<Direction> directions, int cycles, int settleSeconds,
                                 String referenceInstrument, List<String> reasoning) {
            this(pointsPercentOfSpan, pointsInput, inputUnit, directions, cycles, settleSeconds, referenceInstrument,
                    reasoning, null);
        }

        /** @return this plan with another window for applied values (± input units) */
        public StaticCalibration withAppliedWindow(double window) {
            return new StaticCalibration(pointsPercentOfSpan, pointsInput, inputUnit, directions, cycles,
                    settleSeconds, referenceInstrument, reasoning, window);
        }

        /** @return the window for applied values: the plan's own, else the default for the specification */
        public double appliedWindowFor(SensorSpecification spec) {
            return appliedWindow != null ? appliedWindow : defaultAppliedWindow(spec);
        }

        /**
         * The default window between the applied value and its set point (common practice of the lab, stated in
         * every procedure): ±0.5 °C for a temperature sensor in a dry block or bath (a block settles within a few
         * tenths of a degree of its set point), else ±1 % of the span (a pressure controller, dead-weight set or
         * load frame lands within a fraction of a percent).
         *
         * @param spec the specification
         * @return the window in the specification's input unit, &gt; 0
         */
        public static double defaultAppliedWindow(SensorSpecification spec) {
            if (spec.kind() == SensorKind.RTD || spec.kind() == SensorKind.THERMOCOUPLE) {
                // a temperature difference: the size of one kelvin in the input unit
                double kelvin = org.dockgate.core.quantity.Units.convert(1.0, "K", spec.inputUnit())
                        - org.dockgate.core.quantity.Units.convert(0.0, "K", spec.inputUnit());
                return 0.5 * Math.abs(kelvin);
            }
            return 0.01 * spec.span();
        }

        public int readingsPerUnit() {
            return pointsInput.size() * directions.size() * cycles;
        }
    }

    public record NoiseCapture(int samples, double sampleRateHz, double durationSeconds, List<String> reasoning) {
        public NoiseCapture {
            reasoning = List.copyOf(reasoning);
        }
    }

    public record FrequencySweep(double referenceHz, List<Double> frequenciesHz, double amplitude, String amplitudeUnit,
                                 String referenceInstrument, List<String> reasoning) {
        public FrequencySweep {
            frequenciesHz = List.copyOf(frequenciesHz);
            reasoning = List.copyOf(reasoning);
        }
    }

    /**
     * One metric's limits: the tolerance from the datasheet, the planned expanded uncertainty of the
     * measurement, the acceptance limits the decision rule gives, and the TUR.
     */
    public record MetricAcceptance(Metric metric, String unit, OptionalDouble toleranceLower,
                                   OptionalDouble toleranceUpper, OptionalDouble plannedExpandedUncertainty,
                                   double coverageFactor, OptionalDouble acceptanceLower,
                                   OptionalDouble acceptanceUpper, OptionalDouble testUncertaintyRatio,
                                   boolean turAdequate, String referenceInstrument, String reasoning) {
    }

    /** The plans for one typical lot size under the three severities. */
    public record SamplingRow(int lotSize, SamplingPlan normal, SamplingPlan tightened, SamplingPlan reduced) {
    }
}
