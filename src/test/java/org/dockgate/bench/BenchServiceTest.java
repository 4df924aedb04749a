package org.dockgate.bench;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.Supplier;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.series.Direction;
import org.dockgate.instruments.InstrumentNotSelectableException;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.instruments.InstrumentView;
import org.dockgate.instruments.NewCalibration;
import org.dockgate.instruments.NewInstrument;
import org.dockgate.instruments.UncertaintyBand;
import org.dockgate.instruments.UncertaintyMode;
import org.dockgate.procedures.ProcedureService;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.context.annotation.Import;
import org.springframework.dao.DataAccessException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.AuthorityUtils;
import org.springframework.security.core.context.SecurityContextHolder;

/** Recording, corrections, conditions and concurrency on the run's real database (H2 or a shared PostgreSQL). */
@SpringBootTest
@Import(BenchFixtures.Config.class)
class BenchServiceTest {

    @Autowired BenchService bench;
    @Autowired BenchFixtures.TestLots lots;
    @Autowired CatalogueService catalogue;
    @Autowired ProcedureService procedures;
    @Autowired InstrumentService instruments;
    @Autowired JdbcTemplate jdbc;

    BenchLot lot;
    BenchPlan plan;
    String instrument;

    @BeforeEach
    void openLot() {
        lot = lots.open(BenchFixtures.procedure(catalogue, procedures).id(), 6);
        plan = bench.planFor(lot);
        instrument = bench.selectableInstruments(plan).get(0).identifier();
    }

    static <T> T as(String user, Supplier<T> work) {
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(
                user, null, AuthorityUtils.createAuthorityList("ROLE_OPERATOR")));
        try {
            return work.get();
        } finally {
            SecurityContextHolder.clearContext();
        }
    }

    NewReading at(String serial, int slot, double value, String unit, String token) {
        ExpectedReading e = plan.expected(slot);
        return new NewReading(serial, e.test(), e.point(), e.direction().orElse(null),
                e.cycle().isPresent() ? e.cycle().getAsInt() : null, value, unit, instrument, token);
    }

    @Test
    void theStepsFollowTheProcedureUpThenDownPerCycle() {
        var sc = BenchFixtures.procedure(catalogue, procedures).content().staticCalibration();
        int n = sc.pointsInput().size();
        assertThat(plan.keyed().subList(0, n)).extracting(ExpectedReading::point).containsExactlyElementsOf(sc.pointsInput());
        assertThat(plan.keyed().get(0).direction()).contains(sc.directions().get(0));
        if (sc.directions().size() == 2) {
            // The DOWN run starts at the top point and comes back.
            assertThat(plan.keyed().get(n).direction()).contains(Direction.DOWN);
            assertThat(plan.keyed().get(n).point()).isEqualTo(sc.pointsInput().get(n - 1));
        }
        assertThat(plan.readingsPerUnit()).isEqualTo(sc.readingsPerUnit()
                + (plan.frequenciesHz().size()) + plan.noiseSamples());
    }

    @Test
    void aReadingIsConvertedToTheOutputUnitAndKeptAsEntered() {
        String serial = lot.sampledSerials().get(0);
        double entered = 1.5; // in the output unit's kilo- or milli- neighbour, converted exactly by UCUM
        String other = plan.outputUnit().equals("mV") ? "V" : plan.outputUnit();
        Reading r = as("operator", () -> bench.record(lot.id(), at(serial, 0, entered, other, null)));
        assertThat(r.enteredValue()).isEqualTo(1.5);
        assertThat(r.enteredUnit()).isEqualTo(other);
        assertThat(r.unit()).isEqualTo(plan.outputUnit());
        if (other.equals("V")) {
            assertThat(r.value()).isCloseTo(1500.0, within(1e-9)); // 1 V = 1000 mV, SI prefix
        }
        assertThat(r.recordedBy()).isEqualTo("operator");
        assertThat(r.instrument()).isEqualTo(instrument);
        assertThat(bench.currentReadings(lot.id(), serial)).extracting(Reading::id).containsExactly(r.id());
        assertThat(bench.instrumentsUsed(lot.id(), serial)).containsExactly(instrument);
        assertThat(bench.operators(lot.id())).containsExactly("operator");
    }

    @Test
    void aDoubleSubmitWithTheSameTokenStoresOneReading() {
        String serial = lot.sampledSerials().get(0);
        String token = UUID.randomUUID().toString();
        Reading first = as("operator", () -> bench.record(lot.id(), at(serial, 1, 10.0, null, token)));
        Reading second = as("operator", () -> bench.record(lot.id(), at(serial, 1, 10.0, null, token)));
        assertThat(second.id()).isEqualTo(first.id());
        assertThat(jdbc.queryForObject("select count(*) from bench_reading where lot_id = ?", Integer.class, lot.id()))
                .isEqualTo(1);
    }

    @Test
    void aSecondReadingAtAFilledPointIsRefused() {
        String serial = lot.sampledSerials().get(0);
        as("operator", () -> bench.record(lot.id(), at(serial, 2, 10.0, null, null)));
        assertThatThrownBy(() -> as("operator2", () -> bench.record(lot.id(), at(serial, 2, 11.0, null, null))))
                .isInstanceOf(IllegalStateException.class).hasMessageContaining("while you were entering");
    }

    @Test
    void aCorrectionKeepsTheOriginalAndAStaleOneIsRefused() {
        String serial = lot.sampledSerials().get(1);
        Reading original = as("operator", () -> bench.record(lot.id(), at(serial, 0, 12.34, null, null)));
        Reading fixed = as("operator2", () -> bench.correct(original.id(), 12.43, null, "Digits transposed"));

        assertThat(fixed.supersedes()).contains(original.id());
        assertThat(fixed.correctionReason()).contains("Digits transposed");
        assertThat(fixed.recordedBy()).isEqualTo("operator2");
        assertThat(bench.currentReadings(lot.id(), serial)).extracting(Reading::value).containsExactly(12.43);
        List<Reading> history = bench.history(lot.id(), serial);
        assertThat(history).hasSize(2);
        assertThat(history.get(0).id()).isEqualTo(original.id());
        assertThat(history.get(0).value()).isEqualTo(12.34);
        assertThat(history.get(0).supersededBy()).contains(fixed.id());
        assertThat(bench.operators(lot.id())).containsExactly("operator", "operator2");

        // Someone still looking at the original corrects it too: it changed while they were editing.
        assertThatThrownBy(() -> as("operator", () -> bench.correct(original.id(), 12.5, null, "Typo")))
                .isInstanceOf(ObjectOptimisticLockingFailureException.class);
        assertThatThrownBy(() -> as("operator", () -> bench.correct(fixed.id(), 12.5, null, " ")))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("reason");
    }

    @Test
    void anExpiredInstrumentIsRefusedClearly() {
        InstrumentView usable = instruments.find(instrument).orElseThrow();
        String id = "RI-TBEN-" + UUID.randomUUID().toString().substring(0, 8).toUpperCase();
        LocalDate today = instruments.today();
        instruments.create(new NewInstrument(id, "Expired bench reference", usable.quantity(), usable.rangeMin(),
                usable.rangeMax(), usable.unit(), new NewCalibration("CERT-" + id, today.minusDays(400),
                today.minusDays(10), 2, List.of(new UncertaintyBand(usable.rangeMax(), 0.1, UncertaintyMode.PERCENT_OF_READING)))));
        String serial = lot.sampledSerials().get(0);
        ExpectedReading e = plan.expected(0);
        NewReading withExpired = new NewReading(serial, e.test(), e.point(), e.direction().orElse(null),
                e.cycle().getAsInt(), 1.0, null, id, null);
        assertThatThrownBy(() -> as("operator", () -> bench.record(lot.id(), withExpired)))
                .isInstanceOf(InstrumentNotSelectableException.class)
                .hasMessageContaining(id).hasMessageContaining("out of calibration since " + today.minusDays(10));
        assertThat(bench.history(lot.id(), serial)).isEmpty();
        assertThat(bench.selectableInstruments(plan)).extracting(InstrumentView::identifier).doesNotContain(id);
    }

    @Test
    void onlySampledUnitsOfAnOpenLotAndPointsOfTheProcedureAreRecorded() {
        assertThatThrownBy(() -> as("operator", () -> bench.record(lot.id(), at("NOT-SAMPLED", 0, 1.0, null, null))))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("not one of the units sampled");
        String serial = lot.sampledSerials().get(0);
        ExpectedReading e = plan.expected(0);
        NewReading offPoint = new NewReading(serial, e.test(), e.point() + 0.37 * (plan.rangeMax() - plan.rangeMin()) / 7,
                e.direction().orElse(null), 1, 1.0, null, instrument, null);
        assertThatThrownBy(() -> as("operator", () -> bench.record(lot.id(), offPoint)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("is not a test point");
        assertThatThrownBy(() -> as("operator", () -> bench.record(lot.id(), at(serial, 0, 1.0, "bar", null))))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("cannot be converted");
        lots.close(lot);
        assertThatThrownBy(() -> as("operator", () -> bench.record(lot.id(), at(serial, 0, 1.0, null, null))))
                .isInstanceOf(IllegalStateException.class).hasMessageContaining("no longer awaiting measurement");
    }

    @Test
    void conditionsAreAppendedAndTheLatestApplies() {
        String serial = lot.sampledSerials().get(2);
        assertThat(bench.conditions(lot.id(), serial)).isEmpty();
        as("operator", () -> bench.recordConditions(lot.id(), serial, 22.5, 41.0));
        Conditions latest = as("operator", () -> bench.recordConditions(lot.id(), serial, 23.0, 40.0));
        assertThat(bench.conditions(lot.id(), serial)).contains(latest);
        assertThat(latest.ambientC()).isEqualTo(23.0);
        assertThat(jdbc.queryForObject("select count(*) from bench_conditions where lot_id = ?", Integer.class, lot.id()))
                .isEqualTo(2);
        assertThatThrownBy(() -> as("operator", () -> bench.recordConditions(lot.id(), serial, 22.0, 140.0)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("140 % lies outside 0 … 100 %");
    }

    @Test
    void theDatabaseRefusesToChangeOrRemoveReadingsAndConditions() {
        String serial = lot.sampledSerials().get(3);
        Reading r = as("operator", () -> bench.record(lot.id(), at(serial, 0, 5.0, null, null)));
        Conditions c = as("operator", () -> bench.recordConditions(lot.id(), serial, 21.0, 45.0));
        assertThatThrownBy(() -> jdbc.update("update bench_reading set reading_value = 6 where id = ?", r.id()))
                .isInstanceOf(DataAccessException.class).hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.update("delete from bench_reading where id = ?", r.id()))
                .isInstanceOf(DataAccessException.class).hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.update("update bench_conditions set ambient_c = 30 where id = ?", c.id()))
                .isInstanceOf(DataAccessException.class).hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.update("delete from bench_conditions where id = ?", c.id()))
                .isInstanceOf(DataAccessException.class).hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.execute("truncate table bench_reading")).isInstanceOf(DataAccessException.class);
        assertThatThrownBy(() -> jdbc.execute("truncate table bench_conditions")).isInstanceOf(DataAccessException.class);
        assertThat(bench.reading(r.id()).orElseThrow().value()).isEqualTo(5.0);
    }

    @Test
    void severalTechniciansRecordingDifferentUnitsAtOnceLoseNothing() throws Exception {
        int threads = 4;
        int perUnit = Math.min(plan.keyed().size(), 12);
        ExecutorService pool = Executors.newFixedThreadPool(threads);
        CountDownLatch start = new CountDownLatch(1);
        List<Future<Integer>> done = new ArrayList<>();
        for (int t = 0; t < threads; t++) {
            String serial = lot.sampledSerials().get(t);
            String user = "operator" + (t % 2 == 0 ? "" : "2");
            Callable<Integer> work = () -> {
                start.await();
                int saved = 0;
                for (int slot = 0; slot < perUnit; slot++) {
                    int s = slot;
                    as(user, () -> bench.record(lot.id(), at(serial, s, 1.0 + s, null, serial + "-" + s)));
                    saved++;
                }
                return saved;
            };
            done.add(pool.submit(work));
        }
        start.countDown();
        for (Future<Integer> f : done) {
            assertThat(f.get()).isEqualTo(perUnit);
        }
        pool.shutdown();
        for (int t = 0; t < threads; t++) {
            assertThat(bench.currentReadings(lot.id(), lot.sampledSerials().get(t))).hasSize(perUnit);
        }
        assertThat(bench.progress(lot.id()).values()).containsOnly(perUnit);
    }

    @Test
    void twoPeopleFillingTheSamePointAtOnceGetOneReadingAndOneClearRefusal() throws Exception {
        String serial = lot.sampledSerials().get(5);
        ExecutorService pool = Executors.newFixedThreadPool(2);
        CountDownLatch start = new CountDownLatch(1);
        List<Future<String>> outcomes = new ArrayList<>();
        for (String user : List.of("operator", "operator2")) {
            outcomes.add(pool.submit(() -> {
                start.await();
                try {
                    as(user, () -> bench.record(lot.id(), at(serial, 0, user.length(), null, null)));
                    return "saved";
                } catch (IllegalStateException e) {
                    return e.getMessage();
                }
            }));
        }
        start.countDown();
        List<String> results = new ArrayList<>();
        for (Future<String> f : outcomes) {
            results.add(f.get());
        }
        pool.shutdown();
        assertThat(results).filteredOn("saved"::equals).hasSize(1);
        assertThat(results).filteredOn(r -> !r.equals("saved")).singleElement().asString()
                .contains("while you were entering");
        assertThat(bench.history(lot.id(), serial)).hasSize(1);
    }
}
