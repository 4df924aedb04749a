package org.dockgate.receiving;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import java.util.concurrent.ConcurrentHashMap;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.NewSensorModel;
import org.dockgate.catalogue.OutputKind;
import org.dockgate.catalogue.SensorModelView;
import org.dockgate.catalogue.SupplierStatus;
import org.dockgate.catalogue.SupplierView;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.springframework.boot.test.context.TestConfiguration;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Primary;

/**
 * Test fixtures: suppliers and models with unique codes (the PostgreSQL database is shared), and a
 * procedure lookup the test controls, so receiving is tested without going through procedure approval.
 */
final class ReceivingTestSupport {

    private ReceivingTestSupport() {
    }

    /** Approved procedures by model id, set by the tests. */
    static final class TestProcedures implements ProcedureLookup {
        final Map<Long, LotProcedure> byModel = new ConcurrentHashMap<>();

        @Override
        public Optional<LotProcedure> approvedFor(long modelId) {
            return Optional.ofNullable(byModel.get(modelId));
        }
    }

    @TestConfiguration
    static class Config {
        @Bean
        @Primary
        TestProcedures testProcedures() {
            return new TestProcedures();
        }
    }

    record Pair(SupplierView supplier, SensorModelView model) {
    }

    /** A fresh supplier and a model it supplies, with an approved procedure at the given AQL, level II. */
    static Pair pair(CatalogueService catalogue, TestProcedures procedures, Aql aql, SupplierStatus status) {
        String tag = UUID.randomUUID().toString().substring(0, 8).toUpperCase();
        SupplierView supplier = catalogue.createSupplier("T" + tag, "Test supplier " + tag, "qa@example.invalid", status);
        var template = catalogue.models(null, null, null).get(0);
        SensorModelView model = catalogue.createModel(new NewSensorModel("TM-" + tag, "Test model " + tag,
                template.measurand(), OutputKind.VOLTAGE, "", List.of(supplier.code()), template.latest().specification()));
        if (aql != null) {
            procedures.byModel.put(model.id(), new LotProcedure(900_000 + model.id(), model.latest().id(),
                    "TM-" + tag + " procedure rev 1", aql, InspectionLevel.II));
        }
        return new Pair(supplier, model);
    }

    static List<String> serials(String prefix, int count) {
        List<String> serials = new ArrayList<>();
        for (int i = 1; i <= count; i++) {
            serials.add(prefix + String.format("%04d", i));
        }
        return serials;
    }
}
