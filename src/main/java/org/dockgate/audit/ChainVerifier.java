package org.dockgate.audit;

import java.util.ArrayList;
import java.util.List;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Recomputes the hash chain from the stored entries and checks it against the seals, so that an entry
 * altered or removed in the database (bypassing the application) and a cut-off tail are detected and
 * located.
 */
@Service
public class ChainVerifier {

    private final JdbcTemplate jdbc;
    private final AuditSealer sealer;

    ChainVerifier(JdbcTemplate jdbc, AuditSealer sealer) {
        this.jdbc = jdbc;
        this.sealer = sealer;
    }

    /**
     * Walks every entry in sequence order: entry n must have sequence number n, carry the hash of entry
     * n − 1 as its previous hash (the genesis value for n = 1), and its stored hash must equal the SHA-256
     * of its canonical content. Then every seal (from the seal table and the seal files outside the
     * database) must find its sealed entry present with the sealed head hash, and a valid signature.
     */
    @Transactional(readOnly = true)
    public ChainVerification verify() {
        Walk walk = new Walk(sealer.sealedCounts());
        jdbc.query(con -> {
            var statement = con.prepareStatement("select " + AuditReader.COLUMNS
                    + " from audit_entry order by sequence_no");
            statement.setFetchSize(2000);
            return statement;
        }, rs -> {
            walk.accept(AuditReader.ROW.mapRow(rs, 0));
        });
        List<String> problems = new ArrayList<>(walk.problems);
        Long firstBroken = walk.firstBroken;
        for (AuditSealer.SealCheck check : sealer.checkAll(walk.sealedHashes, walk.expected - 1)) {
            if (!check.ok()) {
                problems.add(check.problem());
                if (firstBroken == null || check.firstMissing() < firstBroken) {
                    firstBroken = check.firstMissing();
                }
            }
        }
        return new ChainVerification(problems.isEmpty(), walk.count, firstBroken, problems);
    }

    private static final class Walk {
        long count;
        long expected = 1;
        String previous = ChainHash.GENESIS;
        Long firstBroken;
        final List<String> problems = new ArrayList<>();
        /** Only the hashes the seals need: holding every hash would not scale to millions of entries. */
        final java.util.Set<Long> sealedCounts;
        final java.util.Map<Long, String> sealedHashes = new java.util.HashMap<>();

        Walk(java.util.Set<Long> sealedCounts) {
            this.sealedCounts = sealedCounts;
        }

        void accept(AuditEntry e) {
            count++;
            if (e.sequenceNo() != expected) {
                fail(expected, "Entries " + expected + " to " + (e.sequenceNo() - 1) + " are missing.");
            } else if (!e.previousHash().equals(previous)) {
                fail(e.sequenceNo(), "Entry " + e.sequenceNo() + " does not follow entry " + (e.sequenceNo() - 1)
                        + ": its previous hash does not match.");
            } else if (!ChainHash.of(e).equals(e.entryHash())) {
                fail(e.sequenceNo(), "Entry " + e.sequenceNo() + " was altered: its content no longer matches its hash.");
            }
            if (sealedCounts.contains(e.sequenceNo())) {
                sealedHashes.put(e.sequenceNo(), e.entryHash());
            }
            previous = e.entryHash();
            expected = e.sequenceNo() + 1;
        }

        private void fail(long sequence, String problem) {
            if (firstBroken == null) {
                firstBroken = sequence;
            }
            if (problems.size() < 20) {
                problems.add(problem);
            }
        }
    }
}
