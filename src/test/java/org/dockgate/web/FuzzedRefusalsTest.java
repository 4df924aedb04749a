package org.dockgate.web;

import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.not;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.request;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.view;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.platform.Role;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Qualifier;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.HttpMethod;
import org.springframework.http.MediaType;
import org.springframework.mock.web.MockHttpServletResponse;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.web.method.HandlerMethod;
import org.springframework.web.servlet.mvc.method.RequestMappingInfo;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;

/** The 500s found by fuzzing (issue 10, item 7): each is now a refusal that names the field. */
@SpringBootTest
@AutoConfigureMockMvc
class FuzzedRefusalsTest {

    @Autowired MockMvc mvc;
    @Autowired CatalogueService catalogue;
    @Autowired @Qualifier("requestMappingHandlerMapping") RequestMappingHandlerMapping mappings;

    private long anyRevision() {
        return catalogue.models(null, null, null).get(0).latest().id();
    }

    @Test
    void deriveWithANullOverrideIsA400NamingTheOverride() throws Exception {
        mvc.perform(post("/api/v1/procedures/derive").with(httpBasic("engineer", "engineer-demo"))
                        .contentType(MediaType.APPLICATION_JSON)
                        .content("{\"specificationRevisionId\":" + anyRevision() + ",\"overrides\":{\"static.cycles\":null}}"))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.field").value("overrides.static.cycles"))
                .andExpect(jsonPath("$.detail").value(containsString("'static.cycles'")))
                .andExpect(jsonPath("$.detail").value(not(containsString("java."))));
    }

    @Test
    void deriveWithAnUnknownOrMalformedOverrideNamesIt() throws Exception {
        for (String key : List.of("nonsense", "limit.NO_SUCH_METRIC.lower", "limit..")) {
            mvc.perform(post("/api/v1/procedures/derive").with(httpBasic("engineer", "engineer-demo"))
                            .contentType(MediaType.APPLICATION_JSON)
                            .content("{\"specificationRevisionId\":" + anyRevision() + ",\"overrides\":{\"" + key + "\":\"1\"}}"))
                    .andExpect(status().isBadRequest())
                    .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                    .andExpect(jsonPath("$.field").value("overrides." + key))
                    .andExpect(jsonPath("$.detail").value(containsString("'" + key + "'")));
        }
    }

    @Test
    void theCatalogueFormWithoutASensitivityUnitIsShownAgainWithTheMessageOnThatField() throws Exception {
        mvc.perform(post("/catalogue/new").with(user("engineer").roles("ENGINEER")).with(csrf())
                        .param("partNumber", "FZ-NO-UNIT").param("name", "No sensitivity unit")
                        .param("kind", "PRESSURE_TRANSDUCER").param("measurand", "pressure").param("outputKind", "VOLTAGE")
                        .param("inputUnit", "bar").param("rangeMin", "0").param("rangeMax", "6").param("outputUnit", "mV")
                        .param("sensitivityNominal", "10").param("sensitivityTolerance", "1")
                        .param("sensitivityToleranceMode", "PERCENT"))
                .andExpect(status().isOk())
                .andExpect(view().name("catalogue/form"))
                .andExpect(content().string(containsString("id=\"sensitivityUnit-error\"")))
                .andExpect(content().string(containsString("Enter the unit of the sensitivity")))
                // what was typed is kept
                .andExpect(content().string(containsString("value=\"FZ-NO-UNIT\"")));
        assertThat(catalogue.modelByPartNumber("FZ-NO-UNIT")).isEmpty();
    }

    @Test
    void theSigningApiAnswersProblemDocumentsEvenToABrowser() throws Exception {
        for (String accept : List.of("text/html", "*/*", "application/json")) {
            mvc.perform(post("/api/v1/lots/987654321/certificates").with(httpBasic("engineer", "engineer-demo"))
                            .header("Accept", accept).contentType(MediaType.APPLICATION_JSON).content("{\"password\":"))
                    .andExpect(status().isBadRequest())
                    .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON));
            mvc.perform(post("/api/v1/lots/987654321/certificates").with(httpBasic("engineer", "engineer-demo"))
                            .header("Accept", accept).contentType(MediaType.APPLICATION_JSON).content("{\"password\":\"x\"}"))
                    .andExpect(status().is4xxClientError())
                    .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON));
        }
    }

    /**
     * Every {@code /api/v1} mapping, called with an unknown id and a broken body as a browser and as a
     * client would: whatever it refuses, it refuses with a problem document, never an HTML page.
     */
    @Test
    void everyApiMappingRefusesWithAProblemDocument() throws Exception {
        String[] roles = Arrays.stream(Role.values()).map(Role::name).toArray(String[]::new);
        List<String> failures = new ArrayList<>();
        int calls = 0;
        for (Map.Entry<RequestMappingInfo, HandlerMethod> e : mappings.getHandlerMethods().entrySet()) {
            for (String pattern : e.getKey().getPatternValues()) {
                if (!pattern.startsWith("/api/v1/")) {
                    continue;
                }
                var methods = e.getKey().getMethodsCondition().getMethods();
                for (var method : methods.isEmpty() ? List.of(org.springframework.web.bind.annotation.RequestMethod.GET)
                        : methods) {
                    String path = pattern.replaceAll("\\{[^}]*(?i:id)[^}]*}", "987654321").replaceAll("\\{[^}]+}", "NO-SUCH-1");
                    boolean variable = pattern.contains("{");
                    for (String accept : List.of("text/html,application/xhtml+xml", "*/*")) {
                        calls++;
                        var call = request(HttpMethod.valueOf(method.name()), path).header("Accept", accept).with(user("engineer").roles(roles));
                        if (method.name().equals("POST") || method.name().equals("PUT")) {
                            call.contentType(MediaType.APPLICATION_JSON).content("{\"broken\":");
                        }
                        MockHttpServletResponse response = mvc.perform(call).andReturn().getResponse();
                        String type = response.getContentType();
                        boolean problem = type != null && MediaType.APPLICATION_PROBLEM_JSON
                                .isCompatibleWith(MediaType.parseMediaType(type));
                        boolean mustRefuse = variable || !method.name().equals("GET");
                        if (response.getStatus() >= 500 || (mustRefuse && response.getStatus() < 400)
                                || (response.getStatus() >= 400 && !problem)) {
                            failures.add(method + " " + pattern + " (Accept " + accept + "): " + response.getStatus() + " "
                                    + type);
                        }
                    }
                }
            }
        }
        assertThat(calls).isGreaterThan(50);
        assertThat(failures).isEmpty();
    }
}
