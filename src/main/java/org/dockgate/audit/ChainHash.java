package org.dockgate.audit;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.HexFormat;

/**
 * The canonical content of an entry and its SHA-256. Each field is written as its length in UTF-8
 * bytes, a colon and the bytes, so no two different entries share a canonical form; absent values are
 * written as {@code -}. The previous entry's hash is part of the content: that is the chain.
 */
final class ChainHash {

    static final String GENESIS = "0".repeat(64);

    private ChainHash() {
    }

    /** Timestamps are kept to the microsecond, the precision both databases store. */
    static Instant truncate(Instant instant) {
        return instant.truncatedTo(ChronoUnit.MICROS);
    }

    static String of(AuditEntry e) {
        return of(e.sequenceNo(), e.occurredAt(), e.actorId(), e.actorName(), e.channel(), e.client(),
                e.entityType(), e.entityId(), e.action(), e.summary(), e.changes(), e.reason(), e.previousHash());
    }

    static String of(long sequenceNo, Instant occurredAt, String actorId, String actorName, String channel,
                     String client, String entityType, String entityId, String action, String summary,
                     String changes, String reason, String previousHash) {
        MessageDigest digest = sha256();
        for (String field : new String[] {Long.toString(sequenceNo), truncate(occurredAt).toString(), actorId,
            actorName, channel, client, entityType, entityId, action, summary, changes, reason, previousHash}) {
            if (field == null) {
                digest.update((byte) '-');
            } else {
                byte[] bytes = field.getBytes(StandardCharsets.UTF_8);
                digest.update((bytes.length + ":").getBytes(StandardCharsets.US_ASCII));
                digest.update(bytes);
            }
            digest.update((byte) '|');
        }
        return HexFormat.of().formatHex(digest.digest());
    }

    static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is not available", e);
        }
    }
}
