package org.dockgate.audit;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.core.RowMapper;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Reads the trail for the viewer, an entity's history and the CSV export. Pages are keyed on the
 * sequence number (newest first, "entries before n"), which stays fast on millions of entries where an
 * offset would not; every filter column is indexed together with the sequence number.
 */
@Service
public class AuditReader {

    static final String COLUMNS = "sequence_no, occurred_at, actor_id, actor_name, channel, client, entity_type,"
            + " entity_id, action, summary, changes, reason, previous_hash, entry_hash";

    static final RowMapper<AuditEntry> ROW = AuditReader::map;

    private final JdbcTemplate jdbc;

    AuditReader(JdbcTemplate jdbc) {
        this.jdbc = jdbc;
    }

    /** A page of entries, newest first. */
    public record Page(List<AuditEntry> entries, Long nextBefore) {
    }

    /** Up to {@code size} entries matching the filter with a sequence number below {@code before} (null: newest). */
    @Transactional(readOnly = true)
    public Page page(AuditFilter filter, Long before, int size) {
        int limit = Math.max(1, Math.min(size, 500));
        List<Object> args = new ArrayList<>();
        String where = where(filter, args);
        if (before != null) {
            where += (where.isEmpty() ? " where " : " and ") + "sequence_no < ?";
            args.add(before);
        }
        args.add(limit + 1);
        List<AuditEntry> rows = jdbc.query("select " + COLUMNS + " from audit_entry" + where
                + " order by sequence_no desc fetch first ? rows only", ROW, args.toArray());
        Long next = null;
        if (rows.size() > limit) {
            rows = rows.subList(0, limit);
            next = rows.get(limit - 1).sequenceNo();
        }
        return new Page(List.copyOf(rows), next);
    }

    /** Every entry about one record, oldest first. */
    @Transactional(readOnly = true)
    public List<AuditEntry> history(String entityType, String entityId) {
        return jdbc.query("select " + COLUMNS + " from audit_entry where entity_type = ? and entity_id = ?"
                + " order by sequence_no", ROW, entityType, entityId);
    }

    /** Streams all matching entries, oldest first, without holding them in memory. */
    @Transactional(readOnly = true)
    public void forEach(AuditFilter filter, Consumer<AuditEntry> sink) {
        List<Object> args = new ArrayList<>();
        String where = where(filter, args);
        jdbc.query(con -> {
            var statement = con.prepareStatement("select " + COLUMNS + " from audit_entry" + where
                    + " order by sequence_no");
            statement.setFetchSize(1000);
            for (int i = 0; i < args.size(); i++) {
                statement.setObject(i + 1, args.get(i));
            }
            return statement;
        }, rs -> {
            sink.accept(map(rs, 0));
        });
    }

    @Transactional(readOnly = true)
    public List<String> entityTypes() {
        return jdbc.queryForList("select distinct entity_type from audit_entry order by entity_type", String.class);
    }

    @Transactional(readOnly = true)
    public List<String> actions() {
        return jdbc.queryForList("select distinct action from audit_entry order by action", String.class);
    }

    private static String where(AuditFilter filter, List<Object> args) {
        List<String> clauses = new ArrayList<>();
        if (filter.actor() != null) {
            clauses.add("actor_id = ?");
            args.add(filter.actor());
        }
        if (filter.entityType() != null) {
            clauses.add("entity_type = ?");
            args.add(filter.entityType());
        }
        if (filter.entityId() != null) {
            clauses.add("entity_id = ?");
            args.add(filter.entityId());
        }
        if (filter.action() != null) {
            clauses.add("action = ?");
            args.add(filter.action());
        }
        if (filter.from() != null) {
            clauses.add("occurred_at >= ?");
            args.add(filter.from().atStartOfDay().atOffset(ZoneOffset.UTC));
        }
        if (filter.to() != null) {
            clauses.add("occurred_at < ?");
            args.add(filter.to().plusDays(1).atStartOfDay().atOffset(ZoneOffset.UTC));
        }
        return clauses.isEmpty() ? "" : " where " + String.join(" and ", clauses);
    }

    private static AuditEntry map(ResultSet rs, int row) throws SQLException {
        return new AuditEntry(rs.getLong("sequence_no"), rs.getObject("occurred_at", java.time.OffsetDateTime.class).toInstant(),
                rs.getString("actor_id"), rs.getString("actor_name"), rs.getString("channel"), rs.getString("client"),
                rs.getString("entity_type"), rs.getString("entity_id"), rs.getString("action"),
                rs.getString("summary"), rs.getString("changes"), rs.getString("reason"),
                rs.getString("previous_hash"), rs.getString("entry_hash"));
    }
}
