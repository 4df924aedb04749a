package org.dockgate.core.procedure;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.dockgate.core.procedure.KindPractice.Item;
import org.dockgate.core.procedure.SensorSpecification.RtdClass;
import org.junit.jupiter.api.Test;

class KindPracticeTest {

    static SensorSpecification rtd(double r0, String cls) {
        return new SensorSpecification(SensorKind.RTD, "°C", -50, 250, "Ω", null, null, null, null, null, null, null,
                null, null, null, new RtdClass(r0, cls));
    }

    static Item item(KindPractice.Practice p, String title) {
        return p.items().stream().filter(i -> i.title().equals(title)).findFirst().orElseThrow();
    }

    @Test
    void theMeasuringCurrentComesFromTheStatedExcitationElseFromR0() {
        var stated = KindPractice.of(rtd(100, "A"), "0.5 mA measuring current");
        assertThat(item(stated, "Measuring current").text()).contains("0.5 mA measuring current");
        assertThat(item(stated, "Measuring current").source()).isEqualTo("specification");
        // common practice: 1 mA for a Pt100, a tenth of it for a Pt1000
        assertThat(item(KindPractice.of(rtd(100, "B"), null), "Measuring current").text()).contains("1 mA")
                .contains("Pt100");
        assertThat(item(KindPractice.of(rtd(1000, "B"), " "), "Measuring current").text()).contains("0.1 mA")
                .contains("Pt1000");
    }

    @Test
    void theStabilityThresholdIsATenthOfTheClassToleranceAtZero() {
        // IEC 60751:2008 Table 1: class B ±(0.3 + 0.005|t|) °C, so 0.3 °C at 0 °C
        assertThat(item(KindPractice.of(rtd(100, "B"), null), "Stability criterion").text()).contains("0.03 °C");
        assertThat(item(KindPractice.of(rtd(100, "B"), null), "Ice-point check").text()).contains("±0.3 °C");
    }

    @Test
    void everyKindHasWarmUpFirstAndTheElectricalCautionAndEveryItemASource() {
        var specs = List.of(rtd(100, "A"),
                new SensorSpecification(SensorKind.LIGHT_SENSOR, "lx", 0, 1000, "V",
                        new SensorSpecification.Sensitivity(0.01, "V/lx", 1, SensorSpecification.ToleranceMode.PERCENT),
                        null, null, null, null, null, null, null, null, null, null));
        for (var spec : specs) {
            var p = KindPractice.of(spec, null);
            assertThat(p.items().get(0).title()).isEqualTo("Warm-up");
            assertThat(p.cautions()).extracting(Item::title).contains("Electrical excitation");
            assertThat(p.items()).allSatisfy(i -> assertThat(i.source()).isNotBlank());
        }
    }
}
