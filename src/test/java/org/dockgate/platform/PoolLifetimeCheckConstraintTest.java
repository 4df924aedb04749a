package org.dockgate.platform;

import static org.assertj.core.api.Assertions.assertThat;

import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.sql.Types;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The connection pool retires every connection after its maximum lifetime (30 minutes by default), so
 * after half an hour every insert runs on a connection other than the one that created the schema. H2
 * 2.4.240 then refuses inserts into tables with {@code CHECK (… IN …)} constraints ("Check constraint
 * invalid", error 23513). This test forces that moment: it creates the schema on an H2 file database,
 * retires every pool connection, and inserts into every table that has a check constraint on a fresh one.
 */
class PoolLifetimeCheckConstraintTest {

    /** H2's error code for a check constraint it cannot evaluate (as opposed to 23514, violated). */
    private static final int CHECK_CONSTRAINT_INVALID = 23513;

    @Test
    void insertsIntoEveryCheckedTableSucceedAfterThePoolReplacedItsConnections(@TempDir Path dir) throws Exception {
        HikariConfig config = new HikariConfig();
        config.setJdbcUrl("jdbc:h2:file:" + dir.resolve("dockgate") + ";AUTO_SERVER=FALSE");
        config.setUsername("dockgate");
        config.setPassword("");
        config.setMaximumPoolSize(2);
        try (HikariDataSource pool = new HikariDataSource(config)) {
            Flyway.configure().dataSource(pool)
                    .locations("classpath:db/migration/common", "classpath:db/migration/h2")
                    .load().migrate();
            Map<String, List<String>> checkedTables = checkedTables(pool);
            assertThat(checkedTables).as("the schema has check constraints to exercise").isNotEmpty();

            // What maxLifetime does after 30 minutes: every connection the schema was created on is retired.
            pool.getHikariPoolMXBean().softEvictConnections();

            try (Connection fresh = pool.getConnection(); Statement st = fresh.createStatement()) {
                // Only the check constraints are under test here, not the foreign keys between the rows.
                st.execute("SET REFERENTIAL_INTEGRITY FALSE");
                List<String> invalid = new ArrayList<>();
                for (var table : checkedTables.entrySet()) {
                    try {
                        insertSampleRow(fresh, table.getKey());
                    } catch (SQLException e) {
                        if (e.getErrorCode() == CHECK_CONSTRAINT_INVALID) {
                            invalid.add(table.getKey() + " " + table.getValue() + ": " + e.getMessage().lines().findFirst().orElse(""));
                        }
                    }
                }
                st.execute("SET REFERENTIAL_INTEGRITY TRUE");
                assertThat(invalid).as("check constraints H2 could not evaluate on a replaced connection").isEmpty();
            }
        }
    }

    private static Map<String, List<String>> checkedTables(HikariDataSource pool) throws SQLException {
        Map<String, List<String>> tables = new LinkedHashMap<>();
        try (Connection c = pool.getConnection();
             ResultSet rs = c.createStatement().executeQuery("""
                     select tc.table_name, tc.constraint_name from information_schema.table_constraints tc
                     where tc.constraint_type = 'CHECK' and tc.table_schema = 'PUBLIC'
                     order by tc.table_name, tc.constraint_name""")) {
            while (rs.next()) {
                tables.computeIfAbsent(rs.getString(1), t -> new ArrayList<>()).add(rs.getString(2));
            }
        }
        return tables;
    }

    /**
     * Inserts one row whose columns hold simple values of their type. The values may well violate a
     * constraint (23514) or a uniqueness rule: only "constraint invalid" is the defect under test.
     */
    private static void insertSampleRow(Connection c, String table) throws SQLException {
        List<String> columns = new ArrayList<>();
        List<Integer> types = new ArrayList<>();
        try (ResultSet rs = c.getMetaData().getColumns(null, "PUBLIC", table, null)) {
            while (rs.next()) {
                if ("YES".equals(rs.getString("IS_GENERATEDCOLUMN")) || "YES".equals(rs.getString("IS_AUTOINCREMENT"))) {
                    continue;
                }
                columns.add(rs.getString("COLUMN_NAME"));
                types.add(rs.getInt("DATA_TYPE"));
            }
        }
        String sql = "insert into " + table + " (" + String.join(", ", columns) + ") values ("
                + String.join(", ", columns.stream().map(x -> "?").toList()) + ")";
        try (PreparedStatement ps = c.prepareStatement(sql)) {
            for (int i = 0; i < columns.size(); i++) {
                ps.setObject(i + 1, sampleValue(types.get(i)), types.get(i));
            }
            ps.executeUpdate();
        }
    }

    private static Object sampleValue(int sqlType) {
        return switch (sqlType) {
            case Types.BOOLEAN, Types.BIT -> Boolean.FALSE;
            case Types.INTEGER, Types.SMALLINT, Types.TINYINT, Types.BIGINT -> 1;
            case Types.DOUBLE, Types.FLOAT, Types.REAL, Types.NUMERIC, Types.DECIMAL -> 1.0;
            case Types.DATE -> java.sql.Date.valueOf("2026-01-01");
            case Types.TIMESTAMP, Types.TIMESTAMP_WITH_TIMEZONE -> java.time.OffsetDateTime.parse("2026-01-01T00:00:00Z");
            case Types.BLOB, Types.VARBINARY, Types.BINARY, Types.LONGVARBINARY -> new byte[] {1};
            default -> "X";
        };
    }
}
