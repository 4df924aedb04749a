package org.dockgate.core.rtd;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.dockgate.core.UnevaluableException;
import org.dockgate.core.metrics.Accuracy;
import org.dockgate.core.metrics.LocalSensitivity;
import org.dockgate.core.metrics.TransferFunction;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.CalibrationSeries;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

class CallendarVanDusenTest {

    private final CallendarVanDusen pt100 = CallendarVanDusen.iec60751(100);

    @ParameterizedTest(name = "R({0} °C) = {1} Ω")
    @CsvSource({
        // IEC 60751 Pt100 table, reference sheet A8: CVD value to 6 decimals [C+X]; the table prints 2 decimals [C].
        "-100, 60.255840, 60.26",
        "0,    100.000000, 100.00",
        "100,  138.505500, 138.51",
        "200,  175.856000, 175.86",
        "400,  247.092000, 247.09",
    })
    void pt100TableValues(double t, double computed, double printed) {
        double r = pt100.resistanceOhm(t);
        assertThat(r).isCloseTo(computed, within(5e-7)); // A8 computed value, printed to 6 decimals
        assertThat(Math.round(r * 100) / 100.0).isEqualTo(printed); // IEC 60751 table, 2 decimals
    }

    @Test
    void pt100At800IsOnlyAComputedValue() {
        // Reference sheet A8 [X only; the tables seen end at 600 °C]: 375.704000 Ω.
        assertThat(pt100.resistanceOhm(800)).isCloseTo(375.704, within(5e-7));
    }

    @Test
    void alphaIsTheConventional385() {
        // IEC 60751: alpha = (R100 - R0)/(100 °C R0), conventionally 3.851e-3 /°C; computed 0.00385055 (A8 / §6.1).
        double alpha = (pt100.resistanceOhm(100) - 100) / (100 * 100);
        assertThat(alpha).isCloseTo(0.00385055, within(5e-9));
    }

    @Test
    void pt1000ScalesWithR0() {
        CallendarVanDusen pt1000 = CallendarVanDusen.iec60751(1000);
        assertThat(pt1000.resistanceOhm(100)).isCloseTo(1385.055, within(5e-6)); // 10 x A8 Pt100 value
        assertThat(pt1000.temperatureC(1385.055)).isCloseTo(100, within(1e-9));
    }

    @Test
    void sensitivityValues() {
        // Reference sheet A8: dR/dt = 0.390830 Ω/K at 0 °C and 0.379280 Ω/K at 100 °C (R0 (A + 2Bt)).
        assertThat(pt100.sensitivityOhmPerC(0)).isCloseTo(0.390830, within(5e-7));
        assertThat(pt100.sensitivityOhmPerC(100)).isCloseTo(0.379280, within(5e-7));
        // Below 0 °C the derivative includes the C term; compare with a central difference of R (h = 1e-4 °C,
        // truncation error ~h^2 R'''/6 far below 1e-9 Ω/°C).
        double h = 1e-4;
        double numeric = (pt100.resistanceOhm(-150 + h) - pt100.resistanceOhm(-150 - h)) / (2 * h);
        assertThat(pt100.sensitivityOhmPerC(-150)).isCloseTo(numeric, within(1e-8));
        // The two branches meet smoothly at 0 °C.
        assertThat(pt100.sensitivityOhmPerC(-1e-12)).isCloseTo(pt100.sensitivityOhmPerC(0), within(1e-12));
    }

    @Test
    void inverseValues() {
        // Reference sheet A8: R = 138.5055 Ω -> 100.000000 °C; R = 175.86 Ω -> 200.010878 °C.
        assertThat(pt100.temperatureC(138.5055)).isCloseTo(100.0, within(5e-7));
        assertThat(pt100.temperatureC(175.86)).isCloseTo(200.010878, within(5e-7));
        // Below zero (Newton iteration): the A8 value at -100 °C inverts back within 1e-9 °C.
        assertThat(pt100.temperatureC(60.25584)).isCloseTo(-100.0, within(1e-9));
        assertThat(pt100.temperatureC(100.0)).isEqualTo(0.0);
        assertThat(pt100.temperatureC(pt100.resistanceOhm(-200))).isCloseTo(-200.0, within(1e-9));
        assertThat(pt100.temperatureC(pt100.resistanceOhm(850))).isCloseTo(850.0, within(1e-9));
    }

    @Test
    void refusesOutOfRange() {
        assertThatThrownBy(() -> pt100.resistanceOhm(-200.5))
                .isInstanceOf(UnevaluableException.class).hasMessageContaining("−200 … 850");
        assertThatThrownBy(() -> pt100.resistanceOhm(851)).isInstanceOf(UnevaluableException.class);
        assertThatThrownBy(() -> pt100.resistanceOhm(Double.NaN)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> pt100.temperatureC(10)).isInstanceOf(UnevaluableException.class);
        assertThatThrownBy(() -> pt100.temperatureC(400)).isInstanceOf(UnevaluableException.class);
        assertThatThrownBy(() -> pt100.temperatureC(Double.POSITIVE_INFINITY))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> CallendarVanDusen.iec60751(0)).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> CallendarVanDusen.iec60751(Double.NaN)).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void accuracyOfAThermometerAgainstTheCurve() {
        // A probe reading 138.6 Ω at 100 °C: error through the inverse curve is T(138.6) - 100, and to first order
        // (138.6 - 138.5055)/0.37928 = 0.249156 °C (hand arithmetic from the A8 values).
        CalibrationSeries readings = CalibrationSeries.of(
                CalibrationPoint.up(0, 100.02), CalibrationPoint.up(100, 138.6), CalibrationPoint.up(200, 175.80));
        TransferFunction curve = pt100.asTransferFunction();
        Accuracy inverse = Accuracy.of(readings, curve, 0, 200);
        Accuracy local = Accuracy.of(readings, curve, 0, 200, Accuracy.ErrorConversion.LOCAL_SENSITIVITY);
        assertThat(local.maxErrorInput()).isCloseTo((138.6 - 138.5055) / 0.37928, within(1e-9));
        assertThat(inverse.maxErrorInput()).isCloseTo(pt100.temperatureC(138.6) - 100, within(1e-12));
        // The two conversions differ by the curvature only: |B| e^2 / (A + 2B t) ~ 1e-4 °C here.
        assertThat(inverse.maxErrorInput()).isCloseTo(local.maxErrorInput(), within(2e-4));
        assertThat(inverse.maxErrorPercentSpan()).isCloseTo(inverse.maxErrorInput() / 200 * 100, within(1e-12));
        assertThat(inverse.worstReading().input()).isEqualTo(100);
    }

    @Test
    void localSensitivityFromNeighbouringPoints() {
        // Above 0 °C the CVD curve is exactly quadratic, so the three-point slope at 100 °C from readings at
        // 50, 100 and 150 °C equals R0 (A + 2B·100) = 0.379280 Ω/°C (reference sheet A8).
        CalibrationSeries readings = CalibrationSeries.of(
                CalibrationPoint.up(50, pt100.resistanceOhm(50)),
                CalibrationPoint.up(100, pt100.resistanceOhm(100)),
                CalibrationPoint.up(150, pt100.resistanceOhm(150)));
        assertThat(LocalSensitivity.ofSeries(readings, 100)).isCloseTo(0.379280, within(1e-9));
        assertThat(LocalSensitivity.ofSeries(readings, 50)).isCloseTo(pt100.sensitivityOhmPerC(50), within(1e-9));
        assertThat(LocalSensitivity.ofCurve(pt100.asTransferFunction(), 100)).isCloseTo(0.379280, within(5e-7));
    }

    @Test
    void tabulatedCurveFromThePrintedTable() {
        // IEC 60751 Pt100 table, 2 decimals (reference sheet A8): 0 °C 100.00, 100 °C 138.51, 200 °C 175.86.
        TransferFunction table = TransferFunction.tabulated(new double[] {0, 100, 200},
                new double[] {100.00, 138.51, 175.86});
        assertThat(table.output(50)).isCloseTo((100.00 + 138.51) / 2, within(1e-12));
        assertThat(table.input(138.51)).isEqualTo(100);
        // At the interior table point, three-point slope (175.86 - 100.00)/200 for equal spacing.
        assertThat(table.sensitivityAt(100)).isCloseTo((175.86 - 100.00) / 200, within(1e-12));
        assertThat(table.sensitivityAt(150)).isCloseTo((175.86 - 138.51) / 100, within(1e-12));
        assertThatThrownBy(() -> table.output(250)).isInstanceOf(UnevaluableException.class);
        assertThatThrownBy(() -> TransferFunction.tabulated(new double[] {0, 1, 2}, new double[] {1, 3, 2}))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("monotonic");
    }
}
