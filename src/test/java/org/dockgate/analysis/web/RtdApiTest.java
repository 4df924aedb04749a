package org.dockgate.analysis.web;

import static org.dockgate.analysis.web.StaticAnalysisApiTest.number;
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

/** {@code GET /api/v1/analysis/rtd/resistance} and {@code /temperature}. */
@SpringBootTest
@AutoConfigureMockMvc
class RtdApiTest {

    @Autowired MockMvc mvc;

    ResultActions get(String pathAndQuery) throws Exception {
        return mvc.perform(org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get(pathAndQuery)
                .with(httpBasic("operator", "operator-demo")));
    }

    @Test
    void pt100At100CelsiusClassA() throws Exception {
        // Reference sheet A8 (IEC 60751): R(100 °C) = 138.5055 Ω, dR/dt = 0.379280 Ω/°C, class A ±0.35 °C.
        get("/api/v1/analysis/rtd/resistance?temperatureC=100&r0=100&toleranceClass=A").andExpect(status().isOk())
                .andExpect(number("$.resistanceOhm", 138.5055, 5e-7))
                .andExpect(number("$.sensitivityOhmPerC", 0.379280, 5e-7))
                .andExpect(number("$.toleranceC", 0.35, 1e-12))
                .andExpect(jsonPath("$.classValid").value(true));
    }

    @Test
    void classAaAt300IsFlaggedInvalid() throws Exception {
        // Reference sheet A8: AA is valid only from -50 to 250 °C (wire-wound, IEC 60751).
        get("/api/v1/analysis/rtd/resistance?temperatureC=300&toleranceClass=AA").andExpect(status().isOk())
                .andExpect(number("$.toleranceC", 0.10 + 0.0017 * 300, 1e-12))
                .andExpect(jsonPath("$.classValid").value(false));
    }

    @Test
    void withoutAClassToleranceIsNull() throws Exception {
        // Pt1000 at -100 °C: 10 x the A8 Pt100 value 60.255840 Ω; R0 defaults to 100 when omitted.
        get("/api/v1/analysis/rtd/resistance?temperatureC=-100&r0=1000").andExpect(status().isOk())
                .andExpect(number("$.resistanceOhm", 602.55840, 5e-6))
                .andExpect(jsonPath("$.toleranceC").value(nullValue()))
                .andExpect(jsonPath("$.classValid").value(nullValue()));
        get("/api/v1/analysis/rtd/resistance?temperatureC=0").andExpect(status().isOk())
                .andExpect(number("$.resistanceOhm", 100, 1e-12));
    }

    @Test
    void temperatureFromResistance() throws Exception {
        // Reference sheet A8: 175.86 Ω -> 200.010878 °C; 138.5055 Ω -> 100.000000 °C.
        get("/api/v1/analysis/rtd/temperature?resistanceOhm=175.86&r0=100").andExpect(status().isOk())
                .andExpect(number("$.temperatureC", 200.010878, 5e-7));
        get("/api/v1/analysis/rtd/temperature?resistanceOhm=1385.055&r0=1000").andExpect(status().isOk())
                .andExpect(number("$.temperatureC", 100, 5e-7));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            NaN temperature      | /api/v1/analysis/rtd/resistance?temperatureC=NaN                      | temperatureC
            infinite temperature | /api/v1/analysis/rtd/resistance?temperatureC=Infinity                 | temperatureC
            text temperature     | /api/v1/analysis/rtd/resistance?temperatureC=hot                      | temperatureC
            missing temperature  | /api/v1/analysis/rtd/resistance?r0=100                                | temperatureC
            unknown class        | /api/v1/analysis/rtd/resistance?temperatureC=100&toleranceClass=D      | AA, A, B, C
            zero R0              | /api/v1/analysis/rtd/resistance?temperatureC=100&r0=0                 | R0
            NaN resistance       | /api/v1/analysis/rtd/temperature?resistanceOhm=NaN                     | resistanceOhm
            missing resistance   | /api/v1/analysis/rtd/temperature?r0=100                               | resistanceOhm
            negative R0          | /api/v1/analysis/rtd/temperature?resistanceOhm=100&r0=-100             | R0
            """)
    void malformedInputIsABadRequest(String name, String pathAndQuery, String detailMentions) throws Exception {
        get(pathAndQuery).andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail", containsString(detailMentions)));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            above 850 °C         | /api/v1/analysis/rtd/resistance?temperatureC=900                      | 850
            below -200 °C        | /api/v1/analysis/rtd/resistance?temperatureC=-250                     | 200
            resistance too low   | /api/v1/analysis/rtd/temperature?resistanceOhm=10                      | outside
            resistance too high  | /api/v1/analysis/rtd/temperature?resistanceOhm=500                     | outside
            """)
    void outOfRangeIsUnprocessable(String name, String pathAndQuery, String detailMentions) throws Exception {
        get(pathAndQuery).andExpect(status().isUnprocessableContent())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail", containsString(detailMentions)));
    }

    @Test
    void needsSigningIn() throws Exception {
        mvc.perform(org.springframework.test.web.servlet.request.MockMvcRequestBuilders
                        .get("/api/v1/analysis/rtd/temperature?resistanceOhm=100"))
                .andExpect(status().isUnauthorized());
    }
}
