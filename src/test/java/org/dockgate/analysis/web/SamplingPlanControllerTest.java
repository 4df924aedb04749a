package org.dockgate.analysis.web;

import static org.hamcrest.Matchers.containsString;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.request.MockHttpServletRequestBuilder;

/** GET /api/v1/sampling-plan through the real security chain (HTTP Basic with a demo account). */
@SpringBootTest
@AutoConfigureMockMvc
class SamplingPlanControllerTest {

    @Autowired MockMvc mvc;

    private static MockHttpServletRequestBuilder plan() {
        return get("/api/v1/sampling-plan").with(httpBasic("operator", "operator-demo"));
    }

    @Test
    void aPlanReachedByAnArrowUsesTheRowWhereThePlanIsFound() throws Exception {
        // ISO 2859-1:1999 Table 1: lot 1000, level II -> J; Table 2-A, J / AQL 0.40: down arrow -> K, n 125, 1/2
        mvc.perform(plan().param("lotSize", "1000").param("aql", "0.40"))
                .andExpect(status().isOk())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_JSON))
                .andExpect(jsonPath("$.codeLetter").value("J"))
                .andExpect(jsonPath("$.planCodeLetter").value("K"))
                .andExpect(jsonPath("$.sampleSize").value(125))
                .andExpect(jsonPath("$.acceptNumber").value(1))
                .andExpect(jsonPath("$.rejectNumber").value(2))
                .andExpect(jsonPath("$.fullInspection").value(false))
                .andExpect(jsonPath("$.length()").value(6));
    }

    @ParameterizedTest(name = "lot {0}, AQL {1}, level {2}, {3}: {4} -> {5} n {6} {7}/{8}")
    @CsvSource({
        // lot,  aql,   level, severity,  code, used, n,    Ac, Re, full
        "1000,   1.0,   II,    NORMAL,    J,    J,    80,   2,  3,  false", // ISO 2859-1:1999 Table 2-A, J, AQL 1.0
        "1000,   1,     II,    TIGHTENED, J,    J,    80,   1,  2,  false", // Table 2-B, J, AQL 1.0
        "1000,   1.0,   II,    REDUCED,   J,    J,    32,   1,  2,  false", // Table 2-C (1999, no gaps), J, AQL 1.0
        "200000, 0.025, III,   TIGHTENED, Q,    S,    3150, 1,  2,  false", // Table 2-B, Q / 0.025 -> row S
        "15,     6.5,   II,    NORMAL,    B,    A,    2,    0,  1,  false", // Table 2-A, B / 6.5: up arrow
        "120,    0.065, II,    NORMAL,    F,    L,    120,  0,  1,  true",  // Table 2-A, F / 0.065 -> L n 200: 100 %
        "800,    1.0,   S-2,   normal,    C,    E,    13,   0,  1,  false", // Table 1 S-2 -> C; 2-A C / 1.0 -> E
    })
    void plansFromAllThreeTables(String lot, String aql, String level, String severity, String code, String used,
            int n, int ac, int re, boolean full) throws Exception {
        mvc.perform(plan().param("lotSize", lot).param("aql", aql).param("level", level).param("severity", severity))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.codeLetter").value(code))
                .andExpect(jsonPath("$.planCodeLetter").value(used))
                .andExpect(jsonPath("$.sampleSize").value(n))
                .andExpect(jsonPath("$.acceptNumber").value(ac))
                .andExpect(jsonPath("$.rejectNumber").value(re))
                .andExpect(jsonPath("$.fullInspection").value(full));
    }

    @Test
    void levelAndSeverityDefaultToIIAndNormal() throws Exception {
        // ISO 2859-1:1999 Table 1 level II, lot 2500 -> K; Table 2-A, K / AQL 2.5: n 125, 7/8
        mvc.perform(plan().param("lotSize", "2500").param("aql", "2.5"))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.codeLetter").value("K"))
                .andExpect(jsonPath("$.sampleSize").value(125))
                .andExpect(jsonPath("$.acceptNumber").value(7));
    }

    @ParameterizedTest(name = "{0}={1}")
    @CsvSource(delimiter = '|', value = {
        "lotSize | 0       | Lot size must be at least 1, was 0.",
        "lotSize | -3      | Lot size must be at least 1, was -3.",
        "lotSize | many    | Parameter 'lotSize' has the value 'many', which is not a whole number.",
        "lotSize | 1.5     | Parameter 'lotSize' has the value '1.5', which is not a whole number.",
        "lotSize | 99999999999 | Parameter 'lotSize' has the value '99999999999', which is not a whole number.",
        "aql     | 0.5     | AQL 0.5 is not in the ISO 2859-1 series; valid values are 0.010, 0.015, 0.025",
        "aql     | 15      | AQL 15.0 is not in the ISO 2859-1 series",
        "aql     | NaN     | AQL 'NaN' is not a number; valid values are",
        "aql     | abc     | AQL 'abc' is not a number",
        "level   | IV      | Unknown inspection level 'IV'; valid levels are S1, S2, S3, S4, I, II, III.",
        "severity| STRICT  | Unknown severity 'STRICT'; valid severities are NORMAL, TIGHTENED, REDUCED.",
    })
    void badInputIsAClearProblemNeverA500(String name, String value, String detail) throws Exception {
        // a valid request with the one parameter under test replaced by the bad value
        MockHttpServletRequestBuilder request = plan().param("lotSize", name.equals("lotSize") ? value : "1000")
                .param("aql", name.equals("aql") ? value : "1.0");
        if (name.equals("level") || name.equals("severity")) {
            request.param(name, value);
        }
        mvc.perform(request)
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.status").value(400))
                .andExpect(jsonPath("$.detail").value(containsString(detail)));
    }

    @Test
    void missingParametersAreNamed() throws Exception {
        mvc.perform(plan().param("aql", "1.0"))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail").value("Parameter 'lotSize' is required."));
        mvc.perform(plan().param("lotSize", "1000"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.detail").value("Parameter 'aql' is required."));
    }

    @Test
    void anySignedInUserMayCallItButNotAnonymous() throws Exception {
        mvc.perform(get("/api/v1/sampling-plan").param("lotSize", "1000").param("aql", "1.0"))
                .andExpect(status().isUnauthorized())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON));
        for (String user : new String[] {"engineer", "supervisor", "auditor", "admin"}) {
            mvc.perform(get("/api/v1/sampling-plan").with(httpBasic(user, user + "-demo"))
                            .param("lotSize", "1000").param("aql", "1.0"))
                    .andExpect(status().isOk());
        }
    }

    @Test
    void theEndpointIsDocumented() throws Exception {
        mvc.perform(get("/v3/api-docs"))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("/api/v1/sampling-plan")))
                .andExpect(content().string(containsString("planCodeLetter")))
                .andExpect(content().string(containsString("100 % inspection (lot 120, AQL 0.065)")));
    }
}
