package org.dockgate.instruments.web;

import static org.hamcrest.Matchers.allOf;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.not;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.redirectedUrl;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.UUID;
import org.dockgate.instruments.InstrumentService;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.request.MockHttpServletRequestBuilder;

/**
 * The register's pages through the real filter chains: who sees what, the forms' field errors (typed
 * values kept), and the calibration history. Instruments made here are already expired, so on a shared
 * database no other test finds them qualifying.
 */
@SpringBootTest
@AutoConfigureMockMvc
class InstrumentsPagesTest {

    @Autowired MockMvc mvc;
    @Autowired InstrumentService service;

    static String fresh() {
        return "RI-TPG-" + UUID.randomUUID().toString().substring(0, 8).toUpperCase();
    }

    /** The new-instrument form filled in well, with some fields replaced: "field", "value", ... */
    MockHttpServletRequestBuilder createForm(String id, String... overrides) {
        LocalDate today = service.today();
        Map<String, String> fields = new LinkedHashMap<>();
        fields.put("identifier", id);
        fields.put("description", "Page test gauge");
        fields.put("quantity", "pressure");
        fields.put("rangeMin", "0");
        fields.put("rangeMax", "16");
        fields.put("unit", "bar");
        fields.put("certificateNumber", "CERT-" + id);
        fields.put("calibratedOn", today.minusDays(400).toString());
        fields.put("dueOn", today.minusDays(20).toString());
        fields.put("expandedUncertainty", "0.025");
        fields.put("uncertaintyMode", "PERCENT_OF_READING");
        fields.put("coverageFactor", "2");
        for (int row = 1; row <= 3; row++) {
            fields.put("band" + row + "UpTo", "");
            fields.put("band" + row + "U", "");
            fields.put("band" + row + "Mode", "ABSOLUTE");
        }
        for (int i = 0; i < overrides.length; i += 2) {
            fields.put(overrides[i], overrides[i + 1]);
        }
        MockHttpServletRequestBuilder request = post("/reference-instruments").with(user("admin").roles("ADMIN"))
                .with(csrf());
        fields.forEach(request::param);
        return request;
    }

    @ParameterizedTest(name = "{0} reads the register")
    @ValueSource(strings = {"OPERATOR", "ENGINEER", "SUPERVISOR", "AUDITOR", "ADMIN"})
    void everyRoleReadsTheRegisterWithItsDueDateStatus(String role) throws Exception {
        mvc.perform(get("/reference-instruments").with(user(role.toLowerCase()).roles(role)))
                .andExpect(status().isOk())
                .andExpect(content().string(allOf(containsString("RI-PRS-02"), containsString("Expired since"),
                        containsString("badge-EXPIRED"), containsString("badge-DUE_SOON"),
                        containsString("href=\"/reference-instruments\""))));
        mvc.perform(get("/reference-instruments/RI-PRS-01").with(user(role.toLowerCase()).roles(role)))
                .andExpect(status().isOk())
                .andExpect(content().string(allOf(containsString("NBL-C-24117"), containsString("calibration-history"))));
    }

    @Test
    void theListIsOrderedByDueDateAndFilters() throws Exception {
        String page = mvc.perform(get("/reference-instruments").with(user("operator").roles("OPERATOR")))
                .andReturn().getResponse().getContentAsString();
        // demo: RI-PRS-02 expired 15 days ago, RI-ACC-01 due in 20 days, RI-PRS-01 due in 240 days
        org.assertj.core.api.Assertions.assertThat(page.indexOf("instrument-RI-PRS-02"))
                .isLessThan(page.indexOf("instrument-RI-ACC-01"));
        org.assertj.core.api.Assertions.assertThat(page.indexOf("instrument-RI-ACC-01"))
                .isLessThan(page.indexOf("instrument-RI-PRS-01"));
        mvc.perform(get("/reference-instruments").param("quantity", "acceleration").param("status", "DUE_SOON")
                        .with(user("operator").roles("OPERATOR")))
                .andExpect(content().string(allOf(containsString("instrument-RI-ACC-01"),
                        not(containsString("instrument-RI-PRS-01")), containsString("Due in 20 days"))));
    }

    @Test
    void onlyAdminSeesAndUsesTheForms() throws Exception {
        mvc.perform(get("/reference-instruments").with(user("operator").roles("OPERATOR")))
                .andExpect(content().string(not(containsString("id=\"new-instrument\""))));
        mvc.perform(get("/reference-instruments/new").with(user("operator").roles("OPERATOR")))
                .andExpect(status().isForbidden());
        mvc.perform(get("/reference-instruments/new").with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isForbidden());
        mvc.perform(get("/reference-instruments/RI-PRS-01/calibrations/new").with(user("engineer").roles("ENGINEER")))
                .andExpect(status().isForbidden());
        mvc.perform(post("/reference-instruments").with(user("operator").roles("OPERATOR")).with(csrf())
                        .param("identifier", fresh()))
                .andExpect(status().isForbidden());
        mvc.perform(post("/reference-instruments/RI-PRS-01/calibrations").with(user("supervisor").roles("SUPERVISOR"))
                        .with(csrf()).param("version", "0"))
                .andExpect(status().isForbidden());
        mvc.perform(get("/reference-instruments/new").with(user("admin").roles("ADMIN")))
                .andExpect(status().isOk()).andExpect(content().string(containsString("autofocus")));
        mvc.perform(get("/reference-instruments").with(user("admin").roles("ADMIN")))
                .andExpect(content().string(containsString("id=\"new-instrument\"")));
    }

    @Test
    void anUnknownInstrumentIsNotFound() throws Exception {
        mvc.perform(get("/reference-instruments/RI-NOPE-99").with(user("operator").roles("OPERATOR")))
                .andExpect(status().isNotFound());
    }

    @Test
    void badInputIsShownBesideItsFieldAndTheTypedValuesStay() throws Exception {
        String id = fresh();
        mvc.perform(createForm(id, "rangeMax", "sixteen", "calibratedOn", "17/11/2026"))
                .andExpect(status().isOk())
                .andExpect(content().string(allOf(
                        containsString("&#39;sixteen&#39; is not a number"), containsString("value=\"sixteen\""),
                        containsString("is not a date; write it as YYYY-MM-DD"), containsString("value=\"17/11/2026\""),
                        containsString("value=\"" + id + "\""), containsString("value=\"Page test gauge\""))));
        mvc.perform(createForm(id, "unit", "mV"))
                .andExpect(status().isOk())
                .andExpect(content().string(allOf(containsString("id=\"unit-error\""),
                        containsString("does not fit a pressure"))));
        mvc.perform(createForm(id, "dueOn", service.today().minusDays(500).toString()))
                .andExpect(content().string(allOf(containsString("id=\"dueOn-error\""),
                        containsString("must come after the calibration date"))));
        mvc.perform(createForm(id, "band1UpTo", "20", "band1U", "0.01"))
                .andExpect(content().string(allOf(containsString("id=\"band1UpTo-error\""),
                        containsString("beyond the range"))));
        mvc.perform(createForm(id, "band1UpTo", "4", "band1U", "abc"))
                .andExpect(content().string(containsString("id=\"band1U-error\"")));
        mvc.perform(createForm("RI-PRS-01"))
                .andExpect(content().string(allOf(containsString("id=\"identifier-error\""),
                        containsString("RI-PRS-01 is already in the register"))));
        org.assertj.core.api.Assertions.assertThat(service.find(id)).as("nothing saved by refused forms").isEmpty();
    }

    @Test
    void anInstrumentIsAddedAndRecalibratedWithItsHistoryKept() throws Exception {
        String id = fresh();
        mvc.perform(createForm(id, "band1UpTo", "2", "band1U", "0.0004", "band1Mode", "ABSOLUTE"))
                .andExpect(redirectedUrl("/reference-instruments/" + id));
        mvc.perform(get("/reference-instruments/" + id).with(user("admin").roles("ADMIN")))
                .andExpect(content().string(allOf(containsString("CERT-" + id), containsString("Expired since"),
                        containsString("id=\"expired-warning\""), containsString("U = 0.0004 bar"),
                        containsString("up to 2 bar"), containsString("U = 0.025 % of reading"),
                        containsString("id=\"record-calibration\""))));
        long version = service.find(id).orElseThrow().version();
        mvc.perform(get("/reference-instruments/" + id + "/calibrations/new").with(user("admin").roles("ADMIN")))
                .andExpect(status().isOk())
                .andExpect(content().string(allOf(containsString("value=\"0.025\""), containsString("value=\"2\""),
                        containsString("name=\"version\""))));
        LocalDate today = service.today();
        mvc.perform(post("/reference-instruments/" + id + "/calibrations").with(user("admin").roles("ADMIN")).with(csrf())
                        .param("version", String.valueOf(version)).param("certificateNumber", "CERT-" + id + "-B")
                        .param("calibratedOn", today.minusDays(2).toString())
                        .param("dueOn", today.minusDays(1).toString())
                        .param("expandedUncertainty", "0.02").param("uncertaintyMode", "PERCENT_OF_READING")
                        .param("coverageFactor", "2"))
                .andExpect(redirectedUrl("/reference-instruments/" + id));
        mvc.perform(get("/reference-instruments/" + id).with(user("auditor").roles("AUDITOR")))
                .andExpect(content().string(allOf(containsString("id=\"calibration-1\""),
                        containsString("id=\"calibration-2\""), containsString("CERT-" + id + "-B"),
                        containsString("CERT-" + id + "<"), containsString("/audit/history/REFERENCE_INSTRUMENT/" + id),
                        not(containsString("id=\"record-calibration\"")))));
        // a stale version keeps the typed values and says what happened
        mvc.perform(post("/reference-instruments/" + id + "/calibrations").with(user("admin").roles("ADMIN")).with(csrf())
                        .param("version", String.valueOf(version)).param("certificateNumber", "CERT-" + id + "-C")
                        .param("calibratedOn", today.minusDays(1).toString()).param("dueOn", today.toString())
                        .param("expandedUncertainty", "0.03").param("uncertaintyMode", "PERCENT_OF_READING")
                        .param("coverageFactor", "2"))
                .andExpect(status().isOk())
                .andExpect(content().string(allOf(containsString("while you were editing"),
                        containsString("value=\"CERT-" + id + "-C\""), containsString("value=\"0.03\""))));
        org.assertj.core.api.Assertions.assertThat(service.find(id).orElseThrow().calibrations()).hasSize(2);
    }

    @Test
    void theNavigationOffersTheRegisterToEveryone() throws Exception {
        mvc.perform(get("/").with(user("operator").roles("OPERATOR")))
                .andExpect(content().string(allOf(containsString("href=\"/reference-instruments\""),
                        containsString("Reference instruments"))));
    }
}
