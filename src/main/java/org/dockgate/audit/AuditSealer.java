package org.dockgate.audit;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.GeneralSecurityException;
import java.security.KeyFactory;
import java.security.KeyPair;
import java.security.KeyPairGenerator;
import java.security.PrivateKey;
import java.security.PublicKey;
import java.security.Signature;
import java.security.spec.PKCS8EncodedKeySpec;
import java.security.spec.X509EncodedKeySpec;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Base64;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import org.dockgate.audit.AuditEvent.Actor;
import org.dockgate.platform.DataDirectory;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.scheduling.annotation.Scheduled;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;
import org.springframework.transaction.support.TransactionSynchronization;
import org.springframework.transaction.support.TransactionSynchronizationManager;

/**
 * Seals the head of the chain: the entry count and the hash of the last entry, signed with the lab's
 * Ed25519 seal key, stored in the database, written as a small text file to {@code <data-dir>/seals/}
 * and exportable. A seal kept outside the database makes a cut-off tail detectable: the chain may be
 * intact up to its new end, but a seal then covers entries that no longer exist.
 *
 * <p>The seal key lives in {@code <data-dir>/keys/} (created on first use), not in the database, so
 * someone with only database access cannot forge a seal.
 */
@Service
public class AuditSealer {

    private static final Logger log = LoggerFactory.getLogger(AuditSealer.class);
    static final String HEADER = "DOCKGATE AUDIT SEAL v1";

    private final JdbcTemplate jdbc;
    private final AuditTrail trail;
    private final DataDirectory dataDirectory;
    private final Clock clock;
    private final String labName;
    private volatile KeyPair keys;

    AuditSealer(JdbcTemplate jdbc, AuditTrail trail, DataDirectory dataDirectory, Clock clock,
                @Value("${dockgate.lab.name:Dockgate laboratory}") String labName) {
        this.jdbc = jdbc;
        this.trail = trail;
        this.dataDirectory = dataDirectory;
        this.clock = clock;
        this.labName = labName;
    }

    /** A stored seal. */
    public record Seal(long sequenceNo, long sealedCount, String headHash, Instant sealedAt, String text) {
    }

    /** The outcome of checking one seal against the chain. */
    record SealCheck(boolean ok, String problem, long firstMissing) {
    }

    /** The daily seal, shortly after midnight UTC; skipped when nothing was appended since the last seal. */
    @Scheduled(cron = "${dockgate.audit.seal-cron:0 5 0 * * *}", zone = "UTC")
    public void sealDaily() {
        try {
            Long last = jdbc.queryForObject("select max(sealed_count) from audit_seal", Long.class);
            Long head = jdbc.queryForObject("select last_sequence from audit_head where id = 1", Long.class);
            if (head != null && head > 0 && (last == null || head > last + 1)) {
                seal("daily seal");
            }
        } catch (RuntimeException e) {
            log.error("The daily audit seal failed", e);
        }
    }

    /**
     * Seals the current head: locks it, signs "count and head hash", appends a SEAL entry to the chain
     * (so the seal is itself recorded), stores the seal and, after commit, writes its file.
     */
    @Transactional
    public Seal seal(String occasion) {
        var head = jdbc.queryForMap("select last_sequence, last_hash from audit_head where id = 1 for update");
        long count = ((Number) head.get("last_sequence")).longValue();
        String headHash = (String) head.get("last_hash");
        Instant at = ChainHash.truncate(clock.instant());
        String text = sign(count, headHash, at);
        long sequence = trail.appendNow(AuditEvent.of("AUDIT_TRAIL", "chain", "SEAL",
                "Sealed " + count + " entries, head " + headHash.substring(0, 16) + "… (" + occasion + ")"));
        jdbc.update("insert into audit_seal (sequence_no, sealed_count, head_hash, sealed_at, seal_text)"
                + " values (?, ?, ?, ?, ?)", sequence, count, headHash, at.atOffset(ZoneOffset.UTC), text);
        Seal seal = new Seal(sequence, count, headHash, at, text);
        if (TransactionSynchronizationManager.isSynchronizationActive()) {
            TransactionSynchronizationManager.registerSynchronization(new TransactionSynchronization() {
                @Override
                public void afterCommit() {
                    writeFile(seal);
                }
            });
        } else {
            writeFile(seal);
        }
        return seal;
    }

    @Transactional(readOnly = true)
    public List<Seal> seals() {
        return jdbc.query("select sequence_no, sealed_count, head_hash, sealed_at, seal_text from audit_seal"
                + " order by sequence_no desc", (rs, i) -> new Seal(rs.getLong(1), rs.getLong(2), rs.getString(3),
                rs.getObject(4, java.time.OffsetDateTime.class).toInstant(), rs.getString(5)));
    }

    @Transactional(readOnly = true)
    public Optional<Seal> seal(long sequenceNo) {
        return seals().stream().filter(s -> s.sequenceNo() == sequenceNo).findFirst();
    }

    /** Counts covered by any seal, in the database or in the seal folder. */
    Set<Long> sealedCounts() {
        Set<Long> counts = new TreeSet<>();
        allSealTexts().keySet().forEach(text -> parse(text).ifPresent(p -> counts.add(p.count())));
        return counts;
    }

    /**
     * Checks every seal: its signature must verify with the seal key, and the entry it covers must
     * exist with the sealed hash.
     *
     * @param hashes       stored hashes at the sealed counts
     * @param lastSequence the last sequence number found in the chain
     */
    List<SealCheck> checkAll(Map<Long, String> hashes, long lastSequence) {
        List<SealCheck> checks = new ArrayList<>();
        for (Map.Entry<String, String> found : allSealTexts().entrySet()) {
            checks.add(check(found.getKey(), found.getValue(), hashes, lastSequence));
        }
        return checks;
    }

    /** Checks one seal text (for example one an auditor kept) against the chain as it is now. */
    @Transactional(readOnly = true)
    public String checkText(String text) {
        Optional<Parsed> parsed = parse(text);
        if (parsed.isEmpty()) {
            return "This is not a Dockgate audit seal.";
        }
        long last = Optional.ofNullable(jdbc.queryForObject("select max(sequence_no) from audit_entry", Long.class))
                .orElse(0L);
        List<String> hash = jdbc.queryForList("select entry_hash from audit_entry where sequence_no = ?",
                String.class, parsed.get().count());
        SealCheck check = check(text, "the pasted seal",
                hash.isEmpty() ? Map.of() : Map.of(parsed.get().count(), hash.get(0)), last);
        return check.ok() ? "The seal is genuine and the trail still holds the " + parsed.get().count()
                + " entries it covers, unchanged." : check.problem();
    }

    private SealCheck check(String text, String where, Map<Long, String> hashes, long lastSequence) {
        Optional<Parsed> parsed = parse(text);
        if (parsed.isEmpty()) {
            return new SealCheck(false, "The seal in " + where + " cannot be read.", lastSequence + 1);
        }
        Parsed seal = parsed.get();
        if (!signatureValid(seal)) {
            return new SealCheck(false, "The seal in " + where + " has an invalid signature.", seal.count());
        }
        if (seal.count() == 0) {
            return new SealCheck(true, null, 0);
        }
        if (seal.count() > lastSequence) {
            return new SealCheck(false, "The trail ends at entry " + lastSequence + ", but the seal of "
                    + seal.sealedAt() + " covers " + seal.count() + " entries: entries " + (lastSequence + 1)
                    + " to " + seal.count() + " were removed.", lastSequence + 1);
        }
        String stored = hashes.get(seal.count());
        if (stored == null) {
            return new SealCheck(false, "Entry " + seal.count() + ", covered by the seal of " + seal.sealedAt()
                    + ", is missing.", seal.count());
        }
        if (!stored.equals(seal.headHash())) {
            return new SealCheck(false, "Entry " + seal.count() + " no longer has the hash sealed on "
                    + seal.sealedAt() + ".", seal.count());
        }
        return new SealCheck(true, null, 0);
    }

    /** Seal texts keyed by text, valued by where they were found; the same seal in both places counts once. */
    private Map<String, String> allSealTexts() {
        Map<String, String> texts = new LinkedHashMap<>();
        jdbc.queryForList("select seal_text from audit_seal order by sequence_no", String.class)
                .forEach(t -> texts.put(t, "the database"));
        Path folder = dataDirectory.folder("seals");
        try (DirectoryStream<Path> files = Files.newDirectoryStream(folder, "seal-*.txt")) {
            for (Path file : files) {
                texts.putIfAbsent(Files.readString(file, StandardCharsets.UTF_8), "file " + file.getFileName());
            }
        } catch (IOException e) {
            throw new UncheckedIOException("Cannot read the seal folder " + folder, e);
        }
        return texts;
    }

    private record Parsed(long count, String headHash, String sealedAt, String keyFingerprint, String signed,
                          byte[] signature) {
    }

    private String sign(long count, String headHash, Instant at) {
        String body = HEADER + "\n"
                + "lab: " + labName.replace('\n', ' ') + "\n"
                + "entries: " + count + "\n"
                + "head-sha256: " + headHash + "\n"
                + "sealed-at: " + at + "\n"
                + "key-sha256: " + fingerprint(keys().getPublic()) + "\n";
        try {
            Signature signer = Signature.getInstance("Ed25519");
            signer.initSign(keys().getPrivate());
            signer.update(body.getBytes(StandardCharsets.UTF_8));
            return body + "signature-ed25519: " + Base64.getEncoder().encodeToString(signer.sign()) + "\n";
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("Cannot sign the audit seal", e);
        }
    }

    private Optional<Parsed> parse(String text) {
        if (text == null) {
            return Optional.empty();
        }
        String normalised = text.replace("\r\n", "\n").strip() + "\n";
        if (!normalised.startsWith(HEADER + "\n")) {
            return Optional.empty();
        }
        int cut = normalised.indexOf("signature-ed25519: ");
        if (cut < 0) {
            return Optional.empty();
        }
        Map<String, String> fields = new LinkedHashMap<>();
        for (String line : normalised.split("\n")) {
            int colon = line.indexOf(": ");
            if (colon > 0) {
                fields.put(line.substring(0, colon), line.substring(colon + 2).trim());
            }
        }
        try {
            return Optional.of(new Parsed(Long.parseLong(fields.get("entries")), fields.get("head-sha256"),
                    fields.get("sealed-at"), fields.get("key-sha256"), normalised.substring(0, cut),
                    Base64.getDecoder().decode(fields.get("signature-ed25519"))));
        } catch (RuntimeException e) {
            return Optional.empty();
        }
    }

    private boolean signatureValid(Parsed seal) {
        try {
            Signature verifier = Signature.getInstance("Ed25519");
            verifier.initVerify(keys().getPublic());
            verifier.update(seal.signed().getBytes(StandardCharsets.UTF_8));
            return verifier.verify(seal.signature());
        } catch (GeneralSecurityException e) {
            return false;
        }
    }

    private void writeFile(Seal seal) {
        Path file = dataDirectory.folder("seals").resolve("seal-" + String.format("%012d", seal.sealedCount())
                + "-" + seal.sealedAt().toEpochMilli() + ".txt");
        try {
            Files.writeString(file, seal.text(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            log.error("Cannot write the audit seal file {}", file, e);
        }
    }

    private KeyPair keys() {
        KeyPair loaded = keys;
        if (loaded == null) {
            synchronized (this) {
                if (keys == null) {
                    keys = loadOrCreateKeys();
                }
                loaded = keys;
            }
        }
        return loaded;
    }

    private KeyPair loadOrCreateKeys() {
        Path folder = dataDirectory.folder("keys");
        Path privateFile = folder.resolve("audit-seal-ed25519.p8");
        Path publicFile = folder.resolve("audit-seal-ed25519.pub");
        try {
            KeyFactory factory = KeyFactory.getInstance("Ed25519");
            if (Files.exists(privateFile) && Files.exists(publicFile)) {
                PrivateKey privateKey = factory.generatePrivate(new PKCS8EncodedKeySpec(Files.readAllBytes(privateFile)));
                PublicKey publicKey = factory.generatePublic(new X509EncodedKeySpec(Files.readAllBytes(publicFile)));
                return new KeyPair(publicKey, privateKey);
            }
            KeyPair created = KeyPairGenerator.getInstance("Ed25519").generateKeyPair();
            Files.write(publicFile, created.getPublic().getEncoded());
            Files.write(privateFile, created.getPrivate().getEncoded());
            restrict(privateFile);
            log.info("Created the audit seal key in {}", folder);
            return created;
        } catch (IOException e) {
            throw new UncheckedIOException("Cannot read or create the audit seal key in " + folder, e);
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("The audit seal key in " + folder + " cannot be used", e);
        }
    }

    private static void restrict(Path file) {
        try {
            Files.setPosixFilePermissions(file, java.nio.file.attribute.PosixFilePermissions.fromString("rw-------"));
        } catch (UnsupportedOperationException | IOException e) {
            log.warn("Cannot restrict the permissions of {}", file);
        }
    }

    /** The seal key's public part, for auditors who check seal texts elsewhere. */
    public String publicKeyBase64() {
        return Base64.getEncoder().encodeToString(keys().getPublic().getEncoded());
    }

    static String fingerprint(PublicKey key) {
        return HexFormat.of().formatHex(ChainHash.sha256().digest(key.getEncoded()));
    }

    static Actor sealActor() {
        return Actor.SYSTEM;
    }
}
