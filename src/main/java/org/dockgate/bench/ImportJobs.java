package org.dockgate.bench;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermission;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.Set;
import org.dockgate.platform.DataDirectory;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.core.io.FileSystemResource;
import org.springframework.security.concurrent.DelegatingSecurityContextRunnable;
import org.springframework.stereotype.Component;

/**
 * Imports run in the background for the bench page, which polls their progress. The upload is copied
 * to a temporary file first (the request's copy is gone when the request ends); the job runs as the
 * person who started it (their security context goes with it, so the readings and the audit entry
 * name them). Jobs are kept in memory until the application stops.
 */
@Component
public class ImportJobs {

    private static final Logger log = LoggerFactory.getLogger(ImportJobs.class);

    /** Where a job stands. */
    public enum State { RUNNING, DONE, FAILED }

    /**
     * A snapshot of one job.
     *
     * @param id             the job id
     * @param lotId          the lot
     * @param state          running, done or failed
     * @param rowsRead       rows read so far (of the checking pass)
     * @param bytesRead      characters read so far
     * @param bytesTotal     the file's size
     * @param outcome        the result, once done
     * @param failure        why it failed, once failed
     */
    public record Job(String id, long lotId, State state, long rowsRead, long bytesRead, long bytesTotal,
                      ImportOutcome outcome, String failure) {

        /** @return 0–100 (written into the job's JSON as {@code percent}) */
        @com.fasterxml.jackson.annotation.JsonProperty("percent")
        public int percent() {
            if (state != State.RUNNING) {
                return 100;
            }
            return bytesTotal <= 0 ? 0 : (int) Math.min(99, 100 * bytesRead / bytesTotal);
        }
    }

    private final ReadingImport imports;
    private final Map<String, Job> jobs = new ConcurrentHashMap<>();
    private final ExecutorService executor = Executors.newFixedThreadPool(2, r -> {
        Thread t = new Thread(r, "bench-import");
        t.setDaemon(true);
        return t;
    });

    /** Owner-only: an upload may carry a supplier's data and must not be readable by other local users. */
    static final Set<PosixFilePermission> OWNER_ONLY = PosixFilePermissions.fromString("rw-------");
    static final String PREFIX = "dockgate-import-";

    private final Path folder;

    @org.springframework.beans.factory.annotation.Autowired
    ImportJobs(ReadingImport imports, DataDirectory data) {
        this(imports, data.folder("tmp"));
    }

    ImportJobs(ReadingImport imports, Path folder) {
        this.imports = imports;
        this.folder = folder;
        restrict(folder, PosixFilePermissions.fromString("rwx------"));
        removeLeftovers();
    }

    /** Copies left by a crash (a job's copy is deleted when the job ends) are removed at start. */
    void removeLeftovers() {
        try (DirectoryStream<Path> left = Files.newDirectoryStream(folder, PREFIX + "*")) {
            for (Path p : left) {
                Files.deleteIfExists(p);
                log.info("Removed the leftover upload copy {}", p);
            }
        } catch (IOException e) {
            log.warn("Could not clear leftover upload copies in {}: {}", folder, e.getMessage());
        }
    }

    /** The upload copied to an owner-only file in Dockgate's own temporary folder. */
    Path copy(InputStream upload) throws IOException {
        Path copy = Files.getFileStore(folder).supportsFileAttributeView(PosixFileAttributeView.class)
                ? Files.createTempFile(folder, PREFIX, ".csv", PosixFilePermissions.asFileAttribute(OWNER_ONLY))
                : Files.createTempFile(folder, PREFIX, ".csv");
        try {
            // Not Files.copy with REPLACE_EXISTING: it would recreate the file with default permissions.
            try (java.io.OutputStream out = Files.newOutputStream(copy)) {
                upload.transferTo(out);
            }
        } catch (IOException | RuntimeException e) {
            Files.deleteIfExists(copy);
            throw e;
        }
        return copy;
    }

    Path folder() {
        return folder;
    }

    private static void restrict(Path path, Set<PosixFilePermission> permissions) {
        try {
            if (Files.getFileStore(path).supportsFileAttributeView(PosixFileAttributeView.class)) {
                Files.setPosixFilePermissions(path, permissions);
            }
        } catch (IOException e) {
            throw new UncheckedIOException("Cannot restrict " + path, e);
        }
    }

    /**
     * Starts an import in the background.
     *
     * @param lotId      the lot
     * @param upload     the file
     * @param instrument the reference instrument
     * @param preview    check only
     * @return the job, running
     */
    public Job start(long lotId, InputStream upload, String instrument, boolean preview) {
        Path copy;
        try {
            copy = copy(upload);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        String id = UUID.randomUUID().toString();
        long size = copy.toFile().length();
        // A commit reads the file twice (check, then save): the bar covers both passes.
        long total = preview ? size : 2 * size;
        jobs.put(id, new Job(id, lotId, State.RUNNING, 0, 0, total, null, null));
        java.util.concurrent.atomic.AtomicLong last = new java.util.concurrent.atomic.AtomicLong();
        java.util.concurrent.atomic.AtomicLong offset = new java.util.concurrent.atomic.AtomicLong();
        executor.submit(new DelegatingSecurityContextRunnable(() -> {
            try {
                ImportOutcome outcome = imports.importFile(lotId, new FileSystemResource(copy), instrument, preview,
                        (rows, chars) -> {
                            if (chars < last.getAndSet(chars)) {
                                offset.set(size);
                            }
                            jobs.computeIfPresent(id, (k, j) -> new Job(id, lotId, State.RUNNING, rows,
                                    offset.get() + chars, total, null, null));
                        });
                jobs.put(id, new Job(id, lotId, State.DONE, outcome.rowsRead(), total, total, outcome, null));
            } catch (RuntimeException e) {
                log.debug("Import job {} refused: {}", id, e.getMessage());
                String why = e instanceof IllegalArgumentException || e instanceof IllegalStateException
                        ? e.getMessage() : "The import failed unexpectedly; nothing was saved.";
                if (!(e instanceof IllegalArgumentException || e instanceof IllegalStateException)) {
                    log.error("Import job {} failed", id, e);
                }
                jobs.put(id, new Job(id, lotId, State.FAILED, 0, size, size, null, why));
            } finally {
                try {
                    Files.deleteIfExists(copy);
                } catch (IOException e) {
                    log.warn("Could not delete {}", copy);
                }
            }
        }));
        return jobs.get(id);
    }

    /** @return the job, if there is one with this id */
    public Optional<Job> job(String id) {
        return Optional.ofNullable(jobs.get(id));
    }
}
