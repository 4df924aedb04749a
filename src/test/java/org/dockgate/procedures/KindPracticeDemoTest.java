package org.dockgate.procedures;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.util.List;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.procedure.KindPractice;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.web.util.HtmlUtils;

/**
 * The demo models' approved procedures (seed-data/sensor-models.json) print their kind's preparation items,
 * the electrical-excitation caution and the deferral to local codes, in the PDF and on the procedure page.
 */
@SpringBootTest
@AutoConfigureMockMvc
class KindPracticeDemoTest {

    @Autowired MockMvc mvc;
    @Autowired CatalogueService catalogue;
    @Autowired ProcedureService procedures;

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "TR-100A|Ice-point check;Immersion depth;Stability criterion;4-wire connection;Measuring current: Read with 1 mA measuring current;Self-heating check;Heat:",
        "QP-250|Exercise cycles;Head-height correction;Excitation: Set the excitation to 10 V DC;Pressure:",
        "LC-500S|Exercise cycles;Alignment;Excitation: Set the excitation to 10 V DC",
        "PX-4410|Stud mounting and torque;Noise isolation;Noise bandwidth;Supply IEPE constant current 4 mA"})
    void theKindsItemsArePrintedAndShown(String partNumber, String expected) throws Exception {
        var model = catalogue.modelByPartNumber(partNumber).orElseThrow();
        var procedure = procedures.approvedFor(model.id()).orElseThrow();
        List<String> items = new java.util.ArrayList<>(List.of(expected.split(";")));
        items.add("Warm-up");
        items.add("Electrical excitation: Switch the excitation supply off");

        byte[] pdf = mvc.perform(get("/procedures/" + procedure.id() + "/pdf").with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk()).andReturn().getResponse().getContentAsByteArray();
        String text;
        try (var doc = org.apache.pdfbox.Loader.loadPDF(pdf)) {
            text = new org.apache.pdfbox.text.PDFTextStripper().getText(doc).replaceAll("\\s+", " ");
        }
        assertThat(text).contains(items).contains(KindPractice.DEFERRAL);

        String page = HtmlUtils.htmlUnescape(mvc.perform(get("/procedures/" + procedure.id())
                        .with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk()).andReturn().getResponse().getContentAsString());
        assertThat(page).contains("id=\"kind-practice\"").contains(items).contains(KindPractice.DEFERRAL);
    }
}
