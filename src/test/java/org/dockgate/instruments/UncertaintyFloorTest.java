package org.dockgate.instruments;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The band formula U(x) = max(floor, band figure) over the calibrated range, without a database: a band never
 * gives U = 0, and a value outside the calibrated range has no U at all. Figures worked by hand.
 */
class UncertaintyFloorTest {

    static final LocalDate TODAY = LocalDate.of(2026, 12, 2);
    static final Instant RECORDED = Instant.parse("2026-11-20T09:00:00Z");

    /** 0 … 20 bar instrument, 0.01 % of reading, k = 2, with the calibrated range and floor given. */
    static InstrumentView pressure(Double calibratedMin, Double calibratedMax, Double floor) {
        CalibrationRecord c = new CalibrationRecord(1, "C-1", TODAY.minusDays(10), TODAY.plusDays(300), 2.0,
                List.of(new UncertaintyBand(20, 0.01, UncertaintyMode.PERCENT_OF_READING)), RECORDED,
                calibratedMin, calibratedMax, floor);
        return InstrumentView.of("RI-TEST", "test", "pressure", 0, 20, "bar", List.of(c), TODAY, 0);
    }

    @Test
    void aZeroInputGetsTheFloorNotZero() {
        InstrumentView v = pressure(0.0, 20.0, 0.0004);
        // 0.01 % of 0 bar = 0 < floor 0.0004 bar: U = 0.0004 bar
        assertThat(v.expandedUncertaintyAt(0, "bar")).isEqualTo(0.0004);
        // 0.01 % of 2 bar = 0.0002 bar, still below the floor
        assertThat(v.expandedUncertaintyAt(2, "bar")).isCloseTo(0.0004, within(1e-15));
        // 0.01 % of 10 bar = 0.001 bar, above the floor: the band's figure
        assertThat(v.expandedUncertaintyAt(10, "bar")).isCloseTo(0.001, within(1e-15));
        // in another unit: 0.0004 bar = 40 Pa = 0.04 kPa, converted as a difference
        assertThat(v.expandedUncertaintyAt(0, "kPa")).isCloseTo(0.04, within(1e-12));
        assertThat(v.uncertaintyFloorDerived(v.current())).isFalse();
    }

    @Test
    void aRecordWithoutAFloorGetsTheFigureAtTenPercentOfFullScale() {
        InstrumentView v = pressure(null, null, null);
        // derived: 0.01 % × 10 % × 20 bar = 0.0002 bar
        assertThat(v.uncertaintyFloor(v.current())).isCloseTo(0.0002, within(1e-15));
        assertThat(v.uncertaintyFloorDerived(v.current())).isTrue();
        assertThat(v.expandedUncertaintyAt(0, "bar")).isCloseTo(0.0002, within(1e-15));
        assertThat(v.expandedUncertaintyAt(20, "bar")).isCloseTo(0.002, within(1e-15));
        // the calibrated range defaults to the instrument's range
        assertThat(v.calibratedRange(v.current())).isEqualTo("0 … 20 bar");
    }

    @Test
    void absoluteAndFullScaleBandsNeedNoDerivedFloor() {
        CalibrationRecord c = new CalibrationRecord(1, "C-1", TODAY.minusDays(10), TODAY.plusDays(300), 2.0,
                List.of(new UncertaintyBand(30, 0.05, UncertaintyMode.PERCENT_OF_FULL_SCALE)), RECORDED);
        InstrumentView v = InstrumentView.of("RI-FS", "test", "pressure", 0, 30, "bar", List.of(c), TODAY, 0);
        assertThat(v.uncertaintyFloor(c)).isZero();
        // 0.05 % of 30 bar full scale = 0.015 bar everywhere, zero input included
        assertThat(v.expandedUncertaintyAt(0, "bar")).isCloseTo(0.015, within(1e-15));
    }

    @Test
    void insideTheCalibratedRangeTheBandAppliesOutsideItNothingDoes() {
        InstrumentView v = pressure(0.2, 20.0, 0.0001);
        // 0.01 % of 0.2 bar = 0.00002 bar < floor 0.0001 bar
        assertThat(v.expandedUncertaintyAt(0.2, "bar")).isCloseTo(0.0001, within(1e-15));
        assertThat(v.expandedUncertaintyAt(15, "bar")).isCloseTo(0.0015, within(1e-15));
        assertThat(v.inCalibratedRange(v.current(), 0, "bar")).isFalse();
        assertThatThrownBy(() -> v.expandedUncertaintyAt(0, "bar"))
                .isInstanceOf(OutsideCalibratedRangeException.class)
                .hasMessage("RI-TEST is calibrated over 0.2 … 20 bar (certificate C-1); 0 bar lies outside it.");
        // The instrument no longer covers a 0 … 10 bar test, although its own range does.
        assertThat(v.covers(0, 10, "bar")).isFalse();
        assertThat(v.covers(0.2, 10, "bar")).isTrue();
    }
}
