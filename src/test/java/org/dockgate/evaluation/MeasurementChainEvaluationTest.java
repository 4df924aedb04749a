package org.dockgate.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import org.dockgate.bench.BenchPlan;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.ExpectedReading;
import org.dockgate.bench.ImportOutcome;
import org.dockgate.bench.ImportProgress;
import org.dockgate.bench.NewReading;
import org.dockgate.bench.ReadingImport;
import org.dockgate.bench.ReadingTest;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.procedure.Metric;
import org.dockgate.core.series.Direction;
import org.dockgate.core.uncertainty.UncertaintyContribution;
import org.dockgate.instruments.InstrumentNotSelectableException;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.NewLot;
import org.dockgate.receiving.NewReceipt;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.core.io.ByteArrayResource;

/**
 * The measurement chain through the real modules (issue 11, item 3): a QP-250 unit measured with the demo's
 * readout (RI-DMM-02: 0.0035 % of reading above 10 mV, k = 2, resolution 0.00001 V in the register) and excitation
 * supply (RI-PSU-01: 0.01 % of reading, k = 2, range 0 to 10 V) shows their lines with the register's figures and
 * certificate numbers; a readout out of calibration is refused at the bench and in a file.
 */
@SpringBootTest
class MeasurementChainEvaluationTest {

    @Autowired EvaluationService evaluation;
    @Autowired ReceivingService receiving;
    @Autowired BenchService bench;
    @Autowired ReadingImport imports;
    @Autowired CatalogueService catalogue;

    LotView receiveLot() {
        var model = catalogue.modelByPartNumber("QP-250").orElseThrow();
        var supplier = catalogue.supplierByCode("QSL").orElseThrow();
        String tag = UUID.randomUUID().toString().substring(0, 6);
        List<String> serials = new ArrayList<>();
        for (int i = 1; i <= 8; i++) {
            serials.add("C" + tag + "-" + i);
        }
        var receipt = EvaluationServiceTest.as("operator", () -> receiving.receive(new NewReceipt("PO-C-" + tag,
                "DN-C-" + tag, LocalDate.now(), supplier.id(), List.of(new NewLot(model.id(), 8, serials)), "chain-" + tag)));
        return receiving.lots(LotState.AWAITING_MEASUREMENT).stream().filter(l -> l.receiptId() == receipt.id())
                .findFirst().orElseThrow();
    }

    @Test
    void theReadoutAndTheExcitationSupplyHaveTheirOwnLinesWithTheRegistersFigures() {
        LotView lot = receiveLot();
        String serial = lot.sampledSerials().get(0);
        BenchPlan plan = bench.planFor(bench.lot(lot.id()).orElseThrow());
        List<NewReading> readings = new ArrayList<>();
        for (ExpectedReading slot : plan.keyed()) {
            double value = Math.round((10.0 * slot.point() + 0.0002 * slot.cycle().orElse(1)) * 10000) / 10000.0;
            readings.add(new NewReading(serial, ReadingTest.STATIC, slot.point(), slot.direction().orElse(Direction.UP),
                    slot.cycle().orElse(1), value, "mV", plan.suggestedInstrument(), null, null, "RI-DMM-02",
                    "RI-PSU-01"));
        }
        EvaluationServiceTest.as("operator", () -> bench.recordMany(lot.id(), readings));
        UnitEvaluationView unit = evaluation.unit(lot.id(), serial);
        assertThat(unit.instruments()).contains("RI-DMM-02", "RI-PSU-01");
        assertThat(unit.calibrations()).extracting(UnitEvaluationView.CalibrationUsed::certificateNumber)
                .contains("NBL-C-24164", "NBL-C-24169");
        var sensitivity = unit.result().metric(Metric.SENSITIVITY).orElseThrow();
        double top = plan.rangeMax();
        // Readout at the top reading y ≈ 10 mV/bar · 10 bar = 100 mV = 0.1 V (above the 0.01 V floor segment):
        // U = 0.0035 % · 100 mV = 0.0035 mV, k = 2, u = 0.00175 mV (the 0.0006 mV cycle scatter moves it by 2·10⁻⁸).
        UncertaintyContribution readout = line(sensitivity.budget().contributions(),
                "readout RI-DMM-02, certificate NBL-C-24164: U = ");
        assertThat(readout.standardUncertainty()).isCloseTo(0.00175, within(1e-7));
        // A scale error, c = 1/x_top: relative to the slope it is u/(b₁·x_top) = 0.00175 mV / 100 mV = 1.75·10⁻⁵,
        // whatever the acceptance's unit.
        assertThat(readout.standardUncertainty() * readout.sensitivityCoefficient() / sensitivity.measured())
                .isCloseTo(0.00175 / (10.0 * top), within(1e-9));
        // Register resolution 0.00001 V = 0.01 mV: u = 0.01/(2√3) mV = 0.0028868 mV (JCGM 100:2008 F.2.2.1).
        UncertaintyContribution resolution = line(sensitivity.budget().contributions(),
                "readout RI-DMM-02, certificate NBL-C-24164 resolution: δ = 0.01 mV");
        assertThat(resolution.standardUncertainty()).isCloseTo(0.01 / (2 * Math.sqrt(3)), within(1e-12));
        // Excitation at its set voltage (10 V, the top of its range): U = 0.01 % · 10 V = 1 mV, k = 2,
        // u(V)/V = 0.0005 V / 10 V = 0.005 %; a scale error of the slope: u = 0.00005 · |b₁|.
        UncertaintyContribution excitation = line(sensitivity.budget().contributions(),
                "excitation RI-PSU-01, certificate NBL-C-24169");
        assertThat(excitation.standardUncertainty()).isCloseTo(0.00005 * Math.abs(sensitivity.measured()),
                within(1e-15));
    }

    @Test
    void aReadoutOutOfCalibrationIsRefusedAtTheBenchAndInAFile() {
        LotView lot = receiveLot();
        String serial = lot.sampledSerials().get(1);
        BenchPlan plan = bench.planFor(bench.lot(lot.id()).orElseThrow());
        ExpectedReading slot = plan.expected(0);
        // RI-PRS-02's calibration expired 15 days ago (seed data).
        assertThatThrownBy(() -> EvaluationServiceTest.as("operator", () -> bench.record(lot.id(), new NewReading(serial,
                ReadingTest.STATIC, slot.point(), slot.direction().orElseThrow(), slot.cycle().getAsInt(), 0.2, "mV",
                plan.suggestedInstrument(), null, null, "RI-PRS-02", null))))
                .isInstanceOf(InstrumentNotSelectableException.class)
                .hasMessageContaining("readout instrument RI-PRS-02")
                .hasMessageContaining("out of calibration");
        String csv = "serial,test,point,direction,cycle,value,unit,readout\n" + serial + ",STATIC," + slot.point() + ","
                + slot.direction().orElseThrow() + "," + slot.cycle().getAsInt() + ",0.2,mV,RI-PRS-02\n";
        ImportOutcome outcome = EvaluationServiceTest.as("operator", () -> imports.importFile(lot.id(),
                new ByteArrayResource(csv.getBytes(StandardCharsets.UTF_8)), plan.suggestedInstrument(), false,
                ImportProgress.NONE));
        assertThat(outcome.valid()).isFalse();
        assertThat(outcome.errors()).anySatisfy(e -> assertThat(e).contains("line 2, column 'readout'")
                .contains("RI-PRS-02").contains("out of calibration"));
        assertThat(bench.currentReadings(lot.id(), serial)).isEmpty();
    }

    static UncertaintyContribution line(List<UncertaintyContribution> lines, String prefix) {
        return lines.stream().filter(c -> c.name().startsWith(prefix)).findFirst()
                .orElseThrow(() -> new AssertionError("no line '" + prefix + "' in " + lines));
    }
}
