package org.dockgate.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.test.web.servlet.MockMvc;

/**
 * The cost of looking at a lot's evaluation, as ratios against a raw JDBC read of the same lot's current
 * readings measured in the same run (issue 11, item 8). Measured on the demo data: a dispositioned
 * pressure lot of 13 sampled units and the half-measured accelerometer lot (awaiting measurement, so
 * computed from its readings).
 *
 * <ul>
 * <li>R: raw JDBC, every current reading of the lot (id, serial, test, point, value, instrument, recorded_at)
 * into a list — the floor any evaluation has to pay;</li>
 * <li>E: {@code lotEvaluation} of the lot awaiting measurement (computed from its readings);</li>
 * <li>F: {@code lotEvaluation} of the dispositioned lot (served from its frozen results);</li>
 * <li>C: {@code recheck} of the dispositioned lot (every unit recomputed from its readings and compared);</li>
 * <li>A: {@code GET /api/v1/lots/{id}/evaluation} of the dispositioned lot through MockMvc (serialised).</li>
 * </ul>
 * Interleaved rounds (R E F C A, then A C F E R, …) so a drift of the machine hits all alike; the medians of
 * the rounds of current-thread CPU time per operation are compared. Asserts only that the work happened.
 * Not named {@code *Test}: run it alone,
 *
 * <pre>mvn -o test -Dtest=EvaluationCostBenchmark -Dsurefire.failIfNoSpecifiedTests=false</pre>
 *
 * Sizes: {@code -Dbenchmark.ops=20} operations per mode per round, {@code -Dbenchmark.rounds=4}.
 */
@SpringBootTest
@AutoConfigureMockMvc
class EvaluationCostBenchmark {

    static final int OPS = Integer.getInteger("benchmark.ops", 20);
    static final int ROUNDS = Integer.getInteger("benchmark.rounds", 4);

    @Autowired EvaluationService evaluation;
    @Autowired ReceivingService receiving;
    @Autowired JdbcTemplate jdbc;
    @Autowired MockMvc mvc;

    private final ThreadMXBean threads = ManagementFactory.getThreadMXBean();

    record Mode(String key, String name, Callable<Object> work) {
    }

    @Test
    void lotEvaluationAgainstARawReadOfItsReadings() throws Exception {
        LotView dispositioned = receiving.lots(LotState.DISPOSITIONED_ACCEPTED).stream()
                .filter(l -> l.sampledSerials().size() == 13).findFirst().orElseThrow();
        LotView awaiting = receiving.lots(LotState.AWAITING_MEASUREMENT).stream()
                .filter(l -> l.partNumber().equals("PX-4410")).findFirst().orElseThrow();
        int readingsDispositioned = raw(dispositioned.id()).size();
        int readingsAwaiting = raw(awaiting.id()).size();
        assertThat(readingsDispositioned).isPositive();
        assertThat(readingsAwaiting).isPositive();
        assertThat(evaluation.lotEvaluation(dispositioned.id()).units()).allMatch(UnitEvaluationView::frozen);
        assertThat(evaluation.recheck(dispositioned.id()).identical()).isTrue();

        List<Mode> modes = List.of(
                new Mode("R", "raw JDBC read of the dispositioned lot's readings", () -> raw(dispositioned.id())),
                new Mode("R2", "raw JDBC read of the awaiting lot's readings", () -> raw(awaiting.id())),
                new Mode("E", "lotEvaluation, lot awaiting measurement (computed)", () -> evaluation.lotEvaluation(awaiting.id())),
                new Mode("F", "lotEvaluation, dispositioned lot (frozen)", () -> evaluation.lotEvaluation(dispositioned.id())),
                new Mode("C", "recheck, dispositioned lot (all units recomputed)", () -> evaluation.recheck(dispositioned.id())),
                new Mode("A", "GET /api/v1/lots/{id}/evaluation, dispositioned lot", () -> api(dispositioned.id())));
        for (Mode m : modes) { // warm-up: JIT and caches, not measured
            run(m, OPS);
        }
        Map<String, List<Double>> cpu = new LinkedHashMap<>();
        Map<String, List<Double>> wall = new LinkedHashMap<>();
        for (int round = 0; round < ROUNDS; round++) {
            List<Mode> order = new ArrayList<>(modes);
            if (round % 2 == 1) {
                java.util.Collections.reverse(order);
            }
            for (Mode m : order) {
                double[] f = run(m, OPS);
                wall.computeIfAbsent(m.key(), k -> new ArrayList<>()).add(f[0]);
                cpu.computeIfAbsent(m.key(), k -> new ArrayList<>()).add(f[1]);
            }
        }
        StringBuilder out = new StringBuilder();
        out.append(String.format(Locale.ROOT, "%nEvaluation cost benchmark: %d operations per mode per round, %d rounds;"
                        + " dispositioned lot %d (%d units, %d readings), awaiting lot %d (%d readings)%n%n", OPS, ROUNDS,
                dispositioned.id(), dispositioned.sampledSerials().size(), readingsDispositioned, awaiting.id(),
                readingsAwaiting));
        out.append("| mode | median CPU µs per operation (rounds) | median wall µs (rounds) |\n|---|---|---|\n");
        for (Mode m : modes) {
            out.append(String.format(Locale.ROOT, "| %s: %s | %.0f (%s) | %.0f (%s) |%n", m.key(), m.name(),
                    median(cpu.get(m.key())), list(cpu.get(m.key())), median(wall.get(m.key())), list(wall.get(m.key()))));
        }
        double r = median(cpu.get("R"));
        double r2 = median(cpu.get("R2"));
        out.append(String.format(Locale.ROOT, "%nCPU ratios: E/R2 %.1f, F/R %.1f, C/R %.1f, A/R %.1f%n",
                median(cpu.get("E")) / r2, median(cpu.get("F")) / r, median(cpu.get("C")) / r, median(cpu.get("A")) / r));
        System.out.println(out);
        Path file = Path.of("target", "benchmarks", "evaluation-cost.md");
        Files.createDirectories(file.getParent());
        Files.writeString(file, out.toString());
    }

    private List<Object[]> raw(long lotId) {
        return jdbc.query("select id, serial, test, point, reading_value, instrument, recorded_at from bench_reading r"
                        + " where lot_id = ? and not exists (select 1 from bench_reading s where s.supersedes_id = r.id)"
                        + " order by serial, slot_no, revision_no",
                (rs, n) -> new Object[] {rs.getLong(1), rs.getString(2), rs.getString(3), rs.getDouble(4), rs.getDouble(5),
                        rs.getString(6), rs.getObject(7, java.time.OffsetDateTime.class)}, lotId);
    }

    private String api(long lotId) throws Exception {
        var response = mvc.perform(get("/api/v1/lots/{id}/evaluation", lotId).with(user("auditor").roles("AUDITOR")))
                .andReturn().getResponse();
        if (response.getStatus() != 200) {
            throw new AssertionError("the API answered " + response.getStatus());
        }
        return response.getContentAsString();
    }

    /** {wall µs, current-thread CPU µs} per operation over {@code n} operations. */
    private double[] run(Mode mode, int n) throws Exception {
        long cpu0 = threads.getCurrentThreadCpuTime();
        long t0 = System.nanoTime();
        for (int i = 0; i < n; i++) {
            if (mode.work().call() == null) {
                throw new AssertionError(mode.name() + " gave nothing");
            }
        }
        long wallNs = System.nanoTime() - t0;
        long cpuNs = threads.getCurrentThreadCpuTime() - cpu0;
        return new double[] {wallNs / 1e3 / n, cpuNs / 1e3 / n};
    }

    static double median(List<Double> values) {
        double[] v = values.stream().mapToDouble(Double::doubleValue).sorted().toArray();
        return v.length % 2 == 1 ? v[v.length / 2] : (v[v.length / 2 - 1] + v[v.length / 2]) / 2;
    }

    private static String list(List<Double> values) {
        return String.join(", ", values.stream().map(v -> String.format(Locale.ROOT, "%.0f", v)).toList());
    }
}
