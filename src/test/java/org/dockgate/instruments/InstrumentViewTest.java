package org.dockgate.instruments;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import org.dockgate.core.quantity.Units;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Range coverage and uncertainty at a value, without a database: the arithmetic of {@link InstrumentView}. */
class InstrumentViewTest {

    static final LocalDate TODAY = LocalDate.of(2024, 2, 28);

    static InstrumentView view(double min, double max, String unit, UncertaintyBand... bands) {
        CalibrationRecord c = new CalibrationRecord(1, "C-1", TODAY.minusDays(10), TODAY.plusDays(300), 2.0,
                List.of(bands), Instant.parse("2024-02-18T09:00:00Z"));
        return InstrumentView.of("RI-TEST", "test", "pressure", min, max, unit, List.of(c), TODAY, 0);
    }

    @Test
    void psiIsTheHandbookValueInPascal() {
        // NIST SP 811 (2008) Appendix B.8: 1 psi (pound-force per square inch) = 6.894 757 E+03 Pa
        assertThat(Units.convert(1, "psi", "Pa")).isCloseTo(6894.757, within(0.0005));
        // 1 bar = 1E+05 Pa exactly (NIST SP 811 B.8), so 1 bar = 14.503 77 psi to the handbook's digits
        assertThat(Units.convert(1, "bar", "psi")).isCloseTo(1e5 / 6894.757, within(1e-5));
    }

    @ParameterizedTest(name = "0 to {0} {1} in a 0 to 7 bar instrument: {2}")
    @CsvSource({
        // 7 bar = 700000 Pa / 6894.757293 Pa/psi = 101.5264 psi (NIST SP 811 B.8 factor)
        "100,    psi, true",
        "101.52, psi, true",
        "101.53, psi, false",
        "700,    kPa, true",
        "700.01, kPa, false",
        "7,      bar, true",
        "0.7,    MPa, true"})
    void aRangeIsCoveredAfterConversion(double max, String unit, boolean covered) {
        InstrumentView v = view(0, 7, "bar", new UncertaintyBand(7, 0.02, UncertaintyMode.PERCENT_OF_READING));
        assertThat(v.covers(0, max, unit)).isEqualTo(covered);
    }

    @Test
    void anInstrumentInPsiCoversABarRange() {
        InstrumentView v = view(0, 150, "psi", new UncertaintyBand(150, 0.1, UncertaintyMode.ABSOLUTE));
        // 10 bar = 145.0377 psi; 10.35 bar = 150.114 psi (NIST SP 811 B.8 factor)
        assertThat(v.covers(0, 10, "bar")).isTrue();
        assertThat(v.covers(0, 10.35, "bar")).isFalse();
        assertThat(v.covers(-0.1, 5, "bar")).as("below the range").isFalse();
    }

    @Test
    void rangeEndsThatRoundTripThroughAnotherUnitStillFit() {
        InstrumentView v = view(0, 20, "bar", new UncertaintyBand(20, 0.01, UncertaintyMode.PERCENT_OF_READING));
        double twentyBarInPsi = Units.convert(20, "bar", "psi");
        assertThat(v.covers(0, twentyBarInPsi, "psi")).isTrue();
    }

    @Test
    void aUnitOfAnotherKindIsRefused() {
        InstrumentView v = view(0, 7, "bar", new UncertaintyBand(7, 0.02, UncertaintyMode.PERCENT_OF_READING));
        assertThatThrownBy(() -> v.covers(0, 5, "V")).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("not compatible");
    }

    @Test
    void percentOfReadingScalesWithTheValueAndIsGivenInTheAskedUnit() {
        InstrumentView v = view(0, 7, "bar", new UncertaintyBand(7, 0.02, UncertaintyMode.PERCENT_OF_READING));
        // 0.02 % of 5 bar = 0.001 bar = 0.1 kPa (1 bar = 100 kPa exactly)
        assertThat(v.expandedUncertaintyAt(5, "bar")).isCloseTo(0.001, within(1e-15));
        assertThat(v.expandedUncertaintyAt(500, "kPa")).isCloseTo(0.1, within(1e-12));
        // 0.02 % of 100 psi = 0.02 psi, whatever unit the range is kept in
        assertThat(v.expandedUncertaintyAt(100, "psi")).isCloseTo(0.02, within(1e-12));
        assertThat(v.uncertaintyAt(100, "psi").coverageFactor()).isEqualTo(2.0);
    }

    @Test
    void percentOfFullScaleUsesTheLargerRangeLimit() {
        InstrumentView v = view(-100, 100, "m/s2",
                new UncertaintyBand(100, 0.5, UncertaintyMode.PERCENT_OF_FULL_SCALE));
        // full scale = max(|−100|, |100|) = 100 m/s²: U = 0.5 m/s² at every value
        assertThat(v.fullScale()).isEqualTo(100.0);
        assertThat(v.expandedUncertaintyAt(3, "m/s2")).isCloseTo(0.5, within(1e-12));
        assertThat(v.expandedUncertaintyAt(-80, "m/s2")).isCloseTo(0.5, within(1e-12));
        // 0.5 m/s² in standard gravity: 0.5 / 9.80665 (CGPM 1901 standard acceleration of gravity)
        assertThat(v.expandedUncertaintyAt(1, "g")).isCloseTo(0.5 / 9.80665, within(1e-12));
    }

    @Test
    void aTemperatureUncertaintyConvertsAsADifference() {
        InstrumentView v = view(-40, 300, "°C", new UncertaintyBand(300, 0.03, UncertaintyMode.ABSOLUTE));
        // A difference of 1 °C is 1 K and 1.8 °F (ITS-90 / the definition of the degree Fahrenheit)
        assertThat(v.expandedUncertaintyAt(100, "°C")).isCloseTo(0.03, within(1e-12));
        assertThat(v.expandedUncertaintyAt(373.15, "K")).isCloseTo(0.03, within(1e-9));
        assertThat(v.expandedUncertaintyAt(212, "°F")).isCloseTo(0.054, within(1e-9));
    }

    @ParameterizedTest(name = "{0} ohm: U = {1} ohm")
    @CsvSource({
        "10,  0.005",   // first segment, absolute
        "100, 0.005",   // a segment includes its upper end
        "200, 0.01",    // second segment: 0.005 % of 200 ohm
        "400, 0.02"})
    void theSegmentOfTheValueGivesU(double value, double expected) {
        InstrumentView v = view(0, 400, "ohm",
                new UncertaintyBand(100, 0.005, UncertaintyMode.ABSOLUTE),
                new UncertaintyBand(400, 0.005, UncertaintyMode.PERCENT_OF_READING));
        assertThat(v.expandedUncertaintyAt(value, "ohm")).isCloseTo(expected, within(1e-12));
    }

    @Test
    void aValueOutsideTheRangeHasNoUncertainty() {
        InstrumentView v = view(0, 7, "bar", new UncertaintyBand(7, 0.02, UncertaintyMode.PERCENT_OF_READING));
        assertThatThrownBy(() -> v.expandedUncertaintyAt(8, "bar")).isInstanceOf(IllegalArgumentException.class)
                .hasMessage("RI-TEST is calibrated over 0 … 7 bar (certificate C-1); 8 bar lies outside it.");
    }

    @ParameterizedTest(name = "due {0} days after today: {1}")
    @CsvSource({"-1, EXPIRED", "0, EXPIRED", "1, DUE_SOON", "30, DUE_SOON", "31, IN_CALIBRATION", "365, IN_CALIBRATION"})
    void statusFollowsTheDueDate(int days, CalibrationStatus expected) {
        assertThat(CalibrationStatus.of(TODAY.plusDays(days), TODAY)).isEqualTo(expected);
    }

    @Test
    void aBandRefusesNonsense() {
        assertThatThrownBy(() -> new UncertaintyBand(Double.NaN, 1, UncertaintyMode.ABSOLUTE))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> new UncertaintyBand(1, 0, UncertaintyMode.ABSOLUTE))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("greater than zero");
        assertThatThrownBy(() -> new UncertaintyBand(1, 1, null)).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void quantitiesCheckTheirUnits() {
        Quantity.PRESSURE.requireUnit("psi");
        Quantity.ACCELERATION.requireUnit("g");
        Quantity.TEMPERATURE.requireUnit("°C");
        Quantity.RESISTANCE.requireUnit("kΩ");
        Quantity.RATIO.requireUnit("mV/V");
        assertThatThrownBy(() -> Quantity.PRESSURE.requireUnit("mV")).isInstanceOf(IllegalArgumentException.class)
                .hasMessage("The unit 'mV' does not fit a pressure: 'mV' is a unit of voltage, a pressure needs a"
                        + " unit such as Pa, kPa, bar or psi.");
        assertThatThrownBy(() -> Quantity.of("presure")).isInstanceOf(IllegalArgumentException.class)
                .hasMessageStartingWith("Unknown quantity 'presure': use one of pressure, acceleration");
        assertThat(Quantity.of(" Pressure ")).isEqualTo(Quantity.PRESSURE);
        assertThat(Quantity.of(Units.dimensionName("mA"))).isEqualTo(Quantity.CURRENT);
        assertThat(Quantity.of(Units.dimensionName("mV/V"))).isEqualTo(Quantity.RATIO);
        for (Quantity q : Quantity.values()) {
            assertThat(Quantity.of(Units.dimensionName(q.referenceUnit()))).as(q.label()).isEqualTo(q);
        }
    }

    @Test
    void theCalibrationInForceIsTheLatestAlreadyEnteredCalibratedAndNotYetDueAtTheReading() {
        UncertaintyBand fine = new UncertaintyBand(20, 0.01, UncertaintyMode.PERCENT_OF_READING);
        UncertaintyBand coarse = new UncertaintyBand(20, 1.0, UncertaintyMode.PERCENT_OF_READING);
        // A: calibrated 2024-01-10, entered the same day, due 2024-03-01.
        CalibrationRecord a = new CalibrationRecord(1, "A", LocalDate.of(2024, 1, 10), LocalDate.of(2024, 3, 1), 2.0,
                List.of(fine), Instant.parse("2024-01-10T12:00:00Z"));
        // B: calibrated 2024-02-20 but entered only on 2024-02-27 at 14:00.
        CalibrationRecord b = new CalibrationRecord(2, "B", LocalDate.of(2024, 2, 20), LocalDate.of(2025, 2, 20), 2.0,
                List.of(coarse), Instant.parse("2024-02-27T14:00:00Z"));
        InstrumentView v = InstrumentView.of("RI-TEST", "test", "pressure", 0, 20, "bar", List.of(b, a), TODAY, 0);

        // Before B was entered, even on a day B's calibration date covers: A (a record never reaches back).
        assertThat(v.calibrationInForce(Instant.parse("2024-02-25T09:00:00Z"))).map(CalibrationRecord::certificateNumber).contains("A");
        assertThat(v.calibrationInForce(Instant.parse("2024-02-27T13:59:59Z"))).map(CalibrationRecord::certificateNumber).contains("A");
        // From the moment B is entered: B, the latest calibration then in the register.
        assertThat(v.calibrationInForce(Instant.parse("2024-02-27T14:00:00Z"))).map(CalibrationRecord::certificateNumber).contains("B");
        // Before A was entered: none. After A was due and before B was entered: none.
        assertThat(v.calibrationInForce(Instant.parse("2024-01-10T11:00:00Z"))).isEmpty();
        CalibrationRecord late = new CalibrationRecord(2, "B", LocalDate.of(2024, 3, 5), LocalDate.of(2025, 3, 5), 2.0,
                List.of(coarse), Instant.parse("2024-03-05T08:00:00Z"));
        InstrumentView gap = InstrumentView.of("RI-TEST", "test", "pressure", 0, 20, "bar", List.of(late, a), TODAY, 0);
        assertThat(gap.calibrationInForce(Instant.parse("2024-03-02T10:00:00Z"))).isEmpty();
        // U of a given record, not the current one: 0.01 % and 1 % of 10 bar.
        assertThat(v.expandedUncertaintyAt(a, 10, "bar")).isCloseTo(0.001, within(1e-12));
        assertThat(v.expandedUncertaintyAt(b, 10, "bar")).isCloseTo(0.1, within(1e-12));
    }
}
