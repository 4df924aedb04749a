package org.dockgate.certificates;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.FileTime;
import java.security.GeneralSecurityException;
import java.security.KeyStore;
import java.security.PrivateKey;
import java.security.cert.Certificate;
import java.security.cert.X509Certificate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;
import org.dockgate.platform.DataDirectory;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * The PKCS#12 key store in {@code <data-dir>/keys/signing-keystore.p12}: the lab root's key, the keys of
 * imported CAs and the signers' keys, all protected by {@code dockgate.signing.keystore-password}. Kept
 * outside the database, like the audit seal key, so that someone with only database access can neither
 * sign nor make Dockgate trust another CA: verification trusts the CAs found here, never a certificate
 * that only the database names.
 *
 * <p>Entries are never removed (a revoked signer's key stays, unused, so nothing that verified before
 * stops verifying). Changes lock the file, re-read it and replace it atomically, so two Dockgate
 * processes on one data folder do not lose each other's entries.
 */
@Component
class SigningKeyStore {

    private static final Logger log = LoggerFactory.getLogger(SigningKeyStore.class);

    /** The documented demo password of application.properties; pages call a key store under it a demo key. */
    static final String DEMO_PASSWORD = "dockgate-demo-keystore";
    static final String LAB_ROOT_ALIAS = "lab-root";
    static final String CA_PREFIX = "ca-";
    static final String SIGNER_PREFIX = "signer-";

    private static final java.util.concurrent.ConcurrentMap<Path, Object> FILE_MONITORS =
            new java.util.concurrent.ConcurrentHashMap<>();

    private final Path file;
    private final Path lockFile;
    private final char[] password;
    private KeyStore cached;
    private FileTime cachedTime;
    private long cachedSize = -1;

    SigningKeyStore(DataDirectory dataDirectory,
                    @Value("${dockgate.signing.keystore-password:}") String password) {
        if (password == null || password.isBlank()) {
            throw new IllegalStateException("No key store password: set dockgate.signing.keystore-password"
                    + " (in the postgres profile, the environment variable DOCKGATE_KEYSTORE_PASSWORD)."
                    + " Dockgate will not create or use signing keys without one.");
        }
        Path folder = dataDirectory.folder("keys");
        this.file = folder.resolve("signing-keystore.p12");
        this.lockFile = folder.resolve("signing-keystore.lock");
        this.password = password.toCharArray();
    }

    /** True when the key store is protected by the published demo password: its keys prove nothing. */
    boolean demoPassword() {
        return Arrays.equals(password, DEMO_PASSWORD.toCharArray());
    }

    Path file() {
        return file;
    }

    boolean contains(String alias) {
        try {
            return load().containsAlias(alias);
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("The signing key store " + file + " cannot be read", e);
        }
    }

    /**
     * The certificate of the key entry under an alias, read without decrypting the key (decrypting costs a
     * PBKDF2 derivation per entry, too slow for listing pages).
     */
    Optional<X509Certificate> keyCertificate(String alias) {
        try {
            KeyStore store = load();
            if (alias == null || !store.isKeyEntry(alias)) {
                return Optional.empty();
            }
            return store.getCertificate(alias) instanceof X509Certificate x509 ? Optional.of(x509) : Optional.empty();
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("The signing key store " + file + " cannot be read", e);
        }
    }

    /** The key and certificate chain stored under an alias, if any. */
    Optional<KeyStore.PrivateKeyEntry> privateKey(String alias) {
        try {
            KeyStore store = load();
            if (!store.isKeyEntry(alias)) {
                return Optional.empty();
            }
            return Optional.of((KeyStore.PrivateKeyEntry) store.getEntry(alias,
                    new KeyStore.PasswordProtection(password)));
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("The signing key '" + alias + "' in " + file + " cannot be used", e);
        }
    }

    /**
     * The CAs whose certificates this lab trusts: every lab root it ever created and every imported CA
     * (the CA certificate itself, with or without its key).
     */
    List<X509Certificate> trustAnchors() {
        try {
            KeyStore store = load();
            List<X509Certificate> anchors = new ArrayList<>();
            for (String alias : Collections.list(store.aliases())) {
                if (alias.equals(LAB_ROOT_ALIAS) || alias.startsWith(LAB_ROOT_ALIAS + "-")
                        || alias.startsWith(CA_PREFIX)) {
                    Certificate certificate = store.getCertificate(alias);
                    if (certificate instanceof X509Certificate x509) {
                        anchors.add(x509);
                    }
                }
            }
            return anchors;
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("The signing key store " + file + " cannot be read", e);
        }
    }

    void putKey(String alias, PrivateKey key, List<X509Certificate> chain) {
        update(store -> {
            try {
                store.setKeyEntry(alias, key, password, chain.toArray(Certificate[]::new));
            } catch (GeneralSecurityException e) {
                throw new IllegalStateException("Cannot store the key '" + alias + "'", e);
            }
        });
    }

    void putCertificate(String alias, X509Certificate certificate) {
        update(store -> {
            try {
                store.setCertificateEntry(alias, certificate);
            } catch (GeneralSecurityException e) {
                throw new IllegalStateException("Cannot store the certificate '" + alias + "'", e);
            }
        });
    }

    /** Adds an entry under the file lock, unless the alias is already taken (first writer wins). */
    boolean putKeyIfAbsent(String alias, PrivateKey key, List<X509Certificate> chain) {
        boolean[] added = {false};
        update(store -> {
            try {
                if (!store.containsAlias(alias)) {
                    store.setKeyEntry(alias, key, password, chain.toArray(Certificate[]::new));
                    added[0] = true;
                }
            } catch (GeneralSecurityException e) {
                throw new IllegalStateException("Cannot store the key '" + alias + "'", e);
            }
        });
        return added[0];
    }

    private void update(Consumer<KeyStore> change) {
        // One JVM-wide monitor per file (two application contexts in one JVM may share a data folder, and
        // a second FileLock from the same JVM would throw), then the file lock against other processes.
        synchronized (FILE_MONITORS.computeIfAbsent(file, f -> new Object())) {
            synchronized (this) {
                try {
                    updateLocked(change);
                } finally {
                    cached = null;
                }
            }
        }
    }

    private void updateLocked(Consumer<KeyStore> change) {
        try (FileChannel channel = FileChannel.open(lockFile, StandardOpenOption.CREATE, StandardOpenOption.WRITE);
             FileLock ignored = channel.lock()) {
            cached = null;
            KeyStore store = load();
            change.accept(store);
            ByteArrayOutputStream bytes = new ByteArrayOutputStream();
            store.store(bytes, password);
            Path temporary = file.resolveSibling(file.getFileName() + ".tmp");
            Files.write(temporary, bytes.toByteArray());
            restrict(temporary);
            try {
                Files.move(temporary, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(temporary, file, StandardCopyOption.REPLACE_EXISTING);
            }
            cached = null;
        } catch (IOException e) {
            throw new UncheckedIOException("Cannot write the signing key store " + file, e);
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("Cannot write the signing key store " + file, e);
        }
    }

    /** The key store as on disk (re-read when the file changed, e.g. by another process). */
    private synchronized KeyStore load() throws GeneralSecurityException {
        try {
            KeyStore store = KeyStore.getInstance("PKCS12");
            if (!Files.exists(file)) {
                store.load(null, password);
                return store;
            }
            FileTime time = Files.getLastModifiedTime(file);
            long size = Files.size(file);
            if (cached != null && time.equals(cachedTime) && size == cachedSize) {
                return cached;
            }
            try {
                store.load(new ByteArrayInputStream(Files.readAllBytes(file)), password);
            } catch (IOException e) {
                throw new IllegalStateException("The signing key store " + file + " cannot be opened with the"
                        + " configured password (dockgate.signing.keystore-password). Use the password it was"
                        + " created with.", e);
            }
            cached = store;
            cachedTime = time;
            cachedSize = size;
            return store;
        } catch (IOException e) {
            throw new UncheckedIOException("Cannot read the signing key store " + file, e);
        }
    }

    private static void restrict(Path path) {
        try {
            Files.setPosixFilePermissions(path, java.nio.file.attribute.PosixFilePermissions.fromString("rw-------"));
        } catch (UnsupportedOperationException | IOException e) {
            log.warn("Cannot restrict the permissions of {}", path);
        }
    }
}
