package org.dockgate.platform;

import static org.assertj.core.api.Assertions.assertThat;

import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.Date;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The default database is an H2 file; the pool retires its connections (Hikari's max-lifetime is 30
 * minutes). H2 2.4.240 then refuses every insert into a table with a {@code CHECK (… IN …)} constraint
 * with "Check constraint invalid", because the constraint is evaluated on a connection other than the
 * one that created it. This test builds the schema with the application's migrations on a fresh H2 file,
 * throws every pooled connection away, and inserts one row into every table that has a check
 * constraint — found in INFORMATION_SCHEMA, so a table added later is covered without editing this test.
 */
class H2CheckConstraintsAcrossConnectionsTest {

    private static final Pattern IN_LIST = Pattern.compile("\"(\\w+)\"\\s+IN\\s*\\(\\s*'([^']*)'");

    @TempDir
    Path folder;

    @Test
    void everyCheckedTableAcceptsAnInsertAfterThePoolReplacedItsConnections() throws SQLException {
        HikariConfig config = new HikariConfig();
        config.setJdbcUrl("jdbc:h2:file:" + folder.resolve("dockgate").toAbsolutePath() + ";AUTO_SERVER=FALSE");
        config.setUsername("dockgate");
        config.setPassword("");
        config.setMaximumPoolSize(2);
        try (HikariDataSource pool = new HikariDataSource(config)) {
            Flyway.configure().dataSource(pool)
                    .locations("classpath:db/migration/common", "classpath:db/migration/h2")
                    .load().migrate();

            // What the pool does when max-lifetime passes: every connection is closed and replaced.
            pool.getHikariPoolMXBean().softEvictConnections();

            try (Connection connection = pool.getConnection()) {
                Map<String, List<String>> checks = checkConstraints(connection);
                assertThat(checks).as("tables with check constraints").containsKey("BENCH_READING");

                List<String> refused = new ArrayList<>();
                try (Statement statement = connection.createStatement()) {
                    // Only the check constraints are under test: parents of foreign keys need not exist.
                    statement.execute("SET REFERENTIAL_INTEGRITY FALSE");
                }
                connection.setAutoCommit(false);
                for (Map.Entry<String, List<String>> table : checks.entrySet()) {
                    try {
                        insertOneRow(connection, table.getKey(), table.getValue());
                    } catch (SQLException e) {
                        refused.add(table.getKey() + ": " + e.getMessage());
                    }
                }
                connection.rollback();
                assertThat(refused).as("inserts refused after the pool replaced its connections").isEmpty();
            }
        }
    }

    /** Table name → the CHECK clauses on it (H2's own rendering of them). */
    private static Map<String, List<String>> checkConstraints(Connection connection) throws SQLException {
        Map<String, List<String>> checks = new TreeMap<>();
        String sql = """
                select tc.table_name, cc.check_clause
                  from information_schema.table_constraints tc
                  join information_schema.check_constraints cc
                    on cc.constraint_schema = tc.constraint_schema and cc.constraint_name = tc.constraint_name
                 where tc.constraint_type = 'CHECK' and tc.table_schema = 'PUBLIC'
                """;
        try (Statement statement = connection.createStatement(); ResultSet rows = statement.executeQuery(sql)) {
            while (rows.next()) {
                checks.computeIfAbsent(rows.getString(1), k -> new ArrayList<>()).add(rows.getString(2));
            }
        }
        return checks;
    }

    /**
     * Inserts a row that fills every required column: a value from the IN list where a check names one,
     * otherwise a value of the column's type that grows with the column's position (so "max > min" and
     * "due > calibrated" style checks on columns declared in that order hold).
     */
    private static void insertOneRow(Connection connection, String table, List<String> clauses) throws SQLException {
        Map<String, String> allowed = new LinkedHashMap<>();
        for (String clause : clauses) {
            Matcher m = IN_LIST.matcher(clause);
            while (m.find()) {
                allowed.putIfAbsent(m.group(1), m.group(2));
            }
        }
        List<String> names = new ArrayList<>();
        List<Object> values = new ArrayList<>();
        String sql = """
                select column_name, data_type, ordinal_position from information_schema.columns
                 where table_schema = 'PUBLIC' and table_name = ? and is_nullable = 'NO'
                   and is_identity = 'NO' and column_default is null
                 order by ordinal_position
                """;
        try (PreparedStatement query = connection.prepareStatement(sql)) {
            query.setString(1, table);
            try (ResultSet rows = query.executeQuery()) {
                while (rows.next()) {
                    String column = rows.getString(1);
                    names.add('"' + column + '"');
                    values.add(allowed.containsKey(column) ? allowed.get(column) : valueOf(rows.getString(2), rows.getInt(3)));
                }
            }
        }
        String insert = names.isEmpty()
                ? "insert into \"" + table + "\" default values"
                : "insert into \"" + table + "\" (" + String.join(", ", names) + ") values ("
                        + String.join(", ", names.stream().map(n -> "?").toList()) + ")";
        try (PreparedStatement statement = connection.prepareStatement(insert)) {
            for (int i = 0; i < values.size(); i++) {
                statement.setObject(i + 1, values.get(i));
            }
            statement.executeUpdate();
        }
    }

    private static Object valueOf(String dataType, int position) {
        return switch (dataType) {
            case "BIGINT", "INTEGER", "SMALLINT", "TINYINT" -> (long) position;
            case "DOUBLE PRECISION", "REAL", "NUMERIC", "DECIMAL", "DECFLOAT" -> (double) position;
            case "BOOLEAN" -> Boolean.TRUE;
            case "DATE" -> Date.valueOf(java.time.LocalDate.of(2026, 1, 1).plusDays(position));
            case "TIMESTAMP WITH TIME ZONE", "TIMESTAMP" ->
                    OffsetDateTime.of(2026, 1, 1, 0, 0, 0, 0, ZoneOffset.UTC).plusDays(position);
            case "BINARY VARYING", "BINARY", "BINARY LARGE OBJECT" -> new byte[] {1, 2, 3};
            default -> "x" + position;
        };
    }
}
