package org.dockgate.demo;

import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.SensorModelView;
import org.dockgate.catalogue.SupplierStatus;
import org.dockgate.catalogue.SupplierView;
import org.dockgate.core.sampling.Severity;
import org.dockgate.core.sampling.SingleSamplingPlans;
import org.dockgate.receiving.LotProcedure;
import org.dockgate.receiving.ProcedureLookup;
import org.dockgate.receiving.NewLot;
import org.dockgate.receiving.NewReceipt;
import org.dockgate.receiving.ReceivingService;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;

/**
 * The demo's received lots (invented): one lot from each supplier that is not disqualified, of the first
 * model it supplies that has an approved procedure, received by the operator. Models without an approved
 * procedure are skipped.
 */
@Component
@Order(600)
class DemoReceiving implements DemoStep {

    private final CatalogueService catalogue;
    private final ProcedureLookup procedures;
    private final ReceivingService receiving;
    private final Clock clock;

    DemoReceiving(CatalogueService catalogue, ProcedureLookup procedures, ReceivingService receiving, Clock clock) {
        this.catalogue = catalogue;
        this.procedures = procedures;
        this.receiving = receiving;
        this.clock = clock;
    }

    @Override
    public String name() {
        return "receiving";
    }

    @Override
    public void load(SeedFiles files) {
        DemoLoader.as("operator", () -> {
            int n = 0;
            for (SupplierView supplier : catalogue.suppliers()) {
                if (supplier.status() == SupplierStatus.DISQUALIFIED) {
                    continue;
                }
                for (SensorModelView model : catalogue.models(null, null, supplier.id())) {
                    LotProcedure procedure = procedures.approvedFor(model.id()).orElse(null);
                    int quantity = 20 + 15 * (n + 1);
                    if (procedure == null || !planExists(quantity, procedure)) {
                        continue;
                    }
                    n++;
                    List<String> serials = new ArrayList<>();
                    for (int i = 1; i <= quantity; i++) {
                        serials.add(supplier.code() + "-" + model.partNumber() + "-" + String.format("%04d", i));
                    }
                    receiving.receive(new NewReceipt("PO-2026-" + (100 + n), "DN-" + supplier.code() + "-" + (700 + n),
                            LocalDate.now(clock).minusDays(n), supplier.id(),
                            List.of(new NewLot(model.id(), quantity, serials)), "demo-receipt-" + supplier.code()));
                    break;
                }
            }
            return null;
        });
    }

    /** Some AQL columns have no plan for small lots; such a model is skipped rather than failing the demo. */
    private static boolean planExists(int quantity, LotProcedure procedure) {
        try {
            SingleSamplingPlans.plan(quantity, procedure.aql(), procedure.level(), Severity.NORMAL);
            return true;
        } catch (IllegalArgumentException e) {
            return false;
        }
    }
}
