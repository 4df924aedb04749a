package org.dockgate.core.metrics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.dockgate.core.PropertyCheck.forAll;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import javax.measure.UnitConverter;
import org.dockgate.core.quantity.Units;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.CalibrationSeries;
import org.dockgate.core.series.Direction;
import org.junit.jupiter.api.Test;

/**
 * Properties that follow from the definitions themselves (no outside source needed): an exactly
 * linear response has no nonlinearity or hysteresis, and %FSO figures do not depend on the units.
 */
class StaticCharacteristicsProperties {

    /** An exactly linear series: equally spaced inputs across the range, every cycle, optionally both ways. */
    private static CalibrationSeries linearSeries(double slope, double offset, double rangeMin, double span,
            int inputs, int cycles, boolean bothWays) {
        List<CalibrationPoint> points = new ArrayList<>();
        for (int c = 1; c <= cycles; c++) {
            for (int i = 0; i < inputs; i++) {
                double x = rangeMin + span * i / (inputs - 1);
                points.add(new CalibrationPoint(x, offset + slope * x, Direction.UP, c));
            }
            if (bothWays) {
                for (int i = inputs - 1; i >= 0; i--) {
                    double x = rangeMin + span * i / (inputs - 1);
                    points.add(new CalibrationPoint(x, offset + slope * x, Direction.DOWN, c));
                }
            }
        }
        return CalibrationSeries.of(points);
    }

    /**
     * Slope magnitude 1e-3 … 1e3 with either sign, span 0.1 … 1000, the range placed anywhere within two spans of
     * zero, and an offset up to ten full-scale outputs: output magnitudes stay within ~12 FSO, so double rounding
     * stays ~1e-13 %FSO, far below the 1e-9 %FSO asserted.
     */
    @Test
    void exactlyLinearSeriesHasNoNonlinearityOrHysteresis() {
        forAll(300, g -> {
            double log10Slope = g.doubles(-3, 3);
            boolean negative = g.bool();
            double log10Span = g.doubles(-1, 3);
            double rangeStartInSpans = g.doubles(-2, 1);
            double offsetInFso = g.doubles(-10, 10);
            int inputs = g.ints(2, 12);
            int cycles = g.ints(1, 4);
            boolean bothWays = g.bool();
            double slope = (negative ? -1 : 1) * Math.pow(10, log10Slope);
            double span = Math.pow(10, log10Span);
            double rangeMin = rangeStartInSpans * span;
            double offset = offsetInFso * Math.abs(slope) * span;
            CalibrationSeries series = linearSeries(slope, offset, rangeMin, span, inputs, cycles, bothWays);

            StaticCharacteristics sc = StaticCharacteristics.of(series, rangeMin, rangeMin + span);

            assertThat(sc.nonlinearityBestFitPercentFso()).isLessThan(1e-9);
            assertThat(sc.nonlinearityTerminalPercentFso()).isLessThan(1e-9);
            assertThat(sc.hysteresisPercentFso().isPresent()).isEqualTo(bothWays);
            sc.hysteresisPercentFso().ifPresent(h -> assertThat(h).isLessThan(1e-9));
            sc.repeatabilityPercentFso().ifPresent(r -> assertThat(r).isLessThan(1e-9));
            assertThat(sc.sensitivity()).isCloseTo(slope, within(Math.abs(slope) * 1e-12));
        });
    }

    /** Scaling every output by k scales the sensitivity by k and leaves every %FSO figure unchanged. */
    @Test
    void scalingTheOutputScalesSensitivityAndKeepsPercentFso() {
        forAll(200, g -> {
            double log10K = g.doubles(-3, 3);
            boolean negativeK = g.bool();
            long seed = g.anyLong();
            double k = (negativeK ? -1 : 1) * Math.pow(10, log10K);
            CalibrationSeries series = noisySeries(seed);
            CalibrationSeries scaled = CalibrationSeries.of(series.points().stream()
                    .map(p -> new CalibrationPoint(p.input(), k * p.output(), p.direction(), p.cycle()))
                    .toList());

            StaticCharacteristics a = StaticCharacteristics.of(series, 0, 10);
            StaticCharacteristics b = StaticCharacteristics.of(scaled, 0, 10);

            assertThat(b.sensitivity()).isCloseTo(k * a.sensitivity(), within(Math.abs(k * a.sensitivity()) * 1e-12));
            assertThat(b.fullScaleOutput()).isCloseTo(Math.abs(k) * a.fullScaleOutput(),
                    within(Math.abs(k) * a.fullScaleOutput() * 1e-12));
            assertSamePercentages(a, b);
            assertThat(b.repeatabilityStdDev().orElseThrow()).isCloseTo(Math.abs(k) * a.repeatabilityStdDev().orElseThrow(),
                    within(Math.abs(k) * a.repeatabilityStdDev().orElseThrow() * 1e-9));
        });
    }

    /** Expressing readings in other units (mV to V, bar to kPa) changes the sensitivity by the unit factors only. */
    @Test
    void resultsScaleCorrectlyWithUnits() {
        forAll(100, g -> {
            long seed = g.anyLong();
            CalibrationSeries mvPerBar = noisySeries(seed);
            UnitConverter mvToV = Units.converter("mV", "V");
            UnitConverter barToKpa = Units.converter("bar", "kPa");
            CalibrationSeries vPerKpa = CalibrationSeries.of(mvPerBar.points().stream()
                    .map(p -> new CalibrationPoint(barToKpa.convert(p.input()), mvToV.convert(p.output()),
                            p.direction(), p.cycle()))
                    .toList());

            StaticCharacteristics a = StaticCharacteristics.of(mvPerBar, 0, 10);
            StaticCharacteristics b = StaticCharacteristics.of(vPerKpa, 0, 1000);

            // 1 mV/bar = 1e-3 V / 100 kPa = 1e-5 V/kPa (SI Brochure: 1 bar = 100 kPa).
            assertThat(b.sensitivity()).isCloseTo(a.sensitivity() * 1e-5, within(Math.abs(a.sensitivity()) * 1e-5 * 1e-12));
            assertThat(b.offset()).isCloseTo(a.offset() * 1e-3, within(1e-12 * (Math.abs(a.offset()) + 1) * 1e-3));
            assertThat(b.fullScaleOutput()).isCloseTo(a.fullScaleOutput() * 1e-3, within(a.fullScaleOutput() * 1e-15));
            assertSamePercentages(a, b);
        });
    }

    private static void assertSamePercentages(StaticCharacteristics a, StaticCharacteristics b) {
        assertThat(b.nonlinearityBestFitPercentFso()).isCloseTo(a.nonlinearityBestFitPercentFso(), within(1e-9));
        assertThat(b.nonlinearityTerminalPercentFso()).isCloseTo(a.nonlinearityTerminalPercentFso(), within(1e-9));
        assertThat(b.hysteresisPercentFso().orElseThrow()).isCloseTo(a.hysteresisPercentFso().orElseThrow(),
                within(1e-9));
        assertThat(b.repeatabilityPercentFso().orElseThrow()).isCloseTo(a.repeatabilityPercentFso().orElseThrow(),
                within(1e-9));
        assertThat(b.rSquared().orElseThrow()).isCloseTo(a.rSquared().orElseThrow(), within(1e-12));
    }

    /** A 0-10 bar transducer near 10 mV/bar with random nonlinearity, hysteresis and noise, 2 cycles up and down. */
    private static CalibrationSeries noisySeries(long seed) {
        Random random = new Random(seed);
        double slope = 10 * (1 + 0.1 * random.nextGaussian());
        double bow = 0.02 * random.nextGaussian();
        double hysteresis = 0.05 * random.nextDouble();
        List<CalibrationPoint> points = new ArrayList<>();
        for (int cycle = 1; cycle <= 2; cycle++) {
            for (Direction d : Direction.values()) {
                for (int i = 0; i <= 5; i++) {
                    double x = 2.0 * i;
                    double y = 0.1 + slope * x + bow * x * (10 - x) + (d == Direction.DOWN ? hysteresis : 0)
                            + 0.01 * random.nextGaussian();
                    points.add(new CalibrationPoint(x, y, d, cycle));
                }
            }
        }
        return CalibrationSeries.of(points);
    }
}
