package org.dockgate.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.util.ArrayList;
import java.util.List;
import javax.sql.DataSource;
import org.dockgate.DatabaseAdmin;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.Reading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.core.evaluation.MetricResult;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.test.web.servlet.MockMvc;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code GET /api/v1/lots/{id}/evaluation} answers with its own records (issue 11, item 7): compact by default,
 * budget lines behind {@code ?detail=budgets}, no "Infinity" or "NaN" strings, the figures exactly those of the
 * evaluation, and after disposition the frozen record. On the demo data: the accepted QP-250 lot of 40 with
 * 13 sampled units (ISO 2859-1:1999 Table 1, lot 26–50, level II → D; Table 2-A at AQL 1.0 follows the arrow
 * to E, n 13) and the half-measured accelerometer lot.
 */
@SpringBootTest
@AutoConfigureMockMvc
class EvaluationApiTest {

    @Autowired MockMvc mvc;
    @Autowired EvaluationService evaluation;
    @Autowired ReceivingService receiving;
    @Autowired BenchService bench;
    @Autowired DataSource dataSource;
    @Autowired JsonMapper json;

    LotView thirteenUnitLot() {
        return receiving.lots(LotState.DISPOSITIONED_ACCEPTED).stream().filter(l -> l.sampledSerials().size() == 13)
                .findFirst().orElseThrow();
    }

    String answer(long lotId, String detail) throws Exception {
        var request = get("/api/v1/lots/{id}/evaluation", lotId).with(user("auditor").roles("AUDITOR"));
        if (detail != null) {
            request = request.param("detail", detail);
        }
        var response = mvc.perform(request).andExpect(status().isOk()).andReturn().getResponse();
        response.setCharacterEncoding("UTF-8");
        return response.getContentAsString();
    }

    @Test
    void aThirteenUnitLotAnswersCompactlyWithoutInfinityAndWithBudgetLinesOnlyOnRequest() throws Exception {
        LotView lot = thirteenUnitLot();
        String compact = answer(lot.id(), null);
        String budgets = answer(lot.id(), "budgets");
        int compactBytes = compact.getBytes(java.nio.charset.StandardCharsets.UTF_8).length;
        int budgetBytes = budgets.getBytes(java.nio.charset.StandardCharsets.UTF_8).length;
        System.out.printf("GET /api/v1/lots/%d/evaluation (13 units): %d bytes; with detail=budgets: %d bytes%n", lot.id(),
                compactBytes, budgetBytes);
        assertThat(compactBytes).isLessThan(50_000);
        assertThat(budgetBytes).isGreaterThan(compactBytes);
        for (String body : List.of(compact, budgets)) {
            assertThat(body).doesNotContain("Infinity").doesNotContain("NaN");
        }

        JsonNode c = json.readTree(compact);
        assertThat(c.get("lotId").asLong()).isEqualTo(lot.id());
        assertThat(c.get("lot").get("id").asLong()).isEqualTo(lot.id());
        assertThat(c.get("lot").get("version").isNumber()).isTrue();
        assertThat(c.get("frozen").asBoolean()).isTrue();
        assertThat(c.get("detail").asString()).isEqualTo("summary");
        assertThat(c.get("complete").asBoolean()).isTrue();
        assertThat(c.get("nonconforming").asInt()).isZero();
        assertThat(c.get("wouldAccept").asBoolean()).isTrue();
        assertThat(c.get("procedure").get("id").asLong()).isEqualTo(lot.procedureRevisionId());
        assertThat(c.get("units")).hasSize(13);
        assertThat(compact).doesNotContain("\"budget\"").doesNotContain("\"lines\"").doesNotContain("\"points\"")
                .doesNotContain("\"note\"").doesNotContain("\"staticPoints\"");

        // Every figure is the one of the frozen evaluation, exactly; ν_eff = ∞ is null.
        LotEvaluationView ev = evaluation.lotEvaluation(lot.id());
        int infinite = 0;
        for (int i = 0; i < 13; i++) {
            UnitEvaluationView unit = ev.units().get(i);
            JsonNode u = c.get("units").get(i);
            assertThat(u.get("serial").asString()).isEqualTo(unit.serial());
            assertThat(u.get("verdict").asString()).isEqualTo(unit.result().unitVerdict().orElseThrow().name());
            assertThat(u.get("frozen").asBoolean()).isTrue();
            assertThat(u.get("calibrations").get(0).get("certificateNumber").asString())
                    .isEqualTo(unit.calibrations().get(0).certificateNumber());
            assertThat(u.get("metrics")).hasSize(unit.result().metrics().size());
            for (int j = 0; j < unit.result().metrics().size(); j++) {
                MetricResult m = unit.result().metrics().get(j);
                JsonNode a = u.get("metrics").get(j);
                assertThat(a.get("metric").asString()).isEqualTo(m.metric().name());
                assertThat(a.get("value").asDouble()).isEqualTo(m.measured());
                assertThat(a.get("unit").asString()).isEqualTo(m.unit());
                assertThat(a.get("expandedUncertainty").asDouble()).isEqualTo(m.uncertainty().value());
                assertThat(a.get("coverageFactor").asDouble()).isEqualTo(m.uncertainty().coverageFactor());
                assertThat(a.get("verdict").asString()).isEqualTo(m.verdict().name());
                assertThat(a.get("probabilityOfConformance").asDouble()).isEqualTo(m.probabilityOfConformance());
                assertThat(a.has("toleranceLower") && a.has("toleranceUpper") && a.has("acceptanceLower")
                        && a.has("acceptanceUpper")).isTrue();
                if (m.tolerance().upper().isPresent()) {
                    assertThat(a.get("toleranceUpper").asDouble()).isEqualTo(m.tolerance().upper().getAsDouble());
                } else {
                    assertThat(a.get("toleranceUpper").isNull()).isTrue();
                }
                if (m.acceptanceLower().isPresent()) {
                    assertThat(a.get("acceptanceLower").asDouble()).isEqualTo(m.acceptanceLower().getAsDouble());
                } else {
                    assertThat(a.get("acceptanceLower").isNull()).isTrue();
                }
                if (m.budget().hasInfiniteDegreesOfFreedom()) {
                    assertThat(a.get("effectiveDegreesOfFreedom").isNull()).isTrue();
                    infinite++;
                } else {
                    assertThat(a.get("effectiveDegreesOfFreedom").asDouble()).isEqualTo(m.budget().effectiveDegreesOfFreedom());
                }
            }
        }

        // detail=budgets: the lines of every metric, with ν_i = ∞ as null, and the per-point checks.
        JsonNode b = json.readTree(budgets);
        assertThat(b.get("detail").asString()).isEqualTo("budgets");
        MetricResult first = ev.units().get(0).result().metrics().get(0);
        JsonNode lines = b.get("units").get(0).get("metrics").get(0).get("budget").get("lines");
        assertThat(lines).hasSize(first.budget().contributions().size());
        for (int k = 0; k < lines.size(); k++) {
            var line = first.budget().contributions().get(k);
            assertThat(lines.get(k).get("name").asString()).isEqualTo(line.name());
            assertThat(lines.get(k).get("basis").asString()).isEqualTo(line.basis().name());
            assertThat(lines.get(k).get("standardUncertainty").asDouble()).isEqualTo(line.standardUncertainty());
            assertThat(lines.get(k).get("contribution").asDouble()).isEqualTo(line.contribution());
            if (Double.isInfinite(line.degreesOfFreedom())) {
                assertThat(lines.get(k).get("degreesOfFreedom").isNull()).isTrue();
            } else {
                assertThat(lines.get(k).get("degreesOfFreedom").asDouble()).isEqualTo(line.degreesOfFreedom());
            }
        }
        // Every line with ν_i = ∞ (Type B: the cases that printed "Infinity" before) is null, in every unit.
        int infiniteLines = 0;
        for (int i = 0; i < 13; i++) {
            List<MetricResult> metrics = ev.units().get(i).result().metrics();
            for (int j = 0; j < metrics.size(); j++) {
                JsonNode budget = b.get("units").get(i).get("metrics").get(j).get("budget");
                var contributions = metrics.get(j).budget().contributions();
                for (int k = 0; k < contributions.size(); k++) {
                    if (Double.isInfinite(contributions.get(k).degreesOfFreedom())) {
                        assertThat(budget.get("lines").get(k).get("degreesOfFreedom").isNull()).isTrue();
                        infiniteLines++;
                    }
                }
                assertThat(budget.get("effectiveDegreesOfFreedom").isNull())
                        .isEqualTo(metrics.get(j).budget().hasInfiniteDegreesOfFreedom());
            }
        }
        assertThat(infiniteLines + infinite).isPositive();
        boolean pointByPoint = false;
        for (JsonNode m : b.get("units").get(0).get("metrics")) {
            assertThat(m.get("budget").get("lines").size()).isPositive();
            assertThat(m.get("note").asString()).isNotBlank();
            if (m.has("points")) {
                pointByPoint = true;
                assertThat(m.get("points").get(0).get("budget").get("lines").size()).isPositive();
            }
        }
        assertThat(pointByPoint).as("ACCURACY is judged point by point").isTrue();
        assertThat(b.get("units").get(0).get("staticPoints").size()).isPositive();
    }

    @Test
    void afterDispositionTheAnswerIsTheFrozenRecordEvenWhenAStoredReadingChangesBehindTheApplication() throws Exception {
        LotView lot = thirteenUnitLot();
        String before = answer(lot.id(), "budgets");
        String serial = lot.sampledSerials().get(4);
        Reading top = bench.currentReadings(lot.id(), serial).stream().filter(r -> r.test() == ReadingTest.STATIC)
                .max((x, y) -> Double.compare(x.point(), y.point())).orElseThrow();
        DatabaseAdmin dba = new DatabaseAdmin(dataSource);
        dba.bypassing("bench_reading", "bench_reading_append_only", () -> dba.jdbc()
                .update("update bench_reading set reading_value = reading_value + 0.5 where id = ?", top.id()));
        try {
            assertThat(evaluation.recheck(lot.id()).identical()).as("the change is real").isFalse();
            assertThat(answer(lot.id(), "budgets")).isEqualTo(before);
        } finally {
            dba.bypassing("bench_reading", "bench_reading_append_only", () -> dba.jdbc()
                    .update("update bench_reading set reading_value = ? where id = ?", top.value(), top.id()));
        }
    }

    @Test
    void aLotAwaitingMeasurementIsComputedAndSaysWhatIsMissing() throws Exception {
        LotView lot = receiving.lots(LotState.AWAITING_MEASUREMENT).stream().filter(l -> l.partNumber().equals("PX-4410"))
                .findFirst().orElseThrow();
        String body = answer(lot.id(), null);
        assertThat(body).doesNotContain("Infinity").doesNotContain("NaN");
        JsonNode a = json.readTree(body);
        assertThat(a.get("frozen").asBoolean()).isFalse();
        assertThat(a.get("complete").asBoolean()).isFalse();
        assertThat(a.get("wouldAccept").isNull()).isTrue();
        assertThat(a.get("nonconformance").isNull()).isTrue();
        List<String> unmeasured = new ArrayList<>();
        for (JsonNode u : a.get("units")) {
            assertThat(u.get("frozen").asBoolean()).isFalse();
            if (u.get("readings").asInt() == 0) {
                unmeasured.add(u.get("serial").asString());
                assertThat(u.get("verdict").isNull()).isTrue();
                assertThat(u.get("missing").size()).isPositive();
            }
        }
        assertThat(unmeasured).isNotEmpty();
        assertThat(a.get("units").get(0).get("metrics").size()).isPositive();
    }

    @Test
    void anUnknownDetailIsAProblemNamingTheFieldAndTheAnswerNeedsSignIn() throws Exception {
        LotView lot = thirteenUnitLot();
        mvc.perform(get("/api/v1/lots/{id}/evaluation", lot.id()).param("detail", "everything")
                        .with(httpBasic("auditor", "auditor-demo")))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.detail").value(org.hamcrest.Matchers.containsString("'detail'")));
        mvc.perform(get("/api/v1/lots/{id}/evaluation", lot.id())).andExpect(status().isUnauthorized());
        mvc.perform(get("/api/v1/lots/{id}/evaluation", lot.id()).param("detail", "budgets")
                        .with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.units[0].metrics[0].budget.lines[0].name").exists());
    }
}
