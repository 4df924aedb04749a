package org.dockgate.core.metrics;

import static org.dockgate.core.PropertyCheck.forAll;
import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Bandwidth is a property of the shape of the response, not of its units. */
class FrequencyResponseProperties {

    @Test
    void bandwidthIgnoresAmplitudeUnitsAndFollowsFrequencyScale() {
        forAll(200, g -> {
            double log10Fc = g.doubles(-2, 4);
            int perDecade = g.ints(3, 30);
            double log10Gain = g.doubles(-6, 6);
            double log10FrequencyScale = g.doubles(-3, 3);
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
        });
    }
}
