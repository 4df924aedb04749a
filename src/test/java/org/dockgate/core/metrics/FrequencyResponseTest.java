package org.dockgate.core.metrics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.function.DoubleUnaryOperator;
import org.dockgate.core.UnevaluableException;
import org.junit.jupiter.api.Test;

class FrequencyResponseTest {

    /** Samples |H(f)| at 10^(startDecade + k/perDecade), k = 0 … decades·perDecade. */
    private static List<FrequencyPoint> logGrid(double startDecade, int decades, int perDecade,
            DoubleUnaryOperator magnitude) {
        List<FrequencyPoint> points = new ArrayList<>();
        for (int k = 0; k <= decades * perDecade; k++) {
            double f = Math.pow(10, startDecade + (double) k / perDecade);
            points.add(new FrequencyPoint(f, magnitude.applyAsDouble(f)));
        }
        return points;
    }

    @Test
    void halfPowerLevelIsMinus3Point0103Db() {
        // Reference sheet A4: amplitude ratio 1/sqrt(2) = 0.7071067812 is -3.0103 dB.
        assertThat(FrequencyResponse.HALF_POWER_LEVEL_DB).isCloseTo(20 * Math.log10(1 / Math.sqrt(2)), within(1e-14));
        assertThat(FrequencyResponse.HALF_POWER_LEVEL_DB).isCloseTo(-3.0103, within(5e-5));
    }

    @Test
    void firstOrderLowPassBandwidthIsTheCornerFrequency() {
        // Reference sheet A4: first order, tau = 0.5 s, f-3dB = 1/(2 pi tau) = 0.318309886 Hz (Doebelin, from memory).
        double fc = 1 / (2 * Math.PI * 0.5);
        assertThat(fc).isCloseTo(0.318309886, within(1e-9));
        List<FrequencyPoint> sweep = logGrid(-3, 5, 10, f -> 1 / Math.sqrt(1 + (f / fc) * (f / fc)));
        FrequencyResponse response = FrequencyResponse.of(sweep);

        assertThat(response.withinSweep()).isTrue();
        assertThat(response.referenceFrequencyHz()).isEqualTo(0.001);
        // The reference (0.001 Hz) sits a hair below 0 dB, so the relative -3.0103 dB point is
        // fc * sqrt(1 + 2 (fref/fc)^2) (hand algebra from |H|^2 = 1/(1 + (f/fc)^2)).
        double exact = fc * Math.sqrt(1 + 2 * Math.pow(0.001 / fc, 2));
        // Interpolation error bound: chord error in dB <= h^2/8 |L''| with h = 0.1 decade and |L''| = 40 ln10 x/(1+x)^2
        // <= 23.03 dB/decade^2 near the corner, over a slope of 10 dB/decade there: 0.0029 decade, i.e. 0.7 %.
        double bandwidth = response.bandwidthHz().orElseThrow();
        assertThat(bandwidth).isCloseTo(exact, within(exact * 0.007));

        // The interpolation rule itself, hand-coded: bracketing grid points 10^-0.5 and 10^-0.4 Hz, level linear in
        // dB against log10 f.
        double aRef = 1 / Math.sqrt(1 + Math.pow(0.001 / fc, 2));
        double f1 = Math.pow(10, -0.5);
        double f2 = Math.pow(10, -0.4);
        double l1 = 20 * Math.log10(1 / Math.sqrt(1 + (f1 / fc) * (f1 / fc)) / aRef);
        double l2 = 20 * Math.log10(1 / Math.sqrt(1 + (f2 / fc) * (f2 / fc)) / aRef);
        assertThat(l1).isGreaterThan(FrequencyResponse.HALF_POWER_LEVEL_DB);
        assertThat(l2).isLessThan(FrequencyResponse.HALF_POWER_LEVEL_DB);
        double logF = Math.log10(f1) + (FrequencyResponse.HALF_POWER_LEVEL_DB - l1) / (l2 - l1) * 0.1;
        assertThat(bandwidth).isCloseTo(Math.pow(10, logF), within(1e-12));
    }

    @Test
    void secondOrderButterworthBandwidthIsTheNaturalFrequency() {
        // Reference sheet A4: zeta = 1/sqrt(2) gives r-3dB = 1.000000; f_n = 1000 Hz is a grid point here.
        double fn = 1000;
        double zeta = Math.sqrt(0.5);
        List<FrequencyPoint> sweep = logGrid(1, 4, 10, f -> secondOrder(f / fn, zeta));
        FrequencyResponse response = FrequencyResponse.of(sweep);
        // Only the reference level (1 - 5e-9 dB at 10 Hz) separates the result from 1000 Hz: relative 1e-6.
        assertThat(response.bandwidthHz().orElseThrow()).isCloseTo(1000, within(1e-3));
    }

    @Test
    void criticallyDampedSecondOrder() {
        // Reference sheet A4 [X]: zeta = 1 gives r-3dB = sqrt(1 - 2 + sqrt(2)) = 0.6436.
        double fn = 1000;
        double rc = Math.sqrt(1 - 2 + Math.sqrt(4 - 4 + 2));
        assertThat(rc).isCloseTo(0.6436, within(5e-5));
        // 50 points per decade: the chord error (~0.26 % at 10 per decade) shrinks by 25; tolerance 2e-4 relative.
        FrequencyResponse response = FrequencyResponse.of(logGrid(1, 3, 50, f -> secondOrder(f / fn, 1.0)));
        assertThat(response.bandwidthHz().orElseThrow()).isCloseTo(rc * fn, within(rc * fn * 2e-4));
    }

    @Test
    void resonanceDoesNotStopTheSearch() {
        // zeta = 0.05: the response peaks near f_n and falls to -3 dB at r = sqrt(1 - 2 z^2 + sqrt(4 z^4 - 4 z^2 + 2))
        // (reference sheet A4 formula [X]); 100 points per decade, tolerance 1e-3 relative.
        double z = 0.05;
        double rc = Math.sqrt(1 - 2 * z * z + Math.sqrt(4 * Math.pow(z, 4) - 4 * z * z + 2));
        FrequencyResponse response = FrequencyResponse.of(logGrid(1, 3, 100, f -> secondOrder(f / 1000, z)));
        assertThat(response.bandwidthHz().orElseThrow()).isCloseTo(rc * 1000, within(rc * 1000 * 1e-3));
    }

    @Test
    void undampedAccelerometerNeverFallsWithinASweepBelowResonance() {
        // Reference sheet A4: undamped seismic sensor, amplitude 1/(1 - r^2) rises towards resonance.
        double fn = 10_000;
        List<FrequencyPoint> sweep = new ArrayList<>(logGrid(1, 2, 10, f -> 1 / (1 - Math.pow(f / fn, 2))));
        // A4 [X]: +5 % amplitude error at r = 0.218218 (exactly sqrt(1 - 1/1.05)); put a point there.
        double r5 = Math.sqrt(1 - 1 / 1.05);
        assertThat(r5).isCloseTo(0.218218, within(5e-7));
        sweep.add(new FrequencyPoint(r5 * fn, 1.05));
        sweep.add(new FrequencyPoint(0.9 * fn, 1 / (1 - 0.81)));
        FrequencyResponse response = FrequencyResponse.of(sweep);
        assertThat(response.withinSweep()).isFalse();
        assertThat(response.bandwidthHz()).isEmpty();

        // Flatness up to the +5 % point: 20 log10(1.05) dB above a reference that is itself 1/(1 - 1e-6).
        FrequencyResponse.Flatness flatness = response.flatness(10, r5 * fn);
        assertThat(flatness.maxDeviationDb())
                .isCloseTo(20 * Math.log10(1.05) - 20 * Math.log10(1 / (1 - 1e-6)), within(1e-12));
        assertThat(flatness.signedDeviationDb()).isPositive();
        assertThat(flatness.atFrequencyHz()).isEqualTo(r5 * fn);
    }

    @Test
    void referenceBetweenPointsIsInterpolatedInDbAgainstLogFrequency() {
        // -20 dB per decade between 100 Hz (1.0) and 1000 Hz (0.1): at 10^2.5 Hz the level is -10 dB (hand arithmetic).
        List<FrequencyPoint> sweep = List.of(new FrequencyPoint(1000, 0.1), new FrequencyPoint(100, 1.0));
        FrequencyResponse response = FrequencyResponse.of(sweep, OptionalDouble.of(Math.pow(10, 2.5)));
        assertThat(response.referenceAmplitude()).isCloseTo(Math.pow(10, -0.5), within(1e-14));
        // From -10 dB absolute the level must fall to -13.0103 dB: log10 f = 2.5 + 3.0103/20.
        assertThat(response.bandwidthHz().orElseThrow())
                .isCloseTo(Math.pow(10, 2.5 - FrequencyResponse.HALF_POWER_LEVEL_DB / 20), within(1e-9));
        assertThat(response.points()).extracting(FrequencyPoint::frequencyHz).containsExactly(100.0, 1000.0);
        // Band edge interpolated too: flatness over [100, 10^2.5] is 10 dB at the lower edge (100 Hz, +10 dB).
        assertThat(response.flatness(100, Math.pow(10, 2.5)).maxDeviationDb()).isCloseTo(10, within(1e-12));
        assertThat(response.flatness(150, 200).maxDeviationDb())
                .isCloseTo(20 * Math.log10(Math.pow(10, -Math.log10(1.5)) / Math.pow(10, -0.5)), within(1e-12));
    }

    @Test
    void aPointExactlyAtTheLevelIsTheBandwidth() {
        List<FrequencyPoint> sweep = List.of(new FrequencyPoint(10, 2.0), new FrequencyPoint(50, 2.0),
                new FrequencyPoint(80, 2.0 * Math.pow(10, FrequencyResponse.HALF_POWER_LEVEL_DB / 20)),
                new FrequencyPoint(200, 0.5));
        assertThat(FrequencyResponse.of(sweep).bandwidthHz().orElseThrow()).isCloseTo(80, within(1e-9));
    }

    @Test
    void refusesBadInput() {
        assertThatThrownBy(() -> FrequencyResponse.of(List.of()))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("none");
        assertThatThrownBy(() -> FrequencyResponse.of(List.of(new FrequencyPoint(10, 1))))
                .isInstanceOf(UnevaluableException.class).hasMessageContaining("two frequencies");
        assertThatThrownBy(() -> FrequencyResponse.of(List.of(new FrequencyPoint(10, 1), new FrequencyPoint(10, 2))))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("twice");
        assertThatThrownBy(() -> new FrequencyPoint(0, 1)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> new FrequencyPoint(10, 0)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> new FrequencyPoint(Double.NaN, 1)).isInstanceOf(IllegalArgumentException.class);
        List<FrequencyPoint> sweep = List.of(new FrequencyPoint(10, 1), new FrequencyPoint(100, 0.5));
        assertThatThrownBy(() -> FrequencyResponse.of(sweep, OptionalDouble.of(5)))
                .isInstanceOf(UnevaluableException.class).hasMessageContaining("outside the sweep");
        assertThatThrownBy(() -> FrequencyResponse.of(sweep, OptionalDouble.of(Double.POSITIVE_INFINITY)))
                .isInstanceOf(IllegalArgumentException.class);
        FrequencyResponse response = FrequencyResponse.of(sweep);
        assertThatThrownBy(() -> response.flatness(20, 200)).isInstanceOf(UnevaluableException.class);
        assertThatThrownBy(() -> response.flatness(50, 20)).isInstanceOf(IllegalArgumentException.class);
    }

    private static double secondOrder(double r, double zeta) {
        return 1 / Math.sqrt(Math.pow(1 - r * r, 2) + Math.pow(2 * zeta * r, 2));
    }
}
