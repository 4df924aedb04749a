package org.dockgate.core.quantity;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class UnitsTest {

    @Test
    void poundPerSquareInchIsExactByDefinition() {
        // NIST SP 811 (2008) B.8 prints 6.894 757 E+03 Pa; the exact value follows from the definitions there of the
        // pound (0.453 592 37 kg), g_n (9.806 65 m/s²) and the inch (0.0254 m): 6894.757293168361... Pa.
        // Double precision holds it to 1 ulp (relative 4e-16 allowed).
        assertThat(0.45359237 * 9.80665 / (0.0254 * 0.0254)).isCloseTo(6894.757293168361, within(1e-11));
        assertThat(Units.convert(1, "psi", "Pa")).isCloseTo(6894.757293168361, within(6894.757293168361 * 4e-16));
        assertThat(Units.convert(100, "psi", "kPa")).isCloseTo(689.4757293168361, within(1e-12));
    }

    @Test
    void standardGravityIsExactByDefinition() {
        // 3rd CGPM (1901): standard acceleration of gravity g_n = 9.80665 m/s² exactly.
        assertThat(Units.convert(1, "g", "m/s2")).isEqualTo(9.80665);
        assertThat(Units.convert(1, "g", "m/s²")).isEqualTo(9.80665);
        assertThat(Units.convert(1000, "mg", "g")).isCloseTo(1.0, within(1e-15));
        assertThat(Units.convert(20, "µg", "m/s2")).isCloseTo(20e-6 * 9.80665, within(1e-18));
    }

    @Test
    void barIsOneHundredKilopascal() {
        // SI Brochure (9th ed.) Table 8: 1 bar = 0.1 MPa = 100 000 Pa.
        assertThat(Units.convert(1, "bar", "Pa")).isEqualTo(100_000.0);
        assertThat(Units.convert(1, "bar", "MPa")).isCloseTo(0.1, within(1e-16));
        assertThat(Units.convert(250, "mbar", "kPa")).isCloseTo(25, within(1e-12));
    }

    @Test
    void temperaturesConvertAsAbsoluteValues() {
        // SI Brochure (9th ed.) 2.3.1: t/°C = T/K - 273.15.
        assertThat(Units.convert(25, "°C", "K")).isCloseTo(298.15, within(1e-12));
        assertThat(Units.convert(25, "degC", "K")).isCloseTo(298.15, within(1e-12));
        assertThat(Units.convert(100, "℃", "°F")).isCloseTo(212, within(1e-12)); // t/°F = 1.8 t/°C + 32
    }

    @Test
    void sensitivityUnitsConvertByTheirFactors() {
        // 1 mV/g = 1 mV / 9.80665 (m/s²) (CGPM 1901 g_n); 1 pC/g likewise.
        assertThat(Units.convert(100, "mV/g", "mV/(m/s2)")).isCloseTo(100 / 9.80665, within(1e-12));
        assertThat(Units.convert(10, "pC/g", "pC/(m.s-2)")).isCloseTo(10 / 9.80665, within(1e-12));
        assertThat(Units.convert(2, "mV/V", "1")).isCloseTo(0.002, within(1e-18));
        assertThat(Units.convert(1, "kohm", "Ω")).isCloseTo(1000, within(1e-12));
        assertThat(Units.convert(5, "kN", "N")).isCloseTo(5000, within(1e-12));
        assertThat(Units.convert(20, "mA", "A")).isCloseTo(0.020, within(1e-17));
    }

    @ParameterizedTest(name = "{0} -> {1}")
    @CsvSource({
        "m/s2, m/s2", "m/s², m/s2", "g, [g]", "mg, m[g]", "µg, u[g]", "μV, uV", "psi, [psi]", "°C, Cel",
        "degC, Cel", "Ω, Ohm", "ohm, Ohm", "mV/g, mV/[g]", "pC/g, pC/[g]", "mV/V, mV/V", "kPa, kPa", "lx, lx",
        "N·m, N.m", "Cel, Cel", "[psi], [psi]", "gram, g", "s-1, s-1",
    })
    void mapsFriendlySymbolsToUcum(String symbol, String ucum) {
        assertThat(Units.toUcum(symbol)).isEqualTo(ucum);
    }

    @ParameterizedTest(name = "{0} is a {1}")
    @CsvSource({
        "Pa, pressure", "kPa, pressure", "MPa, pressure", "bar, pressure", "psi, pressure",
        "N, force", "kN, force", "°C, temperature", "K, temperature", "lx, illuminance", "V, voltage",
        "mV, voltage", "mA, electric current", "Ω, resistance", "pC, electric charge", "m/s2, acceleration",
        "g, acceleration", "mV/V, dimensionless ratio", "Hz, frequency", "gram, mass",
    })
    void knowsTheKindOfQuantity(String symbol, String kind) {
        assertThat(Units.dimensionName(symbol)).isEqualTo(kind);
    }

    @Test
    void refusesIncompatibleUnitsWithAClearMessage() {
        assertThat(Units.isCompatible("mV/g", "Pa")).isFalse();
        assertThatThrownBy(() -> Units.requireCompatible("mV/g", "Pa"))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("'mV/g' is not compatible with 'Pa'")
                .hasMessageContaining("a pressure was expected");
        assertThatThrownBy(() -> Units.convert(1, "°C", "Pa"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("a temperature");
        assertThatThrownBy(() -> Measure.of(3, "V").requireCompatibleWith("A"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("an electric current was expected");
    }

    @Test
    void refusesUnknownOrEmptyUnits() {
        assertThatThrownBy(() -> Units.parse("furlongs")).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("Unknown unit 'furlongs'");
        assertThatThrownBy(() -> Units.parse(" ")).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> Units.parse(null)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> Measure.of(Double.NaN, "V")).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> Units.convert(Double.POSITIVE_INFINITY, "V", "mV"))
                .isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void measuresConvert() {
        Measure pressure = Measure.of(14.5, "psi");
        // 14.5 psi x 6894.757293168361 Pa/psi (NIST SP 811) = 99973.98075 Pa (hand arithmetic).
        assertThat(pressure.to("Pa").value()).isCloseTo(14.5 * 6894.757293168361, within(1e-9));
        assertThat(pressure.to("bar").unit()).isEqualTo("bar");
        assertThat(pressure.valueIn("kPa")).isCloseTo(99.97398075094, within(1e-9));
    }

    @Test
    void convertersAreCached() {
        assertThat(Units.converter("psi", "Pa")).isSameAs(Units.converter("psi", "Pa"));
    }

    /** Unit texts that crashed requests with a java.lang.Error from the UCUM parser or a stack overflow. */
    @org.junit.jupiter.params.ParameterizedTest
    @org.junit.jupiter.params.provider.ValueSource(strings = {"mV\u00e9", "\u20ac", "\ufeffmV", "mV\ufffd",
            "m\u202eV", "[", "{", "mV{x}", "mV6000", "m[g", "mV)", "V\u0000", "mV/\u00e9"})
    void refusesMalformedUnitTextWithAMessageNotAnError(String text) {
        assertThatThrownBy(() -> Units.parse(text)).isInstanceOf(IllegalArgumentException.class)
                .message().doesNotContain("\u202e").doesNotContain("\u0000");
    }

    @Test
    void refusesOverlongUnitText() {
        assertThatThrownBy(() -> Units.parse("m".repeat(33))).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("at most 32 characters");
    }

    @Test
    void theCacheOfParsedUnitsIsBounded() {
        // Every row of a hostile file may carry a different valid unit text: the cache must not grow with it.
        for (int a = 1; a <= 9; a++) {
            for (int b = 1; b <= 9; b++) {
                for (int c = 1; c <= 9; c++) {
                    Units.parse("m" + a + ".s-" + b + ".kg" + c); // 729 different valid units
                }
            }
        }
        assertThat(Units.cachedEntries()).isLessThanOrEqualTo(2 * Units.CACHE_LIMIT);
    }
}
