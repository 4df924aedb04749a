package org.dockgate.demo;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.DefaultApplicationArguments;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.jdbc.core.JdbcTemplate;

/** The demo scenario loads once: a second run (as at a second start) changes nothing. */
@SpringBootTest
class DemoLoaderTest {

    @Autowired DemoLoader loader;
    @Autowired JdbcTemplate jdbc;

    @Test
    void everyStepOfTheScenarioLoaded() {
        List<String> loaded = jdbc.queryForList("select name from demo_seed_step", String.class);
        assertThat(loaded).containsAll(loader.stepNames());
    }

    @Test
    void aSecondLoadChangesNothing() {
        List<String> tables = List.of("user_account", "demo_seed_step", "audit_entry");
        Map<String, Long> before = counts(tables);
        assertThat(before.get("user_account")).isGreaterThanOrEqualTo(5);
        loader.run(new DefaultApplicationArguments());
        assertThat(counts(tables)).isEqualTo(before);
    }

    private Map<String, Long> counts(List<String> tables) {
        return tables.stream().collect(java.util.stream.Collectors.toMap(t -> t,
                t -> jdbc.queryForObject("select count(*) from " + t, Long.class)));
    }
}
