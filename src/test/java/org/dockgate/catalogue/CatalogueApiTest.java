package org.dockgate.catalogue;

import static org.hamcrest.Matchers.allOf;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.hasItem;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;

/** The catalogue and procedure API as the README shows it: create a model, refuse a unit mismatch, derive. */
@SpringBootTest
@AutoConfigureMockMvc
class CatalogueApiTest {

    @Autowired MockMvc mvc;
    @Autowired CatalogueService catalogue;

    static String model(String part, String sensitivityUnit) {
        return """
            {"partNumber":"%s","name":"Pressure transducer 0 to 6 bar","measurand":"pressure","outputKind":"VOLTAGE",
             "excitation":"10 V DC","supplierCodes":["QSL"],
             "specification":{"kind":"PRESSURE_TRANSDUCER","inputUnit":"bar","rangeMin":0,"rangeMax":6,"outputUnit":"mV",
               "sensitivity":{"nominal":10,"unit":"%s","tolerance":1,"mode":"PERCENT"},"accuracyPctFso":0.5,"hysteresisPctFso":0.1}}
            """.formatted(part, sensitivityUnit);
    }

    @Test
    void createRefuseAndDerive() throws Exception {
        String part = "API-" + UUID.randomUUID().toString().substring(0, 6);
        mvc.perform(post("/api/v1/sensor-models").with(httpBasic("engineer", "engineer-demo"))
                        .contentType(MediaType.APPLICATION_JSON).content(model(part + "X", "mV/g")))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail").value(containsString("does not fit a pressure transducer")));
        mvc.perform(post("/api/v1/sensor-models").with(httpBasic("operator", "operator-demo"))
                        .contentType(MediaType.APPLICATION_JSON).content(model(part + "Y", "mV/bar")))
                .andExpect(status().isForbidden());
        mvc.perform(post("/api/v1/sensor-models").with(httpBasic("engineer", "engineer-demo"))
                        .contentType(MediaType.APPLICATION_JSON).content(model(part, "mV/bar")))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.partNumber").value(part))
                .andExpect(jsonPath("$.latest.revisionNo").value(1));
        long revision = catalogue.modelByPartNumber(part).orElseThrow().latest().id();
        mvc.perform(post("/api/v1/procedures/derive").with(httpBasic("engineer", "engineer-demo"))
                        .contentType(MediaType.APPLICATION_JSON)
                        .content("{\"specificationRevisionId\":" + revision
                                + ",\"aql\":\"1.0\",\"level\":\"II\",\"rule\":\"GUARD_BANDED\",\"overrides\":{\"static.cycles\":\"5\"}}"))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.staticCalibration.cycles").value(5))
                .andExpect(jsonPath("$.staticCalibration.directions[1]").value("DOWN"))
                .andExpect(jsonPath("$.staticCalibration.referenceInstrument").value("RI-PRS-01"));
        mvc.perform(get("/api/v1/sensor-models/999999").with(httpBasic("auditor", "auditor-demo")))
                .andExpect(status().isNotFound())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON));
    }

    @Test
    void anRtdSpecificationCarriesItsConstructionAndTheDerivationFlagsPointsOutsideTheClassRange() throws Exception {
        String part = "RTD-" + UUID.randomUUID().toString().substring(0, 6);
        String body = """
            {"partNumber":"%s","name":"Pt100 thin-film element, class A","measurand":"temperature","outputKind":"RESISTANCE",
             "excitation":"1 mA","supplierCodes":["TWI"],
             "specification":{"kind":"RTD","inputUnit":"°C","rangeMin":-50,"rangeMax":250,"outputUnit":"Ω",
               "rtd":{"r0Ohm":100,"toleranceClass":"A","construction":"THIN_FILM"}}}
            """.formatted(part);
        mvc.perform(post("/api/v1/sensor-models").with(httpBasic("engineer", "engineer-demo"))
                        .contentType(MediaType.APPLICATION_JSON).content(body))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.latest.specification.rtd.construction").value("THIN_FILM"));
        var model = catalogue.modelByPartNumber(part).orElseThrow();
        // IEC 60751:2008 Table 3 (from memory, not checked against the printed table): class A thin-film -30 … 300 °C.
        mvc.perform(post("/api/v1/procedures/derive").with(httpBasic("engineer", "engineer-demo"))
                        .contentType(MediaType.APPLICATION_JSON)
                        .content("{\"specificationRevisionId\":" + model.latest().id() + "}"))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.reasoning").value(hasItem(allOf(
                        containsString("Outside the validity range of class A for a thin-film element"),
                        containsString("IEC 60751:2008 Table 3): -50 ")))));
        mvc.perform(get("/catalogue/" + model.id()).with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk()).andExpect(content().string(containsString("class A, thin-film element")));
        // A datasheet stored before the construction was asked for reads as wire-wound.
        String old = body.replace(part, part + "W").replace(",\"construction\":\"THIN_FILM\"", "");
        mvc.perform(post("/api/v1/sensor-models").with(httpBasic("engineer", "engineer-demo"))
                        .contentType(MediaType.APPLICATION_JSON).content(old))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.latest.specification.rtd.construction").value("WIRE_WOUND"));
    }
}
