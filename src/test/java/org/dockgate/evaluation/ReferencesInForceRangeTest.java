package org.dockgate.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import org.dockgate.bench.Reading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.core.UnevaluableException;
import org.dockgate.core.evaluation.ReferenceUncertainty;
import org.dockgate.core.series.Direction;
import org.dockgate.instruments.CalibrationRecord;
import org.dockgate.instruments.CalibrationStatus;
import org.dockgate.instruments.InstrumentView;
import org.dockgate.instruments.UncertaintyBand;
import org.dockgate.instruments.UncertaintyMode;
import org.junit.jupiter.api.Test;

/** A reading outside the calibrated range of the reference in force is flagged and not used (no database). */
class ReferencesInForceRangeTest {

    static final Instant RECORDED = Instant.parse("2026-11-20T09:00:00Z");

    static Reading reading(double point, Instant at) {
        return new Reading(1, 1, "S-1", ReadingTest.STATIC, point, Optional.of(Direction.UP), OptionalInt.of(1), 0,
                10 * point, "mV", 10 * point, "mV", "RI-T", "operator", at, Optional.empty(), Optional.empty(),
                Optional.empty(), Optional.empty(), Optional.empty(), point, Optional.empty(), Optional.empty());
    }

    @Test
    void aReadingBelowTheCalibratedRangeIsFlaggedAndHasNoUncertainty() {
        // 0 … 20 bar instrument, calibrated over 0.2 … 20 bar only: 0.01 % of reading, floor 0.0001 bar, k = 2.
        CalibrationRecord record = new CalibrationRecord(1, "C-9", LocalDate.of(2026, 11, 20),
                LocalDate.of(2027, 11, 20), 2.0, List.of(new UncertaintyBand(20, 0.01,
                UncertaintyMode.PERCENT_OF_READING)), RECORDED, 0.2, 20.0, 0.0001);
        InstrumentView view = new InstrumentView("RI-T", "test", "pressure", 0, 20, "bar", record, List.of(record),
                LocalDate.of(2026, 12, 2), CalibrationStatus.IN_CALIBRATION, 353, 0,
                java.util.OptionalDouble.empty());
        Instant at = Instant.parse("2026-12-01T10:00:00Z");
        List<String> problems = new ArrayList<>();
        Map<String, UnitEvaluationView.CalibrationUsed> used = new LinkedHashMap<>();
        Optional<ReferenceUncertainty> ref = ReferencesInForce.of(List.of(reading(0, at), reading(10, at)),
                id -> Optional.of(view), "bar", true, used, problems);
        assertThat(problems).singleElement().asString().contains("The reading at 0.0 bar")
                .contains("calibrated over 0.2 … 20 bar only (certificate C-9)")
                .contains("outside the range of the reference in force");
        // 0.01 % of 10 bar = 0.001 bar
        assertThat(ref.orElseThrow().expandedAt(10)).isCloseTo(0.001, within(1e-15));
        // A metric that needs U at 0 bar is not evaluable, with the reason.
        assertThatThrownBy(() -> ref.get().expandedAt(0)).isInstanceOf(UnevaluableException.class)
                .hasMessageContaining("0.2 … 20 bar");
    }
}
