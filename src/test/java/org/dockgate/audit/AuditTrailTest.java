package org.dockgate.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import javax.sql.DataSource;
import org.dockgate.DatabaseAdmin;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.dao.DataAccessException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The audit trail on the real database of the run (H2, or PostgreSQL in CI): chain verification,
 * tampering behind the application's back, a cut-off tail, rollbacks, concurrent writers, and the
 * database's own refusal of updates and deletes. Tampering is undone at the end of each test, so a
 * database shared with other test classes stays intact.
 */
@SpringBootTest
class AuditTrailTest {

    @Autowired ApplicationEventPublisher events;
    @Autowired ChainVerifier verifier;
    @Autowired AuditSealer sealer;
    @Autowired JdbcTemplate jdbc;
    @Autowired DataSource dataSource;
    @Autowired PlatformTransactionManager transactionManager;

    DatabaseAdmin admin;
    TransactionTemplate tx;

    @BeforeEach
    void setUp() {
        admin = new DatabaseAdmin(dataSource);
        tx = new TransactionTemplate(transactionManager);
        assertThat(verifier.verify().intact()).as("chain intact before the test").isTrue();
    }

    private long head() {
        return jdbc.queryForObject("select last_sequence from audit_head where id = 1", Long.class);
    }

    private void record(String id, String action) {
        tx.executeWithoutResult(s -> events.publishEvent(AuditEvent.of("TEST_RECORD", id, action, "test " + id)));
    }

    @Test
    void appendedEntriesFormAnIntactChain() {
        long before = head();
        for (int i = 0; i < 5; i++) {
            record("chain-" + i, "CREATE");
        }
        ChainVerification result = verifier.verify();
        assertThat(result.intact()).isTrue();
        assertThat(result.entries()).isEqualTo(before + 5);
        assertThat(result.firstBrokenEntry()).isNull();
        List<Map<String, Object>> rows = jdbc.queryForList("select sequence_no, previous_hash, entry_hash"
                + " from audit_entry where sequence_no >= ? order by sequence_no", Math.max(before, 1));
        for (int i = 1; i < rows.size(); i++) {
            assertThat(rows.get(i).get("previous_hash")).as("entry %s links to its predecessor",
                    rows.get(i).get("sequence_no")).isEqualTo(rows.get(i - 1).get("entry_hash"));
        }
    }

    @Test
    void anEntryAlteredInTheDatabaseIsNamed() {
        for (int i = 0; i < 4; i++) {
            record("alter-" + i, "CREATE");
        }
        long target = head() - 2;
        String original = jdbc.queryForObject("select summary from audit_entry where sequence_no = ?",
                String.class, target);
        admin.bypassing("audit_entry", "audit_entry_append_only",
                () -> admin.jdbc().update("update audit_entry set summary = ? where sequence_no = ?",
                        "quietly changed", target));
        try {
            ChainVerification result = verifier.verify();
            assertThat(result.intact()).isFalse();
            assertThat(result.firstBrokenEntry()).isEqualTo(target);
            assertThat(result.problems()).anyMatch(p -> p.contains("Entry " + target + " was altered"));
        } finally {
            admin.bypassing("audit_entry", "audit_entry_append_only",
                    () -> admin.jdbc().update("update audit_entry set summary = ? where sequence_no = ?",
                            original, target));
        }
        assertThat(verifier.verify().intact()).isTrue();
    }

    @Test
    void anEntryRemovedFromTheMiddleIsNamed() {
        for (int i = 0; i < 3; i++) {
            record("gap-" + i, "CREATE");
        }
        long target = head() - 1;
        Map<String, Object> row = jdbc.queryForMap("select * from audit_entry where sequence_no = ?", target);
        admin.bypassing("audit_entry", "audit_entry_append_only",
                () -> admin.jdbc().update("delete from audit_entry where sequence_no = ?", target));
        try {
            ChainVerification result = verifier.verify();
            assertThat(result.intact()).isFalse();
            assertThat(result.firstBrokenEntry()).isEqualTo(target);
        } finally {
            reinsert(List.of(row));
        }
        assertThat(verifier.verify().intact()).isTrue();
    }

    @Test
    void aCutOffTailIsCaughtByTheSeal() {
        for (int i = 0; i < 3; i++) {
            record("tail-" + i, "CREATE");
        }
        var seal = sealer.seal("test");
        assertThat(seal.sealedCount()).isEqualTo(head() - 1);
        long firstRemoved = seal.sealedCount() - 1;
        // Remove the last two sealed entries and the seal entry itself, and reset the head, as a
        // database administrator hiding recent history would.
        List<Map<String, Object>> removed = jdbc.queryForList(
                "select * from audit_entry where sequence_no >= ? order by sequence_no", firstRemoved);
        Map<String, Object> sealRow = jdbc.queryForMap("select * from audit_seal where sequence_no = ?",
                seal.sequenceNo());
        Map<String, Object> headRow = jdbc.queryForMap("select * from audit_head where id = 1");
        admin.bypassing("audit_seal", "audit_seal_append_only",
                () -> admin.jdbc().update("delete from audit_seal where sequence_no = ?", seal.sequenceNo()));
        admin.bypassing("audit_entry", "audit_entry_append_only",
                () -> admin.jdbc().update("delete from audit_entry where sequence_no >= ?", firstRemoved));
        String newHeadHash = jdbc.queryForObject("select entry_hash from audit_entry where sequence_no = ?",
                String.class, firstRemoved - 1);
        jdbc.update("update audit_head set last_sequence = ?, last_hash = ? where id = 1", firstRemoved - 1,
                newHeadHash);
        try {
            ChainVerification result = verifier.verify();
            assertThat(result.intact()).as("the remaining chain links, but the seal file covers more").isFalse();
            assertThat(result.firstBrokenEntry()).isEqualTo(firstRemoved);
            assertThat(result.problems()).anyMatch(p -> p.contains("were removed"));
            assertThat(sealer.checkText(seal.text())).contains("were removed");
        } finally {
            reinsert(removed);
            admin.jdbc().update("insert into audit_seal (sequence_no, sealed_count, head_hash, sealed_at, seal_text)"
                            + " values (?, ?, ?, ?, ?)", sealRow.get("sequence_no"), sealRow.get("sealed_count"),
                    sealRow.get("head_hash"), sealRow.get("sealed_at"), sealRow.get("seal_text"));
            jdbc.update("update audit_head set last_sequence = ?, last_hash = ? where id = 1",
                    headRow.get("last_sequence"), headRow.get("last_hash"));
        }
        assertThat(verifier.verify().intact()).isTrue();
        assertThat(sealer.checkText(seal.text())).startsWith("The seal is genuine");
    }

    @Test
    void aForgedSealIsRefused() {
        record("forge", "CREATE");
        var seal = sealer.seal("test");
        String forged = seal.text().replace("entries: " + seal.sealedCount(), "entries: " + (seal.sealedCount() - 1));
        assertThat(sealer.checkText(forged)).contains("invalid signature");
    }

    @Test
    void aRolledBackTransactionLeavesNoEntry() {
        long before = head();
        assertThatThrownBy(() -> tx.executeWithoutResult(s -> {
            events.publishEvent(AuditEvent.of("TEST_RECORD", "rollback", "CREATE", "will roll back"));
            throw new IllegalStateException("business failure");
        })).isInstanceOf(IllegalStateException.class);
        assertThat(head()).isEqualTo(before);
        assertThat(jdbc.queryForObject("select count(*) from audit_entry where entity_id = 'rollback'", Integer.class))
                .isZero();
    }

    @Test
    void manyThreadsWritingAtOnceLeaveOneIntactChain() throws Exception {
        long before = head();
        int threads = 8;
        int perThread = 25;
        ExecutorService pool = Executors.newFixedThreadPool(threads);
        CountDownLatch start = new CountDownLatch(1);
        List<Future<?>> done = new ArrayList<>();
        for (int t = 0; t < threads; t++) {
            int thread = t;
            done.add(pool.submit(() -> {
                start.await();
                for (int i = 0; i < perThread; i++) {
                    record("thread-" + thread + "-" + i, "CREATE");
                }
                return null;
            }));
        }
        start.countDown();
        for (Future<?> f : done) {
            f.get(120, TimeUnit.SECONDS);
        }
        pool.shutdown();
        assertThat(head()).isEqualTo(before + threads * perThread);
        ChainVerification result = verifier.verify();
        assertThat(result.intact()).isTrue();
        assertThat(jdbc.queryForObject("select count(*) from audit_entry where sequence_no > ?", Long.class, before))
                .isEqualTo((long) threads * perThread);
    }

    @Test
    void theDatabaseRefusesUpdatesAndDeletes() {
        record("refuse", "CREATE");
        long last = head();
        assertThatThrownBy(() -> jdbc.update("update audit_entry set summary = 'x' where sequence_no = ?", last))
                .isInstanceOf(DataAccessException.class).hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.update("delete from audit_entry where sequence_no = ?", last))
                .isInstanceOf(DataAccessException.class).hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.execute("truncate table audit_entry"))
                .isInstanceOf(DataAccessException.class);
        assertThat(verifier.verify().intact()).isTrue();
    }

    @Test
    void aReasonIsRequiredForCorrections() {
        assertThatThrownBy(() -> AuditEvent.of("READING", 1, "CORRECT", "changed"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("reason");
        assertThatThrownBy(() -> AuditEvent.withReason("LOT", 1, "LIFT_BLOCK", "lifted", "  "))
                .isInstanceOf(IllegalArgumentException.class);
        assertThat(AuditEvent.withReason("READING", 1, "OVERRIDE", "x", "instrument swapped").reason())
                .isEqualTo("instrument swapped");
    }

    private void reinsert(List<Map<String, Object>> rows) {
        for (Map<String, Object> r : rows) {
            admin.jdbc().update("insert into audit_entry (sequence_no, occurred_at, actor_id, actor_name, channel,"
                            + " client, entity_type, entity_id, action, summary, changes, reason, previous_hash,"
                            + " entry_hash) values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)",
                    r.get("sequence_no"), r.get("occurred_at"), r.get("actor_id"), r.get("actor_name"),
                    r.get("channel"), r.get("client"), r.get("entity_type"), r.get("entity_id"), r.get("action"),
                    r.get("summary"), r.get("changes"), r.get("reason"), r.get("previous_hash"), r.get("entry_hash"));
        }
    }
}
