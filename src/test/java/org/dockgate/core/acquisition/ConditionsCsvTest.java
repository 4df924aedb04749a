package org.dockgate.core.acquisition;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.StringReader;
import java.util.List;
import java.util.OptionalDouble;
import org.dockgate.core.procedure.EnvironmentalLimits;
import org.dockgate.core.procedure.SensorKind;
import org.junit.jupiter.api.Test;

/** The companion conditions file, the physical checks and the procedure's limits, in plain Java. */
class ConditionsCsvTest {

    static final String HEADER = ConditionsCsv.HEADER + "\n";

    static ConditionsCsv.Report parse(String text) {
        return ConditionsCsv.parse(new StringReader(text));
    }

    @Test
    void aGoodFileGivesOneRowPerUnitWithOptionalPressureAndReason() {
        var report = parse("\uFEFF" + HEADER + "SN-1,22.8,45,101.3,\r\n\r\nSN-2, 29.1 ,46,,\"Cooling failed, lot needed\"\n");
        assertThat(report.valid()).isTrue();
        assertThat(report.rowsRead()).isEqualTo(2);
        assertThat(report.rows()).hasSize(2);
        var first = report.rows().get(0);
        assertThat(first.line()).isEqualTo(2);
        assertThat(first.conditions()).isEqualTo(new AmbientConditions(22.8, 45, OptionalDouble.of(101.3)));
        assertThat(first.deviationReason()).isEmpty();
        var second = report.rows().get(1);
        assertThat(second.line()).isEqualTo(4); // the blank line counts
        assertThat(second.conditions().pressureKPa()).isEmpty();
        assertThat(second.deviationReason()).contains("Cooling failed, lot needed");
    }

    @Test
    void everyBadFieldIsNamedByLineAndColumn() {
        var report = parse(HEADER
                + "SN-1,abc,45,,\n"
                + "SN-2,22,45%,,\n"
                + ",22,45,,\n"
                + "SN-4,-300,45,,\n"
                + "SN-5,22,101,,\n"
                + "SN-6,22,45,-1,\n"
                + "SN-7,22,45\n"
                + "SN-8,22,,,\n"
                + "SN-9,22.5,40,,\n"
                + "SN-9,22.6,41,,\n"
                + "SN-10,\"22,5\",40,,\n");
        assertThat(report.errors().stream().map(RowError::toString).toList()).containsExactly(
                "line 2, column 'ambientC': 'abc' is not a number",
                "line 3, column 'relativeHumidityPercent': '45%' is not a number",
                "line 4, column 'serial': is empty; the unit's serial number is needed",
                "line 5, column 'ambientC': -300 °C lies below absolute zero (-273.15 °C).",
                "line 6, column 'relativeHumidityPercent': 101 % lies outside 0 … 100 %: relative humidity is a ratio.",
                "line 7, column 'pressureKPa': -1 kPa is negative; an absolute pressure cannot be.",
                "line 8: 3 fields, expected 5 (" + ConditionsCsv.HEADER + ")",
                "line 9, column 'relativeHumidityPercent': is empty; a number is expected",
                "line 11, column 'serial': 'SN-9' already has conditions on line 10; give one line per unit",
                "line 12, column 'ambientC': '22,5' is not a number (write the decimal separator as a point)");
        assertThat(report.rows()).extracting(ConditionsCsv.ConditionsRow::serial).containsExactly("SN-9");
    }

    @Test
    void aWrongHeaderOrABrokenQuoteStopsTheFile() {
        assertThat(parse("serial;ambientC\nSN-1;22\n").errors()).singleElement().asString()
                .startsWith("line 1: the header row must be exactly");
        assertThat(parse("").errors()).singleElement().asString().contains("the file is empty");
        var broken = parse(HEADER + "SN-1,22,45,,\"no end\n");
        assertThat(broken.valid()).isFalse();
        assertThat(broken.errors().get(0).message()).contains("malformed");
    }

    @Test
    void impossibleConditionsAreRefusedWhateverTheLimits() {
        assertThatThrownBy(() -> AmbientConditions.of(Double.NaN, 45)).hasMessageContaining("'ambientC'");
        assertThatThrownBy(() -> AmbientConditions.of(-273.16, 45)).hasMessageContaining("below absolute zero");
        AmbientConditions.of(-273.15, 0); // absolute zero itself is a temperature (SI Brochure 2.3.1)
        assertThatThrownBy(() -> AmbientConditions.of(23, 100.01)).hasMessageContaining("'relativeHumidityPercent'");
        assertThatThrownBy(() -> new AmbientConditions(23, 45, OptionalDouble.of(Double.POSITIVE_INFINITY)))
                .hasMessageContaining("'pressureKPa'");
    }

    @Test
    void theLimitsAreInclusiveAndEachDepartureNamesTheValueAndTheLimit() {
        EnvironmentalLimits limits = EnvironmentalLimits.defaultFor(SensorKind.PRESSURE_TRANSDUCER);
        // Common practice: 23 ± 5 °C, 20 … 80 % RH.
        assertThat(limits).isEqualTo(EnvironmentalLimits.GENERAL);
        assertThat(limits.departures(AmbientConditions.of(18, 20))).isEmpty();
        assertThat(limits.departures(AmbientConditions.of(28, 80))).isEmpty();
        assertThat(limits.departures(AmbientConditions.of(17.9, 80.5))).containsExactly(
                "ambient temperature 17.9 °C lies below the procedure's limit of 18 °C (18 … 28 °C)",
                "relative humidity 80.5 % lies above the procedure's limit of 80 % RH (20 … 80 % RH)");
        assertThat(EnvironmentalLimits.defaultFor(SensorKind.ACCELEROMETER).departures(AmbientConditions.of(23, 78)))
                .containsExactly("relative humidity 78 % lies above the procedure's limit of 75 % RH (20 … 75 % RH)");
        assertThatThrownBy(() -> new EnvironmentalLimits(28, 18, 20, 80, "x")).hasMessageContaining("lies above");
        assertThatThrownBy(() -> new EnvironmentalLimits(18, 28, 20, 120, "x")).hasMessageContaining("0 ≤ lowest");
        assertThat(List.of(limits.describe())).singleElement().asString().contains("18 … 28 °C").contains("common practice");
    }
}
