package org.dockgate.instruments;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.test.context.bean.override.convention.TestBean;

/**
 * The register's rules on the real database of the run, with a clock the test sets. The clock starts
 * at the real time (the demo scenario, loaded at start, must agree with the calendar on a shared
 * PostgreSQL) and is set to a fixed test day in the past for each test, so the instruments made here
 * are long expired for any other test that looks at the register. Each test makes its own instruments
 * under fresh identifiers, and looks only at those.
 */
@SpringBootTest
class InstrumentServiceTest {

    /** A leap year's 28 February, so that "due within 30 days" crosses 29 February. */
    static final Instant TEST_DAY = Instant.parse("2024-02-28T09:00:00Z");
    static final LocalDate TODAY = LocalDate.of(2024, 2, 28);
    static final Instant START = Instant.now().truncatedTo(ChronoUnit.SECONDS);
    static final MutableClock CLOCK = new MutableClock(START);

    @TestBean
    Clock clock;

    static Clock clock() {
        return CLOCK;
    }

    @Autowired InstrumentService service;
    @Autowired JdbcTemplate jdbc;

    @BeforeEach
    void fixTheDay() {
        CLOCK.set(TEST_DAY);
    }

    @AfterEach
    void backToNow() {
        CLOCK.set(START);
    }

    static String fresh(String stem) {
        return "RI-T" + stem + "-" + UUID.randomUUID().toString().substring(0, 8).toUpperCase();
    }

    InstrumentView pressure(String id, double max, String unit, LocalDate calibratedOn, LocalDate dueOn) {
        return service.create(new NewInstrument(id, "Test pressure reference", "pressure", 0, max, unit,
                NewCalibration.uniform("CERT-" + id, calibratedOn, dueOn, 0.02, UncertaintyMode.PERCENT_OF_READING,
                        2, max)));
    }

    @Test
    void anExpiredInstrumentIsRefusedWithAClearMessage() {
        String id = fresh("EXP");
        pressure(id, 7, "bar", LocalDate.of(2023, 2, 20), LocalDate.of(2024, 2, 20));
        InstrumentView view = service.find(id).orElseThrow();
        assertThat(view.status()).isEqualTo(CalibrationStatus.EXPIRED);
        assertThat(view.selectable()).isFalse();
        assertThat(view.expiredSince()).contains(LocalDate.of(2024, 2, 20));
        assertThat(view.daysUntilDue()).isEqualTo(-8);
        assertThatThrownBy(() -> service.requireSelectable(id))
                .isInstanceOf(InstrumentNotSelectableException.class)
                .isInstanceOf(IllegalStateException.class)
                .hasMessage(id + " is out of calibration since 2024-02-20 and cannot be selected.");
        assertThatThrownBy(() -> service.requireSelectable(id, LocalDate.of(2024, 3, 5)))
                .hasMessage(id + " is out of calibration since 2024-02-20 and cannot be selected for 2024-03-05.");
        // ...but it was usable on a day its calibration was in force (a reading taken then stays valid).
        assertThat(service.requireSelectable(id, LocalDate.of(2024, 2, 19)).identifier()).isEqualTo(id);
        assertThatThrownBy(() -> service.requireSelectable(id, LocalDate.of(2023, 1, 1)))
                .isInstanceOf(InstrumentNotSelectableException.class)
                .hasMessageContaining("had no calibration in force on 2023-01-01");
        assertThat(service.qualifying("pressure", 0, 5, "bar")).extracting(InstrumentView::identifier)
                .doesNotContain(id);
        assertThat(service.list("pressure", CalibrationStatus.EXPIRED)).extracting(InstrumentView::identifier)
                .contains(id);
    }

    @Test
    void theDueDateItselfIsTheFirstDayOutOfCalibration() {
        String id = fresh("DUE");
        pressure(id, 7, "bar", LocalDate.of(2023, 3, 1), TODAY);
        assertThat(service.find(id).orElseThrow().status()).isEqualTo(CalibrationStatus.EXPIRED);
        assertThatThrownBy(() -> service.requireSelectable(id))
                .hasMessage(id + " is out of calibration since 2024-02-28 and cannot be selected.");
    }

    @Test
    void dueSoonIsFlaggedFromThirtyDaysBeforeTheDueDate() {
        // 2024-02-28 + 30 days = 2024-03-29, because 2024 is a leap year (ISO 8601 / Gregorian calendar)
        String at30 = fresh("D30");
        String at31 = fresh("D31");
        pressure(at30, 7, "bar", LocalDate.of(2023, 3, 29), LocalDate.of(2024, 3, 29));
        pressure(at31, 7, "bar", LocalDate.of(2023, 3, 30), LocalDate.of(2024, 3, 30));
        InstrumentView thirty = service.find(at30).orElseThrow();
        InstrumentView thirtyOne = service.find(at31).orElseThrow();
        assertThat(thirty.daysUntilDue()).isEqualTo(30);
        assertThat(thirty.status()).isEqualTo(CalibrationStatus.DUE_SOON);
        assertThat(thirty.dueSoon()).isTrue();
        assertThat(thirty.selectable()).as("due soon is still selectable").isTrue();
        assertThat(thirtyOne.daysUntilDue()).isEqualTo(31);
        assertThat(thirtyOne.status()).isEqualTo(CalibrationStatus.IN_CALIBRATION);
        assertThat(thirtyOne.dueSoon()).isFalse();

        CLOCK.set(TEST_DAY.plus(1, ChronoUnit.DAYS));
        assertThat(service.find(at31).orElseThrow().status()).isEqualTo(CalibrationStatus.DUE_SOON);
        CLOCK.set(Instant.parse("2024-03-28T23:59:59Z"));
        assertThat(service.find(at30).orElseThrow().status()).as("last day before the due date")
                .isEqualTo(CalibrationStatus.DUE_SOON);
        assertThat(service.requireSelectable(at30).identifier()).isEqualTo(at30);
        CLOCK.set(Instant.parse("2024-03-29T00:00:00Z"));
        assertThat(service.find(at30).orElseThrow().status()).isEqualTo(CalibrationStatus.EXPIRED);
    }

    @Test
    void qualifyingInstrumentsCoverTheRangeAfterUnitConversion() {
        String bar = fresh("BAR");
        String psi = fresh("PSI");
        String expired = fresh("OLD");
        pressure(bar, 7, "bar", LocalDate.of(2024, 1, 10), LocalDate.of(2025, 1, 10));
        pressure(psi, 150, "psi", LocalDate.of(2024, 1, 10), LocalDate.of(2025, 1, 10));
        pressure(expired, 500, "psi", LocalDate.of(2023, 1, 10), LocalDate.of(2024, 1, 10));
        // 1 psi = 6894.757 Pa (NIST SP 811 B.8): 100 psi = 6.894757 bar fits 0-7 bar, 102 psi = 7.0326 bar does not;
        // 7 bar = 101.526 psi, 10 bar = 145.04 psi fits 0-150 psi, 10.35 bar = 150.11 psi does not.
        assertThat(ids(service.qualifying("pressure", 0, 100, "psi"))).contains(bar, psi).doesNotContain(expired);
        assertThat(ids(service.qualifying("pressure", 0, 102, "psi"))).contains(psi).doesNotContain(bar, expired);
        assertThat(ids(service.qualifying("pressure", 0, 10, "bar"))).contains(psi).doesNotContain(bar, expired);
        assertThat(ids(service.qualifying("pressure", 0, 10.35, "bar"))).doesNotContain(bar, psi, expired);
        assertThat(ids(service.qualifying("PRESSURE", 1, 2, "kPa"))).contains(bar, psi);

        List<String> ordered = ids(service.qualifying("pressure", 0, 50, "psi")).stream()
                .filter(i -> i.equals(bar) || i.equals(psi)).toList();
        assertThat(ordered).as("narrowest span first: 7 bar = 101.5 psi < 150 psi").containsExactly(bar, psi);
        assertThat(ids(service.qualifying("acceleration", 0, 10, "g"))).doesNotContain(bar, psi);

        assertThatThrownBy(() -> service.qualifying("pressure", 0, 10, "V"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("does not fit a pressure");
        assertThatThrownBy(() -> service.qualifying("pressure", 10, 0, "bar"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("starts above its end");
        assertThatThrownBy(() -> service.qualifying("pressure", 0, Double.NaN, "bar"))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> service.qualifying("voltage pressure", 0, 1, "bar"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("Unknown quantity");
    }

    @Test
    void theUncertaintyAtAValueComesInTheAskedUnit() {
        String id = fresh("UNC");
        pressure(id, 7, "bar", LocalDate.of(2024, 1, 10), LocalDate.of(2025, 1, 10));
        // 0.02 % of reading: at 100 psi U = 0.02 psi; at 500 kPa U = 0.1 kPa
        assertThat(service.expandedUncertaintyAt(id, 100, "psi")).isCloseTo(0.02, within(1e-12));
        assertThat(service.expandedUncertaintyAt(id.toLowerCase(), 500, "kPa")).isCloseTo(0.1, within(1e-12));
        assertThat(service.uncertaintyAt(id, 5, "bar").standardUncertainty()).isCloseTo(0.0005, within(1e-15));
        assertThatThrownBy(() -> service.expandedUncertaintyAt(id, 8, "bar"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("lies outside it");
        assertThatThrownBy(() -> service.expandedUncertaintyAt("RI-NOT-THERE", 1, "bar"))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessage("There is no reference instrument 'RI-NOT-THERE' in the register.");
    }

    @Test
    void aNewCalibrationIsANewRecordAndKeepsTheOldOne() {
        String id = fresh("CAL");
        InstrumentView first = pressure(id, 7, "bar", LocalDate.of(2023, 2, 1), LocalDate.of(2024, 2, 1));
        assertThat(first.status()).isEqualTo(CalibrationStatus.EXPIRED);
        CalibrationRecord old = first.current();

        NewCalibration recalibration = new NewCalibration("CERT-" + id + "-2", LocalDate.of(2024, 2, 26),
                LocalDate.of(2025, 2, 26), 2.0, List.of(
                        new UncertaintyBand(1, 0.0002, UncertaintyMode.ABSOLUTE),
                        new UncertaintyBand(7, 0.015, UncertaintyMode.PERCENT_OF_READING)));
        InstrumentView second = service.recordCalibration(id, recalibration, first.version());

        assertThat(second.version()).isGreaterThan(first.version());
        assertThat(second.status()).isEqualTo(CalibrationStatus.IN_CALIBRATION);
        assertThat(second.calibrations()).hasSize(2);
        assertThat(second.current().sequenceNo()).isEqualTo(2);
        assertThat(second.current().certificateNumber()).isEqualTo("CERT-" + id + "-2");
        assertThat(second.calibrations().get(1)).as("the first record, unchanged").isEqualTo(old);
        assertThat(service.find(id).orElseThrow().calibrations()).containsExactlyElementsOf(second.calibrations());
        // the new certificate's segments: 0.0002 bar up to 1 bar, 0.015 % of reading above
        assertThat(service.expandedUncertaintyAt(id, 0.5, "bar")).isCloseTo(0.0002, within(1e-15));
        assertThat(service.expandedUncertaintyAt(id, 4, "bar")).isCloseTo(0.0006, within(1e-15));
        assertThat(service.requireSelectable(id).identifier()).isEqualTo(id);
        // the old calibration still answers for its own days, and the gap between them is refused
        assertThat(service.requireSelectable(id, LocalDate.of(2023, 6, 1)).identifier()).isEqualTo(id);
        assertThatThrownBy(() -> service.requireSelectable(id, LocalDate.of(2024, 2, 10)))
                .hasMessageContaining("out of calibration since 2024-02-01");

        // a stale version, a repeated certificate or an earlier date are refused; nothing is added
        assertThatThrownBy(() -> service.recordCalibration(id, NewCalibration.uniform("CERT-" + id + "-3",
                TODAY, TODAY.plusYears(1), 0.02, UncertaintyMode.PERCENT_OF_READING, 2, 7), first.version()))
                .isInstanceOf(ObjectOptimisticLockingFailureException.class);
        assertThatThrownBy(() -> service.recordCalibration(id, NewCalibration.uniform("cert-" + id + "-2",
                TODAY, TODAY.plusYears(1), 0.02, UncertaintyMode.PERCENT_OF_READING, 2, 7), second.version()))
                .isInstanceOf(InstrumentException.class).hasMessageContaining("is already recorded")
                .extracting(e -> ((InstrumentException) e).field()).isEqualTo("certificateNumber");
        assertThatThrownBy(() -> service.recordCalibration(id, NewCalibration.uniform("CERT-" + id + "-4",
                LocalDate.of(2024, 2, 25), TODAY.plusYears(1), 0.02, UncertaintyMode.PERCENT_OF_READING, 2, 7),
                second.version()))
                .isInstanceOf(InstrumentException.class).hasMessageContaining("cannot be dated earlier");
        assertThat(service.find(id).orElseThrow().calibrations()).hasSize(2);
    }

    @Test
    void everyChangeLeavesAnAuditEntryWithItsFields() {
        String id = fresh("AUD");
        InstrumentView created = pressure(id, 7, "bar", LocalDate.of(2024, 1, 10), LocalDate.of(2025, 1, 10));
        service.recordCalibration(id, NewCalibration.uniform("CERT-" + id + "-2", TODAY, TODAY.plusYears(1),
                0.01, UncertaintyMode.PERCENT_OF_READING, 2, 7), created.version());
        List<Map<String, Object>> entries = jdbc.queryForList("select action, changes, summary from audit_entry"
                + " where entity_type = ? and entity_id = ? order by sequence_no", InstrumentService.ENTITY_TYPE, id);
        assertThat(entries).extracting(e -> e.get("action")).containsExactly("CREATE", "CALIBRATE");
        assertThat((String) entries.get(0).get("changes")).contains("\"range\"").contains("0 to 7 bar")
                .contains("CERT-" + id);
        assertThat((String) entries.get(1).get("changes")).contains("CERT-" + id + "-2").contains("2024-02-28")
                .contains("U = 0.02 % of reading up to 7 bar").contains("U = 0.01 % of reading up to 7 bar");
    }

    @Test
    void badInputIsRefusedNamingTheField() {
        LocalDate on = LocalDate.of(2024, 1, 10);
        assertRefused(new NewInstrument(fresh("U"), "d", "pressure", 0, 7, "V",
                NewCalibration.uniform("C", on, on.plusYears(1), 1, UncertaintyMode.ABSOLUTE, 2, 7)),
                "unit", "The unit 'V' does not fit a pressure");
        assertRefused(new NewInstrument(fresh("Q"), "d", "pressure", 0, 7, "furlong",
                NewCalibration.uniform("C", on, on.plusYears(1), 1, UncertaintyMode.ABSOLUTE, 2, 7)),
                "unit", "Unknown unit 'furlong'");
        assertRefused(new NewInstrument(fresh("D"), "d", "pressure", 0, 7, "bar",
                NewCalibration.uniform("C", on, on.minusDays(1), 1, UncertaintyMode.ABSOLUTE, 2, 7)),
                "dueOn", "must come after the calibration date 2024-01-10");
        assertRefused(new NewInstrument(fresh("F"), "d", "pressure", 0, 7, "bar",
                NewCalibration.uniform("C", TODAY.plusDays(1), TODAY.plusYears(1), 1, UncertaintyMode.ABSOLUTE, 2, 7)),
                "calibratedOn", "is in the future");
        assertRefused(new NewInstrument(fresh("R"), "d", "pressure", 7, 7, "bar",
                NewCalibration.uniform("C", on, on.plusYears(1), 1, UncertaintyMode.ABSOLUTE, 2, 7)),
                "rangeMax", "must be above its lower end");
        assertRefused(new NewInstrument(fresh("K"), "d", "pressure", 0, 7, "bar",
                NewCalibration.uniform("C", on, on.plusYears(1), 1, UncertaintyMode.ABSOLUTE, 0, 7)),
                "coverageFactor", "greater than zero");
        assertRefused(new NewInstrument(fresh("B"), "d", "pressure", 0, 7, "bar",
                new NewCalibration("C", on, on.plusYears(1), 2, List.of(
                        new UncertaintyBand(3, 0.001, UncertaintyMode.ABSOLUTE),
                        new UncertaintyBand(6, 0.02, UncertaintyMode.PERCENT_OF_READING)))),
                "bands[1].upTo", "up to the top of the range (7 bar)");
        assertRefused(new NewInstrument(fresh("O"), "d", "pressure", 0, 7, "bar",
                new NewCalibration("C", on, on.plusYears(1), 2, List.of(
                        new UncertaintyBand(3, 0.001, UncertaintyMode.ABSOLUTE),
                        new UncertaintyBand(2, 0.001, UncertaintyMode.ABSOLUTE),
                        new UncertaintyBand(7, 0.02, UncertaintyMode.PERCENT_OF_READING)))),
                "bands[1].upTo", "must end above the previous one");
        assertRefused(new NewInstrument("no spaces please", "d", "pressure", 0, 7, "bar",
                NewCalibration.uniform("C", on, on.plusYears(1), 1, UncertaintyMode.ABSOLUTE, 2, 7)),
                "identifier", "1 to 40 letters");
        String taken = fresh("DUP");
        pressure(taken, 7, "bar", on, on.plusYears(1));
        assertRefused(new NewInstrument(" " + taken.toLowerCase() + " ", "d", "pressure", 0, 7, "bar",
                NewCalibration.uniform("C", on, on.plusYears(1), 1, UncertaintyMode.ABSOLUTE, 2, 7)),
                "identifier", taken + " is already in the register");
    }

    private void assertRefused(NewInstrument input, String field, String message) {
        assertThatThrownBy(() -> service.create(input)).isInstanceOf(InstrumentException.class)
                .hasMessageContaining(message)
                .extracting(e -> ((InstrumentException) e).field()).isEqualTo(field);
        if (input.identifier() != null && input.identifier().startsWith("RI-T")) {
            assertThat(service.find(input.identifier())).as("nothing saved").isEmpty();
        }
    }

    private static List<String> ids(List<InstrumentView> views) {
        return views.stream().map(InstrumentView::identifier).toList();
    }
}
