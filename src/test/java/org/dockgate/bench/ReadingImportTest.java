package org.dockgate.bench;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.List;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.procedures.ProcedureService;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.context.annotation.Import;
import org.springframework.core.io.ByteArrayResource;
import org.springframework.jdbc.core.JdbcTemplate;

/** Data-acquisition imports: all or nothing, previews save nothing, one audit entry per file. */
@SpringBootTest
@Import(BenchFixtures.Config.class)
class ReadingImportTest {

    @Autowired BenchService bench;
    @Autowired ReadingImport imports;
    @Autowired BenchFixtures.TestLots lots;
    @Autowired CatalogueService catalogue;
    @Autowired ProcedureService procedures;
    @Autowired JdbcTemplate jdbc;

    BenchLot lot;
    BenchPlan plan;
    String instrument;

    @BeforeEach
    void openLot() {
        lot = lots.open(BenchFixtures.procedure(catalogue, procedures).id(), 3);
        plan = bench.planFor(lot);
        instrument = bench.selectableInstruments(plan).get(0).identifier();
    }

    /** Every keyed reading of every unit, plus the first noise samples, as a file. */
    String file(int noisePerUnit) {
        StringBuilder csv = new StringBuilder("serial,test,point,direction,cycle,value,unit\n");
        for (String serial : lot.sampledSerials()) {
            for (ExpectedReading e : plan.keyed()) {
                csv.append(serial).append(',').append(e.test()).append(',').append(e.point()).append(',')
                        .append(e.direction().map(Enum::name).orElse("")).append(',')
                        .append(e.cycle().isPresent() ? Integer.toString(e.cycle().getAsInt()) : "").append(',')
                        .append(e.test() == ReadingTest.SWEEP ? 1.0 + e.slot() * 1e-3 : 0.5 * e.slot()).append(',')
                        .append(plan.outputUnit()).append('\n');
            }
            for (int i = 0; i < Math.min(noisePerUnit, plan.noiseSamples()); i++) {
                csv.append(serial).append(",NOISE,").append(i).append(",,,").append(1e-3 * (i % 7 - 3)).append(',')
                        .append(plan.outputUnit()).append('\n');
            }
        }
        return csv.toString();
    }

    ByteArrayResource bytes(String csv) {
        return new ByteArrayResource(csv.getBytes(StandardCharsets.UTF_8));
    }

    int saved() {
        return jdbc.queryForObject("select count(*) from bench_reading where lot_id = ?", Integer.class, lot.id());
    }

    int auditEntries() {
        return jdbc.queryForObject("select count(*) from audit_entry where entity_type = 'LOT' and entity_id = ?"
                + " and action = 'IMPORT'", Integer.class, Long.toString(lot.id()));
    }

    @Test
    void aValidFileIsSavedWholeWithOneAuditEntry() {
        String csv = file(50);
        long rows = csv.lines().count() - 1;
        ImportOutcome outcome = BenchServiceTest.as("operator",
                () -> imports.importFile(lot.id(), bytes(csv), instrument, false, ImportProgress.NONE));
        assertThat(outcome.errors()).isEmpty();
        assertThat(outcome.saved()).isTrue();
        assertThat(outcome.validRows()).isEqualTo(rows);
        assertThat(saved()).isEqualTo((int) rows);
        assertThat(auditEntries()).isEqualTo(1);
        String summary = jdbc.queryForObject("select summary from audit_entry where entity_type = 'LOT' and entity_id = ?"
                + " and action = 'IMPORT'", String.class, Long.toString(lot.id()));
        assertThat(summary).contains("imported " + rows + " readings").contains(outcome.fileSha256());
        assertThat(outcome.fileSha256()).hasSize(64);
        Reading first = bench.currentReadings(lot.id(), lot.sampledSerials().get(0)).get(0);
        assertThat(first.importId()).contains(outcome.importId());
        assertThat(first.recordedBy()).isEqualTo("operator");
        assertThat(bench.operators(lot.id())).containsExactly("operator");

        // The same file again: every point is already recorded, nothing more is saved.
        ImportOutcome again = BenchServiceTest.as("operator",
                () -> imports.importFile(lot.id(), bytes(csv), instrument, false, ImportProgress.NONE));
        assertThat(again.saved()).isFalse();
        assertThat(again.errors().get(0)).contains("line 2").contains("already has a reading");
        assertThat(saved()).isEqualTo((int) rows);
    }

    @Test
    void oneBadRowSavesNothingAndTheErrorNamesItsLineAndColumn() {
        List<String> lines = new java.util.ArrayList<>(file(10).lines().toList());
        String bad = lines.get(5);
        int comma = bad.lastIndexOf(',', bad.lastIndexOf(',') - 1);
        lines.set(5, bad.substring(0, comma + 1) + "abc" + bad.substring(bad.lastIndexOf(',')));
        String csv = String.join("\n", lines) + "\n";
        ImportOutcome outcome = BenchServiceTest.as("operator",
                () -> imports.importFile(lot.id(), bytes(csv), instrument, false, ImportProgress.NONE));
        assertThat(outcome.saved()).isFalse();
        assertThat(outcome.errorCount()).isEqualTo(1);
        assertThat(outcome.errors().get(0)).startsWith("line 6, column 'value'");
        assertThat(saved()).isZero();
        assertThat(auditEntries()).isZero();
    }

    @Test
    void aPointOfAnotherUnitOrOffTheProcedureIsNamed() {
        String csv = "serial,test,point,direction,cycle,value,unit\n"
                + "NOT-SAMPLED,NOISE,0,,,0.001," + plan.outputUnit() + "\n"
                + lot.sampledSerials().get(0) + ",STATIC," + (plan.staticPoints().get(0) + 0.123 * (plan.rangeMax() - plan.rangeMin()))
                + ",UP,1,0.5," + plan.outputUnit() + "\n";
        ImportOutcome outcome = imports.importFile(lot.id(), bytes(csv), instrument, true, ImportProgress.NONE);
        assertThat(outcome.errors()).hasSize(2);
        assertThat(outcome.errors().get(0)).contains("line 2").contains("not one of the units sampled");
        assertThat(outcome.errors().get(1)).contains("line 3").contains("is not a test point");
    }

    @Test
    void aPreviewChecksEveryRowAndSavesNothing() {
        String csv = file(20) + lot.sampledSerials().get(0) + ",NOISE,0,,,0.002," + plan.outputUnit() + "\n";
        ImportOutcome outcome = imports.importFile(lot.id(), bytes(csv), instrument, true, ImportProgress.NONE);
        assertThat(outcome.preview()).isTrue();
        assertThat(outcome.saved()).isFalse();
        // The last line repeats the first unit's noise sample 0.
        assertThat(outcome.errors()).singleElement().asString().contains("line " + csv.lines().count())
                .contains("earlier in this file");
        assertThat(outcome.firstRows()).hasSize(ReadingImport.PREVIEW_ROWS);
        assertThat(saved()).isZero();

        ImportOutcome clean = imports.importFile(lot.id(), bytes(file(20)), instrument, true, ImportProgress.NONE);
        assertThat(clean.valid()).isTrue();
        assertThat(clean.saved()).isFalse();
        assertThat(saved()).isZero();
        assertThat(auditEntries()).isZero();
    }

    /**
     * One million readings in one transaction (opt-in, about a minute: -Ddockgate.bench.million=true).
     * Streams the file from disk; memory stays flat because rows go to the database in batches.
     */
    @Test
    @org.junit.jupiter.api.condition.EnabledIfSystemProperty(named = "dockgate.bench.million", matches = "true")
    void aMillionReadingsImportInOneTransaction() throws Exception {
        int perUnit = plan.readingsPerUnit();
        int units = (int) Math.ceil(1_000_000.0 / perUnit);
        lot = lots.open(lot.procedureRevisionId(), units);
        java.nio.file.Path path = java.nio.file.Files.createTempFile("million", ".csv");
        long rows = 0;
        try (var out = java.nio.file.Files.newBufferedWriter(path)) {
            out.write("serial,test,point,direction,cycle,value,unit\n");
            for (String serial : lot.sampledSerials()) {
                for (ExpectedReading e : plan.keyed()) {
                    out.write(serial + "," + e.test() + "," + e.point() + "," + e.direction().map(Enum::name).orElse("")
                            + "," + (e.cycle().isPresent() ? e.cycle().getAsInt() : "") + ",1.5," + plan.outputUnit() + "\n");
                    rows++;
                }
                for (int i = 0; i < plan.noiseSamples() && rows < 1_000_000; i++) {
                    out.write(serial + ",NOISE," + i + ",,," + (i % 5) * 1e-4 + "," + plan.outputUnit() + "\n");
                    rows++;
                }
            }
        }
        long started = System.nanoTime();
        long[] progressCalls = {0};
        ImportOutcome outcome = BenchServiceTest.as("operator", () -> imports.importFile(lot.id(),
                new org.springframework.core.io.FileSystemResource(path), instrument, false, (r, c) -> progressCalls[0]++));
        double seconds = (System.nanoTime() - started) / 1e9;
        java.nio.file.Files.delete(path);
        System.out.printf("Imported %d readings in %.1f s (%d progress reports)%n", outcome.validRows(), seconds,
                progressCalls[0]);
        assertThat(outcome.errors()).isEmpty();
        assertThat(outcome.validRows()).isEqualTo(rows).isGreaterThanOrEqualTo(1_000_000);
        assertThat(saved()).isEqualTo((int) rows);
        assertThat(progressCalls[0]).isGreaterThan(100);
    }
}
