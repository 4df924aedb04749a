package org.dockgate.instruments.web;

import static org.hamcrest.Matchers.closeTo;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.everyItem;
import static org.hamcrest.Matchers.hasItem;
import static org.hamcrest.Matchers.is;
import static org.hamcrest.Matchers.not;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.header;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.time.LocalDate;
import java.util.UUID;
import java.util.stream.Stream;
import org.dockgate.instruments.InstrumentService;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.ResultActions;

/**
 * The register's JSON API with the demo accounts over HTTP Basic: reads for everyone, writes for ADMIN,
 * problem documents with a human detail for every refusal. Instruments made here are already expired,
 * so on a shared database no other test finds them qualifying.
 */
@SpringBootTest
@AutoConfigureMockMvc
class InstrumentsApiTest {

    static final MediaType PROBLEM = MediaType.APPLICATION_PROBLEM_JSON;

    @Autowired MockMvc mvc;
    @Autowired InstrumentService service;

    static String fresh() {
        return "RI-TAPI-" + UUID.randomUUID().toString().substring(0, 8).toUpperCase();
    }

    String body(String id, String unit, String extra) {
        LocalDate today = service.today();
        return """
                {"identifier": "%s", "description": "API test gauge", "quantity": "pressure",
                 "rangeMin": 0, "rangeMax": 250, "unit": "%s", "certificateNumber": "CERT-%s",
                 "calibratedOn": "%s", "dueOn": "%s", "coverageFactor": 2%s}"""
                .formatted(id, unit, id, today.minusDays(400), today.minusDays(5), extra);
    }

    ResultActions postAs(String user, String password, String json) throws Exception {
        return mvc.perform(post("/api/v1/reference-instruments").with(httpBasic(user, password))
                .contentType(MediaType.APPLICATION_JSON).content(json));
    }

    @Test
    void everyoneReadsTheRegisterWithItsStatusFlags() throws Exception {
        mvc.perform(get("/api/v1/reference-instruments").with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$[?(@.identifier == 'RI-PRS-02')].status").value(hasItem("EXPIRED")))
                .andExpect(jsonPath("$[?(@.identifier == 'RI-PRS-02')].selectable").value(hasItem(false)))
                .andExpect(jsonPath("$[?(@.identifier == 'RI-ACC-01')].dueSoon").value(hasItem(true)));
        mvc.perform(get("/api/v1/reference-instruments").param("status", "DUE_SOON")
                        .with(httpBasic("auditor", "auditor-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$[*].status").value(everyItem(is("DUE_SOON"))))
                .andExpect(jsonPath("$[*].identifier").value(hasItem("RI-ACC-01")));
        mvc.perform(get("/api/v1/reference-instruments").param("quantity", "pressure")
                        .with(httpBasic("engineer", "engineer-demo")))
                .andExpect(jsonPath("$[*].quantity").value(everyItem(is("pressure"))))
                .andExpect(jsonPath("$[*].identifier").value(hasItem("RI-PRS-01")));
        mvc.perform(get("/api/v1/reference-instruments/RI-PRS-02").with(httpBasic("supervisor", "supervisor-demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.status").value("EXPIRED"))
                .andExpect(jsonPath("$.expiredSince").value(service.today().minusDays(15).toString()))
                .andExpect(jsonPath("$.current.certificateNumber").value("NBL-C-23019"))
                .andExpect(jsonPath("$.current.bands[0].mode").value("PERCENT_OF_FULL_SCALE"))
                .andExpect(jsonPath("$.calibrations.length()").value(1));
    }

    @ParameterizedTest(name = "GET {0}: {1}")
    @CsvSource(delimiter = '|', value = {
        "/api/v1/reference-instruments?quantity=presure | Unknown quantity 'presure'",
        "/api/v1/reference-instruments?status=LATE       | Parameter 'status' has the value 'LATE'"})
    void badFiltersAreRefusedWithAProblem(String path, String detail) throws Exception {
        mvc.perform(get(path).with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isBadRequest()).andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.detail").value(containsString(detail)));
    }

    @Test
    void anUnknownInstrumentIsAProblem404() throws Exception {
        mvc.perform(get("/api/v1/reference-instruments/RI-NOPE-1").with(httpBasic("operator", "operator-demo")))
                .andExpect(status().isNotFound()).andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.detail").value("There is no reference instrument 'RI-NOPE-1' in the register."));
    }

    @ParameterizedTest(name = "{0} may not add an instrument")
    @CsvSource({"operator,operator-demo", "engineer,engineer-demo", "supervisor,supervisor-demo",
        "auditor,auditor-demo"})
    void onlyAdminAddsInstruments(String user, String password) throws Exception {
        String id = fresh();
        postAs(user, password, body(id, "kPa", ", \"expandedUncertainty\": 0.05, \"uncertaintyMode\": \"ABSOLUTE\""))
                .andExpect(status().isForbidden()).andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.detail").value("This needs the role ADMIN."));
        mvc.perform(post("/api/v1/reference-instruments/RI-PRS-01/calibrations").with(httpBasic(user, password))
                        .contentType(MediaType.APPLICATION_JSON).content("{}"))
                .andExpect(status().isForbidden());
        org.assertj.core.api.Assertions.assertThat(service.find(id)).isEmpty();
    }

    @Test
    void adminAddsAnInstrumentAndRecordsACalibration() throws Exception {
        String id = fresh();
        postAs("admin", "admin-demo", body(id, "kPa", """
                , "bands": [{"upTo": 50, "expandedUncertainty": 0.01, "mode": "ABSOLUTE"},
                            {"expandedUncertainty": 0.02, "mode": "PERCENT_OF_READING"}]"""))
                .andExpect(status().isCreated())
                .andExpect(header().string("Location", "/api/v1/reference-instruments/" + id))
                .andExpect(jsonPath("$.status").value("EXPIRED"))
                .andExpect(jsonPath("$.current.bands[1].upTo").value(250.0))
                .andExpect(jsonPath("$.version").value(0));
        LocalDate today = service.today();
        String calibration = """
                {"version": %d, "certificateNumber": "CERT-%s-2", "calibratedOn": "%s", "dueOn": "%s",
                 "coverageFactor": 2, "expandedUncertainty": 0.015, "uncertaintyMode": "PERCENT_OF_READING"}""";
        mvc.perform(post("/api/v1/reference-instruments/" + id + "/calibrations").with(httpBasic("admin", "admin-demo"))
                        .contentType(MediaType.APPLICATION_JSON)
                        .content(calibration.formatted(0, id, today.minusDays(3), today.minusDays(1))))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.calibrations.length()").value(2))
                .andExpect(jsonPath("$.calibrations[0].certificateNumber").value("CERT-" + id + "-2"))
                .andExpect(jsonPath("$.calibrations[1].certificateNumber").value("CERT-" + id))
                .andExpect(jsonPath("$.version").value(1));
        mvc.perform(post("/api/v1/reference-instruments/" + id + "/calibrations").with(httpBasic("admin", "admin-demo"))
                        .contentType(MediaType.APPLICATION_JSON)
                        .content(calibration.formatted(0, id + "-3", today.minusDays(1), today)))
                .andExpect(status().isConflict()).andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.detail").value(containsString("changed while you were editing")));
        mvc.perform(post("/api/v1/reference-instruments/" + id + "/calibrations").with(httpBasic("admin", "admin-demo"))
                        .contentType(MediaType.APPLICATION_JSON)
                        .content("{\"certificateNumber\": \"X\", \"calibratedOn\": \"" + today + "\", \"dueOn\": \""
                                + today.plusDays(1) + "\", \"coverageFactor\": 2, \"expandedUncertainty\": 1,"
                                + " \"uncertaintyMode\": \"ABSOLUTE\"}"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.detail").value(containsString("'version' is required")));
        mvc.perform(post("/api/v1/reference-instruments/RI-NOPE-2/calibrations").with(httpBasic("admin", "admin-demo"))
                        .contentType(MediaType.APPLICATION_JSON).content("{}"))
                .andExpect(status().isNotFound());
    }

    static Stream<Arguments> badInput() {
        return Stream.of(
                Arguments.of("unit of another kind", "V", ", \"expandedUncertainty\": 1, \"uncertaintyMode\": \"ABSOLUTE\"",
                        "The unit 'V' does not fit a pressure"),
                Arguments.of("unknown mode", "kPa", ", \"expandedUncertainty\": 1, \"uncertaintyMode\": \"ROUGHLY\"",
                        "Field 'uncertaintyMode' has the value 'ROUGHLY'"),
                Arguments.of("U not a number", "kPa", ", \"expandedUncertainty\": \"small\", \"uncertaintyMode\": \"ABSOLUTE\"",
                        "Field 'expandedUncertainty'"),
                Arguments.of("U missing", "kPa", ", \"uncertaintyMode\": \"ABSOLUTE\"", "'expandedUncertainty' is required"),
                Arguments.of("U and bands both given", "kPa", ", \"expandedUncertainty\": 1, \"uncertaintyMode\": \"ABSOLUTE\","
                        + " \"bands\": [{\"expandedUncertainty\": 1, \"mode\": \"ABSOLUTE\"}]", "Give either"),
                Arguments.of("band beyond the range", "kPa",
                        ", \"bands\": [{\"upTo\": 300, \"expandedUncertainty\": 1, \"mode\": \"ABSOLUTE\"}]", "beyond the range"),
                Arguments.of("zero uncertainty", "kPa", ", \"expandedUncertainty\": 0, \"uncertaintyMode\": \"ABSOLUTE\"",
                        "greater than zero"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("badInput")
    void badInputIsA400ProblemWithADetail(String name, String unit, String extra, String detail) throws Exception {
        String id = fresh();
        postAs("admin", "admin-demo", body(id, unit, extra))
                .andExpect(status().isBadRequest()).andExpect(content().contentTypeCompatibleWith(PROBLEM))
                .andExpect(jsonPath("$.detail").value(containsString(detail)));
        org.assertj.core.api.Assertions.assertThat(service.find(id)).as("nothing saved").isEmpty();
    }

    @Test
    void aDuplicateIdentifierAndDatesOutOfOrderNameTheirField() throws Exception {
        postAs("admin", "admin-demo", body("RI-PRS-01", "bar",
                ", \"expandedUncertainty\": 1, \"uncertaintyMode\": \"ABSOLUTE\""))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.field").value("identifier"))
                .andExpect(jsonPath("$.detail").value(containsString("RI-PRS-01 is already in the register")));
        String json = body(fresh(), "bar", ", \"expandedUncertainty\": 1, \"uncertaintyMode\": \"ABSOLUTE\"")
                .replace("\"dueOn\": \"" + service.today().minusDays(5), "\"dueOn\": \"" + service.today().minusDays(500));
        postAs("admin", "admin-demo", json)
                .andExpect(status().isBadRequest()).andExpect(jsonPath("$.field").value("dueOn"))
                .andExpect(jsonPath("$.detail").value(containsString("must come after the calibration date")));
        postAs("admin", "admin-demo", "{\"identifier\": ")
                .andExpect(status().isBadRequest()).andExpect(content().contentTypeCompatibleWith(PROBLEM));
    }

    @Test
    void theEndpointsAreDocumented() throws Exception {
        mvc.perform(get("/v3/api-docs")).andExpect(status().isOk())
                .andExpect(content().string(containsString("/api/v1/reference-instruments/{identifier}/calibrations")))
                .andExpect(content().string(containsString("Reference instruments")))
                .andExpect(content().string(not(containsString("NoSuchInstrument"))));
    }

    @Test
    void aCalibrationStatesItsRangeAndFloorAndBothAreChecked() throws Exception {
        String id = fresh();
        postAs("admin", "admin-demo", body(id, "bar", ", \"expandedUncertainty\": 0.01, \"uncertaintyMode\":"
                        + " \"PERCENT_OF_READING\", \"calibratedMin\": 0.2, \"calibratedMax\": 200,"
                        + " \"uncertaintyFloor\": 0.0005"))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.current.calibratedMin").value(0.2))
                .andExpect(jsonPath("$.current.calibratedMax").value(200.0))
                .andExpect(jsonPath("$.current.uncertaintyFloor").value(0.0005))
                .andExpect(jsonPath("$.current.uncertaintyFloorDerived").value(false));
        // Without them: the instrument's range, and the floor derived (0.01 % × 10 % × 250 bar = 0.0025 bar).
        String plain = fresh();
        postAs("admin", "admin-demo", body(plain, "bar", ", \"expandedUncertainty\": 0.01, \"uncertaintyMode\":"
                        + " \"PERCENT_OF_READING\""))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.current.calibratedMin").value(0.0))
                .andExpect(jsonPath("$.current.calibratedMax").value(250.0))
                .andExpect(jsonPath("$.current.uncertaintyFloor").value(closeTo(0.0025, 1e-12)))
                .andExpect(jsonPath("$.current.uncertaintyFloorDerived").value(true));
        postAs("admin", "admin-demo", body(fresh(), "bar", ", \"expandedUncertainty\": 0.01, \"uncertaintyMode\":"
                        + " \"PERCENT_OF_READING\", \"calibratedMin\": -5"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.field").value("calibratedMin"))
                .andExpect(jsonPath("$.detail").value(containsString("inside the instrument's range (0 to 250 bar)")));
        postAs("admin", "admin-demo", body(fresh(), "bar", ", \"expandedUncertainty\": 0.01, \"uncertaintyMode\":"
                        + " \"PERCENT_OF_READING\", \"calibratedMin\": 100, \"calibratedMax\": 50"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.field").value("calibratedMax"));
        postAs("admin", "admin-demo", body(fresh(), "bar", ", \"expandedUncertainty\": 0.01, \"uncertaintyMode\":"
                        + " \"PERCENT_OF_READING\", \"uncertaintyFloor\": 0"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.field").value("uncertaintyFloor"))
                .andExpect(jsonPath("$.detail").value(containsString("greater than zero")));
    }
}
