package org.dockgate.receiving;

import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.SupplierStatus;
import org.dockgate.core.sampling.Aql;
import org.dockgate.receiving.ReceivingTestSupport.Pair;
import org.dockgate.receiving.ReceivingTestSupport.TestProcedures;
import org.junit.jupiter.api.Test;
import java.util.UUID;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.context.annotation.Import;
import org.springframework.http.MediaType;
import org.springframework.security.test.context.support.WithMockUser;
import org.springframework.test.web.servlet.MockMvc;

/** Roles on the receiving pages and API, and refusals as problem documents. */
// Its own in-memory database on every run: these tests fix lots to stand-in procedure revisions (see
// ReceivingTestSupport), which must not appear in a database other test contexts share (the PostgreSQL run).
@SpringBootTest(properties = {"spring.datasource.url=jdbc:h2:mem:receiving-${random.uuid};DB_CLOSE_DELAY=-1",
    "spring.datasource.username=sa", "spring.datasource.password=",
    "dockgate.data-dir=target/test-data/receiving-${random.uuid}"})
@AutoConfigureMockMvc
@Import(ReceivingTestSupport.Config.class)
@WithMockUser(username = "engineer", roles = "ENGINEER")
class ReceivingWebTest {

    @Autowired MockMvc mvc;
    @Autowired CatalogueService catalogue;
    @Autowired TestProcedures procedures;
    @Autowired ReceivingService receiving;

    private String body(Pair pair, int quantity, String serials) {
        return "{\"purchaseOrder\":\"PO-W\",\"deliveryNote\":\"DN-W\",\"receivedOn\":\"2026-01-05\",\"supplierId\":"
                + pair.supplier().id() + ",\"lots\":[{\"modelId\":" + pair.model().id() + ",\"quantity\":" + quantity
                + ",\"serials\":" + serials + "}]}";
    }

    @Test
    void everyReceivingRoleReadsAndOnlyOperatorsAndEngineersReceive() throws Exception {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        for (String role : new String[] {"OPERATOR", "ENGINEER", "SUPERVISOR", "AUDITOR"}) {
            mvc.perform(get("/receiving").with(user(role.toLowerCase()).roles(role))).andExpect(status().isOk());
            mvc.perform(get("/api/v1/lots").with(user(role.toLowerCase()).roles(role))).andExpect(status().isOk());
        }
        mvc.perform(post("/api/v1/receipts").with(user("auditor").roles("AUDITOR")).with(csrf())
                .contentType(MediaType.APPLICATION_JSON).content(body(pair, 2, "[\"W1\",\"W2\"]")))
                .andExpect(status().isForbidden());
        String created = mvc.perform(post("/api/v1/receipts").with(user("operator").roles("OPERATOR")).with(csrf())
                .contentType(MediaType.APPLICATION_JSON).content(body(pair, 2, "[\"W1\",\"W2\"]")))
                .andExpect(status().isCreated()).andExpect(jsonPath("$.lots[0].state").value("AWAITING_MEASUREMENT"))
                .andReturn().getResponse().getContentAsString();
        long lotId = Long.parseLong(created.replaceAll("(?s).*\"lots\":\\[\\{\"id\":(\\d+).*", "$1"));
        mvc.perform(get("/receiving/lots/" + lotId).with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk()).andExpect(content().string(containsString("sample re-drawn from seed: identical")));
        mvc.perform(get("/api/v1/lots/" + lotId).with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk()).andExpect(jsonPath("$.sampledSerials").isArray());
        mvc.perform(post("/receiving/switching/1/lift").with(user("operator").roles("OPERATOR")).with(csrf())
                .param("reason", "x").param("version", "0")).andExpect(status().isForbidden());
        mvc.perform(get("/receiving/new").with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk()).andExpect(content().string(containsString("autofocus")));
    }

    @Test
    void aReceiptTokenReusedWithAnotherPurchaseOrderOrByAnotherUserIsAConflictNamingTheToken() throws Exception {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        String token = "receipt-" + UUID.randomUUID();
        String first = body(pair, 2, "[\"R1\",\"R2\"]").replaceFirst("\\}$", ",\"clientToken\":\"" + token + "\"}");
        String created = mvc.perform(post("/api/v1/receipts").with(user("operator").roles("OPERATOR")).with(csrf())
                        .contentType(MediaType.APPLICATION_JSON).content(first))
                .andExpect(status().isCreated()).andReturn().getResponse().getContentAsString();
        String receiptId = created.replaceAll("(?s)^\\{\"id\":(\\d+).*", "$1");
        // The same submit again: the receipt already saved.
        mvc.perform(post("/api/v1/receipts").with(user("operator").roles("OPERATOR")).with(csrf())
                        .contentType(MediaType.APPLICATION_JSON).content(first))
                .andExpect(status().isCreated()).andExpect(jsonPath("$.id").value(Long.parseLong(receiptId)));
        for (String other : new String[] {first.replace("PO-W", "PO-OTHER"), first.replace("\"R2\"", "\"R3\"")}) {
            mvc.perform(post("/api/v1/receipts").with(user("operator").roles("OPERATOR")).with(csrf())
                            .contentType(MediaType.APPLICATION_JSON).content(other))
                    .andExpect(status().isConflict())
                    .andExpect(content().contentTypeCompatibleWith("application/problem+json"))
                    .andExpect(jsonPath("$.detail").value(containsString("'" + token + "'")));
        }
        mvc.perform(post("/api/v1/receipts").with(user("another-operator").roles("OPERATOR")).with(csrf())
                        .contentType(MediaType.APPLICATION_JSON).content(first))
                .andExpect(status().isConflict())
                .andExpect(jsonPath("$.detail").value(containsString("'" + token + "'")));
    }

    @Test
    void badInputIsABadRequestProblemDocument() throws Exception {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        mvc.perform(post("/api/v1/receipts").with(csrf()).contentType(MediaType.APPLICATION_JSON)
                .content(body(pair, 3, "[\"V1\",\"V2\"]")))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.detail").value("2 serials for a quantity of 3."));
        mvc.perform(post("/api/v1/receipts").with(csrf()).contentType(MediaType.APPLICATION_JSON)
                .content(body(pair, 2, "[\"V1\",\"V1\"]")))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.detail").value(containsString("V1 (lines 1, 2)")));
        mvc.perform(post("/api/v1/receipts").with(csrf()).contentType(MediaType.APPLICATION_JSON).content("{\"lots\":"))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON));
    }

    @Test
    void onlyASupervisorApprovesReducedInspectionAndThePageShowsWhatIsMissing() throws Exception {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        mvc.perform(post("/api/v1/receipts").with(user("operator").roles("OPERATOR")).with(csrf())
                .contentType(MediaType.APPLICATION_JSON).content(body(pair, 2, "[\"V1\",\"V2\"]")))
                .andExpect(status().isCreated());
        long id = receiving.switching(pair.supplier().id(), pair.model().id()).orElseThrow().id();
        for (String role : new String[] {"OPERATOR", "ENGINEER", "AUDITOR", "ADMIN"}) {
            mvc.perform(post("/receiving/switching/" + id + "/reduced/approve").with(user(role.toLowerCase()).roles(role))
                    .with(csrf()).param("reason", "x").param("productionSteady", "true").param("version", "0"))
                    .andExpect(status().isForbidden());
            mvc.perform(post("/receiving/switching/" + id + "/reduced/withdraw").with(user(role.toLowerCase()).roles(role))
                    .with(csrf()).param("reason", "x").param("version", "0")).andExpect(status().isForbidden());
        }
        assertThat(receiving.reducedDecisions(pair.supplier().id(), pair.model().id())).isEmpty();
        mvc.perform(get("/receiving/switching").with(user("supervisor").roles("SUPERVISOR")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("switching score 0 of 30 (ISO 2859-1:1999 clause 9.3.3 a)")))
                .andExpect(content().string(containsString("/receiving/switching/" + id + "/reduced/approve")));
        long version = receiving.switchingById(id).orElseThrow().version();
        mvc.perform(post("/receiving/switching/" + id + "/reduced/approve").with(user("supervisor").roles("SUPERVISOR"))
                .with(csrf()).param("reason", "Supplier audit passed").param("productionSteady", "true")
                .param("version", String.valueOf(version))).andExpect(status().is3xxRedirection());
        assertThat(receiving.reducedDecisions(pair.supplier().id(), pair.model().id())).singleElement()
                .satisfies(d -> assertThat(d.decidedBy()).isEqualTo("supervisor"));
        mvc.perform(get("/receiving/switching").with(user("auditor").roles("AUDITOR")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("Approved by supervisor")))
                .andExpect(content().string(org.hamcrest.Matchers.not(containsString("/reduced/withdraw"))));
    }
}
