package org.dockgate.certificates;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.ExpectedReading;
import org.dockgate.bench.NewConditions;
import org.dockgate.bench.NewReading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.series.Direction;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.evaluation.UnitEvaluationView;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.NewLot;
import org.dockgate.receiving.NewReceipt;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;
import static org.hamcrest.Matchers.containsString;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.flash;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

/**
 * Conditions are part of the record: a lot is not dispositioned while a sampled unit has none (the message
 * names the units), and a unit measured outside the procedure's limits under a recorded deviation carries it
 * into the frozen results and onto the signed certificate (ISO/IEC 17025:2017 7.8.2.1 n), read back with
 * PDFBox.
 */
@SpringBootTest
@AutoConfigureMockMvc
class ConditionsOnTheRecordTest {

    @Autowired MockMvc mvc;

    @Autowired LotCertificateService certificates;
    @Autowired CertificateRegister register;
    @Autowired EvaluationService evaluation;
    @Autowired ReceivingService receiving;
    @Autowired CatalogueService catalogue;
    @Autowired BenchService bench;

    /** A QP-250 lot of 8 (100 % inspection), every reading on the nominal 10 mV/bar line, no conditions yet. */
    LotView measuredLot() {
        var model = catalogue.modelByPartNumber("QP-250").orElseThrow();
        var supplier = catalogue.supplierByCode("QSL").orElseThrow();
        String tag = UUID.randomUUID().toString().substring(0, 6);
        List<String> serials = new ArrayList<>();
        for (int i = 1; i <= 8; i++) {
            serials.add("E" + tag + "-" + i);
        }
        var receipt = LotFixtures.as("operator", () -> receiving.receive(new NewReceipt("PO-E-" + tag, "DN-E-" + tag,
                LocalDate.now(), supplier.id(), List.of(new NewLot(model.id(), 8, serials)), "token-e-" + tag)));
        LotView lot = receiving.lots(LotState.AWAITING_MEASUREMENT).stream().filter(l -> l.receiptId() == receipt.id())
                .findFirst().orElseThrow();
        var plan = bench.planFor(bench.lot(lot.id()).orElseThrow());
        for (String serial : lot.sampledSerials()) {
            List<NewReading> readings = new ArrayList<>();
            for (ExpectedReading slot : plan.keyed()) {
                double value = Math.round((10.0 * slot.point() + 0.0002 * slot.cycle().orElse(1)) * 10000) / 10000.0;
                readings.add(new NewReading(serial, ReadingTest.STATIC, slot.point(), slot.direction().orElse(Direction.UP),
                        slot.cycle().orElse(1), value, "mV", plan.suggestedInstrument(), null));
            }
            LotFixtures.as("operator", () -> bench.recordMany(lot.id(), readings));
        }
        return lot;
    }

    void disposition(LotView lot) {
        LotFixtures.as("engineer", () -> evaluation.disposition(lot.id(), null, "", false, null,
                receiving.lot(lot.id()).orElseThrow().version()));
    }

    @Test
    void aLotIsNotDispositionedWhileASampledUnitLacksConditionsAndADeviationReachesTheCertificate() throws Exception {
        LotView lot = measuredLot();
        List<String> s = lot.sampledSerials();
        assertThat(evaluation.lotEvaluation(lot.id()).complete()).isTrue();
        for (int i = 2; i < s.size(); i++) {
            String serial = s.get(i);
            LotFixtures.as("operator", () -> bench.recordConditions(lot.id(), serial, 23.1, 45.0));
        }
        assertThatThrownBy(() -> disposition(lot)).isInstanceOf(IllegalStateException.class)
                .hasMessageContaining("no environmental conditions are recorded for " + s.get(0) + ", " + s.get(1));
        assertThat(receiving.lot(lot.id()).orElseThrow().state()).isEqualTo(LotState.AWAITING_MEASUREMENT);

        // Outside the limits: refused, then recorded as a deviation with its reason.
        String reason = "Air conditioning out of service; supplier lot needed for the line";
        assertThatThrownBy(() -> LotFixtures.as("operator", () -> bench.recordConditions(lot.id(), s.get(0),
                new NewConditions(29.4, 47.0, null, null)))).hasMessageContaining("ambient temperature 29.4 °C")
                .hasMessageContaining("limit of 28 °C");
        LotFixtures.as("operator", () -> bench.recordConditions(lot.id(), s.get(0),
                new NewConditions(29.4, 47.0, 100.9, reason)));
        assertThatThrownBy(() -> disposition(lot)).hasMessageContaining("recorded for " + s.get(1) + ".")
                .hasMessageNotContaining(s.get(0) + ",");
        // The API (409 problem) and the lot page (its message) name the unit too.
        long version = receiving.lot(lot.id()).orElseThrow().version();
        mvc.perform(post("/api/v1/lots/{id}/disposition", lot.id()).with(user("engineer").roles("ENGINEER"))
                        .contentType(MediaType.APPLICATION_JSON).content("{\"expectedLotVersion\": " + version + "}"))
                .andExpect(status().isConflict())
                .andExpect(jsonPath("$.detail").value(containsString("no environmental conditions are recorded for "
                        + s.get(1))));
        mvc.perform(post("/evaluation/lots/{id}/disposition", lot.id()).with(user("engineer").roles("ENGINEER"))
                        .with(csrf()).param("version", Long.toString(version)))
                .andExpect(status().is3xxRedirection())
                .andExpect(flash().attribute("problem", containsString("recorded for " + s.get(1))));
        LotFixtures.as("operator", () -> bench.recordConditions(lot.id(), s.get(1), 22.7, 44.0));
        disposition(lot);
        assertThat(receiving.lot(lot.id()).orElseThrow().state()).isEqualTo(LotState.DISPOSITIONED_ACCEPTED);

        // The frozen record carries the deviation; the other units have none.
        var units = evaluation.lotEvaluation(lot.id()).units();
        assertThat(units).allMatch(UnitEvaluationView::frozen);
        assertThat(units.stream().filter(u -> u.conditionsDeviation().isPresent()).map(UnitEvaluationView::serial))
                .containsExactly(s.get(0));
        assertThat(units.get(0).conditionsDeviation().orElseThrow()).contains("29.4 °C").contains(reason);

        IssuedCertificate issued = LotFixtures.as("engineer2",
                () -> certificates.approveAndSign(lot.id(), LotCertificateTest.ENGINEER2_PASSWORD));
        String text = LotCertificateTest.flat(IndependentSignatureCheck.textWithFields(
                register.pdf(issued.certificateNumber()).orElseThrow()));
        assertThat(text).contains("Deviations from the procedure")
                .contains("Unit " + s.get(0) + ": ambient temperature 29.4 °C lies above the procedure's limit of 28 °C")
                .contains(reason);
    }

    @Test
    void aLotWithinTheLimitsStatesThatThereWereNoDeviations() throws Exception {
        LotView lot = LotFixtures.acceptedLot(receiving, catalogue, bench, evaluation, "operator");
        IssuedCertificate issued = LotFixtures.as("engineer2",
                () -> certificates.approveAndSign(lot.id(), LotCertificateTest.ENGINEER2_PASSWORD));
        String text = LotCertificateTest.flat(IndependentSignatureCheck.textWithFields(
                register.pdf(issued.certificateNumber()).orElseThrow()));
        assertThat(text).contains("6 Deviations from the procedure None recorded.");
    }
}
