package org.dockgate.audit;

import java.sql.Connection;
import java.sql.SQLException;
import org.h2.api.Trigger;

/**
 * H2 trigger that refuses every UPDATE and DELETE on the table it is attached to, so that append-only
 * records stay append-only even for someone who bypasses the application. Other modules attach it to
 * their immutable tables too (saved readings, approved revisions, signed certificates).
 */
public class AppendOnlyTrigger implements Trigger {

    private String table;

    @Override
    public void init(Connection conn, String schemaName, String triggerName, String tableName, boolean before,
                     int type) {
        this.table = tableName;
    }

    @Override
    public void fire(Connection conn, Object[] oldRow, Object[] newRow) throws SQLException {
        throw new SQLException("Table " + table + " is append-only: " + (newRow == null ? "DELETE" : "UPDATE")
                + " refused", "45000");
    }
}
