package org.dockgate.audit;

import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpSession;
import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import org.dockgate.audit.AuditEvent.Actor;
import org.springframework.context.event.EventListener;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.security.authentication.AnonymousAuthenticationToken;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionSynchronization;
import org.springframework.transaction.support.TransactionSynchronizationManager;
import org.springframework.transaction.support.TransactionTemplate;
import org.springframework.web.context.request.RequestContextHolder;
import org.springframework.web.context.request.ServletRequestAttributes;
import tools.jackson.databind.json.JsonMapper;

/**
 * Appends {@link AuditEvent}s to the hash-chained trail. Events published inside a transaction are
 * collected and appended just before that transaction commits, in it: a committed change always has its
 * entries, a rolled back one never has. The head row is locked only for that short moment, which keeps
 * concurrent writers in one linear chain without holding the lock for the whole business transaction.
 * Events published outside a transaction (security events) are appended in a transaction of their own.
 */
@Service
public class AuditTrail {

    private final JdbcTemplate jdbc;
    private final TransactionTemplate transactions;
    private final Clock clock;
    private final ActorDirectory directory;
    private final JsonMapper json;

    AuditTrail(JdbcTemplate jdbc, PlatformTransactionManager transactionManager, Clock clock,
               ActorDirectory directory, JsonMapper json) {
        this.jdbc = jdbc;
        this.transactions = new TransactionTemplate(transactionManager);
        this.clock = clock;
        this.directory = directory;
        this.json = json;
    }

    /** Who, when, through what: captured at the moment of the event, on the thread that made the change. */
    record Pending(AuditEvent event, Instant occurredAt, String actorId, String actorName, String channel,
                   String client, String changes) {
    }

    @EventListener
    public void on(AuditEvent event) {
        Pending pending = capture(event);
        if (TransactionSynchronizationManager.isSynchronizationActive()
                && TransactionSynchronizationManager.isActualTransactionActive()) {
            PendingEntries.current(this).add(pending);
        } else {
            transactions.executeWithoutResult(status -> append(List.of(pending)));
        }
    }

    private Pending capture(AuditEvent event) {
        String actorId;
        String actorName;
        if (event.actor() != null) {
            actorId = event.actor().userId();
            actorName = event.actor().displayName();
        } else {
            Authentication auth = SecurityContextHolder.getContext().getAuthentication();
            if (auth == null || !auth.isAuthenticated() || auth instanceof AnonymousAuthenticationToken) {
                actorId = Actor.SYSTEM.userId();
                actorName = Actor.SYSTEM.displayName();
            } else {
                actorId = auth.getName();
                actorName = directory.displayName(actorId);
            }
        }
        String channel = "SYSTEM";
        String client = "-";
        if (RequestContextHolder.getRequestAttributes() instanceof ServletRequestAttributes attributes) {
            HttpServletRequest request = attributes.getRequest();
            String path = request.getRequestURI().substring(request.getContextPath().length());
            if (path.startsWith("/api/")) {
                channel = "API";
                String agent = request.getHeader("User-Agent");
                client = "API client " + (agent == null ? "unnamed" : clip(agent, 150));
            } else {
                channel = "PAGE";
                HttpSession session = request.getSession(false);
                client = session == null ? "page, no session" : "page session " + fingerprint(session.getId());
            }
        }
        return new Pending(event, ChainHash.truncate(clock.instant()), clip(actorId, 64), clip(actorName, 200),
                channel, client, json.writeValueAsString(event.changes()));
    }

    /** Appends one event immediately in the current transaction (used by the sealer); returns its sequence number. */
    long appendNow(AuditEvent event) {
        return append(List.of(capture(event)));
    }

    /** Appends in the current transaction, under the head lock; returns the last sequence number written. */
    long append(List<Pending> batch) {
        var head = jdbc.queryForMap("select last_sequence, last_hash from audit_head where id = 1 for update");
        long sequence = ((Number) head.get("last_sequence")).longValue();
        String previous = (String) head.get("last_hash");
        List<Object[]> rows = new ArrayList<>(batch.size());
        for (Pending p : batch) {
            sequence++;
            AuditEvent e = p.event();
            String summary = clip(e.summary(), 2000);
            String reason = e.reason() == null ? null : clip(e.reason(), 2000);
            String hash = ChainHash.of(sequence, p.occurredAt(), p.actorId(), p.actorName(), p.channel(),
                    p.client(), e.entityType(), e.entityId(), e.action(), summary, p.changes(), reason, previous);
            rows.add(new Object[] {sequence, p.occurredAt().atOffset(java.time.ZoneOffset.UTC), p.actorId(), p.actorName(),
                p.channel(), p.client(), e.entityType(), e.entityId(), e.action(), summary, p.changes(), reason,
                previous, hash});
            previous = hash;
        }
        jdbc.batchUpdate("insert into audit_entry (sequence_no, occurred_at, actor_id, actor_name, channel, client,"
                + " entity_type, entity_id, action, summary, changes, reason, previous_hash, entry_hash)"
                + " values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)", rows);
        jdbc.update("update audit_head set last_sequence = ?, last_hash = ? where id = 1", sequence, previous);
        return sequence;
    }

    private static String fingerprint(String sessionId) {
        byte[] digest = ChainHash.sha256().digest(sessionId.getBytes(StandardCharsets.UTF_8));
        return HexFormat.of().formatHex(digest, 0, 6);
    }

    private static String clip(String value, int max) {
        return value.length() <= max ? value : value.substring(0, max - 1) + "…";
    }

    /** The events of one transaction, appended before it commits. */
    private static final class PendingEntries implements TransactionSynchronization {

        private final AuditTrail trail;
        private final List<Pending> entries = new ArrayList<>();

        private PendingEntries(AuditTrail trail) {
            this.trail = trail;
        }

        static List<Pending> current(AuditTrail trail) {
            for (TransactionSynchronization s : TransactionSynchronizationManager.getSynchronizations()) {
                if (s instanceof PendingEntries p && p.trail == trail) {
                    return p.entries;
                }
            }
            PendingEntries created = new PendingEntries(trail);
            TransactionSynchronizationManager.registerSynchronization(created);
            return created.entries;
        }

        @Override
        public void beforeCommit(boolean readOnly) {
            if (!entries.isEmpty()) {
                trail.append(List.copyOf(entries));
                entries.clear();
            }
        }

        @Override
        public int getOrder() {
            // Last of the before-commit work, so entries written by other synchronizations are included.
            return LOWEST_PRECEDENCE;
        }
    }
}
