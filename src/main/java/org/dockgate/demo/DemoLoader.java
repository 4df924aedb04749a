package org.dockgate.demo;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.ZoneOffset;
import java.util.List;
import java.util.function.Supplier;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.core.annotation.Order;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.AuthorityUtils;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Component;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Loads the demo scenario on start when {@code dockgate.demo.enabled} is true (the default profile).
 * Each step runs once per database, through the same services people use, so the demo's records and
 * audit entries are real; steps done on behalf of a demo person run as that person.
 */
@Component
@Order(20)
class DemoLoader implements ApplicationRunner {

    private static final Logger log = LoggerFactory.getLogger(DemoLoader.class);

    private final boolean enabled;
    private final Path seedDir;
    private final List<DemoStep> steps;
    private final JdbcTemplate jdbc;
    private final TransactionTemplate transactions;
    private final Clock clock;

    DemoLoader(@Value("${dockgate.demo.enabled:false}") boolean enabled,
               @Value("${dockgate.demo.seed-dir:./seed-data}") String seedDir, List<DemoStep> steps,
               JdbcTemplate jdbc, PlatformTransactionManager transactionManager, Clock clock) {
        this.enabled = enabled;
        this.seedDir = Path.of(seedDir).toAbsolutePath().normalize();
        this.steps = steps;
        this.jdbc = jdbc;
        this.transactions = new TransactionTemplate(transactionManager);
        this.clock = clock;
    }

    @Override
    public void run(ApplicationArguments args) {
        if (!enabled) {
            return;
        }
        if (!Files.isDirectory(seedDir)) {
            log.warn("Demo data is enabled but the seed folder {} does not exist; nothing loaded.", seedDir);
            return;
        }
        SeedFiles files = new SeedFiles(seedDir);
        for (DemoStep step : steps) {
            try {
                load(step, files);
            } catch (RuntimeException e) {
                // A broken demo file must not keep the lab from starting: the step is not recorded, so it is
                // tried again at the next start once the file is fixed.
                log.error("Demo scenario: step '{}' could not be loaded and was skipped: {}", step.name(), e.getMessage(), e);
            }
        }
    }

    /** The demo steps, in load order (for tests that check every step loaded). */
    List<String> stepNames() {
        return steps.stream().map(DemoStep::name).toList();
    }

    private void load(DemoStep step, SeedFiles files) {
        transactions.executeWithoutResult(status -> {
                Integer done = jdbc.queryForObject("select count(*) from demo_seed_step where name = ?",
                        Integer.class, step.name());
                if (done != null && done > 0) {
                    return;
                }
                step.load(files);
                jdbc.update("insert into demo_seed_step (name, loaded_at) values (?, ?)", step.name(),
                        clock.instant().atOffset(ZoneOffset.UTC));
                log.info("Demo scenario: loaded '{}'", step.name());
        });
    }

    /** Runs work as a demo person, so that its records and audit entries carry that person. */
    static <T> T as(String username, Supplier<T> work) {
        var previous = SecurityContextHolder.getContext().getAuthentication();
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(
                username, null, AuthorityUtils.NO_AUTHORITIES));
        try {
            return work.get();
        } finally {
            SecurityContextHolder.getContext().setAuthentication(previous);
        }
    }
}
