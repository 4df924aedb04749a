package org.dockgate.bench;

import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.multipart;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.nio.charset.StandardCharsets;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
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

/**
 * The applied value beside the set point (issue 11, item 4): the readings API field {@code applied} and the CSV
 * column {@code applied}, both optional, checked against the procedure's window, refused outside it with both
 * values named.
 */
@SpringBootTest
@AutoConfigureMockMvc
@Import(BenchFixtures.Config.class)
class AppliedValueApiTest {

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

    String json(int slot, String applied) {
        ExpectedReading e = plan.expected(slot);
        return "{\"serial\": \"" + lot.sampledSerials().get(0) + "\", \"test\": \"STATIC\", \"point\": " + e.point()
                + ", \"direction\": \"" + e.direction().orElseThrow() + "\", \"cycle\": " + e.cycle().getAsInt()
                + ", \"value\": 1.25, \"instrument\": \"" + instrument + "\""
                + (applied == null ? "" : ", \"applied\": " + applied) + "}";
    }

    @Test
    void theProcedureStatesAWindowAndTheApiKeepsTheAppliedValue() throws Exception {
        double window = plan.appliedWindow();
        assertThat(window).as("a finite default window for the demo procedure").isPositive().isFinite();
        double setPoint = plan.expected(1).point();
        double inside = setPoint + window / 2;
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(json(1, Double.toString(inside))))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.point").value(setPoint))
                .andExpect(jsonPath("$.applied").value(inside));
        // Absent: the set point.
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(json(2, null)))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.applied").value(plan.expected(2).point()));
        mvc.perform(get("/api/v1/lots/{id}/readings", lot.id()).param("serial", lot.sampledSerials().get(0))
                        .with(httpBasic("auditor", "auditor-demo")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("\"applied\":" + inside)));
    }

    @Test
    void anAppliedValueBeyondTheWindowIsRefusedNamingBothValues() throws Exception {
        double window = plan.appliedWindow();
        double setPoint = plan.expected(3).point();
        double beyond = setPoint + 2 * window;
        mvc.perform(post("/api/v1/lots/{id}/readings", lot.id()).with(user("operator").roles("OPERATOR"))
                        .contentType(MediaType.APPLICATION_JSON).content(json(3, Double.toString(beyond))))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.detail", containsString("applied value " + Plain.number(beyond) + " "
                        + plan.inputUnit())))
                .andExpect(jsonPath("$.detail", containsString("set point " + Plain.number(setPoint) + " "
                        + plan.inputUnit())))
                .andExpect(jsonPath("$.detail", containsString("±" + Plain.number(window))));
        assertThat(bench.history(lot.id(), lot.sampledSerials().get(0))).isEmpty();
    }

    @Test
    void theCsvColumnAppliedIsOptionalAndCheckedAgainstTheWindow() throws Exception {
        double window = plan.appliedWindow();
        ExpectedReading first = plan.expected(0);
        ExpectedReading second = plan.expected(1);
        String serial = lot.sampledSerials().get(1);
        String header = "serial,test,point,direction,cycle,value,unit,applied\n";
        String good = row(serial, first, 0.5, Double.toString(first.point() + window / 4));
        String bad = row(serial, second, 1.5, Double.toString(second.point() - 3 * window));
        MockMultipartFile refused = csv(header + good + bad);
        mvc.perform(multipart("/api/v1/lots/{id}/readings:import", lot.id()).file(refused).param("instrument", instrument)
                        .with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.errors[0]", containsString("line 3, column 'applied'")))
                .andExpect(jsonPath("$.errors[0]", containsString(Plain.number(second.point() - 3 * window))))
                .andExpect(jsonPath("$.errors[0]", containsString("set point " + Plain.number(second.point()))));
        assertThat(bench.history(lot.id(), serial)).isEmpty();
        // The good row alone imports with its applied value; an empty cell means the set point.
        String empty = row(serial, second, 1.5, "");
        mvc.perform(multipart("/api/v1/lots/{id}/readings:import", lot.id()).file(csv(header + good + empty))
                        .param("instrument", instrument).with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.saved").value(true));
        assertThat(bench.history(lot.id(), serial)).extracting(Reading::applied)
                .containsExactly(first.point() + window / 4, second.point());
    }

    @Test
    void aReadingSavedBeforeAppliedValuesExistedHasItsSetPointAsAppliedValue() {
        // As the V10_3 migration leaves older rows: no applied value, no readout.
        ExpectedReading e = plan.expected(0);
        jdbc.update("insert into bench_reading (lot_id, serial, test, point, direction, cycle_no, slot_no, revision_no,"
                        + " reading_value, unit, entered_value, entered_unit, instrument, recorded_by, recorded_at)"
                        + " values (?, ?, 'STATIC', ?, ?, ?, 0, 0, 1.0, ?, 1.0, ?, ?, 'operator', ?)", lot.id(),
                lot.sampledSerials().get(0), e.point(), e.direction().orElseThrow().name(), e.cycle().getAsInt(),
                plan.outputUnit(), plan.outputUnit(), instrument, OffsetDateTime.now(ZoneOffset.UTC));
        Reading old = bench.currentReadings(lot.id(), lot.sampledSerials().get(0)).get(0);
        assertThat(old.applied()).isEqualTo(e.point());
        assertThat(old.readout()).isEmpty();
    }

    private String row(String serial, ExpectedReading e, double value, String applied) {
        return serial + ",STATIC," + e.point() + "," + e.direction().orElseThrow() + "," + e.cycle().getAsInt() + ","
                + value + "," + plan.outputUnit() + "," + applied + "\n";
    }

    private static MockMultipartFile csv(String text) {
        return new MockMultipartFile("file", "daq.csv", "text/csv", text.getBytes(StandardCharsets.UTF_8));
    }
}
