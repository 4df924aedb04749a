package org.dockgate.bench;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.OutputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.PreparedStatement;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.BitSet;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import org.dockgate.audit.AuditEvent;
import org.dockgate.core.acquisition.AcquiredReading;
import org.dockgate.core.acquisition.AcquisitionCsv;
import org.dockgate.core.acquisition.AcquisitionReport;
import org.dockgate.core.acquisition.ExpectedUnits;
import org.dockgate.instruments.InstrumentView;
import org.springframework.core.io.InputStreamSource;
import org.springframework.dao.DuplicateKeyException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.support.GeneratedKeyHolder;
import org.springframework.stereotype.Service;

/**
 * Imports a data-acquisition file (format: {@link AcquisitionCsv}) into a lot's readings: every row is
 * checked by the parser (numbers, units, columns) and here (a sampled unit, a point of the procedure,
 * not yet recorded, not twice in the file). A commit stores the whole file in one transaction with
 * batched inserts, or nothing when any row is wrong; a preview checks the same and stores nothing.
 * One summary audit entry per import ("imported N readings", with the file's SHA-256), not one per row.
 */
@Service
public class ReadingImport {

    /** Rows per JDBC batch. */
    static final int BATCH = 1_000;
    /** Valid rows a preview shows. */
    static final int PREVIEW_ROWS = 20;

    private final BenchService bench;

    ReadingImport(BenchService bench) {
        this.bench = bench;
    }

    /**
     * Checks a file and, unless previewing, saves all its readings or none.
     *
     * @param lotId      the lot
     * @param file       the file (UTF-8), read twice: once to check, once to save
     * @param instrument the reference instrument the readings were taken with (in calibration today)
     * @param preview    true: check only, save nothing
     * @param progress   told the progress every 10 000 rows
     * @return what was (or would be) imported, with every problem by line and column
     * @throws IllegalArgumentException when the lot or instrument is wrong
     * @throws IllegalStateException    when the lot is closed, the instrument out of calibration, or
     *                                  someone recorded one of the file's points during the import
     */
    public ImportOutcome importFile(long lotId, InputStreamSource file, String instrument, boolean preview,
                                    ImportProgress progress) {
        // First pass: check every row and hash the file, saving nothing (this is the preview).
        ImportOutcome checked = pass(lotId, file, instrument, null, progress, new HashMap<>());
        if (preview || !checked.valid()) {
            return checked;
        }
        // Second pass, in one transaction: save the import record and every reading, or nothing.
        try {
            return bench.transactions().execute(status -> {
                BenchLot lot = bench.openLot(lotId);
                long importId = startImport(bench.jdbc(), lotId, checked.fileSha256(), checked.validRows(),
                        instrument.strip(), BenchService.currentUser(), bench.clock().instant());
                Map<String, Integer> newSlots = new java.util.TreeMap<>();
                ImportOutcome saved = pass(lotId, file, instrument, importId, progress, newSlots);
                if (!saved.valid() || !saved.fileSha256().equals(checked.fileSha256())) {
                    status.setRollbackOnly();
                    return saved;
                }
                newSlots.forEach((serial, n) -> bench.addProgress(lotId, serial, n));
                bench.events().publishEvent(AuditEvent.of(BenchService.LOT, lotId, "IMPORT", lot.label()
                        + ": imported " + saved.validRows() + " readings with " + instrument.strip()
                        + " from a data-acquisition file, SHA-256 " + saved.fileSha256())
                        .withChanges(List.of(AuditEvent.FieldChange.of("readings", null, saved.validRows()),
                                AuditEvent.FieldChange.of("fileSha256", null, saved.fileSha256()))));
                return saved;
            });
        } catch (DuplicateKeyException e) {
            throw new IllegalStateException("Someone recorded a reading for one of the file's points while it was"
                    + " being imported; nothing of the file was saved. Import it again to see which.");
        }
    }

    /** One pass over the file: checks, and inserts when an import id is given. */
    private ImportOutcome pass(long lotId, InputStreamSource file, String instrumentId, Long importId,
                               ImportProgress progress, Map<String, Integer> newSlots) {
        boolean saving = importId != null;
        BenchLot lot = bench.openLot(lotId);
        BenchPlan plan = bench.planFor(lot);
        InstrumentView instrument = bench.requireInstrument(plan, instrumentId);
        JdbcTemplate jdbc = bench.jdbc();
        int perUnit = plan.readingsPerUnit();
        Map<String, Integer> unitIndex = new HashMap<>();
        for (String s : lot.sampledSerials()) {
            unitIndex.put(s, unitIndex.size());
        }
        // Every point of every sampled unit is one bit: set when recorded (before, or earlier in this file).
        BitSet filled = new BitSet(unitIndex.size() * perUnit);
        jdbc.query("select distinct serial, slot_no from bench_reading where lot_id = ?", rs -> {
            Integer u = unitIndex.get(rs.getString(1));
            if (u != null) {
                filled.set(u * perUnit + rs.getInt(2));
            }
        }, lotId);
        String who = BenchService.currentUser();
        Instant now = bench.clock().instant();
        java.time.LocalDate today = java.time.LocalDate.ofInstant(now, ZoneOffset.UTC);
        Map<String, InstrumentView> chain = new HashMap<>();
        List<Object[]> batch = new ArrayList<>(BATCH);
        List<ImportOutcome.PreviewRow> first = new ArrayList<>();
        MessageDigest sha = sha256();
        AcquisitionReport report;
        try (DigestInputStream digesting = new DigestInputStream(file.getInputStream(), sha);
             BufferedReader reader = new BufferedReader(new InputStreamReader(
                     // The parser closes its reader at the end; the rest of the file must still be hashed.
                     new java.io.FilterInputStream(digesting) {
                         @Override
                         public void close() {
                         }
                     }, StandardCharsets.UTF_8), 1 << 16)) {
            report = AcquisitionCsv.parse(reader, ExpectedUnits.of(plan.inputUnit(), plan.outputUnit()), row -> {
                Integer u = unitIndex.get(row.serial());
                if (u == null) {
                    throw new IllegalArgumentException("column 'serial': " + row.serial()
                            + " is not one of the units sampled from " + lot.label());
                }
                ReadingTest test = ReadingTest.valueOf(row.test().name());
                ExpectedReading slot = plan.slotOf(test, row.point(), row.direction().orElse(null),
                        row.cycle().isPresent() ? row.cycle().getAsInt() : null);
                int bit = u * perUnit + slot.slot();
                if (filled.get(bit)) {
                    throw new IllegalArgumentException(row.serial() + " " + plan.describe(slot.slot())
                            + " already has a reading (saved before, or earlier in this file); correct it instead");
                }
                filled.set(bit);
                double applied;
                String readout;
                String excitation;
                try {
                    applied = plan.appliedAt(slot, row.offNominal() ? row.applied() : null);
                } catch (IllegalArgumentException e) {
                    throw new IllegalArgumentException("column 'applied': " + e.getMessage(), e);
                }
                try {
                    readout = bench.chainInstrument(row.readout().orElse(null), "readout", today, chain);
                } catch (IllegalArgumentException | IllegalStateException e) {
                    throw new IllegalArgumentException("column 'readout': " + e.getMessage(), e);
                }
                try {
                    excitation = bench.chainInstrument(row.excitation().orElse(null), "excitation", today, chain);
                } catch (IllegalArgumentException | IllegalStateException e) {
                    throw new IllegalArgumentException("column 'excitation': " + e.getMessage(), e);
                }
                if (first.size() < PREVIEW_ROWS) {
                    first.add(new ImportOutcome.PreviewRow(row.line(), row.serial(), test, plan.describe(slot.slot()),
                            row.value(), plan.outputUnit()));
                }
                if (saving) {
                    newSlots.merge(row.serial(), 1, Integer::sum);
                    batch.add(BenchService.row(lotId, row.serial(), slot, 0, row.value(), plan.outputUnit(),
                            row.recordedValue(), unitOf(row, plan), instrument.identifier(), who, now, null, null, null,
                            importId, applied, readout, excitation));
                    if (batch.size() == BATCH) {
                        flush(jdbc, batch);
                    }
                }
            }, progress::progress);
            digesting.transferTo(OutputStream.nullOutputStream());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        if (saving && report.valid()) {
            flush(jdbc, batch);
        }
        return new ImportOutcome(!saving, saving && report.valid(), saving && report.valid() ? importId : null,
                report.rowsRead(), report.readingsAccepted(), report.messages(), report.errorCount(),
                HexFormat.of().formatHex(sha.digest()), first);
    }

    /** The unit as written: the parser converts; the entered value keeps the file's unit. */
    private static String unitOf(AcquiredReading row, BenchPlan plan) {
        return row.recordedUnit().isBlank() ? plan.outputUnit() : row.recordedUnit();
    }

    private static long startImport(JdbcTemplate jdbc, long lotId, String sha, long readings, String instrument,
                                    String who, Instant now) {
        GeneratedKeyHolder keys = new GeneratedKeyHolder();
        jdbc.update(c -> {
            PreparedStatement ps = c.prepareStatement("insert into bench_import (lot_id, file_sha256, readings,"
                    + " instrument, recorded_by, recorded_at) values (?, ?, ?, ?, ?, ?)", new String[] {"id"});
            ps.setLong(1, lotId);
            ps.setString(2, sha);
            ps.setLong(3, readings);
            ps.setString(4, instrument);
            ps.setString(5, who);
            ps.setObject(6, OffsetDateTime.ofInstant(now, ZoneOffset.UTC));
            return ps;
        }, keys);
        return keys.getKey().longValue();
    }

    private static void flush(JdbcTemplate jdbc, List<Object[]> batch) {
        if (batch.isEmpty()) {
            return;
        }
        jdbc.batchUpdate(BenchService.INSERT, batch, batch.size(), BenchService::bind);
        batch.clear();
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("This Java has no SHA-256", e);
        }
    }
}
