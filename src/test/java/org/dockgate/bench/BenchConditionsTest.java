package org.dockgate.bench;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.hamcrest.Matchers.allOf;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.hasItem;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.multipart;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.nio.charset.StandardCharsets;
import java.util.List;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.procedure.EnvironmentalLimits;
import org.dockgate.procedures.ProcedureService;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.context.annotation.Import;
import org.springframework.dao.DataAccessException;
import org.springframework.http.MediaType;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.mock.web.MockMultipartFile;
import org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.request.RequestPostProcessor;

/**
 * Environmental conditions against the procedure's limits, through the JSON API (the field names),
 * the bench page form and the companion CSV: refused outside the limits unless recorded as a deviation with
 * a reason, impossible values always refused, append-only, and only the bench roles may record.
 */
@SpringBootTest
@AutoConfigureMockMvc
@Import(BenchFixtures.Config.class)
class BenchConditionsTest {

    static final String PROBLEM = "application/problem+json";
    static final String PATH = "/api/v1/lots/{id}/units/{serial}/conditions";

    @Autowired MockMvc mvc;
    @Autowired BenchService bench;
    @Autowired BenchFixtures.TestLots lots;
    @Autowired CatalogueService catalogue;
    @Autowired ProcedureService procedures;
    @Autowired JdbcTemplate jdbc;

    BenchLot lot;
    String serial;
    EnvironmentalLimits limits;

    @BeforeEach
    void openLot() {
        lot = lots.open(BenchFixtures.procedure(catalogue, procedures).id(), 3);
        serial = lot.sampledSerials().get(0);
        limits = bench.limitsOf(lot);
    }

    static RequestPostProcessor as(String role) {
        return user(role.toLowerCase()).roles(role);
    }

    int rows() {
        return jdbc.queryForObject("select count(*) from bench_conditions where lot_id = ?", Integer.class, lot.id());
    }

    @Test
    void theDemoProceduresCarryTheCommonPracticeLimitsOfTheirKind() {
        // Common practice: 23 ± 5 °C; 20 … 80 % RH (accelerometers at most 75 %).
        assertThat(limits.ambientMinC()).isEqualTo(18.0);
        assertThat(limits.ambientMaxC()).isEqualTo(28.0);
        assertThat(limits.humidityMinPercent()).isEqualTo(20.0);
        assertThat(limits.humidityMaxPercent()).isIn(75.0, 80.0);
        assertThat(limits.basis()).contains("common practice");
    }

    @Test
    void withinTheLimitsTheContractFieldsAreSavedAndReadBack() throws Exception {
        mvc.perform(post(PATH, lot.id(), serial).with(as("OPERATOR")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"ambientC\": 22.8, \"relativeHumidityPercent\": 45.5, \"pressureKPa\": 101.2}"))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.serial").value(serial))
                .andExpect(jsonPath("$.ambientC").value(22.8))
                .andExpect(jsonPath("$.relativeHumidityPercent").value(45.5))
                .andExpect(jsonPath("$.pressureKPa").value(101.2))
                .andExpect(jsonPath("$.deviation").value(false))
                .andExpect(jsonPath("$.deviationReason").isEmpty())
                .andExpect(jsonPath("$.recordedBy").value("operator"));
        // pressureKPa is optional.
        mvc.perform(post(PATH, lot.id(), serial).with(as("ENGINEER")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"ambientC\": 23.4, \"relativeHumidityPercent\": 44}"))
                .andExpect(status().isCreated()).andExpect(jsonPath("$.pressureKPa").isEmpty());
        mvc.perform(get(PATH, lot.id(), serial).with(as("AUDITOR")))
                .andExpect(status().isOk()).andExpect(jsonPath("$.ambientC").value(23.4))
                .andExpect(jsonPath("$.recordedBy").value("engineer"));
        assertThat(rows()).isEqualTo(2);
    }

    @Test
    void outsideTheLimitsTheEntryIsRefusedNamingTheValueAndTheLimit() throws Exception {
        double hot = limits.ambientMaxC() + 2.5; // 30.5 °C against 28 °C
        mvc.perform(post(PATH, lot.id(), serial).with(as("OPERATOR")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"ambientC\": " + hot + ", \"relativeHumidityPercent\": 45}"))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.detail").value(allOf(containsString("ambient temperature 30.5 °C"),
                        containsString("limit of 28 °C"), containsString("18 … 28 °C"), containsString("deviationReason"))));
        double dry = limits.humidityMinPercent() - 8; // 12 % against 20 %
        mvc.perform(post(PATH, lot.id(), serial).with(as("OPERATOR")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"ambientC\": 23, \"relativeHumidityPercent\": " + dry + "}"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.detail").value(allOf(containsString("relative humidity 12 %"),
                        containsString("below the procedure's limit of 20 % RH"))));
        // The limits are inclusive.
        mvc.perform(post(PATH, lot.id(), serial).with(as("OPERATOR")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"ambientC\": " + limits.ambientMaxC() + ", \"relativeHumidityPercent\": "
                                + limits.humidityMinPercent() + "}"))
                .andExpect(status().isCreated());
        assertThat(rows()).isEqualTo(1);
    }

    @Test
    void outsideTheLimitsWithAReasonItIsKeptAsADeviation() throws Exception {
        String reason = "Air conditioning out of service; the line needs the lot today";
        mvc.perform(post(PATH, lot.id(), serial).with(as("OPERATOR")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"ambientC\": 29.4, \"relativeHumidityPercent\": 47, \"deviationReason\": \"" + reason + "\"}"))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.deviation").value(true))
                .andExpect(jsonPath("$.deviationReason").value(reason))
                .andExpect(jsonPath("$.departure").value(containsString("ambient temperature 29.4 °C lies above")));
        Conditions saved = bench.conditions(lot.id(), serial).orElseThrow();
        assertThat(saved.deviationText()).hasValueSatisfying(t -> assertThat(t).contains("29.4 °C").contains(reason));
        // A reason for conditions within the limits would print a deviation that did not happen: refused.
        mvc.perform(post(PATH, lot.id(), serial).with(as("OPERATOR")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"ambientC\": 23, \"relativeHumidityPercent\": 45, \"deviationReason\": \"just in case\"}"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.detail").value(containsString("'deviationReason'")));
        // The rows are append-only, the new columns too.
        assertThatThrownBy(() -> jdbc.update("update bench_conditions set deviation_reason = 'other' where id = ?",
                saved.id())).isInstanceOf(DataAccessException.class);
    }

    @Test
    void impossibleValuesAreAlwaysRefusedEvenAsADeviation() throws Exception {
        String reason = ", \"deviationReason\": \"we want it\"}";
        String[][] cases = {
            {"{\"ambientC\": \"NaN\", \"relativeHumidityPercent\": 45" + reason, "'ambientC' must be a finite number"},
            {"{\"ambientC\": -300, \"relativeHumidityPercent\": 45" + reason, "below absolute zero"},
            {"{\"ambientC\": 23, \"relativeHumidityPercent\": 101" + reason, "'relativeHumidityPercent' 101 %"},
            {"{\"ambientC\": 23, \"relativeHumidityPercent\": -1" + reason, "outside 0 … 100 %"},
            {"{\"ambientC\": 23, \"relativeHumidityPercent\": 45, \"pressureKPa\": -0.5" + reason, "'pressureKPa' -0.5 kPa is negative"},
            {"{\"relativeHumidityPercent\": 45}", "'ambientC' is missing"},
            {"{\"ambientC\": 23}", "'relativeHumidityPercent' is missing"},
            {"{\"ambient\": 23, \"relativeHumidityPercent\": 45}", "'ambient'"},
            {"{\"ambientC\": \"warm\", \"relativeHumidityPercent\": 45}", "'ambientC'"},
        };
        for (String[] c : cases) {
            mvc.perform(post(PATH, lot.id(), serial).with(as("OPERATOR")).contentType(MediaType.APPLICATION_JSON)
                            .content(c[0]))
                    .andExpect(status().isBadRequest())
                    .andExpect(content().contentTypeCompatibleWith(PROBLEM))
                    .andExpect(jsonPath("$.detail").value(containsString(c[1])));
        }
        assertThat(rows()).isZero();
    }

    @Test
    void onlyTheBenchRolesMayRecordConditionsEveryReaderMayReadThem() throws Exception {
        String body = "{\"ambientC\": 23, \"relativeHumidityPercent\": 45}";
        for (String role : List.of("OPERATOR", "ENGINEER")) {
            mvc.perform(post(PATH, lot.id(), serial).with(as(role)).contentType(MediaType.APPLICATION_JSON).content(body))
                    .andExpect(status().isCreated());
        }
        for (String role : List.of("SUPERVISOR", "AUDITOR", "ADMIN")) {
            mvc.perform(post(PATH, lot.id(), serial).with(as(role)).contentType(MediaType.APPLICATION_JSON).content(body))
                    .andExpect(status().isForbidden());
            mvc.perform(multipart("/api/v1/lots/{id}/conditions:import", lot.id()).file(csv("serial,ambientC,"
                    + "relativeHumidityPercent,pressureKPa,deviationReason\n" + serial + ",23,45,,\n")).with(as(role)))
                    .andExpect(status().isForbidden());
        }
        mvc.perform(post(PATH, lot.id(), serial).contentType(MediaType.APPLICATION_JSON).content(body))
                .andExpect(status().isUnauthorized());
        for (String role : List.of("OPERATOR", "ENGINEER", "SUPERVISOR", "AUDITOR")) {
            mvc.perform(get(PATH, lot.id(), serial).with(as(role))).andExpect(status().isOk());
        }
        // The page form: the bench roles only.
        mvc.perform(post("/bench/lots/{id}/units/{s}/conditions", lot.id(), serial).with(as("SUPERVISOR")).with(csrf())
                .param("ambientC", "23").param("relativeHumidityPercent", "45")).andExpect(status().isForbidden());
        assertThat(rows()).isEqualTo(2);
    }

    @Test
    void thePageFormRefusesOrRecordsADeviationAndSaysWhich() throws Exception {
        String page = "/bench/lots/{id}/units/{s}/conditions";
        mvc.perform(post(page, lot.id(), serial).with(as("OPERATOR")).with(csrf())
                        .param("ambientC", "31").param("relativeHumidityPercent", "45"))
                .andExpect(status().is3xxRedirection())
                .andExpect(org.springframework.test.web.servlet.result.MockMvcResultMatchers.flash().attribute("problem",
                        allOf(containsString("ambient temperature 31 °C"), containsString("limit of 28 °C"))));
        assertThat(rows()).isZero();
        mvc.perform(post(page, lot.id(), serial).with(as("OPERATOR")).with(csrf())
                        .param("ambientC", "31").param("relativeHumidityPercent", "45").param("pressureKPa", "100.4")
                        .param("deviationReason", "Heat wave; cooling at capacity"))
                .andExpect(status().is3xxRedirection())
                .andExpect(org.springframework.test.web.servlet.result.MockMvcResultMatchers.flash().attribute("notice",
                        containsString("deviation from the procedure")));
        Conditions saved = bench.conditions(lot.id(), serial).orElseThrow();
        assertThat(saved.deviationReason()).contains("Heat wave; cooling at capacity");
        assertThat(saved.pressureKPa()).contains(100.4);
        // The unit page states the limits and the recorded deviation.
        mvc.perform(get("/bench/lots/{id}/units/{s}", lot.id(), serial).with(as("OPERATOR")))
                .andExpect(status().isOk())
                .andExpect(content().string(allOf(containsString("18 … 28 °C"), containsString("id=\"conditions-deviation\""),
                        containsString("Heat wave; cooling at capacity"))));
    }

    static MockMultipartFile csv(String text) {
        return new MockMultipartFile("file", "conditions.csv", "text/csv", text.getBytes(StandardCharsets.UTF_8));
    }

    @Test
    void theCompanionConditionsFileIsSavedWholeOrNotAtAll() throws Exception {
        String header = "serial,ambientC,relativeHumidityPercent,pressureKPa,deviationReason\n";
        List<String> s = lot.sampledSerials();
        String bad = header
                + s.get(0) + ",22.9,45,101.1,\n"
                + s.get(1) + ",abc,45,,\n"                       // line 3: not a number
                + s.get(2) + ",30.2,45,,\n"                      // line 4: outside the limits without a reason
                + "NOT-SAMPLED,23,45,,\n";                       // line 5: not in the sample
        mvc.perform(multipart("/api/v1/lots/{id}/conditions:import", lot.id()).file(csv(bad)).with(as("OPERATOR")))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.errors").value(hasItem("line 3, column 'ambientC': 'abc' is not a number")))
                .andExpect(jsonPath("$.errors[1]").value(allOf(containsString("line 4"),
                        containsString("ambient temperature 30.2 °C lies above the procedure's limit of 28 °C"))))
                .andExpect(jsonPath("$.errors[2]").value(allOf(containsString("line 5"), containsString("NOT-SAMPLED"))));
        assertThat(rows()).isZero();

        String good = header
                + s.get(0) + ",22.9,45,101.1,\n"
                + "\n"
                + s.get(1) + ",23.2,44,,\n"
                + s.get(2) + ",30.2,45,,\"Cooling failed; measured under deviation D-9\"\n";
        mvc.perform(multipart("/api/v1/lots/{id}/conditions:import", lot.id()).file(csv(good)).param("preview", "true")
                        .with(as("OPERATOR")))
                .andExpect(status().isOk()).andExpect(jsonPath("$.saved").value(false))
                .andExpect(jsonPath("$.validRows").value(3));
        assertThat(rows()).isZero();
        mvc.perform(multipart("/api/v1/lots/{id}/conditions:import", lot.id()).file(csv(good)).with(as("ENGINEER")))
                .andExpect(status().isOk()).andExpect(jsonPath("$.saved").value(true))
                .andExpect(jsonPath("$.rowsRead").value(3));
        assertThat(rows()).isEqualTo(3);
        assertThat(bench.conditions(lot.id(), s.get(0)).orElseThrow().pressureKPa()).contains(101.1);
        assertThat(bench.conditions(lot.id(), s.get(2)).orElseThrow().deviationReason())
                .contains("Cooling failed; measured under deviation D-9");
        assertThat(bench.unitsWithoutConditions(lot.id(), s)).isEmpty();
    }
}
