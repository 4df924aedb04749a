package org.dockgate.core.rtd;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.Scale;

/** The inverse really inverts the Callendar–Van Dusen equation, for any R0. */
class CallendarVanDusenProperties {

    @Property(tries = 1000)
    void temperatureToResistanceAndBackWithinAMicrokelvin(
            @ForAll @DoubleRange(min = -200, max = 850) @Scale(6) double temperatureC,
            @ForAll @DoubleRange(min = 10, max = 10_000) double r0Ohm) {
        CallendarVanDusen cvd = CallendarVanDusen.iec60751(r0Ohm);
        assertThat(cvd.temperatureC(cvd.resistanceOhm(temperatureC))).isCloseTo(temperatureC, within(1e-6));
    }

    @Property(tries = 300)
    void resistanceRisesWithTemperature(
            @ForAll @DoubleRange(min = -200, max = 849) @Scale(6) double temperatureC,
            @ForAll @DoubleRange(min = 1e-3, max = 1) @Scale(6) double step) {
        CallendarVanDusen pt100 = CallendarVanDusen.iec60751(100);
        assertThat(pt100.resistanceOhm(temperatureC + step)).isGreaterThan(pt100.resistanceOhm(temperatureC));
        assertThat(pt100.sensitivityOhmPerC(temperatureC)).isPositive();
    }
}
