package org.dockgate.core.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Instant;
import java.time.ZoneId;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Rounding of results as reported: JCGM 100:2008 7.2.6 (U to at most two significant digits, the result
 * to the same decimal place); U rounded up (common practice).
 */
class ResultFormatTest {

    @ParameterizedTest(name = "U {0} → {1}")
    @CsvSource({
            "0.0095, 0.0095",     // already two significant digits
            "0.01049, 0.011",     // rounded up, not to the nearer 0.010 (common practice)
            "0.013, 0.013",       // no floating-point residue rounds it up to 0.014
            "0.013000000000000001, 0.013",
            "0.0131, 0.014",
            "0.0995, 0.10",       // rounding up crosses a decade: trailing zero kept
            "1.0, 1.0",           // two significant digits even when the double is an integer
            "0.5, 0.50",
            "2.3, 2.3",
            "1234, 1300",
            "0, 0",               // zero U
    })
    void uncertaintyHasTwoSignificantDigitsRoundedUp(double u, String expected) {
        assertThat(ResultFormat.uncertainty(u)).isEqualTo(expected);
    }

    @ParameterizedTest(name = "{0} with U {1} → {2}")
    @CsvSource({
            "10.0, 0.013, 10.000",         // trailing zeros kept: they state the precision
            "10.0012344, 0.0015432, 10.0012",
            "123.456, 2.3, 123.5",
            "9.3e-16, 0.00018, 0.00000",   // floating-point noise far below U prints as zero
            "-0.00001, 0.0018, 0.0000",    // no "−0.0000"
            "-0.0123, 0.0011, −0.0123",    // negative values carry a true minus sign
            "-10.5, 0.013, −10.500",
            "12345.6, 1234, 12300",        // U of 1300: tens and units are not significant
            "0.0125, 0.01049, 0.013",      // value at U's place after U is rounded up (0.011 → 3 decimals)
            "10.0, 0, 10",                 // zero U: a stated value, no precision claimed
    })
    void theValueIsGivenToTheDecimalPlaceOfU(double value, double u, String expected) {
        assertThat(ResultFormat.value(value, u)).isEqualTo(expected);
    }

    @Test
    void aResultReadsWithItsUnitOnTheValueAndOnU() {
        // Issue 12: "10.000 mV/bar, U = 0.013 mV/bar (k = 2.00)".
        assertThat(ResultFormat.withUncertainty(10.0, 0.013, 2.0, "mV/bar"))
                .isEqualTo("10.000 mV/bar, U = 0.013 mV/bar (k = 2.00)");
        assertThat(ResultFormat.uncertaintyWithUnit(0.0095, 2.28, "%FSO")).isEqualTo("0.0095 %FSO (k = 2.28)");
        assertThat(ResultFormat.decimals(0.013)).isEqualTo(3);
        assertThat(ResultFormat.decimals(1234)).isEqualTo(-2);
        assertThatThrownBy(() -> ResultFormat.decimals(0)).isInstanceOf(IllegalArgumentException.class);
        assertThat(ResultFormat.csvNumber(-0.0123, 0.0011)).isEqualTo("-0.0123");
    }

    @Test
    void limitsAreWrittenAsPeopleStateThem() {
        assertThat(ResultFormat.interval(OptionalDouble.of(9.9), OptionalDouble.of(10.1), "mV/bar")).isEqualTo("9.9 … 10.1 mV/bar");
        assertThat(ResultFormat.interval(OptionalDouble.empty(), OptionalDouble.of(0.25), "%FSO")).isEqualTo("≤ 0.25 %FSO");
        assertThat(ResultFormat.interval(OptionalDouble.of(5000), OptionalDouble.empty(), "Hz")).isEqualTo("≥ 5000 Hz");
        assertThat(ResultFormat.interval(OptionalDouble.of(-0.25), OptionalDouble.of(0.25), "°C")).isEqualTo("−0.25 … 0.25 °C");
        // A guard band wider than the tolerance leaves no acceptance zone: said in words, never −∞ … +∞.
        assertThat(ResultFormat.acceptanceZone(OptionalDouble.of(-0.25), OptionalDouble.of(0.25), OptionalDouble.empty(),
                OptionalDouble.empty(), "°C")).isEqualTo("no acceptance zone: the guard band leaves none");
        assertThat(ResultFormat.acceptanceZone(OptionalDouble.empty(), OptionalDouble.of(0.25), OptionalDouble.empty(),
                OptionalDouble.of(0.21), "%FSO")).isEqualTo("≤ 0.21 %FSO");
        assertThat(ResultFormat.acceptanceZone(OptionalDouble.empty(), OptionalDouble.of(0.25), OptionalDouble.empty(),
                OptionalDouble.empty(), "%FSO")).isEqualTo(ResultFormat.EMPTY_ZONE);
        assertThat(ResultFormat.stated(0.1 + 0.2)).isEqualTo("0.3");
    }

    @Test
    void datesAndTimesAreInTheLabsZoneToTheSecond() {
        Instant at = Instant.parse("2026-03-04T08:15:02.123456Z");
        assertThat(ResultFormat.dateTime(at, ZoneId.of("UTC"))).isEqualTo("2026-03-04 08:15:02 UTC");
        assertThat(ResultFormat.dateTime(at, ZoneId.of("Europe/Berlin"))).isEqualTo("2026-03-04 09:15:02 CET");
        assertThat(ResultFormat.dateTime(at, ZoneId.of("UTC"))).doesNotContain(".123");
    }
}
