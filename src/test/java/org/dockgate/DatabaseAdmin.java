package org.dockgate;

import java.sql.Connection;
import java.sql.SQLException;
import javax.sql.DataSource;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * What a database administrator could do behind the application's back: switch off an append-only
 * trigger, change or remove rows, switch it on again. For tamper-detection tests on H2 and PostgreSQL.
 */
public final class DatabaseAdmin {

    private final JdbcTemplate jdbc;
    private final boolean postgres;

    public DatabaseAdmin(DataSource dataSource) {
        this.jdbc = new JdbcTemplate(dataSource);
        try (Connection connection = dataSource.getConnection()) {
            this.postgres = connection.getMetaData().getDatabaseProductName().toLowerCase().contains("postgres");
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
    }

    public boolean isPostgres() {
        return postgres;
    }

    public JdbcTemplate jdbc() {
        return jdbc;
    }

    /** Runs statements with the named row trigger of the table switched off, then switches it on again. */
    public void bypassing(String table, String trigger, Runnable work) {
        if (postgres) {
            jdbc.execute("alter table " + table + " disable trigger " + trigger);
        } else {
            jdbc.execute("drop trigger " + trigger);
        }
        try {
            work.run();
        } finally {
            if (postgres) {
                jdbc.execute("alter table " + table + " enable trigger " + trigger);
            } else {
                jdbc.execute("create trigger " + trigger + " before update, delete on " + table
                        + " for each row call 'org.dockgate.audit.AppendOnlyTrigger'");
            }
        }
    }
}
