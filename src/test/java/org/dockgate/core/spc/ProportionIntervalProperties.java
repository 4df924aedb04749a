package org.dockgate.core.spc;

import static org.dockgate.core.PropertyCheck.forAll;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class ProportionIntervalProperties {

    @Test
    void intervalHoldsTheEstimateAndStaysInTheUnitInterval() {
        forAll(1000, g -> {
            long n = g.longs(1, 100000);
            long x = g.longs(0, n); // x <= n
            double confidence = g.doubles(0.5, 0.999, 3);
            ProportionInterval interval = ProportionInterval.wilson(x, n, confidence);
            assertTrue(0 <= interval.lower() && interval.lower() <= interval.estimate()
                    && interval.estimate() <= interval.upper() && interval.upper() <= 1);
        });
    }

    @Test
    void higherConfidenceNeverNarrowsTheInterval() {
        forAll(1000, g -> {
            long n = g.longs(1, 5000);
            long x = g.longs(0, n); // x <= n
            double confidence = g.doubles(0.5, 0.95, 3);
            ProportionInterval narrow = ProportionInterval.wilson(x, n, confidence);
            ProportionInterval wide = ProportionInterval.wilson(x, n, confidence + 0.04);
            assertTrue(wide.lower() <= narrow.lower() && wide.upper() >= narrow.upper());
        });
    }
}
