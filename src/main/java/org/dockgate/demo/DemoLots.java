package org.dockgate.demo;

import java.math.BigDecimal;
import java.math.MathContext;
import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.ExpectedReading;
import org.dockgate.bench.NewConditions;
import org.dockgate.bench.NewReading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.quantity.Units;
import org.dockgate.core.rtd.CallendarVanDusen;
import org.dockgate.core.series.Direction;
import org.dockgate.evaluation.DispositionAction;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.NewLot;
import org.dockgate.receiving.NewReceipt;
import org.dockgate.receiving.ReceivingService;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;

/**
 * Invented bench readings for the demo's lots, recorded through the bench as the operators and evaluated
 * by the real evaluation: the thermometers and a second pressure lot are measured in full and accepted,
 * the load cells are measured in full and rejected (two units show too much hysteresis) with a
 * nonconformance report, and the accelerometers are half measured. Values come from the nominal transfer
 * function with small, seeded per-unit deviations; nothing here is a real measurement.
 */
@Component
@Order(700)
class DemoLots implements DemoStep {

    private final ReceivingService receiving;
    private final BenchService bench;
    private final EvaluationService evaluation;
    private final CatalogueService catalogue;
    private final Clock clock;

    DemoLots(ReceivingService receiving, BenchService bench, EvaluationService evaluation, CatalogueService catalogue,
             Clock clock) {
        this.receiving = receiving;
        this.bench = bench;
        this.evaluation = evaluation;
        this.catalogue = catalogue;
        this.clock = clock;
    }

    @Override
    public String name() {
        return "lots with readings";
    }

    @Override
    public void load(SeedFiles files) {
        receiveSecondPressureLot();
        for (LotView lot : receiving.lots(LotState.AWAITING_MEASUREMENT)) {
            SensorSpecification spec = catalogue.revision(lot.specificationRevisionId()).orElseThrow().specification();
            switch (lot.partNumber()) {
                case "PX-4410" -> measure(lot, spec, 3, false, List.of());
                case "LC-500S" -> {
                    measure(lot, spec, lot.sampledSerials().size(), true,
                            List.of(lot.sampledSerials().get(2), lot.sampledSerials().get(7)));
                    DemoLoader.as("engineer", () -> evaluation.disposition(lot.id(), DispositionAction.RETURN_TO_SUPPLIER,
                            "Two units show hysteresis above the limit; the rest of the lot is returned with them.", true,
                            LocalDate.now(clock).plusDays(30), receiving.lot(lot.id()).orElseThrow().version()));
                }
                default -> {
                    measure(lot, spec, lot.sampledSerials().size(), true, List.of());
                    DemoLoader.as("engineer", () -> evaluation.disposition(lot.id(), null, "", false, null,
                            receiving.lot(lot.id()).orElseThrow().version()));
                }
            }
        }
    }

    /** A second pressure-transducer lot, from the other supplier of QP-250, so two lots end accepted. */
    private void receiveSecondPressureLot() {
        var model = catalogue.modelByPartNumber("QP-250");
        var supplier = catalogue.supplierByCode("PLM");
        if (model.isEmpty() || supplier.isEmpty() || model.get().suppliers().stream().noneMatch(s -> s.code().equals("PLM"))) {
            return;
        }
        List<String> serials = new ArrayList<>();
        for (int i = 1; i <= 40; i++) {
            serials.add("PLM-QP250-" + String.format("%05d", 3100 + i));
        }
        DemoLoader.as("operator2", () -> receiving.receive(new NewReceipt("PO-2026-117", "DN-PLM-0932",
                LocalDate.now(clock).minusDays(1), supplier.get().id(),
                List.of(new NewLot(model.get().id(), 40, serials)), "demo-receipt-PLM-QP250")));
    }

    /** Records the procedure's readings for the first {@code units} sampled units, alternating the two operators. */
    private void measure(LotView lot, SensorSpecification spec, int units, boolean withNoise, List<String> faulty) {
        var plan = bench.planFor(bench.lot(lot.id()).orElseThrow());
        String instrument = plan.suggestedInstrument();
        for (int u = 0; u < units && u < lot.sampledSerials().size(); u++) {
            String serial = lot.sampledSerials().get(u);
            Random random = new Random(serial.hashCode());
            double gain = 1 + 0.0004 * random.nextGaussian();
            double bow = 0.00004 * random.nextGaussian();
            double hysteresis = faulty.contains(serial) ? 0.0008 : 0.00005 * Math.abs(random.nextGaussian());
            double scatter = 0.00002;
            double tempError = 0.02 * random.nextGaussian();
            double fso = fullScaleOutput(spec);
            List<NewReading> readings = new ArrayList<>();
            String readout = readoutFor(spec);
            String excitation = excitationFor(spec);
            for (ExpectedReading slot : plan.keyed()) {
                double value;
                Double applied = null;
                if (slot.test() == ReadingTest.STATIC) {
                    // The reference lands near, not on, the set point (a vented or unloaded zero is exact); the
                    // sensor responds to what was applied.
                    double x = slot.point();
                    boolean exactZero = x == 0 && spec.rtd() == null;
                    if (!exactZero) {
                        applied = Math.round((x + 0.15 * plan.appliedWindow() * random.nextGaussian()) * 1e4) / 1e4;
                        x = applied;
                    }
                    double shape = 4 * (x - spec.rangeMin()) / spec.span() * (1 - (x - spec.rangeMin()) / spec.span());
                    double down = slot.direction().orElse(Direction.UP) == Direction.DOWN ? hysteresis * fso : 0;
                    value = spec.rtd() != null
                            ? CallendarVanDusen.iec60751(spec.rtd().r0Ohm()).resistanceOhm(x + tempError + 0.004 * random.nextGaussian())
                            : nominal(spec, x) * gain + bow * fso * shape + down + scatter * fso * random.nextGaussian();
                } else {
                    // Sweep: constant input amplitude; a first-order roll-off far above the specified band.
                    double f = slot.point();
                    double limit = spec.bandwidth().upperHz();
                    value = Math.abs(nominal(spec, plan.staticPoints().get(plan.staticPoints().size() - 1) * 0.2)) * gain
                            * (1 + 0.004 * random.nextGaussian()) / Math.sqrt(1 + Math.pow(f / (5 * limit), 2));
                }
                readings.add(new NewReading(serial, slot.test(), slot.point(), slot.direction().orElse(null),
                        slot.cycle().isPresent() ? slot.cycle().getAsInt() : null, round(value, spec), plan.outputUnit(),
                        slot.test() == ReadingTest.SWEEP ? sweepInstrument(lot, instrument) : instrument,
                        "demo-" + lot.id() + "-" + serial + "-" + slot.slot(), applied, readout, excitation));
            }
            if (withNoise && plan.noiseSamples() > 0) {
                double sigma = spec.noiseFloor() == null ? 0.001 : 0.4 * spec.noiseFloor().limit() * Math.abs(nominal(spec, 1) - nominal(spec, 0));
                for (int i = 0; i < plan.noiseSamples(); i++) {
                    readings.add(new NewReading(serial, ReadingTest.NOISE, (double) i, null, null,
                            round(sigma * random.nextGaussian(), spec), plan.outputUnit(), instrument,
                            "demo-" + lot.id() + "-" + serial + "-n" + i, null, readout, excitation));
                }
            }
            String operator = u % 2 == 0 ? "operator" : "operator2";
            // A plausible lab spread, well inside the procedures' 18 … 28 °C and 20 … 75/80 % RH: the air
            // conditioning holds about ±0.5 °C, humidity wanders a few percent, the barometer with the weather.
            Random air = new Random(31L * serial.hashCode() + lot.id());
            double ambient = round1(Math.max(21.6, Math.min(24.4, 23.0 + 0.5 * air.nextGaussian())));
            double humidity = round1(Math.max(36, Math.min(56, 46 + 4 * air.nextGaussian())));
            double pressure = round1(100.9 + 0.5 * air.nextGaussian());
            DemoLoader.as(operator, () -> {
                bench.recordConditions(lot.id(), serial, new NewConditions(ambient, humidity, pressure, null));
                return bench.recordMany(lot.id(), readings);
            });
        }
    }

    private static double round1(double v) {
        return Math.round(v * 10) / 10.0;
    }

    /** The demo's readout by output: the multimeter for volts, the bridge indicator for mV/V, the ohmmeter for an RTD. */
    private static String readoutFor(SensorSpecification spec) {
        if (spec.rtd() != null) {
            return "RI-OHM-01";
        }
        return Units.isCompatible(spec.outputUnit(), "1") ? "RI-BRG-01" : "RI-DMM-02";
    }

    /**
     * The excitation supply of a bridge sensor (pressure transducer, load cell); an accelerometer's IEPE supply is
     * not modelled and an RTD's measuring current comes from the readout.
     */
    private static String excitationFor(SensorSpecification spec) {
        return spec.kind() == org.dockgate.core.procedure.SensorKind.PRESSURE_TRANSDUCER
                || spec.kind() == org.dockgate.core.procedure.SensorKind.LOAD_CELL ? "RI-PSU-01" : null;
    }

    private String sweepInstrument(LotView lot, String staticInstrument) {
        var procedure = bench.planFor(bench.lot(lot.id()).orElseThrow());
        return staticInstrument == null ? procedure.suggestedInstrument() : staticInstrument;
    }

    private static double nominal(SensorSpecification spec, double x) {
        double s = Units.convert(spec.sensitivity().nominal(), spec.sensitivity().unit(),
                "(" + spec.outputUnit() + ")/(" + spec.inputUnit() + ")");
        double offset = spec.zeroOffset() == null ? 0
                : Units.convert(spec.zeroOffset().nominal(), spec.zeroOffset().unit(), spec.outputUnit());
        return offset + s * x;
    }

    private static double fullScaleOutput(SensorSpecification spec) {
        if (spec.rtd() != null) {
            CallendarVanDusen cvd = CallendarVanDusen.iec60751(spec.rtd().r0Ohm());
            return Math.abs(cvd.resistanceOhm(spec.rangeMax()) - cvd.resistanceOhm(spec.rangeMin()));
        }
        return Math.abs(nominal(spec, spec.rangeMax()) - nominal(spec, spec.rangeMin()));
    }

    /** Six significant digits, as a bench readout shows them. */
    private static double round(double value, SensorSpecification spec) {
        if (value == 0) {
            return 0;
        }
        return new BigDecimal(value).round(new MathContext(6)).doubleValue();
    }
}
