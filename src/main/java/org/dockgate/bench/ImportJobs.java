package org.dockgate.bench;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
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

        /** @return 0–100 */
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

    ImportJobs(ReadingImport imports) {
        this.imports = imports;
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
            copy = Files.createTempFile("dockgate-import-", ".csv");
            Files.copy(upload, copy, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
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
