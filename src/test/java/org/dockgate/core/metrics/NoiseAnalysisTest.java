package org.dockgate.core.metrics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.OptionalDouble;
import org.dockgate.core.UnevaluableException;
import org.junit.jupiter.api.Test;

class NoiseAnalysisTest {

    /** Reference sheet A3 noise record, µV. */
    private static final double[] A3_RECORD_UV = {1, -2, 3, -1, 0, 2, -3, 1, -1, 0};

    @Test
    void noiseRecordA3() {
        // Sensitivity 100 mV/g = 100 000 µV/g; full scale 500 g.
        NoiseAnalysis noise = NoiseAnalysis.of(A3_RECORD_UV, 100_000, OptionalDouble.of(500));
        // A3 [X]: mean 0; sample SD (n - 1) = 1.8257419 µV (= sqrt(30/9)); p-p 6 µV.
        assertThat(noise.mean()).isCloseTo(0, within(1e-15));
        assertThat(noise.rmsNoise()).isCloseTo(Math.sqrt(30.0 / 9.0), within(1e-14));
        assertThat(noise.rmsNoise()).isCloseTo(1.8257419, within(5e-8)); // A3, printed to 7 decimals
        assertThat(noise.peakToPeak()).isEqualTo(6.0);
        // Resolution = rms / |S| in g; minimum detectable = 3 rms / |S| (common practice); hand arithmetic.
        double resolution = Math.sqrt(30.0 / 9.0) / 100_000;
        assertThat(noise.resolution()).isCloseTo(resolution, within(1e-19));
        assertThat(noise.minimumDetectable()).isCloseTo(3 * resolution, within(1e-19));
        assertThat(noise.dynamicRangeDb().orElseThrow())
                .isCloseTo(20 * Math.log10(500 / (3 * resolution)), within(1e-9));
        assertThat(noise.n()).isEqualTo(10);
    }

    @Test
    void resolutionExampleA3() {
        // A3: 2 µV rms / 100 mV/g = 2.0e-5 g; 3x rule 6.0e-5 g. Two samples +-a have sample SD a*sqrt(2).
        double a = 2e-6 / Math.sqrt(2);
        NoiseAnalysis noise = NoiseAnalysis.of(new double[] {a, -a}, 0.100);
        assertThat(noise.rmsNoise()).isCloseTo(2e-6, within(1e-20));
        assertThat(noise.resolution()).isCloseTo(2.0e-5, within(1e-18));
        assertThat(noise.minimumDetectable()).isCloseTo(6.0e-5, within(1e-18));
        assertThat(noise.dynamicRangeDb()).isEmpty();
        // A3: the 10x rule gives 2.0e-4 g.
        assertThat(NoiseAnalysis.of(new double[] {a, -a}, 0.100, OptionalDouble.empty(), 10).minimumDetectable())
                .isCloseTo(2.0e-4, within(1e-17));
    }

    @Test
    void rangeExampleA3() {
        // A3: max 500 g, noise floor 0.0005 g -> 20 log10(1e6) = 120.000 dB. Noise floor = 3 rms / |S| with S = 3.
        double rms = 0.0005;
        double a = rms / Math.sqrt(2);
        NoiseAnalysis noise = NoiseAnalysis.of(new double[] {a, -a}, -3.0, OptionalDouble.of(500));
        assertThat(noise.minimumDetectable()).isCloseTo(0.0005, within(1e-15));
        assertThat(noise.dynamicRangeDb().orElseThrow()).isCloseTo(120.0, within(1e-9));
    }

    @Test
    void noVariationGivesNoDynamicRange() {
        NoiseAnalysis noise = NoiseAnalysis.of(new double[] {4, 4, 4}, 2, OptionalDouble.of(10));
        assertThat(noise.mean()).isEqualTo(4);
        assertThat(noise.rmsNoise()).isZero();
        assertThat(noise.minimumDetectable()).isZero();
        assertThat(noise.dynamicRangeDb()).isEmpty();
    }

    @Test
    void refusesBadInput() {
        assertThatThrownBy(() -> NoiseAnalysis.of(new double[0], 1))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("none");
        assertThatThrownBy(() -> NoiseAnalysis.of(new double[] {1}, 1))
                .isInstanceOf(UnevaluableException.class).hasMessageContaining("two samples");
        assertThatThrownBy(() -> NoiseAnalysis.of(new double[] {1, Double.NaN}, 1))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("Sample 2");
        assertThatThrownBy(() -> NoiseAnalysis.of(new double[] {1, 2}, 0))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("sensitivity");
        assertThatThrownBy(() -> NoiseAnalysis.of(new double[] {1, 2}, 1, OptionalDouble.of(-5)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("full-scale");
        assertThatThrownBy(() -> NoiseAnalysis.of(new double[] {1, 2}, Double.POSITIVE_INFINITY))
                .isInstanceOf(IllegalArgumentException.class);
    }
}
