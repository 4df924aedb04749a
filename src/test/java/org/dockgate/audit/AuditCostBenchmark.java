package org.dockgate.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Base64;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import java.util.regex.Pattern;
import javax.sql.DataSource;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.BeanFactory;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.context.TestConfiguration;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.context.ApplicationEvent;
import org.springframework.context.PayloadApplicationEvent;
import org.springframework.context.annotation.Bean;
import org.springframework.context.event.SimpleApplicationEventMulticaster;
import org.springframework.context.support.AbstractApplicationContext;
import org.springframework.core.ResolvableType;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * What auditing costs a write-heavy endpoint: supplier creation through the real server, with the audit
 * trail listening (A) and with audit events dropped before they reach it (B), interleaved in one run;
 * then the database cost of one audit append against a plain insert of a row of the same size.
 *
 * <p>A benchmark, not a test: it prints figures and asserts only that the work was really done (rows
 * created, entries appended or not, chain intact), never a time. Not named {@code *Test}, so
 * {@code mvn verify} does not run it. Run it alone on the default in-memory H2:
 * {@code mvn -o test -Dtest=AuditCostBenchmark -Dsurefire.failIfNoSpecifiedTests=false}; sizes with
 * {@code -Dbenchmark.ops=2000 -Dbenchmark.rounds=4 -Dbenchmark.threads=4 -Dbenchmark.jdbcOps=5000
 * -Dbenchmark.apiOps=40}. Figures are written to {@code target/benchmarks/audit-cost.md} too.
 *
 * <p>Each round reports three measures: requests per second (wall clock), CPU time of Tomcat's request
 * threads per request (the server's own work; the steadiest figure on a machine shared with other
 * work), and CPU time of the whole process per request (adds GC, JIT and the in-process HTTP client,
 * which is the same in both modes).
 *
 * <p>The baseline switch is a test-only application event multicaster (the context uses a bean named
 * {@code applicationEventMulticaster} when one exists): with auditing off it drops {@link AuditEvent}
 * payloads and delivers every other event. Everything else stays: the HTTP round trip, security,
 * the service's validation and insert, building and publishing the event. Production code has no
 * switch, so auditing cannot be turned off by accident.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class AuditCostBenchmark {

    static final int OPS = Integer.getInteger("benchmark.ops", 2000);
    static final int ROUNDS = Integer.getInteger("benchmark.rounds", 4);
    static final int THREADS = Integer.getInteger("benchmark.threads", 4);
    static final int JDBC_OPS = Integer.getInteger("benchmark.jdbcOps", 5000);
    static final int API_OPS = Integer.getInteger("benchmark.apiOps", 40);

    @TestConfiguration
    static class AuditSwitch {
        @Bean(AbstractApplicationContext.APPLICATION_EVENT_MULTICASTER_BEAN_NAME)
        SwitchableMulticaster applicationEventMulticaster(BeanFactory beanFactory) {
            return new SwitchableMulticaster(beanFactory);
        }
    }

    /** Spring's own multicaster, except that audit events are dropped while {@code auditing} is off. */
    static final class SwitchableMulticaster extends SimpleApplicationEventMulticaster {
        volatile boolean auditing = true;
        final AtomicLong dropped = new AtomicLong();

        SwitchableMulticaster(BeanFactory beanFactory) {
            super(beanFactory);
        }

        @Override
        public void multicastEvent(ApplicationEvent event, ResolvableType eventType) {
            if (!auditing && event instanceof PayloadApplicationEvent<?> payload
                    && payload.getPayload() instanceof AuditEvent) {
                dropped.incrementAndGet();
                return;
            }
            super.multicastEvent(event, eventType);
        }
    }

    @LocalServerPort int port;
    @Autowired SwitchableMulticaster multicaster;
    @Autowired JdbcTemplate jdbc;
    @Autowired DataSource dataSource;
    @Autowired AuditTrail trail;
    @Autowired ChainVerifier verifier;
    @Autowired ActorDirectory directory;
    @Autowired PlatformTransactionManager transactionManager;

    final HttpClient http = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1)
            .followRedirects(HttpClient.Redirect.NEVER).build();
    final AtomicLong codes = new AtomicLong();
    final StringBuilder report = new StringBuilder();

    @Test
    void measure() throws Exception {
        String url;
        try (Connection connection = dataSource.getConnection()) {
            url = connection.getMetaData().getURL();
        }
        // It writes thousands of suppliers and append-only audit entries: never into a shared database.
        assumeTrue(url.startsWith("jdbc:h2:mem:"), "the benchmark runs on the in-memory H2 only, not on " + url);
        line("# Audit cost benchmark, " + Instant.now().atOffset(ZoneOffset.UTC).toLocalDate() + ", "
                + Runtime.getRuntime().availableProcessors() + " cores, Java " + System.getProperty("java.version")
                + ", " + url.replaceAll("dockgate-[0-9a-f-]+", "…"));

        List<Client> sessions = new ArrayList<>();
        for (int i = 0; i < THREADS; i++) {
            sessions.add(new Client("engineer", "engineer-demo"));
        }
        // Warm-up: JIT, connection pools, caches, in both modes.
        for (boolean auditing : new boolean[] {true, false, true, false}) {
            round(auditing, sessions.subList(0, 1), OPS / 4);
        }
        line("");
        line("## Supplier creation through the page (POST /suppliers, session, CSRF), " + OPS + " requests per mode");
        compare("1 client", sessions.subList(0, 1), OPS);
        compare(THREADS + " clients", sessions, OPS);

        line("");
        line("## Supplier creation through the API (POST /api/v1/suppliers, HTTP Basic), " + API_OPS
                + " requests per mode");
        apiCompare();

        line("");
        line("## One audit append against a plain insert of a row of the same size, " + JDBC_OPS
                + " single-row transactions per kind");
        jdbcCompare();

        ChainVerification chain = verifier.verify();
        assertThat(chain.intact()).as("chain intact after the benchmark: %s", chain.problems()).isTrue();
        line("");
        line("Chain verified intact afterwards: " + chain.entries() + " entries.");
        Files.createDirectories(Path.of("target", "benchmarks"));
        Files.writeString(Path.of("target", "benchmarks", "audit-cost.md"), report);
        System.out.println(report);
    }

    /** Interleaved rounds A B B A A B …, so a drift of the machine affects both modes alike. */
    private void compare(String label, List<Client> clients, int opsPerMode) throws Exception {
        int perRound = opsPerMode / ROUNDS;
        List<Sample> audited = new ArrayList<>();
        List<Sample> bare = new ArrayList<>();
        for (int r = 0; r < ROUNDS; r++) {
            boolean auditedFirst = r % 2 == 0;
            for (boolean auditing : new boolean[] {auditedFirst, !auditedFirst}) {
                (auditing ? audited : bare).add(round(auditing, clients, perRound));
            }
        }
        report(label, audited, bare);
    }

    /**
     * Wall time and CPU time per operation. On a shared machine the wall time drifts with other people's
     * load; the CPU time this process (or thread) spent is far steadier, so both are reported.
     */
    record Sample(double wallMicrosPerOp, double cpuMicrosPerOp, double serverCpuMicrosPerOp) {
        Sample(double wallMicrosPerOp, double cpuMicrosPerOp) {
            this(wallMicrosPerOp, cpuMicrosPerOp, Double.NaN);
        }

        double perSecond() {
            return 1e6 / wallMicrosPerOp;
        }
    }

    /** CPU time so far of each of Tomcat's request threads: the server's own work, without GC, JIT or the client. */
    static Map<Long, Long> requestThreadCpu() {
        ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        Map<Long, Long> cpu = new HashMap<>();
        for (var info : threads.getThreadInfo(threads.getAllThreadIds())) {
            if (info != null && info.getThreadName().startsWith("http-nio-") && info.getThreadName().contains("-exec-")) {
                cpu.put(info.getThreadId(), threads.getThreadCpuTime(info.getThreadId()));
            }
        }
        return cpu;
    }

    static long requestThreadCpuSince(Map<Long, Long> before) {
        long total = 0;
        for (var now : requestThreadCpu().entrySet()) {
            total += now.getValue() - before.getOrDefault(now.getKey(), 0L);
        }
        return total;
    }

    static long processCpuNanos() {
        return ((com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean())
                .getProcessCpuTime();
    }

    /** One round: {@code ops} supplier creations spread over the clients; CPU is the whole process's. */
    private Sample round(boolean auditing, List<Client> clients, int ops) throws Exception {
        multicaster.auditing = auditing;
        try {
            long suppliersBefore = count("supplier");
            long entriesBefore = count("audit_entry");
            int perClient = ops / clients.size();
            ExecutorService pool = Executors.newFixedThreadPool(clients.size());
            try {
                CountDownLatch start = new CountDownLatch(1);
                List<Future<?>> done = new ArrayList<>();
                for (Client client : clients) {
                    done.add(pool.submit((Callable<Void>) () -> {
                        start.await();
                        for (int i = 0; i < perClient; i++) {
                            client.createSupplier(nextCode());
                        }
                        return null;
                    }));
                }
                var server0 = requestThreadCpu();
                long cpu0 = processCpuNanos();
                long t0 = System.nanoTime();
                start.countDown();
                for (Future<?> f : done) {
                    f.get();
                }
                long wall = System.nanoTime() - t0;
                long cpu = processCpuNanos() - cpu0;
                long server = requestThreadCpuSince(server0);
                int total = perClient * clients.size();
                // The work was done: every supplier created, an entry for each exactly when auditing.
                assertThat(count("supplier") - suppliersBefore).isEqualTo(total);
                assertThat(count("audit_entry") - entriesBefore).isEqualTo(auditing ? total : 0);
                return new Sample(wall / 1e3 / total, cpu / 1e3 / total, server / 1e3 / total);
            } finally {
                pool.shutdownNow();
            }
        } finally {
            multicaster.auditing = true;
        }
    }

    private void apiCompare() throws Exception {
        String basic = "Basic " + Base64.getEncoder().encodeToString("engineer:engineer-demo"
                .getBytes(StandardCharsets.UTF_8));
        List<Sample> audited = new ArrayList<>();
        List<Sample> bare = new ArrayList<>();
        apiRound(true, basic, 5);
        for (int r = 0; r < 2; r++) {
            for (boolean auditing : r == 0 ? new boolean[] {true, false} : new boolean[] {false, true}) {
                multicaster.auditing = auditing;
                try {
                    (auditing ? audited : bare).add(apiRound(auditing, basic, API_OPS / 2));
                } finally {
                    multicaster.auditing = true;
                }
            }
        }
        report("1 client", audited, bare);
    }

    private Sample apiRound(boolean auditing, String basic, int ops) throws Exception {
        long entriesBefore = count("audit_entry");
        var server0 = requestThreadCpu();
        long cpu0 = processCpuNanos();
        long t0 = System.nanoTime();
        for (int i = 0; i < ops; i++) {
            String code = nextCode();
            HttpResponse<String> response = http.send(HttpRequest.newBuilder(uri("/api/v1/suppliers"))
                    .header("Authorization", basic).header("Content-Type", "application/json")
                    .header("User-Agent", "audit-cost-benchmark")
                    .POST(HttpRequest.BodyPublishers.ofString("{\"code\":\"" + code + "\",\"name\":\"Benchmark supplier "
                            + code + "\",\"contact\":\"bench@example.org\",\"status\":\"APPROVED\"}")).build(),
                    HttpResponse.BodyHandlers.ofString());
            assertThat(response.statusCode()).as(response.body()).isEqualTo(200);
        }
        long wall = System.nanoTime() - t0;
        long cpu = processCpuNanos() - cpu0;
        long server = requestThreadCpuSince(server0);
        assertThat(count("audit_entry") - entriesBefore).isEqualTo(auditing ? ops : 0);
        return new Sample(wall / 1e3 / ops, cpu / 1e3 / ops, server / 1e3 / ops);
    }

    /**
     * Per single-row transaction, on one JDBC connection: (1) a plain insert into a table with the audit
     * entry's columns and only a primary key; (2) the same with the audit table's four secondary
     * indexes; (3) the chain append done by hand — lock the head row, hash, insert, move the head — as
     * {@link AuditTrail#append} does it; (4) {@link AuditTrail#appendNow} itself, through JdbcTemplate
     * and the application's transaction manager, including capturing who and serialising the changes;
     * (5) that transaction frame alone, to tell the trail's own cost from the frame's; (6) the frame with
     * the actor lookup the trail makes for a signed-in user (not made in (4), which runs as SYSTEM).
     */
    private void jdbcCompare() throws Exception {
        String columns = "occurred_at timestamp(6) with time zone not null, actor_id varchar(64) not null,"
                + " actor_name varchar(200) not null, channel varchar(16) not null, client varchar(200) not null,"
                + " entity_type varchar(64) not null, entity_id varchar(128) not null, action varchar(64) not null,"
                + " summary varchar(2000) not null, changes varchar not null, reason varchar(2000),"
                + " previous_hash varchar(64) not null, entry_hash varchar(64) not null";
        jdbc.execute("create table bench_plain_row (id bigint generated by default as identity primary key, " + columns + ")");
        jdbc.execute("create table bench_indexed_row (id bigint generated by default as identity primary key, " + columns + ")");
        jdbc.execute("create index ix_bench_entity on bench_indexed_row (entity_type, entity_id, id)");
        jdbc.execute("create index ix_bench_actor on bench_indexed_row (actor_id, id)");
        jdbc.execute("create index ix_bench_action on bench_indexed_row (action, id)");
        jdbc.execute("create index ix_bench_time on bench_indexed_row (occurred_at)");
        TransactionTemplate tx = new TransactionTemplate(transactionManager);
        try (Connection connection = dataSource.getConnection()) {
            connection.setAutoCommit(false);
            List<Sample> plain = new ArrayList<>();
            List<Sample> indexed = new ArrayList<>();
            List<Sample> chained = new ArrayList<>();
            List<Sample> appendNow = new ArrayList<>();
            List<Sample> frame = new ArrayList<>();
            List<Sample> lookup = new ArrayList<>();
            int perRound = JDBC_OPS / ROUNDS;
            timePerOp(() -> plainInserts(connection, "bench_plain_row", perRound / 4));
            timePerOp(() -> chainAppends(connection, perRound / 4));
            timePerOp(() -> trailAppends(tx, perRound / 4));
            for (int r = 0; r < ROUNDS; r++) {
                plain.add(timePerOp(() -> plainInserts(connection, "bench_plain_row", perRound)));
                indexed.add(timePerOp(() -> plainInserts(connection, "bench_indexed_row", perRound)));
                chained.add(timePerOp(() -> chainAppends(connection, perRound)));
                appendNow.add(timePerOp(() -> trailAppends(tx, perRound)));
                frame.add(timePerOp(() -> emptyTransactions(tx, perRound)));
                lookup.add(timePerOp(() -> actorLookups(tx, perRound)));
            }
            double base = median(plain.stream().map(Sample::cpuMicrosPerOp).toList());
            line("");
            line("| kind | median wall µs per transaction (rounds) | median CPU µs (rounds) | CPU × plain |");
            line("|---|---|---|---|");
            jdbcLine("plain insert, primary key only", plain, base);
            jdbcLine("plain insert, with the audit table's 4 indexes", indexed, base);
            jdbcLine("audit append by hand (lock head, SHA-256, insert, move head)", chained, base);
            jdbcLine("AuditTrail.appendNow (the same + capture, JSON, JdbcTemplate, transaction manager)", appendNow, base);
            jdbcLine("for comparison: the transaction manager's frame alone (select 1 in a TransactionTemplate)", frame, base);
            jdbcLine("for comparison: the frame + the actor's display name (ActorDirectory, a JPA query), which"
                    + " the trail looks up for every event of a signed-in user", lookup, base);
        } finally {
            jdbc.execute("drop table bench_plain_row");
            jdbc.execute("drop table bench_indexed_row");
        }
    }

    interface Work {
        int run() throws Exception;
    }

    /** Runs the work on this thread; the CPU is this thread's (the in-memory database runs in it too). */
    private static Sample timePerOp(Work work) throws Exception {
        ThreadMXBean threads = ManagementFactory.getThreadMXBean();
        long cpu0 = threads.getCurrentThreadCpuTime();
        long t0 = System.nanoTime();
        int ops = work.run();
        long wall = System.nanoTime() - t0;
        long cpu = threads.getCurrentThreadCpuTime() - cpu0;
        return new Sample(wall / 1e3 / ops, cpu / 1e3 / ops);
    }

    private static final String CHANGES = "[{\"field\":\"code\",\"oldValue\":null,\"newValue\":\"BX1234\"},"
            + "{\"field\":\"name\",\"oldValue\":null,\"newValue\":\"Benchmark supplier BX1234\"},"
            + "{\"field\":\"status\",\"oldValue\":null,\"newValue\":\"APPROVED\"}]";
    private static final String HASH = "9f2c".repeat(16);

    private int plainInserts(Connection connection, String table, int ops) throws SQLException {
        try (PreparedStatement insert = connection.prepareStatement("insert into " + table + " (occurred_at, actor_id,"
                + " actor_name, channel, client, entity_type, entity_id, action, summary, changes, reason,"
                + " previous_hash, entry_hash) values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)")) {
            for (int i = 0; i < ops; i++) {
                bindEntry(insert, 1, String.valueOf(i), HASH, HASH);
                insert.executeUpdate();
                connection.commit();
            }
        }
        return ops;
    }

    private int chainAppends(Connection connection, int ops) throws SQLException {
        try (PreparedStatement lock = connection.prepareStatement(
                     "select last_sequence, last_hash from audit_head where id = 1 for update");
             PreparedStatement insert = connection.prepareStatement("insert into audit_entry (sequence_no,"
                     + " occurred_at, actor_id, actor_name, channel, client, entity_type, entity_id, action, summary,"
                     + " changes, reason, previous_hash, entry_hash) values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)");
             PreparedStatement move = connection.prepareStatement(
                     "update audit_head set last_sequence = ?, last_hash = ? where id = 1")) {
            for (int i = 0; i < ops; i++) {
                long sequence;
                String previous;
                try (ResultSet head = lock.executeQuery()) {
                    head.next();
                    sequence = head.getLong(1) + 1;
                    previous = head.getString(2);
                }
                Instant at = ChainHash.truncate(Instant.now());
                String id = String.valueOf(i);
                String hash = ChainHash.of(sequence, at, "engineer", "Rui Almeida", "PAGE", "page session 0a1b2c3d4e5f",
                        "SUPPLIER", id, "CREATE", "Supplier BX1234 created", CHANGES, null, previous);
                insert.setLong(1, sequence);
                bindEntry(insert, 2, id, previous, hash, at);
                insert.executeUpdate();
                move.setLong(1, sequence);
                move.setString(2, hash);
                move.executeUpdate();
                connection.commit();
            }
        }
        return ops;
    }

    private int trailAppends(TransactionTemplate tx, int ops) {
        for (int i = 0; i < ops; i++) {
            AuditEvent event = AuditEvent.of("SUPPLIER", i, "CREATE", "Supplier BX1234 created")
                    .withChanges(List.of(FieldChange.of("code", null, "BX1234"),
                            FieldChange.of("name", null, "Benchmark supplier BX1234"),
                            FieldChange.of("status", null, "APPROVED")));
            tx.executeWithoutResult(status -> trail.appendNow(event));
        }
        return ops;
    }

    private int actorLookups(TransactionTemplate tx, int ops) {
        for (int i = 0; i < ops; i++) {
            tx.executeWithoutResult(status -> directory.displayName("engineer"));
        }
        return ops;
    }

    private int emptyTransactions(TransactionTemplate tx, int ops) {
        for (int i = 0; i < ops; i++) {
            tx.executeWithoutResult(status -> jdbc.queryForObject("select 1", Integer.class));
        }
        return ops;
    }

    private static void bindEntry(PreparedStatement statement, int first, String entityId, String previous,
                                  String hash) throws SQLException {
        bindEntry(statement, first, entityId, previous, hash, ChainHash.truncate(Instant.now()));
    }

    private static void bindEntry(PreparedStatement statement, int first, String entityId, String previous,
                                  String hash, Instant at) throws SQLException {
        int i = first;
        statement.setObject(i++, at.atOffset(ZoneOffset.UTC));
        statement.setString(i++, "engineer");
        statement.setString(i++, "Rui Almeida");
        statement.setString(i++, "PAGE");
        statement.setString(i++, "page session 0a1b2c3d4e5f");
        statement.setString(i++, "SUPPLIER");
        statement.setString(i++, entityId);
        statement.setString(i++, "CREATE");
        statement.setString(i++, "Supplier BX1234 created");
        statement.setString(i++, CHANGES);
        statement.setString(i++, null);
        statement.setString(i++, previous);
        statement.setString(i, hash);
    }

    // --- reporting ---------------------------------------------------------------------------------

    private void report(String label, List<Sample> audited, List<Sample> bare) {
        double a = median(audited.stream().map(Sample::perSecond).toList());
        double b = median(bare.stream().map(Sample::perSecond).toList());
        double aServer = median(audited.stream().map(Sample::serverCpuMicrosPerOp).toList());
        double bServer = median(bare.stream().map(Sample::serverCpuMicrosPerOp).toList());
        double aCpu = median(audited.stream().map(Sample::cpuMicrosPerOp).toList());
        double bCpu = median(bare.stream().map(Sample::cpuMicrosPerOp).toList());
        line("");
        line("| " + label + " | requests/s | request-thread CPU µs per request | process CPU µs per request |");
        line("|---|---|---|---|");
        line("| with audit (A) | " + cells(audited) + " |");
        line("| audit events dropped (B) | " + cells(bare) + " |");
        line("");
        line(String.format(Locale.ROOT, "A/B: throughput %.2f, request-thread CPU %.2f, process CPU %.2f. Auditing adds"
                + " %.0f µs of request-thread CPU (%.0f µs of process CPU) per request.", a / b, aServer / bServer,
                aCpu / bCpu, aServer - bServer, aCpu - bCpu));
    }

    /** Median (rounds) for each measure. */
    private static String cells(List<Sample> samples) {
        List<Double> rate = samples.stream().map(Sample::perSecond).toList();
        List<Double> server = samples.stream().map(Sample::serverCpuMicrosPerOp).toList();
        List<Double> cpu = samples.stream().map(Sample::cpuMicrosPerOp).toList();
        return fmt(median(rate)) + " (" + list(rate) + ") | " + fmt(median(server)) + " (" + list(server) + ") | "
                + fmt(median(cpu)) + " (" + list(cpu) + ")";
    }

    private void jdbcLine(String kind, List<Sample> samples, double baseCpu) {
        List<Double> wall = samples.stream().map(Sample::wallMicrosPerOp).toList();
        List<Double> cpu = samples.stream().map(Sample::cpuMicrosPerOp).toList();
        line("| " + kind + " | " + fmt(median(wall)) + " (" + list(wall) + ") | " + fmt(median(cpu)) + " (" + list(cpu)
                + ") | " + String.format(Locale.ROOT, "%.1f", median(cpu) / baseCpu) + " |");
    }

    static double median(List<Double> values) {
        List<Double> sorted = values.stream().sorted().toList();
        int n = sorted.size();
        return n % 2 == 1 ? sorted.get(n / 2) : (sorted.get(n / 2 - 1) + sorted.get(n / 2)) / 2;
    }

    private static String list(List<Double> values) {
        return String.join(", ", values.stream().map(AuditCostBenchmark::fmt).toList());
    }

    private static String fmt(double value) {
        return value >= 100 ? String.format(Locale.ROOT, "%.0f", value) : String.format(Locale.ROOT, "%.1f", value);
    }

    private void line(String text) {
        report.append(text).append('\n');
    }

    private long count(String table) {
        return jdbc.queryForObject("select count(*) from " + table, Long.class);
    }

    private String nextCode() {
        return "B" + Long.toString(codes.incrementAndGet(), 36).toUpperCase(Locale.ROOT);
    }

    private URI uri(String path) {
        return URI.create("http://localhost:" + port + path);
    }

    /** A signed-in page session: its cookie and CSRF token, taken as a browser would. */
    final class Client {
        private final String cookie;
        private final String token;

        Client(String user, String password) throws Exception {
            HttpResponse<String> login = http.send(HttpRequest.newBuilder(uri("/login")).header("Accept", "text/html")
                    .build(), HttpResponse.BodyHandlers.ofString());
            String anonymous = login.headers().firstValue("Set-Cookie").orElseThrow().split(";")[0];
            HttpResponse<String> signedIn = http.send(HttpRequest.newBuilder(uri("/login"))
                    .header("Content-Type", "application/x-www-form-urlencoded").header("Cookie", anonymous)
                    .POST(HttpRequest.BodyPublishers.ofString("username=" + user + "&password=" + password
                            + "&_csrf=" + csrf(login.body()))).build(), HttpResponse.BodyHandlers.ofString());
            assertThat(signedIn.statusCode()).isEqualTo(302);
            assertThat(signedIn.headers().firstValue("Location").orElse("")).endsWith("/");
            cookie = signedIn.headers().firstValue("Set-Cookie").map(c -> c.split(";")[0]).orElse(anonymous);
            // The CSRF token changes at sign-in: take the one the suppliers page carries now.
            HttpResponse<String> page = http.send(HttpRequest.newBuilder(uri("/suppliers")).header("Accept", "text/html")
                    .header("Cookie", cookie).build(), HttpResponse.BodyHandlers.ofString());
            assertThat(page.statusCode()).isEqualTo(200);
            token = csrf(page.body().substring(page.body().indexOf("id=\"new-supplier\"")));
        }

        void createSupplier(String code) throws Exception {
            String form = "code=" + code + "&name=" + URLEncoder.encode("Benchmark supplier " + code, StandardCharsets.UTF_8)
                    + "&contact=bench%40example.org&status=APPROVED&_csrf=" + URLEncoder.encode(token, StandardCharsets.UTF_8);
            HttpResponse<Void> response = http.send(HttpRequest.newBuilder(uri("/suppliers"))
                    .header("Content-Type", "application/x-www-form-urlencoded").header("Cookie", cookie)
                    .POST(HttpRequest.BodyPublishers.ofString(form)).build(), HttpResponse.BodyHandlers.discarding());
            if (response.statusCode() != 302) {
                throw new IllegalStateException("POST /suppliers answered " + response.statusCode());
            }
        }

    }

    private static String csrf(String html) {
        var m = Pattern.compile("name=\"_csrf\" value=\"([^\"]+)\"").matcher(html);
        assertThat(m.find()).as("a CSRF token in the page").isTrue();
        return m.group(1);
    }
}
