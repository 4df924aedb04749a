package org.dockgate.core.metrics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

/** Bandwidth is a property of the shape of the response, not of its units. */
class FrequencyResponseProperties {

    @Property(tries = 200)
    void bandwidthIgnoresAmplitudeUnitsAndFollowsFrequencyScale(
            @ForAll @DoubleRange(min = -2, max = 4) double log10Fc,
            @ForAll @IntRange(min = 3, max = 30) int perDecade,
            @ForAll @DoubleRange(min = -6, max = 6) double log10Gain,
            @ForAll @DoubleRange(min = -3, max = 3) double log10FrequencyScale) {
        double fc = Math.pow(10, log10Fc);
        double gain = Math.pow(10, log10Gain);
        double scale = Math.pow(10, log10FrequencyScale);
        List<FrequencyPoint> base = new ArrayList<>();
        List<FrequencyPoint> scaled = new ArrayList<>();
        for (int k = 0; k <= 4 * perDecade; k++) {
            double f = fc * Math.pow(10, -2 + (double) k / perDecade);
            double a = 1 / Math.sqrt(1 + (f / fc) * (f / fc));
            base.add(new FrequencyPoint(f, a));
            scaled.add(new FrequencyPoint(f * scale, a * gain));
        }
        double bandwidth = FrequencyResponse.of(base).bandwidthHz().orElseThrow();
        double scaledBandwidth = FrequencyResponse.of(scaled).bandwidthHz().orElseThrow();
        assertThat(scaledBandwidth).isCloseTo(bandwidth * scale, within(bandwidth * scale * 1e-9));
        // Chord error bound at 3 points per decade: h^2/8 |L''|/|L'| = (1/3)^2/8 x 23.03/10 = 0.032 decade (7.6 %).
        assertThat(bandwidth).isCloseTo(fc, within(fc * 0.08));
    }
}
