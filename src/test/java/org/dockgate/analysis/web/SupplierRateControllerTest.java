package org.dockgate.analysis.web;

import static org.hamcrest.Matchers.closeTo;
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
import org.springframework.test.web.servlet.ResultActions;
import org.springframework.test.web.servlet.request.MockMvcRequestBuilders;

/** GET /api/v1/analysis/proportion and POST /api/v1/analysis/p-chart. */
@SpringBootTest
@AutoConfigureMockMvc
class SupplierRateControllerTest {

    @Autowired MockMvc mvc;

    private ResultActions proportion(String query) throws Exception {
        return mvc.perform(get("/api/v1/analysis/proportion?" + query).with(httpBasic("auditor", "auditor-demo")));
    }

    private ResultActions pChart(String json) throws Exception {
        return mvc.perform(MockMvcRequestBuilders.post("/api/v1/analysis/p-chart")
                .with(httpBasic("supervisor", "supervisor-demo"))
                .contentType(MediaType.APPLICATION_JSON).content(json));
    }

    @Test
    void wilsonIntervalWorkedByHand() throws Exception {
        // Wilson (1927); REFERENCE.md A10 [X]: 3 rejects in 80 at 95 % (the default) → (0.012835, 0.104547)
        proportion("rejected=3&inspected=80")
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.estimate", closeTo(0.0375, 1e-15), Double.class))
                .andExpect(jsonPath("$.lower", closeTo(0.012835, 5e-7), Double.class))
                .andExpect(jsonPath("$.upper", closeTo(0.104547, 5e-7), Double.class));
    }

    @Test
    void confidenceCanBeChosen() throws Exception {
        // Newcombe (1998) Table II (from memory, REFERENCE.md §7.4): 0/20 at 95 % → 0 … 0.1611
        proportion("rejected=0&inspected=20&confidence=0.95")
                .andExpect(jsonPath("$.lower").value(0.0))
                .andExpect(jsonPath("$.upper", closeTo(0.1611, 5e-5), Double.class));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '~', textBlock = """
            rejected above inspected | rejected=5&inspected=4                 | 400 | must not exceed
            negative count           | rejected=-1&inspected=4                | 400 | negative
            confidence of one        | rejected=1&inspected=4&confidence=1    | 400 | confidence
            NaN confidence           | rejected=1&inspected=4&confidence=NaN  | 400 | confidence
            text for a count         | rejected=some&inspected=4              | 400 | rejected
            missing inspected        | rejected=1                             | 400 | 'inspected' is required
            nothing inspected        | rejected=0&inspected=0                 | 422 | no units inspected
            """)
    void badProportionQueries(String what, String query, int status, String detail) throws Exception {
        proportion(query)
                .andExpect(status().is(status))
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail", containsString(detail)));
    }

    @Test
    void pChartWithVariableSubgroupSizes() throws Exception {
        // REFERENCE.md A10 [X], NIST/SEMATECH e-Handbook 6.3.3.2 formulas: p̄ = 33/910, stepped UCLs, LCL 0
        pChart("""
                {"subgroups": [
                  {"label": "L1", "inspected": 120, "rejected": 4}, {"label": "L2", "inspected": 80, "rejected": 2},
                  {"label": "L3", "inspected": 150, "rejected": 5}, {"label": "L4", "inspected": 100, "rejected": 3},
                  {"label": "L5", "inspected": 200, "rejected": 6}, {"label": "L6", "inspected": 60, "rejected": 1},
                  {"label": "L7", "inspected": 110, "rejected": 4}, {"label": "L8", "inspected": 90, "rejected": 8}]}""")
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.centerLine", closeTo(0.0362637363, 5e-11), Double.class))
                .andExpect(jsonPath("$.subgroups[0].label").value("L1"))
                .andExpect(jsonPath("$.subgroups[0].upperControlLimit", closeTo(0.087461, 5e-7), Double.class))
                .andExpect(jsonPath("$.subgroups[7].upperControlLimit", closeTo(0.095381, 5e-7), Double.class))
                .andExpect(jsonPath("$.subgroups[7].proportion", closeTo(0.088889, 5e-7), Double.class))
                .andExpect(jsonPath("$.subgroups[7].lowerControlLimit").value(0.0))
                .andExpect(jsonPath("$.subgroups[7].outOfControl").value(false));
    }

    @Test
    void outOfControlSubgroupIsFlagged() throws Exception {
        pChart("""
                {"subgroups": [{"label": "a", "inspected": 100, "rejected": 2},
                               {"label": "b", "inspected": 100, "rejected": 15},
                               {"label": "c", "inspected": 100, "rejected": 3}]}""")
                .andExpect(jsonPath("$.subgroups[1].outOfControl").value(true))
                .andExpect(jsonPath("$.subgroups[0].outOfControl").value(false));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '~', textBlock = """
            empty subgroups        | {"subgroups": []}                                                    | at least one
            missing subgroups      | {}                                                                   | at least one
            rejected > inspected   | {"subgroups": [{"label": "a", "inspected": 4, "rejected": 5}]}      | rejected must lie between
            zero inspected         | {"subgroups": [{"label": "a", "inspected": 0, "rejected": 0}]}      | at least 1
            missing label          | {"subgroups": [{"inspected": 4, "rejected": 1}]}                    | label
            missing count          | {"subgroups": [{"label": "a", "inspected": 4}]}                     | rejected
            fractional count       | {"subgroups": [{"label": "a", "inspected": 4.5, "rejected": 1}]}    | whole number
            huge count             | {"subgroups": [{"label": "a", "inspected": 1e30, "rejected": 1}]}   | whole number
            null subgroup          | {"subgroups": [null]}                                                | must not be null
            overflowing total      | {"subgroups": [{"label": "a", "inspected": 9000000000000000000, "rejected": 1}, {"label": "b", "inspected": 9000000000000000000, "rejected": 1}]} | too large
            """)
    void badPCharts(String what, String json, String detail) throws Exception {
        pChart(json)
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail", containsString(detail)));
    }
}
