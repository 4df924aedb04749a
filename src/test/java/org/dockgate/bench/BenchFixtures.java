package org.dockgate.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ThreadLocalRandom;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.procedures.ApprovedProcedure;
import org.dockgate.procedures.ProcedureService;
import org.springframework.boot.test.context.TestConfiguration;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Primary;

/**
 * Lots for bench tests without going through receiving: a lot source the test fills, over the demo's
 * real approved procedures. Lot ids are random and large, so tests on a shared PostgreSQL never meet
 * each other's readings.
 */
public final class BenchFixtures {

    private BenchFixtures() {
    }

    /** Lots by id, set by the tests. */
    public static final class TestLots implements LotSource {
        final Map<Long, BenchLot> lots = new ConcurrentHashMap<>();

        @Override
        public Optional<BenchLot> lot(long lotId) {
            return Optional.ofNullable(lots.get(lotId));
        }

        @Override
        public List<BenchLot> awaitingMeasurement() {
            return lots.values().stream().filter(BenchLot::awaitingMeasurement)
                    .sorted(java.util.Comparator.comparingLong(BenchLot::id)).toList();
        }

        /** A new open lot of the procedure with this many sampled units. */
        public BenchLot open(long procedureRevisionId, int units) {
            long id = 800_000_000L + ThreadLocalRandom.current().nextLong(100_000_000L);
            String tag = Long.toString(id, 36).toUpperCase();
            List<String> serials = new ArrayList<>();
            for (int i = 1; i <= units; i++) {
                serials.add("T" + tag + "-" + String.format("%04d", i));
            }
            BenchLot lot = new BenchLot(id, "Lot " + id, procedureRevisionId, serials, true);
            lots.put(id, lot);
            return lot;
        }

        public void close(BenchLot lot) {
            lots.put(lot.id(), new BenchLot(lot.id(), lot.label(), lot.procedureRevisionId(), lot.sampledSerials(), false));
        }
    }

    @TestConfiguration
    public static class Config {
        @Bean
        @Primary
        public TestLots testLots() {
            return new TestLots();
        }
    }

    /** A demo procedure with a static calibration, and a noise capture when one exists. */
    public static ApprovedProcedure procedure(CatalogueService catalogue, ProcedureService procedures) {
        ApprovedProcedure withStatic = null;
        for (var model : catalogue.models(null, null, null)) {
            Optional<ApprovedProcedure> p = procedures.approvedFor(model.id());
            if (p.isEmpty() || p.get().content().staticCalibration() == null) {
                continue;
            }
            if (p.get().content().noiseCapture() != null) {
                return p.get();
            }
            withStatic = p.get();
        }
        if (withStatic == null) {
            throw new IllegalStateException("The demo scenario has no approved procedure with a static calibration");
        }
        return withStatic;
    }
}
