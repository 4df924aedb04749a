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

import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.ResultActions;

/** {@code POST /api/v1/analysis/frequency-response}. */
@SpringBootTest
@AutoConfigureMockMvc
class FrequencyResponseApiTest {

    @Autowired MockMvc mvc;

    ResultActions send(String body) throws Exception {
        return mvc.perform(post("/api/v1/analysis/frequency-response").with(httpBasic("engineer", "engineer-demo"))
                .contentType(MediaType.APPLICATION_JSON).content(body));
    }

    @Test
    void butterworthSecondOrderBandwidthIsTheNaturalFrequency() throws Exception {
        // Reference sheet A4: second order with zeta = 1/sqrt(2) has r-3dB = 1.000000; f_n = 1000 Hz, 10 points per
        // decade from 10 Hz (1000 Hz is a grid point; the 10 Hz reference is 1 - 5e-9 dB, so 1e-3 Hz tolerance).
        StringBuilder points = new StringBuilder();
        for (int k = 0; k <= 30; k++) {
            double f = Math.pow(10, 1 + k / 10.0);
            double r = f / 1000;
            double a = 1 / Math.sqrt(Math.pow(1 - r * r, 2) + 2 * r * r);
            points.append(k == 0 ? "" : ",").append(String.format(Locale.ROOT,
                    "{\"frequencyHz\": %.17g, \"amplitude\": %.17g}", f, a));
        }
        send("{\"points\": [" + points + "]}").andExpect(status().isOk())
                .andExpect(number("$.referenceAmplitude", 1, 1e-6))
                .andExpect(number("$.bandwidthHz", 1000, 1e-3))
                .andExpect(jsonPath("$.withinSweep").value(true));
    }

    @Test
    void aSweepThatNeverFallsHasNoBandwidth() throws Exception {
        send("""
                {"points": [{"frequencyHz": 10, "amplitude": 1.0}, {"frequencyHz": 100, "amplitude": 0.9},
                            {"frequencyHz": 1000, "amplitude": 1.2}]}
                """).andExpect(status().isOk())
                .andExpect(number("$.referenceAmplitude", 1.0, 0))
                .andExpect(jsonPath("$.bandwidthHz").value(nullValue()))
                .andExpect(jsonPath("$.withinSweep").value(false));
    }

    @Test
    void theDocumentedExampleIsWhatTheEndpointAnswers() throws Exception {
        String body = send(FrequencyResponseController.EXAMPLE_REQUEST).andExpect(status().isOk())
                .andReturn().getResponse().getContentAsString();
        assertSameNumbers(body, FrequencyResponseController.EXAMPLE_RESPONSE);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            empty points         | {"points": []}                                                                  | points
            null point           | {"points": [null]}                                                              | points[0]
            missing amplitude    | {"points": [{"frequencyHz": 10}, {"frequencyHz": 20, "amplitude": 1}]}          | points[0].amplitude
            zero amplitude       | {"points": [{"frequencyHz": 10, "amplitude": 0}, {"frequencyHz": 20, "amplitude": 1}]} | amplitude
            negative frequency   | {"points": [{"frequencyHz": -10, "amplitude": 1}, {"frequencyHz": 20, "amplitude": 1}]} | frequency
            NaN frequency        | {"points": [{"frequencyHz": "NaN", "amplitude": 1}, {"frequencyHz": 20, "amplitude": 1}]} | points[0].frequencyHz
            infinite reference   | {"points": [{"frequencyHz": 10, "amplitude": 1}, {"frequencyHz": 20, "amplitude": 1}], "referenceFrequencyHz": 1e999} | referenceFrequencyHz
            repeated frequency   | {"points": [{"frequencyHz": 10, "amplitude": 1}, {"frequencyHz": 10, "amplitude": 2}]} | twice
            """)
    void malformedInputIsABadRequest(String name, String body, String detailMentions) throws Exception {
        send(body).andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail", containsString(detailMentions)));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            single point         | {"points": [{"frequencyHz": 10, "amplitude": 1}]}                               | two frequencies
            reference outside    | {"points": [{"frequencyHz": 10, "amplitude": 1}, {"frequencyHz": 20, "amplitude": 1}], "referenceFrequencyHz": 5} | outside the sweep
            """)
    void unevaluableInputIsUnprocessable(String name, String body, String detailMentions) throws Exception {
        send(body).andExpect(status().isUnprocessableContent())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail", containsString(detailMentions)));
    }
}
