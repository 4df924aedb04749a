package org.dockgate.bench;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.nio.charset.StandardCharsets;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.procedures.ProcedureService;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.context.annotation.Import;
import org.springframework.core.io.ByteArrayResource;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.test.web.servlet.MockMvc;

/**
 * A unit with thousands of noise samples: its page shows a summary and one page of readings with a
 * "Correct" link each (the form opens on its own page), so its size no longer grows with the readings;
 * the work queue's counts come from the progress table and equal a count over the readings.
 */
@SpringBootTest
@AutoConfigureMockMvc
@Import(BenchFixtures.Config.class)
class BenchUnitPageTest {

    static final int NOISE = 5_000;

    @Autowired MockMvc mvc;
    @Autowired BenchService bench;
    @Autowired ReadingImport imports;
    @Autowired BenchFixtures.TestLots lots;
    @Autowired CatalogueService catalogue;
    @Autowired ProcedureService procedures;
    @Autowired JdbcTemplate jdbc;

    BenchLot lot;
    BenchPlan plan;
    String instrument;
    String serial;
    final DescriptiveStatistics noise = new DescriptiveStatistics();

    @BeforeEach
    void aUnitWithManyNoiseSamples() {
        lot = lots.open(BenchFixtures.procedure(catalogue, procedures).id(), 3);
        plan = bench.planFor(lot);
        assertThat(plan.noiseSamples()).as("the demo procedure's noise capture").isGreaterThanOrEqualTo(NOISE);
        instrument = bench.selectableInstruments(plan).get(0).identifier();
        serial = lot.sampledSerials().get(0);
        StringBuilder csv = new StringBuilder("serial,test,point,direction,cycle,value,unit\n");
        for (ExpectedReading e : plan.keyed()) {
            csv.append(serial).append(',').append(e.test()).append(',').append(e.point()).append(',')
                    .append(e.direction().map(Enum::name).orElse("")).append(',')
                    .append(e.cycle().isPresent() ? Integer.toString(e.cycle().getAsInt()) : "").append(',')
                    .append(e.test() == ReadingTest.SWEEP ? 1.0 + e.slot() * 1e-3 : 0.5 * e.slot()).append(',')
                    .append(plan.outputUnit()).append('\n');
        }
        for (int i = 0; i < NOISE; i++) {
            double v = 1e-3 * ((i * 7919) % 13 - 6);
            noise.addValue(v);
            csv.append(serial).append(",NOISE,").append(i).append(",,,").append(v).append(',')
                    .append(plan.outputUnit()).append('\n');
        }
        ImportOutcome outcome = BenchServiceTest.as("operator", () -> imports.importFile(lot.id(),
                new ByteArrayResource(csv.toString().getBytes(StandardCharsets.UTF_8)), instrument, false,
                ImportProgress.NONE));
        assertThat(outcome.valid()).as(String.join("; ", outcome.errors())).isTrue();
    }

    /** The count the work queue used to make over every reading of the lot. */
    Map<String, Integer> countedOverReadings() {
        Map<String, Integer> done = new HashMap<>();
        jdbc.query("select serial, count(distinct slot_no) from bench_reading where lot_id = ? group by serial",
                rs -> {
                    done.put(rs.getString(1), rs.getInt(2));
                }, lot.id());
        return done;
    }

    @Test
    void theUnitPageIsBoundedAndPaged() throws Exception {
        long readings = plan.keyed().size() + NOISE;
        String html = mvc.perform(get("/bench/lots/{id}/units/{s}", lot.id(), serial).with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk()).andReturn().getResponse().getContentAsString(StandardCharsets.UTF_8);
        // One page of 200 readings plus the keyed form: well under 400 KB (every reading with its own form was
        // about 1 KB a reading, 5 MB here).
        assertThat(html.length()).isLessThan(400_000);
        assertThat(html).contains("?page=2#history-section").contains("?page=" + ((readings + 199) / 200))
                .contains("Readings 1–200 of " + readings);
        assertThat(html).doesNotContain("corr-value-").contains("/correct\"");
        // The summary of the noise series, checked against Commons Math's descriptive statistics.
        SeriesSummary s = bench.summaries(lot.id(), serial).stream().filter(x -> x.test() == ReadingTest.NOISE)
                .findFirst().orElseThrow();
        assertThat(s.count()).isEqualTo(NOISE);
        assertThat(s.min()).isEqualTo(noise.getMin());
        assertThat(s.max()).isEqualTo(noise.getMax());
        assertThat(s.mean()).isCloseTo(noise.getMean(), org.assertj.core.data.Offset.offset(1e-12));
        assertThat(s.stddev().getAsDouble()).isCloseTo(noise.getStandardDeviation(),
                org.assertj.core.data.Offset.offset(1e-12));
        assertThat(html).contains("id=\"summary-NOISE\"");

        // Page 2 shows readings 201–400.
        List<Reading> all = bench.history(lot.id(), serial);
        String second = mvc.perform(get("/bench/lots/{id}/units/{s}", lot.id(), serial).param("page", "2")
                        .with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk()).andReturn().getResponse().getContentAsString(StandardCharsets.UTF_8);
        assertThat(second).contains("id=\"reading-" + all.get(200).id() + "\"")
                .contains("id=\"reading-" + all.get(399).id() + "\"")
                .doesNotContain("id=\"reading-" + all.get(199).id() + "\"")
                .contains("Readings 201–400 of " + readings);

        // The correction form of one reading, on its own page, posting to the corrections endpoint.
        Reading target = all.get(250);
        String form = mvc.perform(get("/bench/lots/{id}/units/{s}/readings/{r}/correct", lot.id(), serial, target.id())
                        .with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk()).andReturn().getResponse().getContentAsString(StandardCharsets.UTF_8);
        assertThat(form).contains("id=\"correction-form\"").contains("/corrections\"")
                .contains("name=\"readingId\" value=\"" + target.id() + "\"");
        // A reading of another unit is not found under this one.
        mvc.perform(get("/bench/lots/{id}/units/{s}/readings/{r}/correct", lot.id(), lot.sampledSerials().get(1),
                target.id()).with(user("operator").roles("OPERATOR"))).andExpect(status().isNotFound());
    }

    @Test
    void theQueueCountsEqualACountOverTheReadings() throws Exception {
        assertThat(bench.progress(lot.id())).isEqualTo(countedOverReadings())
                .containsEntry(serial, plan.keyed().size() + NOISE);
        // Typed readings of another unit, a repeated token and a correction (which adds no point).
        String other = lot.sampledSerials().get(1);
        Reading first = BenchServiceTest.as("operator", () -> bench.record(lot.id(), reading(other, 0, "q-" + lot.id())));
        BenchServiceTest.as("operator", () -> bench.record(lot.id(), reading(other, 0, "q-" + lot.id())));
        BenchServiceTest.as("operator", () -> bench.recordMany(lot.id(), List.of(reading(other, 1, null),
                reading(other, 2, null))));
        BenchServiceTest.as("operator", () -> bench.correct(first.id(), 0.7, null, "Misread the display"));
        assertThat(bench.progress(lot.id())).isEqualTo(countedOverReadings()).containsEntry(other, 3);
        // A refused batch changes nothing.
        try {
            BenchServiceTest.as("operator", () -> bench.recordMany(lot.id(), List.of(reading(other, 3, null),
                    reading(other, 1, null))));
        } catch (RuntimeException expected) {
            // the second point already has a reading
        }
        assertThat(bench.progress(lot.id())).isEqualTo(countedOverReadings()).containsEntry(other, 3);
        String queue = mvc.perform(get("/bench").with(user("operator").roles("OPERATOR")))
                .andExpect(status().isOk()).andReturn().getResponse().getContentAsString(StandardCharsets.UTF_8);
        assertThat(queue).contains(String.format(java.util.Locale.ENGLISH, "%,d/%,d readings",
                        plan.keyed().size() + NOISE, plan.readingsPerUnit()))
                .contains(String.format(java.util.Locale.ENGLISH, "3/%,d readings", plan.readingsPerUnit()));
    }

    NewReading reading(String unit, int slot, String token) {
        ExpectedReading e = plan.expected(slot);
        return new NewReading(unit, e.test(), e.point(), e.direction().orElse(null),
                e.cycle().isPresent() ? e.cycle().getAsInt() : null, 0.5 + slot, null, instrument, token);
    }
}
