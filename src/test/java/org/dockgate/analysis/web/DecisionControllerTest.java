package org.dockgate.analysis.web;

import static org.hamcrest.Matchers.closeTo;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.nullValue;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
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
import org.springframework.test.web.servlet.ResultActions;
import org.springframework.test.web.servlet.request.MockMvcRequestBuilders;

/** POST /api/v1/analysis/decision through the real security chain and problem handler. */
@SpringBootTest
@AutoConfigureMockMvc
class DecisionControllerTest {

    @Autowired MockMvc mvc;

    private ResultActions decide(String json) throws Exception {
        return mvc.perform(MockMvcRequestBuilders.post("/api/v1/analysis/decision")
                .with(httpBasic("engineer", "engineer-demo"))
                .contentType(MediaType.APPLICATION_JSON).content(json));
    }

    @Test
    void nonBinaryConditionalPassWorkedInTheReferenceSheet() throws Exception {
        // ILAC G8:09/2019 §4.2.3, REFERENCE.md A6: ±1.0, U = 0.25 (k defaults to 2) → AL ±0.75, TUR 4;
        // y = 0.80 is CONDITIONAL_PASS; p_c(0.80) = Φ(1.6) − Φ(−14.4) = 0.945200708 (A6 gives it for −0.80)
        decide("""
                {"measured": 0.80, "lowerLimit": -1.0, "upperLimit": 1.0, "expandedUncertainty": 0.25,
                 "rule": "NON_BINARY"}""")
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.verdict").value("CONDITIONAL_PASS"))
                .andExpect(jsonPath("$.acceptanceLower", closeTo(-0.75, 1e-15), Double.class))
                .andExpect(jsonPath("$.acceptanceUpper", closeTo(0.75, 1e-15), Double.class))
                .andExpect(jsonPath("$.probabilityOfConformance", closeTo(0.945200708, 5e-10), Double.class))
                .andExpect(jsonPath("$.testUncertaintyRatio", closeTo(4.0, 1e-15), Double.class))
                .andExpect(jsonPath("$.turAdequate").value(true));
    }

    @ParameterizedTest(name = "{0} at y = {1} -> {2}")
    @CsvSource({
        // ILAC G8:09/2019 §4.2.1–4.2.2 and JCGM 106:2012, REFERENCE.md A6
        "SIMPLE_ACCEPTANCE, 0.99, PASS",
        "SIMPLE_ACCEPTANCE, 1.01, FAIL",
        "GUARD_BANDED, 0.70, PASS",
        "GUARD_BANDED, 0.80, FAIL",
        "NON_BINARY, 1.10, CONDITIONAL_FAIL",
        "NON_BINARY, -1.26, FAIL",
        "RISK_BASED, 0.75, PASS",
        "RISK_BASED, 0.76, FAIL"})
    void eachRule(String rule, double measured, String verdict) throws Exception {
        decide("""
                {"measured": %s, "lowerLimit": -1.0, "upperLimit": 1.0, "expandedUncertainty": 0.25,
                 "coverageFactor": 2, "rule": "%s"}""".formatted(measured, rule))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.verdict").value(verdict));
    }

    @Test
    void riskBasedLimitsWithAGivenRisk() throws Exception {
        // JCGM 106:2012, one-sided: A_U = T_U − u·z_{1−α}; α = 0.05 → z = 1.644853627 (any normal table)
        decide("""
                {"measured": 0.5, "upperLimit": 1.0, "expandedUncertainty": 0.25, "coverageFactor": 2,
                 "rule": "RISK_BASED", "maxFalseAcceptRisk": 0.05}""")
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.verdict").value("PASS"))
                .andExpect(jsonPath("$.acceptanceLower").value(nullValue()))
                .andExpect(jsonPath("$.acceptanceUpper", closeTo(1 - 0.125 * 1.644853627, 1e-9), Double.class))
                .andExpect(jsonPath("$.testUncertaintyRatio").value(nullValue()))
                .andExpect(jsonPath("$.turAdequate").value(nullValue()));
    }

    @Test
    void guardBandFactorAndZeroUncertainty() throws Exception {
        decide("""
                {"measured": 0.6, "lowerLimit": -1.0, "upperLimit": 1.0, "expandedUncertainty": 0.25,
                 "rule": "GUARD_BANDED", "guardBandFactor": 1.5}""")
                .andExpect(jsonPath("$.verdict").value("PASS"))
                .andExpect(jsonPath("$.acceptanceUpper", closeTo(0.625, 1e-15), Double.class));
        // U = 0: TUR infinite → null, adequate
        decide("""
                {"measured": 1.0, "lowerLimit": -1.0, "upperLimit": 1.0, "expandedUncertainty": 0,
                 "rule": "NON_BINARY"}""")
                .andExpect(jsonPath("$.verdict").value("PASS"))
                .andExpect(jsonPath("$.testUncertaintyRatio").value(nullValue()))
                .andExpect(jsonPath("$.turAdequate").value(true));
    }

    @Test
    void aGuardBandThatSwallowsTheToleranceLeavesNoAcceptanceLimits() throws Exception {
        decide("""
                {"measured": 0.0, "lowerLimit": -1.0, "upperLimit": 1.0, "expandedUncertainty": 1.2,
                 "rule": "GUARD_BANDED"}""")
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.verdict").value("FAIL"))
                .andExpect(jsonPath("$.acceptanceLower").value(nullValue()))
                .andExpect(jsonPath("$.acceptanceUpper").value(nullValue()))
                .andExpect(jsonPath("$.turAdequate").value(false));
    }

    @Test
    void theOpenApiDescriptionDocumentsTheEndpointsWithExamples() throws Exception {
        mvc.perform(MockMvcRequestBuilders.get("/v3/api-docs"))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.paths['/api/v1/analysis/decision'].post.requestBody.content"
                        + "['application/json'].examples['ILAC G8 non-binary'].value").exists())
                .andExpect(jsonPath("$.paths['/api/v1/analysis/uncertainty'].post.responses['200']").exists())
                .andExpect(jsonPath("$.paths['/api/v1/analysis/proportion'].get.parameters[0].name").value("rejected"))
                .andExpect(jsonPath("$.paths['/api/v1/analysis/p-chart'].post").exists());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '~', textBlock = """
            unknown rule            | {"measured": 0, "upperLimit": 1, "expandedUncertainty": 0.1, "rule": "LENIENT"}            | SIMPLE_ACCEPTANCE, GUARD_BANDED, NON_BINARY, RISK_BASED
            missing rule            | {"measured": 0, "upperLimit": 1, "expandedUncertainty": 0.1}                               | 'rule' is required
            missing measured        | {"upperLimit": 1, "expandedUncertainty": 0.1, "rule": "NON_BINARY"}                        | 'measured' is required
            missing uncertainty     | {"measured": 0, "upperLimit": 1, "rule": "NON_BINARY"}                                     | 'expandedUncertainty' is required
            no limits               | {"measured": 0, "expandedUncertainty": 0.1, "rule": "NON_BINARY"}                          | lower limit, an upper limit or both
            limits reversed         | {"measured": 0, "lowerLimit": 2, "upperLimit": 1, "expandedUncertainty": 0.1, "rule": "NON_BINARY"} | must be below
            NaN measured            | {"measured": NaN, "upperLimit": 1, "expandedUncertainty": 0.1, "rule": "NON_BINARY"}       | NaN
            infinite measured       | {"measured": 1e999, "upperLimit": 1, "expandedUncertainty": 0.1, "rule": "NON_BINARY"}     | 'measured' must be a finite number
            infinite limit          | {"measured": 0, "upperLimit": -1e999, "expandedUncertainty": 0.1, "rule": "NON_BINARY"}    | 'upperLimit' must be a finite number
            negative uncertainty    | {"measured": 0, "upperLimit": 1, "expandedUncertainty": -0.1, "rule": "NON_BINARY"}        | negative
            zero coverage factor    | {"measured": 0, "upperLimit": 1, "expandedUncertainty": 0.1, "coverageFactor": 0, "rule": "NON_BINARY"} | coverageFactor
            factor with wrong rule  | {"measured": 0, "upperLimit": 1, "expandedUncertainty": 0.1, "rule": "NON_BINARY", "guardBandFactor": 2} | applies only to rule GUARD_BANDED
            risk with wrong rule    | {"measured": 0, "upperLimit": 1, "expandedUncertainty": 0.1, "rule": "GUARD_BANDED", "maxFalseAcceptRisk": 0.01} | applies only to rule RISK_BASED
            negative guard band     | {"measured": 0, "upperLimit": 1, "expandedUncertainty": 0.1, "rule": "GUARD_BANDED", "guardBandFactor": -1} | guardBandFactor
            risk out of range       | {"measured": 0, "upperLimit": 1, "expandedUncertainty": 0.1, "rule": "RISK_BASED", "maxFalseAcceptRisk": 0.7} | maxFalseAcceptRisk
            text for a number       | {"measured": "high", "upperLimit": 1, "expandedUncertainty": 0.1, "rule": "NON_BINARY"}   | measured
            """)
    void malformedRequestsAreClearProblems(String what, String json, String detail) throws Exception {
        decide(json)
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail", containsString(detail)));
    }
}
