package org.dockgate.bench;

import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.hasSize;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.multipart;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.nio.charset.StandardCharsets;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.procedures.ProcedureService;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.context.annotation.Import;
import org.springframework.http.MediaType;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.mock.web.MockMultipartFile;
import org.springframework.test.web.servlet.MockMvc;

/** The readings API and the bench pages through MockMvc: roles, the colon path, bad input as problem documents. */
@SpringBootTest
@AutoConfigureMockMvc
@Import(BenchFixtures.Config.class)
class BenchApiTest {

    static final String PROBLEM = "application/problem+json";

    @Autowired MockMvc mvc;
    @Autowired BenchService bench;
    @Autowired BenchFixtures.TestLots lots;
    @Autowired CatalogueService catalogue;
    @Autowired ProcedureService procedures;
    @Autowired JdbcTemplate jdbc;

    BenchLot lot;
    BenchPlan plan;
    String instrument;

    @BeforeEach
    void openLot() {
        lot = lots.open(BenchFixtures.procedure(catalogue, procedures).id(), 2);
        plan = bench.planFor(lot);
        instrument = bench.selectableInstruments(plan).get(0).identifier();
    }

    String json(int slot, String value, String token) {
        ExpectedReading e = plan.expected(slot);
        return "{\"serial\": \"" + lot.sampledSerials().get(0) + "\", \"test\": \"" + e.test() + "\", \"point\": "
                + e.point() + ", \"direction\": " + e.direction().map(d -> "\"" + d + "\"").orElse("null")
                + ", \"cycle\": " + (e.cycle().isPresent() ? e.cycle().getAsInt() : "null") + ", \"value\": " + value
                + ", \"unit\": \"" + plan.outputUnit() + "\", \"instrument\": \"" + instrument + "\", \"clientToken\": "
                + (token == null ? "null" : "\"" + token + "\"") + "}";
    }

    @Test
    void aClientTokenReusedWithOtherContentOrByAnotherUserIsAConflictNamingTheToken() throws Exception {
        String token = "reuse-" + lot.id();
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(json(0, "0.25", token)))
                .andExpect(status().isCreated()).andExpect(jsonPath("$.value").value(0.25));
        // Same token, same content: the saved reading again (idempotent repeat).
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(json(0, "0.25", token)))
                .andExpect(status().isCreated()).andExpect(jsonPath("$.value").value(0.25));
        // Same token, another value; another point; another user: each refused, nothing saved.
        for (String body : new String[] {json(0, "0.75", token), json(1, "0.25", token)}) {
            mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                            .contentType(MediaType.APPLICATION_JSON).content(body))
                    .andExpect(status().isConflict())
                    .andExpect(content().contentTypeCompatibleWith(PROBLEM))
                    .andExpect(jsonPath("$.detail").value(containsString("'" + token + "'")));
        }
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("someone-else").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(json(0, "0.25", token)))
                .andExpect(status().isConflict())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.detail").value(containsString("'" + token + "'")));
        // In a batch the position is named too, and the batch saves nothing.
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON)
                        .content("[" + json(2, "0.5", "fresh-" + lot.id()) + "," + json(3, "0.5", token) + "]"))
                .andExpect(status().isConflict())
                .andExpect(jsonPath("$.detail").value(containsString("Reading 2")))
                .andExpect(jsonPath("$.detail").value(containsString("'" + token + "'")));
        assertThat(bench.history(lot.id(), lot.sampledSerials().get(0))).hasSize(1)
                .allSatisfy(r -> assertThat(r.value()).isEqualTo(0.25));
    }

    @Test
    void anOperatorPostsOneReadingAndARepeatIsNotStoredTwice() throws Exception {
        String body = json(0, "0.25", "api-" + lot.id() + "-0");
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(httpBasic("operator", "operator-demo"))
                        .contentType(MediaType.APPLICATION_JSON).content(body))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.value").value(0.25))
                .andExpect(jsonPath("$.recordedBy").value("operator"))
                .andExpect(jsonPath("$.instrument").value(instrument));
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(httpBasic("operator", "operator-demo"))
                        .contentType(MediaType.APPLICATION_JSON).content(body))
                .andExpect(status().isCreated());
        assertThat(bench.history(lot.id(), lot.sampledSerials().get(0))).hasSize(1);
    }

    @Test
    void anArrayIsSavedTogetherAndAnsweredAsAnArray() throws Exception {
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON)
                        .content("[" + json(1, "1.5", null) + "," + json(2, "2.5", null) + "]"))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$", hasSize(2)));
        // One bad element refuses the whole array, naming its position.
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON)
                        .content("[" + json(3, "1.5", null) + "," + json(4, "\"abc\"", null) + "]"))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.detail", containsString("[1]")));
        assertThat(bench.history(lot.id(), lot.sampledSerials().get(0))).hasSize(2);
    }

    @Test
    void anAuditorCannotPostAndBadInputIsAProblemDocument() throws Exception {
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(httpBasic("auditor", "auditor-demo"))
                        .contentType(MediaType.APPLICATION_JSON).content(json(0, "1", null)))
                .andExpect(status().isForbidden())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM));
        mvc.perform(get("/api/v1/lots/{id}/readings", lot.id()).param("serial", lot.sampledSerials().get(0))
                        .with(httpBasic("auditor", "auditor-demo")))
                .andExpect(status().isOk());
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(json(0, "1", null).replace("\"STATIC\"", "\"TILT\"")))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.detail", containsString("TILT")));
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content("{\"serial\": "))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM));
        mvc.perform(post("/api/v1/lots/{id}/readings", 1L).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(json(0, "1", null)))
                .andExpect(status().isNotFound())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM));
    }

    @Test
    void theColonPathImportsAFileAndPreviewSavesNothing() throws Exception {
        ExpectedReading e = plan.expected(0);
        String csv = "serial,test,point,direction,cycle,value,unit\n" + lot.sampledSerials().get(1) + "," + e.test() + ","
                + e.point() + "," + e.direction().orElseThrow() + "," + e.cycle().getAsInt() + ",0.31," + plan.outputUnit() + "\n";
        MockMultipartFile file = new MockMultipartFile("file", "daq.csv", "text/csv", csv.getBytes(StandardCharsets.UTF_8));
        mvc.perform(multipart("/api/v1/lots/{id}/readings:import", lot.id()).file(file).param("instrument", instrument)
                        .param("preview", "true").with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.preview").value(true))
                .andExpect(jsonPath("$.validRows").value(1))
                .andExpect(jsonPath("$.saved").value(false));
        assertThat(bench.history(lot.id(), lot.sampledSerials().get(1))).isEmpty();
        mvc.perform(multipart("/api/v1/lots/{id}/readings:import", lot.id()).file(file).param("instrument", instrument)
                        .with(httpBasic("auditor", "auditor-demo")))
                .andExpect(status().isForbidden());
        mvc.perform(multipart("/api/v1/lots/{id}/readings:import", lot.id()).file(file).param("instrument", instrument)
                        .with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.saved").value(true));
        assertThat(bench.history(lot.id(), lot.sampledSerials().get(1))).hasSize(1);
        // Again: refused with every error, nothing more saved.
        mvc.perform(multipart("/api/v1/lots/{id}/readings:import", lot.id()).file(file).param("instrument", instrument)
                        .with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.errors[0]", containsString("line 2")));
    }

    @Test
    void aStaleCorrectionIsAConflict() throws Exception {
        Reading r = BenchServiceTest.as("operator", () -> bench.record(lot.id(), new NewReading(lot.sampledSerials().get(0),
                plan.expected(0).test(), plan.expected(0).point(), plan.expected(0).direction().orElse(null), 1, 3.0, null,
                instrument, null)));
        String body = "{\"value\": 3.1, \"reason\": \"Misread the display\"}";
        mvc.perform(post("/api/v1/readings/{id}/corrections", r.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(body))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.supersedes").value(r.id()));
        mvc.perform(post("/api/v1/readings/{id}/corrections", r.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(body))
                .andExpect(status().isConflict())
                .andExpect(jsonPath("$.detail", containsString("changed while you were editing")));
    }

    @Test
    void theUnitPageSavesByScriptAndByPlainFormPost() throws Exception {
        String serial = lot.sampledSerials().get(0);
        mvc.perform(get("/bench/lots/{id}/units/{s}", lot.id(), serial).with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("name=\"_csrf_header\"")))
                .andExpect(content().string(containsString("id=\"r-0\"")));
        ExpectedReading e = plan.expected(0);
        String autosave = "{\"serial\": \"" + serial + "\", \"test\": \"" + e.test() + "\", \"point\": " + e.point()
                + ", \"direction\": \"" + e.direction().orElseThrow() + "\", \"cycle\": 1, \"text\": \"0.0004 V\","
                + " \"instrument\": \"" + instrument + "\", \"clientToken\": \"page-" + lot.id() + "-0\"}";
        mvc.perform(post("/bench/lots/{id}/autosave", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(autosave))
                .andExpect(status().isForbidden()); // no CSRF token
        mvc.perform(post("/bench/lots/{id}/autosave", lot.id()).with(user("operator").roles("OPERATOR")).with(csrf())
                        .contentType(MediaType.APPLICATION_JSON).content(autosave))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.enteredUnit").value("V"));
        mvc.perform(post("/bench/lots/{id}/units/{s}/readings", lot.id(), serial).with(user("operator").roles("OPERATOR"))
                        .with(csrf()).param("instrument", instrument).param("pageToken", "form-" + lot.id())
                        .param("r-1", "1.25").param("r-2", "2,5"))
                .andExpect(status().is3xxRedirection());
        assertThat(bench.currentReadings(lot.id(), serial)).extracting(Reading::slot).containsExactly(0, 1);
        mvc.perform(post("/bench/lots/{id}/units/{s}/readings", lot.id(), serial).with(user("auditor").roles("AUDITOR"))
                        .with(csrf()).param("instrument", instrument).param("r-3", "1"))
                .andExpect(status().isForbidden());
        mvc.perform(get("/bench").with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString(serial)));
    }
}
