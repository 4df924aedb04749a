package org.dockgate.core.rtd;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ToleranceClassTest {

    @ParameterizedTest(name = "class {0} at {1} °C: ±{2} °C")
    @CsvSource({
        // Reference sheet A8 (IEC 60751 class formulas [C: S13]): tolerances at 100 °C.
        "AA, 100, 0.27",
        "A,  100, 0.35",
        "B,  100, 0.80",
        "C,  100, 1.60",
        // A8: at 400 °C, A 0.95 and B 2.30; at -100 °C, A 0.35 and B 0.80 (IEC 60751:1995 table [C: S13]).
        "A,  400, 0.95",
        "B,  400, 2.30",
        "A, -100, 0.35",
        "B, -100, 0.80",
        // Reference sheet §6.1, 1995 table [C: S13]: A at 0 and 200 °C; B at -200 (outside B's range, formula only),
        // 200 and 850 °C.
        "A,    0, 0.15",
        "A,  200, 0.55",
        "B,  200, 1.30",
        "B, -200, 1.30",
        "B,  850, 4.55",
    })
    void toleranceInDegrees(ToleranceClass c, double t, double expected) {
        assertThat(c.toleranceC(t)).isCloseTo(expected, within(1e-12));
    }

    @Test
    void toleranceInOhms() {
        CallendarVanDusen pt100 = CallendarVanDusen.iec60751(100);
        // Reference sheet A8: class A at 400 °C, 0.95 °C x 0.344630 Ω/°C = 0.3274 Ω (4 decimals).
        assertThat(pt100.sensitivityOhmPerC(400)).isCloseTo(0.344630, within(5e-7));
        assertThat(ToleranceClass.A.toleranceOhm(400, pt100)).isCloseTo(0.3274, within(5e-5));
        // Reference sheet §6.1, IEC 60751:1995 table in ohms [C: S13], 2 decimals: A 100 °C 0.13 Ω,
        // B -100 °C 0.32 Ω, B 200 °C 0.48 Ω, B -200 °C 0.56 Ω.
        assertThat(round2(ToleranceClass.A.toleranceOhm(100, pt100))).isEqualTo(0.13);
        assertThat(round2(ToleranceClass.A.toleranceOhm(200, pt100))).isEqualTo(0.20);
        assertThat(round2(ToleranceClass.B.toleranceOhm(-100, pt100))).isEqualTo(0.32);
        assertThat(round2(ToleranceClass.B.toleranceOhm(100, pt100))).isEqualTo(0.30);
        assertThat(round2(ToleranceClass.B.toleranceOhm(200, pt100))).isEqualTo(0.48);
        assertThat(round2(ToleranceClass.B.toleranceOhm(-200, pt100))).isEqualTo(0.56);
        // The same table prints 1.34 Ω for class B at 850 °C; the first-order tolerance x dR/dt gives
        // 4.55 x 0.292655 = 1.3316 Ω (hand arithmetic), 1.33 Ω. The printed value matches the mean slope over the
        // 800-850 °C step (4.55 x 0.29554 = 1.345), so it is not used as a check of this formula.
        assertThat(ToleranceClass.B.toleranceOhm(850, pt100)).isCloseTo(4.55 * 0.292655, within(1e-9));
    }

    @ParameterizedTest(name = "class {0}: valid {1} … {2} °C")
    @CsvSource({
        // IEC 60751 wire-wound validity ranges (reference sheet §6.1 [C: S13]).
        "AA, -50, 250",
        "A, -100, 450",
        "B, -196, 600",
        "C, -196, 600",
    })
    void validityRanges(ToleranceClass c, double min, double max) {
        assertThat(c.minTemperatureC()).isEqualTo(min);
        assertThat(c.maxTemperatureC()).isEqualTo(max);
        assertThat(c.isValidAt(min)).isTrue();
        assertThat(c.isValidAt(max)).isTrue();
        assertThat(c.isValidAt(min - 0.001)).isFalse();
        assertThat(c.isValidAt(max + 0.001)).isFalse();
    }

    @ParameterizedTest(name = "class {0}, {1}: valid {2} … {3} °C")
    @CsvSource({
        // IEC 60751:2008 Table 3, wire-wound: the same ranges as above (reference sheet §6.1 [C: S13]).
        "AA, WIRE_WOUND, -50, 250",
        "A,  WIRE_WOUND, -100, 450",
        "B,  WIRE_WOUND, -196, 600",
        "C,  WIRE_WOUND, -196, 600",
        // IEC 60751:2008 Table 3, thin-film: from memory, not checked against the printed table.
        "AA, THIN_FILM, 0, 150",
        "A,  THIN_FILM, -30, 300",
        "B,  THIN_FILM, -50, 500",
        "C,  THIN_FILM, -50, 600",
    })
    void validityRangesPerConstruction(ToleranceClass c, RtdConstruction construction, double min, double max) {
        assertThat(c.minTemperatureC(construction)).isEqualTo(min);
        assertThat(c.maxTemperatureC(construction)).isEqualTo(max);
        assertThat(c.isValidAt(min, construction)).isTrue();
        assertThat(c.isValidAt(max, construction)).isTrue();
        assertThat(c.isValidAt(min - 0.001, construction)).isFalse();
        assertThat(c.isValidAt(max + 0.001, construction)).isFalse();
    }

    @Test
    void aClassAFilmElementIsNotDefinedAtMinusFifty() {
        // IEC 60751:2008 Table 3 (from memory): class A thin-film -30 … 300 °C; wire-wound -100 … 450 °C.
        assertThat(ToleranceClass.A.isValidAt(-50, RtdConstruction.THIN_FILM)).isFalse();
        assertThat(ToleranceClass.A.isValidAt(-50, RtdConstruction.WIRE_WOUND)).isTrue();
        assertThat(RtdConstruction.parse(" thin-film ")).isEqualTo(RtdConstruction.THIN_FILM);
        assertThatThrownBy(() -> RtdConstruction.parse("foil"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("WIRE_WOUND, THIN_FILM");
    }

    @Test
    void classAaAt300IsFlagged() {
        // Reference sheet A8: AA at 300 °C is outside its range (-50 … 250), the tool must refuse or flag it.
        assertThat(ToleranceClass.AA.isValidAt(300)).isFalse();
    }

    @Test
    void parsesNames() {
        assertThat(ToleranceClass.parse(" aa ")).isEqualTo(ToleranceClass.AA);
        assertThat(ToleranceClass.parse("B")).isEqualTo(ToleranceClass.B);
        assertThatThrownBy(() -> ToleranceClass.parse("D"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("AA, A, B, C");
        assertThatThrownBy(() -> ToleranceClass.A.toleranceC(Double.NaN)).isInstanceOf(IllegalArgumentException.class);
    }

    private static double round2(double v) {
        return Math.round(v * 100) / 100.0;
    }
}
