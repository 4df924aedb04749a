package org.dockgate.core.rtd;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.dockgate.core.PropertyCheck.forAll;

import org.junit.jupiter.api.Test;

/** The inverse really inverts the Callendar–Van Dusen equation, for any R0. */
class CallendarVanDusenProperties {

    @Test
    void temperatureToResistanceAndBackWithinAMicrokelvin() {
        forAll(1000, g -> {
            double temperatureC = g.doubles(-200, 850, 6);
            double r0Ohm = g.doubles(10, 10_000);
            CallendarVanDusen cvd = CallendarVanDusen.iec60751(r0Ohm);
            assertThat(cvd.temperatureC(cvd.resistanceOhm(temperatureC))).isCloseTo(temperatureC, within(1e-6));
        });
    }

    @Test
    void resistanceRisesWithTemperature() {
        forAll(300, g -> {
            double temperatureC = g.doubles(-200, 849, 6);
            double step = g.doubles(1e-3, 1, 6);
            CallendarVanDusen pt100 = CallendarVanDusen.iec60751(100);
            assertThat(pt100.resistanceOhm(temperatureC + step)).isGreaterThan(pt100.resistanceOhm(temperatureC));
            assertThat(pt100.sensitivityOhmPerC(temperatureC)).isPositive();
        });
    }
}
