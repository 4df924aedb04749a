package org.dockgate.certificates;

import org.dockgate.platform.CurrentActor;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.security.GeneralSecurityException;
import java.security.KeyStore;
import java.security.PrivateKey;
import java.security.Signature;
import java.security.cert.Certificate;
import java.security.cert.X509Certificate;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Clock;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.dockgate.accounts.AccountService;
import org.dockgate.accounts.Person;
import org.dockgate.audit.AuditEvent;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.dockgate.certificates.SigningAuthority.Kind;
import org.dockgate.certificates.SigningIdentity.Origin;
import org.dockgate.platform.Role;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Who may sign: the lab's CA, imported CAs, and each signer's certificate and key. An ADMIN grants
 * signing rights (the lab's CA then issues the person a certificate), revokes them (no new signatures;
 * documents signed before stay verifiable) or imports the organisation's own CA or a person's
 * certificate and key as PKCS#12. Every change is audited.
 *
 * <p>Keys go to the key store file before the database row is committed; if the transaction then rolls
 * back, the key store keeps an unused entry under a random alias, which nothing refers to.
 */
@Service
public class SigningIdentityService {

    private static final Logger log = LoggerFactory.getLogger(SigningIdentityService.class);
    private static final String IDENTITY_COLUMNS = "id, user_id, origin, subject, issuer, serial_hex,"
            + " fingerprint_sha256, certificate_pem, chain_pem, key_alias, not_before, not_after, granted_by,"
            + " granted_at, revoked_at, revoked_by, revoke_reason, version";

    private final JdbcTemplate jdbc;
    private final SigningKeyStore keys;
    private final AccountService accounts;
    private final ApplicationEventPublisher events;
    private final Clock clock;
    private final String labName;
    private final int validityYears;

    SigningIdentityService(JdbcTemplate jdbc, SigningKeyStore keys, AccountService accounts,
                           ApplicationEventPublisher events, Clock clock,
                           @Value("${dockgate.lab.name:Dockgate laboratory}") String labName,
                           @Value("${dockgate.signing.certificate-validity-years:5}") int validityYears) {
        this.jdbc = jdbc;
        this.keys = keys;
        this.accounts = accounts;
        this.events = events;
        this.clock = clock;
        this.labName = labName;
        this.validityYears = validityYears;
    }

    /** A stored identity with what signing needs: key, chain. Package-private: only signing uses it. */
    record SignerKey(SigningIdentity identity, PrivateKey key, List<X509Certificate> chain) {
    }

    // ---------------------------------------------------------------- lab root

    /**
     * On start: creates the lab's root key and self-signed certificate in the key store when there is
     * none, and records it (once) among the authorities.
     */
    @Transactional
    public SigningAuthority ensureLabRoot() {
        if (!keys.contains(SigningKeyStore.LAB_ROOT_ALIAS)) {
            LabCertificateAuthority.Issued root = LabCertificateAuthority.createRoot(labName, keys.demoPassword(),
                    clock.instant());
            if (keys.putKeyIfAbsent(SigningKeyStore.LAB_ROOT_ALIAS, root.keys().getPrivate(),
                    List.of(root.certificate()))) {
                log.info("Created the lab's signing root {} in {}{}", X509s.subject(root.certificate()), keys.file(),
                        keys.demoPassword() ? " (DEMO key store password)" : "");
            }
        }
        X509Certificate root = keys.keyCertificate(SigningKeyStore.LAB_ROOT_ALIAS).orElseThrow();
        String fingerprint = X509s.fingerprint(root);
        if (authorityIdByFingerprint(fingerprint).isEmpty()) {
            Instant now = clock.instant();
            jdbc.update("insert into signing_authority (kind, subject, fingerprint_sha256, certificate_pem, key_alias,"
                            + " not_after, added_by, added_at, version) values (?, ?, ?, ?, ?, ?, ?, ?, 0)",
                    Kind.LAB_ROOT.name(), X509s.subject(root), fingerprint, X509s.pem(root),
                    SigningKeyStore.LAB_ROOT_ALIAS, utc(root.getNotAfter().toInstant()), "system", utc(now));
            long id = authorityIdByFingerprint(fingerprint).orElseThrow();
            events.publishEvent(AuditEvent.of("SIGNING_AUTHORITY", id, "CREATE",
                            "Lab signing root created: " + X509s.subject(root)
                                    + (keys.demoPassword() ? " (demo key store password)" : ""))
                    .withChanges(List.of(FieldChange.of("subject", null, X509s.subject(root)),
                            FieldChange.of("fingerprintSha256", null, fingerprint),
                            FieldChange.of("demoKey", null, keys.demoPassword())))
                    .by(AuditEvent.Actor.SYSTEM));
        }
        return authorities().stream().filter(a -> a.fingerprintSha256().equals(fingerprint)).findFirst().orElseThrow();
    }

    // ---------------------------------------------------------------- reads

    @Transactional(readOnly = true)
    public SigningOverview overview() {
        List<SigningAuthority> authorities = authorities();
        return new SigningOverview(keys.demoPassword(), authorities.stream().filter(SigningAuthority::issuing).findFirst(),
                keys.file().toString(), authorities, identities());
    }

    /** True when the key store is protected by the published demo password. */
    public boolean demoKey() {
        return keys.demoPassword();
    }

    @Transactional(readOnly = true)
    public List<SigningAuthority> authorities() {
        List<String> trusted = keys.trustAnchors().stream().map(X509s::fingerprint).toList();
        List<Map<String, Object>> rows = jdbc.queryForList("select id, kind, subject, fingerprint_sha256, certificate_pem,"
                + " key_alias, not_after, added_by, added_at from signing_authority order by id");
        List<SigningAuthority> found = new ArrayList<>();
        for (Map<String, Object> row : rows) {
            String fingerprint = (String) row.get("fingerprint_sha256");
            String alias = (String) row.get("key_alias");
            boolean canIssue = keys.keyCertificate(alias).map(c -> X509s.fingerprint(c).equals(fingerprint))
                    .orElse(false);
            found.add(new SigningAuthority(((Number) row.get("id")).longValue(), Kind.valueOf((String) row.get("kind")),
                    (String) row.get("subject"), fingerprint, (String) row.get("certificate_pem"),
                    CurrentActor.instant(row.get("not_after")), (String) row.get("added_by"), CurrentActor.instant(row.get("added_at")),
                    trusted.contains(fingerprint), canIssue, false));
        }
        // The issuing CA: the most recently imported CA that can issue, else the lab's own root.
        Optional<SigningAuthority> issuing = found.stream()
                .filter(a -> a.canIssue() && a.kind() == Kind.IMPORTED_CA).reduce((a, b) -> b)
                .or(() -> found.stream().filter(a -> a.canIssue() && a.kind() == Kind.LAB_ROOT).reduce((a, b) -> b));
        return found.stream().map(a -> issuing.isPresent() && issuing.get().id() == a.id()
                ? new SigningAuthority(a.id(), a.kind(), a.subject(), a.fingerprintSha256(), a.certificatePem(),
                a.notAfter(), a.addedBy(), a.addedAt(), a.trusted(), a.canIssue(), true) : a).toList();
    }

    @Transactional(readOnly = true)
    public List<SigningIdentity> identities() {
        Map<Long, Person> people = accounts.all().stream().collect(Collectors.toMap(Person::id, Function.identity()));
        return jdbc.query("select " + IDENTITY_COLUMNS + " from signing_identity order by granted_at desc, id desc",
                (rs, i) -> identity(rs, people));
    }

    @Transactional(readOnly = true)
    public Optional<SigningIdentity> identity(long id) {
        Map<Long, Person> people = accounts.all().stream().collect(Collectors.toMap(Person::id, Function.identity()));
        return jdbc.query("select " + IDENTITY_COLUMNS + " from signing_identity where id = ?",
                (rs, i) -> identity(rs, people), id).stream().findFirst();
    }

    /** The person's current (not revoked) signing identity, if any. */
    @Transactional(readOnly = true)
    public Optional<SigningIdentity> activeIdentity(String username) {
        return identities().stream().filter(i -> i.username().equals(username) && i.active()).findFirst();
    }

    /** The identity whose certificate has this SHA-256 fingerprint, revoked or not. */
    @Transactional(readOnly = true)
    public Optional<SigningIdentity> byFingerprint(String fingerprintSha256) {
        return identities().stream().filter(i -> i.fingerprintSha256().equals(fingerprintSha256)).findFirst();
    }

    /** The CA certificates signatures must chain to: those in the key store (never ones the database alone names). */
    List<X509Certificate> trustAnchors() {
        return keys.trustAnchors();
    }

    /**
     * The key and chain of the person's active identity, checked: not revoked, account enabled, key present
     * and matching the registered certificate, certificate valid now.
     */
    @Transactional(readOnly = true)
    SignerKey signerKey(String username) {
        Person person = accounts.byUsername(username).orElseThrow(() ->
                new IllegalArgumentException("There is no account '" + username + "'."));
        if (!person.enabled()) {
            throw new IllegalStateException("The account of " + person.displayName() + " is disabled; it cannot sign.");
        }
        SigningIdentity identity = activeIdentity(username).orElseThrow(() -> new IllegalStateException(
                person.displayName() + " has no signing rights (or they were revoked). An ADMIN grants them on the"
                        + " Signing identities page."));
        String alias = jdbc.queryForObject("select key_alias from signing_identity where id = ?", String.class,
                identity.id());
        KeyStore.PrivateKeyEntry entry = keys.privateKey(alias).orElseThrow(() -> new IllegalStateException(
                "The signing key of " + person.displayName() + " is missing from the key store " + keys.file()
                        + ". Revoke this identity and grant signing rights again."));
        List<X509Certificate> chain = new ArrayList<>();
        for (Certificate c : entry.getCertificateChain()) {
            chain.add((X509Certificate) c);
        }
        if (!X509s.fingerprint(chain.get(0)).equals(identity.fingerprintSha256())) {
            throw new IllegalStateException("The key store entry of " + person.displayName()
                    + " does not hold the registered certificate; it will not be used.");
        }
        Instant now = clock.instant();
        if (now.isBefore(identity.notBefore()) || now.isAfter(identity.notAfter())) {
            throw new IllegalStateException("The signing certificate of " + person.displayName() + " is valid from "
                    + identity.notBefore() + " to " + identity.notAfter() + ", not now. Grant signing rights again.");
        }
        return new SignerKey(identity, entry.getPrivateKey(), List.copyOf(chain));
    }

    // ---------------------------------------------------------------- changes

    /**
     * Grants signing rights: the issuing CA issues the person a new EC P-256 signing certificate, its key
     * goes to the key store. The person needs an enabled account with the role ENGINEER or SUPERVISOR
     * (those who approve lots) and no active identity.
     */
    @Transactional
    public SigningIdentity grant(String username, String actingUsername) {
        Person person = signer(username);
        SigningAuthority issuing = authorities().stream().filter(SigningAuthority::issuing).findFirst()
                .orElseThrow(() -> new IllegalStateException("No certification authority can issue certificates:"
                        + " the key store holds no CA key. Import the organisation's CA with its key."));
        String caAlias = jdbc.queryForObject("select key_alias from signing_authority where id = ?", String.class,
                issuing.id());
        KeyStore.PrivateKeyEntry ca = keys.privateKey(caAlias).orElseThrow();
        List<X509Certificate> caChain = new ArrayList<>();
        for (Certificate c : ca.getCertificateChain()) {
            caChain.add((X509Certificate) c);
        }
        LabCertificateAuthority.Issued issued = LabCertificateAuthority.issueSigner(person.displayName(),
                person.username(), labName, ca.getPrivateKey(), caChain.get(0), clock.instant(), validityYears);
        List<X509Certificate> chain = new ArrayList<>();
        chain.add(issued.certificate());
        chain.addAll(caChain);
        String alias = SigningKeyStore.SIGNER_PREFIX + UUID.randomUUID();
        keys.putKey(alias, issued.keys().getPrivate(), chain);
        long id = insertIdentity(person, Origin.ISSUED, chain, alias, issuing.id(), actingUsername);
        SigningIdentity identity = identity(id).orElseThrow();
        events.publishEvent(AuditEvent.of("SIGNING_IDENTITY", id, "GRANT",
                        "Signing rights granted to " + person.username() + ": certificate " + identity.serialHex()
                                + " issued by " + X509s.commonName(identity.issuer()))
                .withChanges(identityChanges(identity)));
        return identity;
    }

    /**
     * Revokes signing rights from now on: no new signatures with this certificate. Documents signed before
     * remain verifiable (the certificate and its trust stay). The expected version guards against a
     * concurrent change.
     */
    @Transactional
    public SigningIdentity revoke(long identityId, long expectedVersion, String reason, String actingUsername) {
        if (reason == null || reason.isBlank()) {
            throw new IllegalArgumentException("Say why the signing rights are revoked.");
        }
        SigningIdentity identity = identity(identityId).orElseThrow(() ->
                new IllegalArgumentException("There is no signing identity " + identityId + "."));
        if (identity.version() != expectedVersion) {
            throw new ObjectOptimisticLockingFailureException("signing_identity", identityId);
        }
        if (!identity.active()) {
            throw new IllegalStateException("The signing rights of " + identity.username() + " were already revoked on "
                    + identity.revokedAt() + ".");
        }
        Instant now = clock.instant();
        int changed = jdbc.update("update signing_identity set revoked_at = ?, revoked_by = ?, revoke_reason = ?,"
                        + " version = version + 1 where id = ? and version = ? and revoked_at is null",
                utc(now), actingUsername, clip(reason.strip(), 2000), identityId, expectedVersion);
        if (changed != 1) {
            throw new ObjectOptimisticLockingFailureException("signing_identity", identityId);
        }
        events.publishEvent(AuditEvent.of("SIGNING_IDENTITY", identityId, "REVOKE",
                        "Signing rights of " + identity.username() + " revoked (certificate " + identity.serialHex() + ")")
                .withChanges(List.of(FieldChange.of("revokedAt", null, now)))
                .because(reason.strip()));
        return identity(identityId).orElseThrow();
    }

    /**
     * Imports a CA from a PKCS#12 file: trusted for verification from then on and, when the file holds its
     * private key, the CA that issues new signing certificates (instead of the lab's own root).
     */
    @Transactional
    public SigningAuthority importAuthority(byte[] pkcs12, char[] password, String actingUsername) {
        KeyStore uploaded = readPkcs12(pkcs12, password);
        Optional<KeyStore.PrivateKeyEntry> keyEntry = firstKeyEntry(uploaded, password);
        X509Certificate ca;
        List<X509Certificate> chain = new ArrayList<>();
        if (keyEntry.isPresent()) {
            for (Certificate c : keyEntry.get().getCertificateChain()) {
                chain.add((X509Certificate) c);
            }
            ca = chain.get(0);
            requireKeyMatches(keyEntry.get().getPrivateKey(), ca);
        } else {
            ca = firstCertificate(uploaded).orElseThrow(() ->
                    new IllegalArgumentException("The PKCS#12 file holds no certificate."));
            chain.add(ca);
        }
        if (!X509s.isCa(ca)) {
            throw new IllegalArgumentException("The certificate " + X509s.subject(ca)
                    + " is not a CA certificate (basic constraints CA and key usage keyCertSign).");
        }
        Instant now = clock.instant();
        if (now.isAfter(ca.getNotAfter().toInstant())) {
            throw new IllegalArgumentException("The CA certificate " + X509s.subject(ca) + " expired on "
                    + ca.getNotAfter().toInstant() + ".");
        }
        String fingerprint = X509s.fingerprint(ca);
        if (authorityIdByFingerprint(fingerprint).isPresent()) {
            throw new IllegalStateException("The CA " + X509s.subject(ca) + " is already known.");
        }
        String alias = SigningKeyStore.CA_PREFIX + UUID.randomUUID();
        if (keyEntry.isPresent()) {
            keys.putKey(alias, keyEntry.get().getPrivateKey(), chain);
        } else {
            keys.putCertificate(alias, ca);
        }
        jdbc.update("insert into signing_authority (kind, subject, fingerprint_sha256, certificate_pem, key_alias,"
                        + " not_after, added_by, added_at, version) values (?, ?, ?, ?, ?, ?, ?, ?, 0)",
                Kind.IMPORTED_CA.name(), X509s.subject(ca), fingerprint, X509s.pem(ca),
                keyEntry.isPresent() ? alias : null, utc(ca.getNotAfter().toInstant()), actingUsername, utc(now));
        long id = authorityIdByFingerprint(fingerprint).orElseThrow();
        events.publishEvent(AuditEvent.of("SIGNING_AUTHORITY", id, "IMPORT",
                        "CA imported: " + X509s.subject(ca) + (keyEntry.isPresent() ? " (with its key: issues new"
                                + " signing certificates)" : " (certificate only: trusted for verification)"))
                .withChanges(List.of(FieldChange.of("subject", null, X509s.subject(ca)),
                        FieldChange.of("fingerprintSha256", null, fingerprint),
                        FieldChange.of("withKey", null, keyEntry.isPresent()))));
        return authorities().stream().filter(a -> a.id() == id).findFirst().orElseThrow();
    }

    /**
     * Imports a person's own signing certificate and key (PKCS#12). The certificate must allow signing
     * and chain to a trusted CA (the lab's root or an imported CA), valid now.
     */
    @Transactional
    public SigningIdentity importIdentity(String username, byte[] pkcs12, char[] password, String actingUsername) {
        Person person = signer(username);
        KeyStore uploaded = readPkcs12(pkcs12, password);
        KeyStore.PrivateKeyEntry entry = firstKeyEntry(uploaded, password).orElseThrow(() ->
                new IllegalArgumentException("The PKCS#12 file holds no private key; a signer's file needs the key"
                        + " and its certificate."));
        List<X509Certificate> chain = new ArrayList<>();
        for (Certificate c : entry.getCertificateChain()) {
            chain.add((X509Certificate) c);
        }
        X509Certificate certificate = chain.get(0);
        requireKeyMatches(entry.getPrivateKey(), certificate);
        LabCertificateAuthority.signatureAlgorithm(entry.getPrivateKey());
        if (!X509s.maySign(certificate)) {
            throw new IllegalArgumentException("The certificate " + X509s.subject(certificate)
                    + " does not allow signing (key usage digitalSignature or nonRepudiation).");
        }
        if (certificate.getBasicConstraints() >= 0) {
            throw new IllegalArgumentException("The certificate " + X509s.subject(certificate)
                    + " is a CA certificate; import it as a CA instead.");
        }
        Instant now = clock.instant();
        X509s.PathResult path = X509s.validatePath(certificate, chain.subList(1, chain.size()), keys.trustAnchors(), now);
        if (!path.trusted()) {
            throw new IllegalArgumentException("The certificate " + X509s.subject(certificate)
                    + " does not chain to a trusted CA: " + path.problem()
                    + ". Import the CA that issued it first.");
        }
        String fingerprint = X509s.fingerprint(certificate);
        if (jdbc.queryForObject("select count(*) from signing_identity where fingerprint_sha256 = ?", Long.class,
                fingerprint) > 0) {
            throw new IllegalStateException("This certificate is already registered as a signing identity.");
        }
        String alias = SigningKeyStore.SIGNER_PREFIX + UUID.randomUUID();
        keys.putKey(alias, entry.getPrivateKey(), chain);
        Long authorityId = authorityIdByFingerprint(X509s.fingerprint(path.anchor().get())).orElse(null);
        long id = insertIdentity(person, Origin.IMPORTED, chain, alias, authorityId, actingUsername);
        SigningIdentity identity = identity(id).orElseThrow();
        events.publishEvent(AuditEvent.of("SIGNING_IDENTITY", id, "IMPORT",
                        "Signing certificate of " + person.username() + " imported: " + identity.serialHex()
                                + " issued by " + X509s.commonName(identity.issuer()))
                .withChanges(identityChanges(identity)));
        return identity;
    }

    // ---------------------------------------------------------------- helpers

    private Person signer(String username) {
        Person person = accounts.byUsername(username == null ? "" : username.strip()).orElseThrow(() ->
                new IllegalArgumentException("There is no account '" + username + "'."));
        if (!person.enabled()) {
            throw new IllegalStateException("The account " + person.username() + " is disabled.");
        }
        if (!person.has(Role.ENGINEER) && !person.has(Role.SUPERVISOR)) {
            throw new IllegalStateException(person.displayName() + " is neither ENGINEER nor SUPERVISOR; only they"
                    + " approve and sign certificates.");
        }
        if (activeIdentity(person.username()).isPresent()) {
            throw new IllegalStateException(person.displayName() + " already has active signing rights; revoke them"
                    + " first to replace the certificate.");
        }
        return person;
    }

    private long insertIdentity(Person person, Origin origin, List<X509Certificate> chain, String alias,
                                Long authorityId, String actingUsername) {
        X509Certificate certificate = chain.get(0);
        String fingerprint = X509s.fingerprint(certificate);
        jdbc.update("insert into signing_identity (user_id, origin, subject, issuer, serial_hex, fingerprint_sha256,"
                        + " certificate_pem, chain_pem, key_alias, authority_id, not_before, not_after, granted_by,"
                        + " granted_at, version) values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, 0)",
                person.id(), origin.name(), X509s.subject(certificate), X509s.issuer(certificate),
                X509s.serialHex(certificate), fingerprint, X509s.pem(certificate),
                X509s.pem(chain.subList(1, chain.size())), alias, authorityId,
                utc(certificate.getNotBefore().toInstant()), utc(certificate.getNotAfter().toInstant()),
                actingUsername == null ? "system" : actingUsername, utc(clock.instant()));
        return jdbc.queryForObject("select id from signing_identity where fingerprint_sha256 = ?", Long.class,
                fingerprint);
    }

    private static List<FieldChange> identityChanges(SigningIdentity identity) {
        return List.of(FieldChange.of("user", null, identity.username()),
                FieldChange.of("subject", null, identity.subject()),
                FieldChange.of("issuer", null, identity.issuer()),
                FieldChange.of("serial", null, identity.serialHex()),
                FieldChange.of("fingerprintSha256", null, identity.fingerprintSha256()),
                FieldChange.of("validUntil", null, identity.notAfter()));
    }

    private Optional<Long> authorityIdByFingerprint(String fingerprint) {
        return jdbc.queryForList("select id from signing_authority where fingerprint_sha256 = ?", Long.class, fingerprint)
                .stream().findFirst();
    }

    private SigningIdentity identity(ResultSet rs, Map<Long, Person> people) throws SQLException {
        long userId = rs.getLong("user_id");
        Person person = people.get(userId);
        String alias = rs.getString("key_alias");
        String fingerprint = rs.getString("fingerprint_sha256");
        boolean keyPresent = keys.keyCertificate(alias).map(c -> X509s.fingerprint(c).equals(fingerprint))
                .orElse(false);
        return new SigningIdentity(rs.getLong("id"), userId, person == null ? "#" + userId : person.username(),
                person == null ? "#" + userId : person.displayName(), Origin.valueOf(rs.getString("origin")),
                rs.getString("subject"), rs.getString("issuer"), rs.getString("serial_hex"), fingerprint,
                rs.getString("certificate_pem"), CurrentActor.instant(rs.getObject("not_before", OffsetDateTime.class)),
                CurrentActor.instant(rs.getObject("not_after", OffsetDateTime.class)), rs.getString("granted_by"),
                CurrentActor.instant(rs.getObject("granted_at", OffsetDateTime.class)),
                CurrentActor.instant(rs.getObject("revoked_at", OffsetDateTime.class)), rs.getString("revoked_by"),
                rs.getString("revoke_reason"), keyPresent, rs.getLong("version"));
    }

    private static KeyStore readPkcs12(byte[] pkcs12, char[] password) {
        if (pkcs12 == null || pkcs12.length == 0) {
            throw new IllegalArgumentException("Choose a PKCS#12 file (.p12 or .pfx).");
        }
        try {
            KeyStore store = KeyStore.getInstance("PKCS12");
            store.load(new ByteArrayInputStream(pkcs12), password == null ? new char[0] : password);
            return store;
        } catch (IOException e) {
            throw new IllegalArgumentException("The file cannot be opened as PKCS#12 with this password: either the"
                    + " password is wrong or the file is not a PKCS#12 (.p12/.pfx) file.");
        } catch (GeneralSecurityException e) {
            throw new IllegalArgumentException("The PKCS#12 file cannot be read (" + e.getMessage() + ").");
        }
    }

    private static Optional<KeyStore.PrivateKeyEntry> firstKeyEntry(KeyStore store, char[] password) {
        try {
            for (String alias : Collections.list(store.aliases())) {
                if (store.isKeyEntry(alias)) {
                    KeyStore.Entry entry = store.getEntry(alias, new KeyStore.PasswordProtection(
                            password == null ? new char[0] : password));
                    if (entry instanceof KeyStore.PrivateKeyEntry key
                            && key.getCertificate() instanceof X509Certificate) {
                        return Optional.of(key);
                    }
                }
            }
            return Optional.empty();
        } catch (GeneralSecurityException e) {
            throw new IllegalArgumentException("The key in the PKCS#12 file cannot be read with this password.");
        }
    }

    private static Optional<X509Certificate> firstCertificate(KeyStore store) {
        try {
            return Collections.list(store.aliases()).stream().sorted(Comparator.naturalOrder()).map(alias -> {
                try {
                    return store.getCertificate(alias);
                } catch (GeneralSecurityException e) {
                    return null;
                }
            }).filter(c -> c instanceof X509Certificate).map(c -> (X509Certificate) c).findFirst();
        } catch (GeneralSecurityException e) {
            throw new IllegalArgumentException("The PKCS#12 file cannot be read.");
        }
    }

    /** The key must belong to the certificate: sign a test value and verify it with the certificate's key. */
    private static void requireKeyMatches(PrivateKey key, X509Certificate certificate) {
        try {
            String algorithm = LabCertificateAuthority.signatureAlgorithm(key);
            byte[] probe = UUID.randomUUID().toString().getBytes(java.nio.charset.StandardCharsets.US_ASCII);
            Signature signer = Signature.getInstance(algorithm);
            signer.initSign(key);
            signer.update(probe);
            byte[] signature = signer.sign();
            Signature verifier = Signature.getInstance(algorithm);
            verifier.initVerify(certificate.getPublicKey());
            verifier.update(probe);
            if (!verifier.verify(signature)) {
                throw new IllegalArgumentException("The private key in the file does not belong to its certificate.");
            }
        } catch (GeneralSecurityException e) {
            throw new IllegalArgumentException("The private key in the file does not belong to its certificate.");
        }
    }

    static OffsetDateTime utc(Instant instant) {
        return instant == null ? null : instant.atOffset(ZoneOffset.UTC);
    }


    private static String clip(String text, int max) {
        return text.length() <= max ? text : text.substring(0, max);
    }
}
