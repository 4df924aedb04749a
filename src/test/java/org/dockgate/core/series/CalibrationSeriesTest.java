package org.dockgate.core.series;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class CalibrationSeriesTest {

    private final CalibrationSeries series = CalibrationSeries.of(List.of(
            new CalibrationPoint(0, 0.05, Direction.UP, 1),
            new CalibrationPoint(2, 20.10, Direction.UP, 1),
            new CalibrationPoint(2, 20.20, Direction.DOWN, 1),
            new CalibrationPoint(0, 0.09, Direction.DOWN, 1),
            new CalibrationPoint(0, 0.04, Direction.UP, 2),
            new CalibrationPoint(2, 20.12, Direction.UP, 2)));

    @Test
    void groupsMeansByInputAndDirection() {
        // Hand arithmetic on the first two inputs of reference sheet case A2.
        assertThat(series.distinctInputs()).containsExactly(0, 2);
        assertThat(series.meanOutputByInput().get(0.0)).isCloseTo((0.05 + 0.09 + 0.04) / 3, within(1e-15));
        assertThat(series.meanOutputByInput(Direction.UP).get(2.0)).isCloseTo(20.11, within(1e-12));
        assertThat(series.meanOutputByInput(Direction.DOWN).get(2.0)).isCloseTo(20.20, within(1e-15));
        assertThat(series.groupsByInputAndDirection()).extracting(ReadingGroup::count).containsExactly(2, 1, 2, 1);
        assertThat(series.groupsByInputAndDirection().get(0).variance())
                .isCloseTo(0.01 * 0.01 / 2, within(1e-15));
        assertThat(series.hasDirection(Direction.DOWN)).isTrue();
    }

    @Test
    void isImmutable() {
        List<CalibrationPoint> source = new ArrayList<>(series.points());
        CalibrationSeries copy = CalibrationSeries.of(source);
        source.clear();
        assertThat(copy.size()).isEqualTo(6);
        assertThatThrownBy(() -> copy.points().add(CalibrationPoint.up(1, 1)))
                .isInstanceOf(UnsupportedOperationException.class);
        assertThatThrownBy(() -> copy.meanOutputByInput().put(1.0, 1.0))
                .isInstanceOf(UnsupportedOperationException.class);
        assertThat(copy).isEqualTo(series);
    }

    @Test
    void negativeZeroGroupsWithZero() {
        CalibrationSeries s = CalibrationSeries.of(CalibrationPoint.up(-0.0, 1), CalibrationPoint.up(0.0, 3));
        assertThat(s.distinctInputs()).hasSize(1);
        assertThat(s.meanOutputByInput().get(0.0)).isEqualTo(2.0);
    }

    @Test
    void refusesMalformedPoints() {
        assertThatThrownBy(() -> CalibrationPoint.up(Double.NaN, 1))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("input");
        assertThatThrownBy(() -> CalibrationPoint.up(1, Double.NEGATIVE_INFINITY))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("output");
        assertThatThrownBy(() -> new CalibrationPoint(1, 1, null, 1))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("direction");
        assertThatThrownBy(() -> new CalibrationPoint(1, 1, Direction.UP, -1))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("cycle");
        assertThatThrownBy(() -> CalibrationSeries.of(List.of()))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("at least one");
    }
}
