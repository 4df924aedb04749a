package org.dockgate.web;

import static org.hamcrest.Matchers.containsString;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import org.dockgate.catalogue.CatalogueService;
import org.dockgate.procedures.ProcedureService;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.test.web.servlet.MockMvc;

/** Every main page renders for the demo data (a template error would be a 500 here). */
@SpringBootTest
@AutoConfigureMockMvc
class PagesRenderTest {

    @Autowired MockMvc mvc;
    @Autowired CatalogueService catalogue;
    @Autowired ProcedureService procedures;
    @Autowired org.dockgate.accounts.AccountService accounts;

    @ParameterizedTest
    @ValueSource(strings = {"/", "/catalogue", "/catalogue/new", "/suppliers", "/procedures", "/admin/users", "/audit",
        "/audit/verify", "/MODEL", "/MODEL/revise", "/PROCEDURES_OF_MODEL", "/PROCEDURE"})
    void rendersForAnEngineerAdmin(String path) throws Exception {
        var model = catalogue.modelByPartNumber("QP-250").orElseThrow();
        var procedure = procedures.approvedFor(model.id()).orElseThrow();
        String resolved = switch (path) {
            case "/MODEL" -> "/catalogue/" + model.id();
            case "/MODEL/revise" -> "/catalogue/" + model.id() + "/revise";
            case "/PROCEDURES_OF_MODEL" -> "/procedures?model=" + model.id();
            case "/PROCEDURE" -> "/procedures/" + procedure.id();
            default -> path;
        };
        // Roles are re-read from the account on every request, so the account must really hold them.
        if (accounts.byUsername("all-roles").isEmpty()) {
            accounts.create("all-roles", "All Roles", "all-roles-password", java.util.EnumSet.of(
                    org.dockgate.platform.Role.ENGINEER, org.dockgate.platform.Role.ADMIN,
                    org.dockgate.platform.Role.AUDITOR, org.dockgate.platform.Role.SUPERVISOR));
        }
        mvc.perform(get(resolved).with(user("all-roles").roles("ENGINEER", "ADMIN", "AUDITOR", "SUPERVISOR")))
                .andExpect(status().isOk()).andExpect(content().string(containsString("</html>")));
    }

    @org.junit.jupiter.api.Test
    void theProcedurePagesOfferAndStateTheCountingOfConditionalResults() throws Exception {
        var model = catalogue.modelByPartNumber("QP-250").orElseThrow();
        var procedure = procedures.approvedFor(model.id()).orElseThrow();
        mvc.perform(get("/procedures?model=" + model.id()).with(user("engineer").roles("ENGINEER")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("name=\"conditionalCounting\"")))
                .andExpect(content().string(containsString("value=\"STRICT\"")));
        mvc.perform(get("/procedures/" + procedure.id()).with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString(
                        procedure.settings().conditionalCounting().inWords())));
    }

    @org.junit.jupiter.api.Test
    void anApprovedProcedurePrintsAsPdf() throws Exception {
        var model = catalogue.modelByPartNumber("PX-4410").orElseThrow();
        var procedure = procedures.approvedFor(model.id()).orElseThrow();
        byte[] pdf = mvc.perform(get("/procedures/" + procedure.id() + "/pdf").with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk()).andReturn().getResponse().getContentAsByteArray();
        try (var doc = org.apache.pdfbox.Loader.loadPDF(pdf)) {
            String text = new org.apache.pdfbox.text.PDFTextStripper().getText(doc);
            org.assertj.core.api.Assertions.assertThat(text).contains("PX-4410").contains("Guard-banded acceptance")
                    .contains("safety function");
        }
    }
}
