package org.dockgate.certificates;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import java.util.function.Supplier;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.ExpectedReading;
import org.dockgate.bench.NewReading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.series.Direction;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.NewLot;
import org.dockgate.receiving.NewReceipt;
import org.dockgate.receiving.ReceivingService;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.AuthorityUtils;
import org.springframework.security.core.context.SecurityContextHolder;

/**
 * A fresh dispositioned lot for certificate tests, made through the real services as
 * {@code EvaluationServiceTest} does: a QP-250 lot of 8 from QSL (ISO 2859-1:1999 Table 1, lot 2–8, level II
 * → A; Table 2-A at AQL 1.0 follows the arrow to E, n 13 ≥ 8, so 100 % inspection, Ac 0, Re 1), readings
 * on the nominal 10 mV/bar line, dispositioned by {@code engineer}. Unique serials, so a shared database is fine.
 */
public final class LotFixtures {

    private LotFixtures() {
    }

    public static <T> T as(String user, Supplier<T> work) {
        var previous = SecurityContextHolder.getContext().getAuthentication();
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(user, null,
                AuthorityUtils.createAuthorityList("ROLE_ENGINEER")));
        try {
            return work.get();
        } finally {
            SecurityContextHolder.getContext().setAuthentication(previous);
        }
    }

    /** Receives, measures (every reading recorded as {@code recorder}) and accepts a QP-250 lot of 8. */
    public static LotView acceptedLot(ReceivingService receiving, CatalogueService catalogue, BenchService bench,
                                      EvaluationService evaluation, String recorder) {
        var model = catalogue.modelByPartNumber("QP-250").orElseThrow();
        var supplier = catalogue.supplierByCode("QSL").orElseThrow();
        String tag = UUID.randomUUID().toString().substring(0, 6);
        List<String> serials = new ArrayList<>();
        for (int i = 1; i <= 8; i++) {
            serials.add("C" + tag + "-" + i);
        }
        var receipt = as("operator", () -> receiving.receive(new NewReceipt("PO-C-" + tag, "DN-C-" + tag, LocalDate.now(),
                supplier.id(), List.of(new NewLot(model.id(), 8, serials)), "token-c-" + tag)));
        LotView lot = receiving.lots(LotState.AWAITING_MEASUREMENT).stream().filter(l -> l.receiptId() == receipt.id())
                .findFirst().orElseThrow();
        var plan = bench.planFor(bench.lot(lot.id()).orElseThrow());
        for (String serial : lot.sampledSerials()) {
            List<NewReading> readings = new ArrayList<>();
            for (ExpectedReading slot : plan.keyed()) {
                double cycleScatter = 0.0002 * slot.cycle().orElse(1);
                double value = Math.round((10.0 * slot.point() + cycleScatter) * 10000) / 10000.0;
                readings.add(new NewReading(serial, ReadingTest.STATIC, slot.point(), slot.direction().orElse(Direction.UP),
                        slot.cycle().orElse(1), value, "mV", plan.suggestedInstrument(), null));
            }
            as(recorder, () -> {
                bench.recordConditions(lot.id(), serial, 23.1, 45.0);
                return bench.recordMany(lot.id(), readings);
            });
        }
        LotView current = receiving.lot(lot.id()).orElseThrow();
        as("engineer", () -> evaluation.disposition(lot.id(), null, "", false, null, current.version()));
        return receiving.lot(lot.id()).orElseThrow();
    }
}
