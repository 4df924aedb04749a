package org.dockgate.platform;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.Set;
import org.flywaydb.core.Flyway;
import org.flywaydb.core.api.MigrationInfo;
import org.flywaydb.core.api.MigrationVersion;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * An installation of the first release sits at V9_3. Every migration added since must apply on top of
 * that database: Flyway refuses to start when a version lower than the highest applied one appears later
 * (out-of-order), which would stop every existing installation at its next start.
 */
class MigrationUpgradeTest {

    /** The highest migration version of the first release; databases in the field are at this version. */
    private static final String FIRST_RELEASE = "9.3";

    /** The migrations the first release shipped; a migration added later must have a higher version. */
    private static final Set<String> SHIPPED = Set.of("1.1", "2.1", "2.2", "3.1", "3.2", "4.1", "4.2", "5.1",
            "5.2", "6.1", "7.1", "7.2", "8.1", "8.2", "9.1", "9.2", "9.3");

    @Test
    void everyMigrationAddedSinceTheFirstReleaseHasAHigherVersion() {
        Flyway flyway = Flyway.configure().dataSource("jdbc:h2:mem:migrations-listed", "dockgate", "")
                .locations("classpath:db/migration/common", "classpath:db/migration/h2").load();
        MigrationVersion shippedTop = MigrationVersion.fromVersion(FIRST_RELEASE);
        for (MigrationInfo migration : flyway.info().all()) {
            String version = migration.getVersion().getVersion();
            if (!SHIPPED.contains(version)) {
                assertThat(migration.getVersion().isNewerThan(shippedTop.getVersion()))
                        .as("%s was added after the first release: it must be numbered above %s",
                                migration.getScript(), FIRST_RELEASE)
                        .isTrue();
            }
        }
    }

    @Test
    void aDatabaseOfTheFirstReleaseMigratesToTheCurrentSchema(@TempDir Path dir) {
        String url = "jdbc:h2:file:" + dir.resolve("upgrade") + ";AUTO_SERVER=FALSE";
        Flyway.configure().dataSource(url, "dockgate", "")
                .locations("classpath:db/migration/common", "classpath:db/migration/h2")
                .target(MigrationVersion.fromVersion(FIRST_RELEASE))
                .load().migrate();

        // A second start with the current code: validation must pass and the newer migrations apply.
        Flyway current = Flyway.configure().dataSource(url, "dockgate", "")
                .locations("classpath:db/migration/common", "classpath:db/migration/h2")
                .load();
        var result = current.migrate();
        assertThat(result.success).isTrue();
        assertThat(current.info().pending()).isEmpty();
        assertThat(current.validateWithResult().validationSuccessful)
                .as("every migration added since %s validates against a database at that version", FIRST_RELEASE)
                .isTrue();
    }
}
