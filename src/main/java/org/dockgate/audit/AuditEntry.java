package org.dockgate.audit;

import java.time.Instant;

/** One stored entry of the audit trail, as read back. */
public record AuditEntry(long sequenceNo, Instant occurredAt, String actorId, String actorName, String channel,
                         String client, String entityType, String entityId, String action, String summary,
                         String changes, String reason, String previousHash, String entryHash) {
}
