package org.dockgate.analysis.web;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.hamcrest.Matchers.closeTo;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.not;
import static org.hamcrest.Matchers.nullValue;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.util.Iterator;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.ResultActions;
import org.springframework.test.web.servlet.ResultMatcher;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code POST /api/v1/analysis/static} through the real filter chain, HTTP Basic as an integrating tool would. */
@SpringBootTest
@AutoConfigureMockMvc
class StaticAnalysisApiTest {

    private static final String PATH = "/api/v1/analysis/static";

    /** Reference sheet case A2 (0-10 bar, two cycles up and down), as an integrating tool would send it. */
    private static final String A2 = """
            {"rangeMin": 0, "rangeMax": 10, "points": [
              {"input": 0, "output": 0.05}, {"input": 2, "output": 20.10}, {"input": 4, "output": 40.18},
              {"input": 6, "output": 60.20}, {"input": 8, "output": 80.16}, {"input": 10, "output": 100.05},
              {"input": 10, "output": 100.05, "direction": "DOWN"}, {"input": 8, "output": 80.25, "direction": "DOWN"},
              {"input": 6, "output": 60.32, "direction": "DOWN"}, {"input": 4, "output": 40.30, "direction": "DOWN"},
              {"input": 2, "output": 20.20, "direction": "DOWN"}, {"input": 0, "output": 0.09, "direction": "DOWN"},
              {"input": 0, "output": 0.04, "direction": "UP"}, {"input": 2, "output": 20.12}, {"input": 4, "output": 40.16},
              {"input": 6, "output": 60.22}, {"input": 8, "output": 80.15}, {"input": 10, "output": 100.07},
              {"input": 10, "output": 100.07, "direction": "DOWN"}, {"input": 8, "output": 80.27, "direction": "DOWN"},
              {"input": 6, "output": 60.31, "direction": "DOWN"}, {"input": 4, "output": 40.28, "direction": "DOWN"},
              {"input": 2, "output": 20.22, "direction": "DOWN"}, {"input": 0, "output": 0.10, "direction": "DOWN"}]}
            """;

    @Autowired MockMvc mvc;

    ResultActions send(String body) throws Exception {
        return mvc.perform(post(PATH).with(httpBasic("engineer", "engineer-demo"))
                .contentType(MediaType.APPLICATION_JSON).content(body));
    }

    @Test
    void pressureTransducerCheckCaseA2() throws Exception {
        // Reference sheet A2: slope 5601/560 mV/bar, offset 437/2800 mV; FSO = |slope| x 10 bar (Dockgate's FSO);
        // %FSO figures recomputed from the sheet's mV values: BFSL 0.1139286 mV, terminal 0.1985 mV,
        // hysteresis 0.12 mV, pooled repeatability sqrt(0.00015) mV.
        double fso = 5601.0 / 560.0 * 10;
        send(A2).andExpect(status().isOk())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_JSON))
                .andExpect(number("$.sensitivity", 5601.0 / 560.0, 1e-12))
                .andExpect(number("$.offset", 437.0 / 2800.0, 1e-12))
                .andExpect(number("$.fullScaleOutput", fso, 1e-10))
                .andExpect(number("$.nonlinearityBestFitPctFso",
                        Math.abs(100.06 - (437.0 / 2800 + 10 * 5601.0 / 560)) / fso * 100, 1e-9))
                .andExpect(number("$.nonlinearityTerminalPctFso", 0.1985 / fso * 100, 1e-9))
                .andExpect(number("$.hysteresisPctFso", 0.12 / fso * 100, 1e-9))
                .andExpect(number("$.repeatabilityStdDev", Math.sqrt(0.00015), 1e-12))
                .andExpect(number("$.repeatabilityPctFso", Math.sqrt(0.00015) / fso * 100, 1e-9))
                .andExpect(jsonPath("$.sensitivityStdUncertainty").isNumber())
                .andExpect(jsonPath("$.offsetStdUncertainty").isNumber())
                .andExpect(jsonPath("$.residualStdDev").isNumber())
                .andExpect(jsonPath("$.rSquared").isNumber());
    }

    @Test
    void absentValuesAreNull() throws Exception {
        // Two UP readings only: no residual degrees of freedom, no DOWN points, no repeats.
        send("""
                {"rangeMin": 0, "rangeMax": 10, "points": [{"input": 0, "output": 0.1}, {"input": 10, "output": 100.1}]}
                """).andExpect(status().isOk())
                .andExpect(number("$.sensitivity", 10.0, 1e-12))
                .andExpect(jsonPath("$.residualStdDev").value(nullValue()))
                .andExpect(jsonPath("$.sensitivityStdUncertainty").value(nullValue()))
                .andExpect(jsonPath("$.offsetStdUncertainty").value(nullValue()))
                .andExpect(jsonPath("$.hysteresisPctFso").value(nullValue()))
                .andExpect(jsonPath("$.repeatabilityStdDev").value(nullValue()))
                .andExpect(jsonPath("$.repeatabilityPctFso").value(nullValue()));
    }

    @Test
    void theDocumentedExampleIsWhatTheEndpointAnswers() throws Exception {
        String body = send(StaticAnalysisController.EXAMPLE_REQUEST).andExpect(status().isOk())
                .andReturn().getResponse().getContentAsString();
        assertSameNumbers(body, StaticAnalysisController.EXAMPLE_RESPONSE);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            NaN literal            | {"rangeMin": NaN, "rangeMax": 10, "points": [{"input": 0, "output": 0}]}                 | NaN
            NaN as a string        | {"rangeMin": "NaN", "rangeMax": 10, "points": [{"input": 0, "output": 0}]}               | rangeMin
            overflow to infinity   | {"rangeMin": 0, "rangeMax": 1e400, "points": [{"input": 0, "output": 0}]}                | rangeMax
            infinite output        | {"rangeMin": 0, "rangeMax": 10, "points": [{"input": 0, "output": "Infinity"}]}         | points[0].output
            missing range          | {"rangeMax": 10, "points": [{"input": 0, "output": 0}, {"input": 1, "output": 1}]}      | rangeMin
            missing input          | {"rangeMin": 0, "rangeMax": 10, "points": [{"output": 0}, {"input": 1, "output": 1}]}   | points[0].input
            empty points           | {"rangeMin": 0, "rangeMax": 10, "points": []}                                           | points
            no points              | {"rangeMin": 0, "rangeMax": 10}                                                         | points
            null point             | {"rangeMin": 0, "rangeMax": 10, "points": [null]}                                       | points[0]
            unknown direction      | {"rangeMin": 0, "rangeMax": 10, "points": [{"input": 0, "output": 0, "direction": "SIDEWAYS"}]} | UP, DOWN
            reversed range         | {"rangeMin": 10, "rangeMax": 0, "points": [{"input": 0, "output": 0}, {"input": 1, "output": 1}]} | below
            text for a number      | {"rangeMin": "zero", "rangeMax": 10, "points": [{"input": 0, "output": 0}]}              | rangeMin
            not JSON               | rangeMin=0                                                                               | JSON
            """)
    void malformedInputIsABadRequest(String name, String body, String detailMentions) throws Exception {
        send(body).andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.status").value(400))
                .andExpect(jsonPath("$.detail", containsString(detailMentions)));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            single distinct input  | {"rangeMin": 0, "rangeMax": 10, "points": [{"input": 5, "output": 1}, {"input": 5, "output": 2}]}  | distinct inputs
            single reading         | {"rangeMin": 0, "rangeMax": 10, "points": [{"input": 5, "output": 1}]}                           | two points
            zero span              | {"rangeMin": 5, "rangeMax": 5, "points": [{"input": 0, "output": 1}, {"input": 10, "output": 2}]} | zero span
            zero sensitivity       | {"rangeMin": 0, "rangeMax": 10, "points": [{"input": 0, "output": 1}, {"input": 10, "output": 1}]} | full-scale output
            """)
    void unevaluableInputIsUnprocessable(String name, String body, String detailMentions) throws Exception {
        send(body).andExpect(status().isUnprocessableContent())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.status").value(422))
                .andExpect(jsonPath("$.detail", containsString(detailMentions)))
                .andExpect(jsonPath("$.detail", not(containsString("Exception"))));
    }

    @Test
    void anySignedInUserMayCallItButNobodyElse() throws Exception {
        mvc.perform(post(PATH).with(httpBasic("operator", "operator-demo"))
                        .contentType(MediaType.APPLICATION_JSON).content(A2))
                .andExpect(status().isOk());
        mvc.perform(post(PATH).contentType(MediaType.APPLICATION_JSON).content(A2))
                .andExpect(status().isUnauthorized())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON));
    }

    @Test
    void theEndpointsAreDocumentedWithExamples() throws Exception {
        mvc.perform(org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get("/v3/api-docs"))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("/api/v1/analysis/static")))
                .andExpect(content().string(containsString("/api/v1/analysis/noise")))
                .andExpect(content().string(containsString("/api/v1/analysis/frequency-response")))
                .andExpect(content().string(containsString("/api/v1/analysis/rtd/resistance")))
                .andExpect(content().string(containsString("/api/v1/analysis/rtd/temperature")))
                .andExpect(content().string(containsString("0-10 bar transducer, two cycles up, one down")))
                .andExpect(content().string(containsString("accelerometer sweep, reference 160 Hz")));
    }

    /** A JSON number within an absolute tolerance, read as a double whatever type the JSON parser picked. */
    static ResultMatcher number(String path, double expected, double tolerance) {
        return jsonPath(path).value(closeTo(expected, tolerance), Double.class);
    }

    /** Same fields, every number equal within 1e-9 relative (the documented examples print 10 digits). */
    static void assertSameNumbers(String actualJson, String expectedJson) {
        JsonMapper mapper = JsonMapper.builder().build();
        JsonNode actual = mapper.readTree(actualJson);
        JsonNode expected = mapper.readTree(expectedJson);
        assertThat(actual.propertyNames()).containsExactlyInAnyOrderElementsOf(expected.propertyNames());
        for (Iterator<Map.Entry<String, JsonNode>> it = expected.properties().iterator(); it.hasNext();) {
            Map.Entry<String, JsonNode> e = it.next();
            JsonNode value = actual.get(e.getKey());
            if (e.getValue().isNumber()) {
                double wanted = e.getValue().asDouble();
                assertThat(value.asDouble()).as(e.getKey()).isCloseTo(wanted, within(Math.abs(wanted) * 1e-9 + 1e-15));
            } else {
                assertThat(value).as(e.getKey()).isEqualTo(e.getValue());
            }
        }
    }
}
