package org.dockgate.analysis.web;

import static org.dockgate.analysis.web.StaticAnalysisApiTest.assertSameNumbers;
import static org.dockgate.analysis.web.StaticAnalysisApiTest.number;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.nullValue;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
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

/** {@code POST /api/v1/analysis/noise}. */
@SpringBootTest
@AutoConfigureMockMvc
class NoiseAnalysisApiTest {

    @Autowired MockMvc mvc;

    ResultActions send(String body) throws Exception {
        return mvc.perform(post("/api/v1/analysis/noise").with(httpBasic("engineer", "engineer-demo"))
                .contentType(MediaType.APPLICATION_JSON).content(body));
    }

    @Test
    void noiseRecordA3() throws Exception {
        // Reference sheet A3: record 1, -2, 3, -1, 0, 2, -3, 1, -1, 0 µV, mean 0, sample SD sqrt(30/9) = 1.8257419 µV,
        // p-p 6 µV; with 100 mV/g = 100 000 µV/g: resolution rms/|S|, minimum detectable 3 rms/|S| (common
        // practice), dynamic range 20 log10(500 g / minimum detectable).
        double rms = Math.sqrt(30.0 / 9.0);
        send("""
                {"samples": [1, -2, 3, -1, 0, 2, -3, 1, -1, 0], "sensitivity": 100000, "fullScaleInput": 500}
                """).andExpect(status().isOk())
                .andExpect(number("$.mean", 0, 1e-15))
                .andExpect(number("$.rmsNoise", rms, 1e-14))
                .andExpect(number("$.peakToPeak", 6, 0))
                .andExpect(number("$.resolution", rms / 100000, 1e-19))
                .andExpect(number("$.minimumDetectable", 3 * rms / 100000, 1e-19))
                .andExpect(number("$.dynamicRangeDb", 20 * Math.log10(500 / (3 * rms / 100000)), 1e-9));
    }

    @Test
    void dynamicRangeIsNullWithoutFullScaleOrNoise() throws Exception {
        send("{\"samples\": [1, 2, 3], \"sensitivity\": 2}").andExpect(status().isOk())
                .andExpect(number("$.rmsNoise", 1, 1e-15))
                .andExpect(jsonPath("$.dynamicRangeDb").value(nullValue()));
        // No variation: the range would be infinite, written as null.
        send("{\"samples\": [4, 4, 4], \"sensitivity\": 2, \"fullScaleInput\": 10}").andExpect(status().isOk())
                .andExpect(number("$.minimumDetectable", 0, 0))
                .andExpect(jsonPath("$.dynamicRangeDb").value(nullValue()));
    }

    @Test
    void theDocumentedExampleIsWhatTheEndpointAnswers() throws Exception {
        String body = send(NoiseAnalysisController.EXAMPLE_REQUEST).andExpect(status().isOk())
                .andReturn().getResponse().getContentAsString();
        assertSameNumbers(body, NoiseAnalysisController.EXAMPLE_RESPONSE);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            empty samples        | {"samples": [], "sensitivity": 1}                        | samples
            no samples           | {"sensitivity": 1}                                       | samples
            null sample          | {"samples": [1, null], "sensitivity": 1}                 | samples[1]
            NaN sample           | {"samples": [1, "NaN"], "sensitivity": 1}                | samples[1]
            infinite sample      | {"samples": [1, -1e999], "sensitivity": 1}               | samples[1]
            NaN literal          | {"samples": [1, NaN], "sensitivity": 1}                  | NaN
            zero sensitivity     | {"samples": [1, 2], "sensitivity": 0}                    | sensitivity
            missing sensitivity  | {"samples": [1, 2]}                                      | sensitivity
            negative full scale  | {"samples": [1, 2], "sensitivity": 1, "fullScaleInput": -5} | full-scale
            samples not a list   | {"samples": "1,2", "sensitivity": 1}                     | samples
            """)
    void malformedInputIsABadRequest(String name, String body, String detailMentions) throws Exception {
        send(body).andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail", containsString(detailMentions)));
    }

    @Test
    void aSingleSampleIsUnprocessable() throws Exception {
        send("{\"samples\": [1], \"sensitivity\": 1}").andExpect(status().isUnprocessableContent())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail", containsString("two samples")));
    }
}
