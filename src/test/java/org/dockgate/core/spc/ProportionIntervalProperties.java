package org.dockgate.core.spc;

import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Assume;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.LongRange;
import net.jqwik.api.constraints.Scale;

class ProportionIntervalProperties {

    @Property
    void intervalHoldsTheEstimateAndStaysInTheUnitInterval(@ForAll @LongRange(min = 1, max = 100000) long n,
            @ForAll @LongRange(min = 0, max = 100000) long x,
            @ForAll @DoubleRange(min = 0.5, max = 0.999) @Scale(3) double confidence) {
        Assume.that(x <= n);
        ProportionInterval interval = ProportionInterval.wilson(x, n, confidence);
        assertTrue(0 <= interval.lower() && interval.lower() <= interval.estimate()
                && interval.estimate() <= interval.upper() && interval.upper() <= 1);
    }

    @Property
    void higherConfidenceNeverNarrowsTheInterval(@ForAll @LongRange(min = 1, max = 5000) long n,
            @ForAll @LongRange(min = 0, max = 5000) long x,
            @ForAll @DoubleRange(min = 0.5, max = 0.95) @Scale(3) double confidence) {
        Assume.that(x <= n);
        ProportionInterval narrow = ProportionInterval.wilson(x, n, confidence);
        ProportionInterval wide = ProportionInterval.wilson(x, n, confidence + 0.04);
        assertTrue(wide.lower() <= narrow.lower() && wide.upper() >= narrow.upper());
    }
}
