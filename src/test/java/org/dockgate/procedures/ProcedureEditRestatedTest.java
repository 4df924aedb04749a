package org.dockgate.procedures;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.io.IOException;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.text.PDFTextStripper;
import org.dockgate.core.procedure.SensorKind;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.test.web.servlet.MockMvc;

/**
 * An edit of the cycles restates every text and figure that depends on them — in the draft, the approved
 * revision's page and its PDF — and the edit with its reason is listed there.
 */
@SpringBootTest
@AutoConfigureMockMvc
class ProcedureEditRestatedTest {

    @Autowired ProcedureService procedures;
    @Autowired ProcedureDocuments documents;
    @Autowired org.dockgate.catalogue.CatalogueService catalogue;
    @Autowired MockMvc mvc;

    @Test
    void threeToFiveCyclesIsRestatedInThePageAndThePdf() throws Exception {
        long spec = newModel();
        long draftId = ProcedureServiceTest.as("engineer", () -> procedures.createDraft(spec, ProcedureServiceTest.SETTINGS));
        var derived = procedures.draft(draftId);
        var statics = derived.proposal().staticCalibration();
        // 6 points × ascending and descending × 3 cycles (repeatability and hysteresis are specified).
        assertThat(statics.readingsPerUnit()).isEqualTo(36);
        assertThat(statics.reasoning()).contains("Three cycles, because repeatability is specified.");
        assertThat(derived.proposal().reasoning()).anyMatch(r -> r.contains("36 static readings"));

        var edited = ProcedureServiceTest.as("engineer", () -> procedures.edit(draftId, "static.cycles", "5",
                "supplier's repeatability drifted on the last two lots", derived.version()));
        var p = edited.proposal();
        assertThat(p.staticCalibration().readingsPerUnit()).isEqualTo(60);
        assertThat(p.staticCalibration().reasoning()).doesNotContain("Three cycles, because repeatability is specified.")
                .anyMatch(r -> r.startsWith("Five cycles, set by the engineer"));
        // The lab's estimate: 10 min set-up + 60 readings × (settle + 15 s), rounded up to whole minutes.
        int settle = SensorKind.PRESSURE_TRANSDUCER.settleSeconds();
        int minutes = (int) Math.ceil((600 + 60 * (settle + 15)) / 60.0);
        assertThat(minutes).isGreaterThan(derived.proposal().estimatedBenchMinutes());
        assertThat(p.estimatedBenchMinutes()).isEqualTo(minutes);
        assertThat(p.reasoning()).noneMatch(r -> r.contains("36 static readings"))
                .anyMatch(r -> r.contains("60 static readings (6 points × 2 directions × 5 cycles)"));

        var approved = ProcedureServiceTest.as("engineer2", () -> procedures.approve(draftId, edited.version()));
        assertThat(approved.content().estimatedBenchMinutes()).isEqualTo(minutes);

        String page = mvc.perform(get("/procedures/" + approved.id()).with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk()).andReturn().getResponse().getContentAsString();
        assertThat(page).contains("Five cycles, set by the engineer", "60 static readings", minutes + " min",
                "static.cycles", "supplier&#39;s repeatability drifted on the last two lots")
                .doesNotContain("Three cycles", "36 static readings");

        String pdf = text(documents.render(approved));
        assertThat(pdf).contains("Five cycles, set by the engineer", "60 static readings", "5 cycles",
                "60 readings per unit", "about " + minutes + " min", "Edits to the derived proposal",
                // the reason wraps inside its table cell: its start stays on the row of the field and the change
                "static.cycles derived → 5 supplier's repeatability drifted on", "the last two lots")
                .doesNotContain("Three cycles", "36 static readings");
    }

    @Test
    void aBenchTimeSetByTheEngineerKeepsTheEstimateInItsReasoning() {
        long spec = newModel();
        long draftId = ProcedureServiceTest.as("engineer", () -> procedures.createDraft(spec, ProcedureServiceTest.SETTINGS));
        var derived = procedures.draft(draftId);
        int estimate = derived.proposal().estimatedBenchMinutes();
        var edited = ProcedureServiceTest.as("engineer", () -> procedures.edit(draftId, "benchMinutes",
                String.valueOf(estimate + 30), "new technician", derived.version()));
        assertThat(edited.proposal().estimatedBenchMinutes()).isEqualTo(estimate + 30);
        assertThat(edited.proposal().reasoning()).anyMatch(r -> r.contains("about " + estimate + " min; the engineer set "
                + (estimate + 30) + " min."));
    }

    /** The pressure transducer of ProcedureServiceTest: hysteresis and repeatability specified. */
    private long newModel() {
        String part = "T-" + java.util.UUID.randomUUID().toString().substring(0, 8);
        var spec = new org.dockgate.core.procedure.SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "bar", 0, 10, "mV",
                new org.dockgate.core.procedure.SensorSpecification.Sensitivity(10, "mV/bar", 1,
                        org.dockgate.core.procedure.SensorSpecification.ToleranceMode.PERCENT),
                null, 0.5, 0.25, null, 0.1, 0.2, null, null, null, null);
        return ProcedureServiceTest.as("engineer", () -> catalogue.createModel(new org.dockgate.catalogue.NewSensorModel(part,
                "Test transducer", "pressure", org.dockgate.catalogue.OutputKind.VOLTAGE, "10 V", java.util.List.of("QSL"),
                spec))).latest().id();
    }

    /** The PDF's text with line breaks as spaces, extracted as ProcedurePdfTest does. */
    private static String text(byte[] pdf) throws IOException {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            PDFTextStripper stripper = new PDFTextStripper();
            stripper.setSortByPosition(true);
            return stripper.getText(document).replaceAll("\\s+", " ");
        }
    }
}
