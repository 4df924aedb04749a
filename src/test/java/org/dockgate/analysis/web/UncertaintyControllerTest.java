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

/** POST /api/v1/analysis/uncertainty through the real security chain and problem handler. */
@SpringBootTest
@AutoConfigureMockMvc
class UncertaintyControllerTest {

    @Autowired MockMvc mvc;

    private ResultActions post(String json) throws Exception {
        return mvc.perform(org.springframework.test.web.servlet.request.MockMvcRequestBuilders
                .post("/api/v1/analysis/uncertainty").with(httpBasic("operator", "operator-demo"))
                .contentType(MediaType.APPLICATION_JSON).content(json));
    }

    @Test
    void evaluatesTheReferenceSheetBudget() throws Exception {
        // REFERENCE.md A5 full budget [X]: u_c = 0.0203442594, ν_eff = 691.38, k(95.45 %) = 2.0036, U = 0.04076;
        // the Type A line is entered as its standard uncertainty 0.00687184271 with ν = 9
        post("""
                {"contributions": [
                  {"name": "repeatability", "standardUncertainty": 0.00687184271, "degreesOfFreedom": 9},
                  {"name": "readout resolution", "halfWidth": 0.005, "distribution": "RECTANGULAR"},
                  {"name": "reference certificate", "expandedUncertainty": 0.030, "coverageFactor": 2},
                  {"name": "temperature", "halfWidth": 0.04, "distribution": "RECTANGULAR",
                   "sensitivityCoefficient": 0.5}],
                 "coverageProbability": 0.9544997361}""")
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.combinedStandardUncertainty", closeTo(0.0203442594, 5e-11), Double.class))
                .andExpect(jsonPath("$.effectiveDegreesOfFreedom", closeTo(691.38, 0.005), Double.class))
                .andExpect(jsonPath("$.coverageFactor", closeTo(2.0036, 5e-5), Double.class))
                .andExpect(jsonPath("$.expandedUncertainty", closeTo(0.04076, 5e-6), Double.class))
                .andExpect(jsonPath("$.contributions[1].name").value("readout resolution"))
                .andExpect(jsonPath("$.contributions[1].standardUncertainty", closeTo(0.00288675135, 5e-12), Double.class))
                .andExpect(jsonPath("$.contributions[3].standardUncertainty", closeTo(0.0230940108, 5e-11), Double.class))
                .andExpect(jsonPath("$.contributions[3].contribution", closeTo(0.0115470054, 5e-11), Double.class));
    }

    @Test
    void infiniteEffectiveDegreesOfFreedomAreNull() throws Exception {
        // every ν infinite: normal coverage factor, GUM Table G.2 row ∞, 95 %: 1.960
        post("""
                {"contributions": [{"name": "a", "standardUncertainty": 0.1},
                                   {"name": "b", "halfWidth": 0.1, "distribution": "U_SHAPED"}],
                 "coverageProbability": 0.95}""")
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.effectiveDegreesOfFreedom").value(nullValue()))
                .andExpect(jsonPath("$.coverageFactor", closeTo(1.960, 5e-4), Double.class));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '~', textBlock = """
            two kinds at once      | {"contributions": [{"name": "a", "standardUncertainty": 0.1, "halfWidth": 0.2, "distribution": "RECTANGULAR"}], "coverageProbability": 0.95} | exactly one
            no kind at all         | {"contributions": [{"name": "a"}], "coverageProbability": 0.95}                                   | exactly one
            half-width alone       | {"contributions": [{"name": "a", "halfWidth": 0.2}], "coverageProbability": 0.95}                | distribution
            U without k            | {"contributions": [{"name": "a", "expandedUncertainty": 0.2}], "coverageProbability": 0.95}      | coverageFactor
            dof without u          | {"contributions": [{"name": "a", "halfWidth": 0.2, "distribution": "TRIANGULAR", "degreesOfFreedom": 4}], "coverageProbability": 0.95} | degreesOfFreedom
            empty contributions    | {"contributions": [], "coverageProbability": 0.95}                                                | at least one
            missing contributions  | {"coverageProbability": 0.95}                                                                     | at least one
            missing name           | {"contributions": [{"standardUncertainty": 0.1}], "coverageProbability": 0.95}                   | name
            missing probability    | {"contributions": [{"name": "a", "standardUncertainty": 0.1}]}                                   | coverageProbability
            probability of one     | {"contributions": [{"name": "a", "standardUncertainty": 0.1}], "coverageProbability": 1}         | coverageProbability
            negative uncertainty   | {"contributions": [{"name": "a", "standardUncertainty": -0.1}], "coverageProbability": 0.95}     | negative
            dof below one          | {"contributions": [{"name": "a", "standardUncertainty": 0.1, "degreesOfFreedom": 0.5}], "coverageProbability": 0.95} | at least 1
            zero coverage factor   | {"contributions": [{"name": "a", "expandedUncertainty": 0.2, "coverageFactor": 0}], "coverageProbability": 0.95} | coverageFactor
            infinite uncertainty   | {"contributions": [{"name": "a", "standardUncertainty": 1e999}], "coverageProbability": 0.95}    | finite
            infinite dof           | {"contributions": [{"name": "a", "standardUncertainty": 0.1, "degreesOfFreedom": 1e999}], "coverageProbability": 0.95} | finite
            NaN                    | {"contributions": [{"name": "a", "standardUncertainty": NaN}], "coverageProbability": 0.95}      | NaN
            unknown distribution   | {"contributions": [{"name": "a", "halfWidth": 0.2, "distribution": "GAUSSIAN"}], "coverageProbability": 0.95} | RECTANGULAR, TRIANGULAR, U_SHAPED
            overflowing product    | {"contributions": [{"name": "a", "standardUncertainty": 1e300, "sensitivityCoefficient": 1e300}], "coverageProbability": 0.95} | too large
            not JSON               | {"contributions": [                                                                              | not valid JSON
            """)
    void malformedRequestsAreClearProblems(String what, String json, String detail) throws Exception {
        post(json)
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail", containsString(detail)));
    }

    @Test
    void needsAuthentication() throws Exception {
        mvc.perform(org.springframework.test.web.servlet.request.MockMvcRequestBuilders
                        .post("/api/v1/analysis/uncertainty").contentType(MediaType.APPLICATION_JSON).content("{}"))
                .andExpect(status().isUnauthorized());
    }
}
