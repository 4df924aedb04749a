package org.dockgate.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

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
import org.dockgate.core.decision.Verdict;
import org.dockgate.core.series.Direction;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.NewLot;
import org.dockgate.receiving.NewReceipt;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.dao.DataAccessException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.AuthorityUtils;
import org.springframework.security.core.context.SecurityContextHolder;

/**
 * Evaluation of a whole lot through the real modules: a QP-250 lot of 8 (ISO 2859-1:1999 Table 1, lot 2–8,
 * level II → A; Table 2-A at AQL 1.0 follows the arrow to E, n 13 ≥ 8, so 100 % inspection with Ac 0, Re 1),
 * readings from the nominal 10 mV/bar line, one unit with its sensitivity 2 % high.
 */
@SpringBootTest
class EvaluationServiceTest {

    @Autowired EvaluationService evaluation;
    @Autowired ReceivingService receiving;
    @Autowired BenchService bench;
    @Autowired CatalogueService catalogue;
    @Autowired JdbcTemplate jdbc;

    static <T> T as(String user, Supplier<T> work) {
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(user, null,
                AuthorityUtils.NO_AUTHORITIES));
        try {
            return work.get();
        } finally {
            SecurityContextHolder.clearContext();
        }
    }

    LotView receiveLot() {
        var model = catalogue.modelByPartNumber("QP-250").orElseThrow();
        var supplier = catalogue.supplierByCode("QSL").orElseThrow();
        String tag = UUID.randomUUID().toString().substring(0, 6);
        List<String> serials = new ArrayList<>();
        for (int i = 1; i <= 8; i++) {
            serials.add("T" + tag + "-" + i);
        }
        var receipt = as("operator", () -> receiving.receive(new NewReceipt("PO-T-" + tag, "DN-T-" + tag, LocalDate.now(),
                supplier.id(), List.of(new NewLot(model.id(), 8, serials)), "token-" + tag)));
        return receiving.lots(LotState.AWAITING_MEASUREMENT).stream().filter(l -> l.receiptId() == receipt.id())
                .findFirst().orElseThrow();
    }

    /** Records every planned reading of a unit: output = gain × 10 mV/bar × p (+ a hysteresis-free, repeatable line). */
    void measure(LotView lot, String serial, double gain) {
        var plan = bench.planFor(bench.lot(lot.id()).orElseThrow());
        List<NewReading> readings = new ArrayList<>();
        for (ExpectedReading slot : plan.keyed()) {
            double cycleScatter = 0.0002 * slot.cycle().orElse(1);
            double value = Math.round((10.0 * gain * slot.point() + cycleScatter) * 10000) / 10000.0;
            readings.add(new NewReading(serial, ReadingTest.STATIC, slot.point(), slot.direction().orElse(Direction.UP),
                    slot.cycle().orElse(1), value, "mV", plan.suggestedInstrument(), null));
        }
        as("operator", () -> {
            bench.recordConditions(lot.id(), serial, 23.1, 45.0);
            return bench.recordMany(lot.id(), readings);
        });
    }

    @Test
    void aCompleteLotWithOneBadUnitIsRejectedWithANonconformanceReportInOneTransaction() {
        LotView lot = receiveLot();
        assertThat(lot.plan().sampleSize()).isEqualTo(8);
        assertThat(lot.plan().acceptNumber()).isZero();
        String bad = lot.sampledSerials().get(3);
        for (String serial : lot.sampledSerials()) {
            measure(lot, serial, serial.equals(bad) ? 1.02 : 1.0);
        }
        LotEvaluationView before = evaluation.lotEvaluation(lot.id());
        assertThat(before.complete()).isTrue();
        assertThat(before.nonconforming()).isEqualTo(1);
        assertThat(before.wouldAccept()).contains(false);
        var badUnit = before.units().stream().filter(u -> u.serial().equals(bad)).findFirst().orElseThrow();
        assertThat(badUnit.result().unitVerdict()).contains(Verdict.FAIL);

        // A stale version changes nothing: no lot state, no switching update, no report.
        int reports = jdbc.queryForObject("select count(*) from nonconformance_report", Integer.class);
        assertThatThrownBy(() -> as("engineer", () -> evaluation.disposition(lot.id(), DispositionAction.RETURN_TO_SUPPLIER,
                "", false, null, lot.version() - 1))).isInstanceOf(ObjectOptimisticLockingFailureException.class);
        assertThat(receiving.lot(lot.id()).orElseThrow().state()).isEqualTo(LotState.AWAITING_MEASUREMENT);
        assertThat(jdbc.queryForObject("select count(*) from nonconformance_report", Integer.class)).isEqualTo(reports);

        // A rejected lot needs its disposition action.
        assertThatThrownBy(() -> as("engineer", () -> evaluation.disposition(lot.id(), null, "", false, null, lot.version())))
                .hasMessageContaining("choose what happens");

        var after = as("engineer", () -> evaluation.disposition(lot.id(), DispositionAction.USE_AS_IS_CONCESSION,
                "Sensitivity 2 % high on one unit", true, LocalDate.now().plusDays(21), lot.version()));
        assertThat(after.lot().state()).isEqualTo(LotState.DISPOSITIONED_REJECTED);
        var ncr = after.nonconformance().orElseThrow();
        assertThat(ncr.number()).startsWith("NCR-");
        assertThat(ncr.failing()).contains(bad).contains("SENSITIVITY FAIL");
        assertThat(ncr.awaitingConcession()).isTrue();

        // Only a supervisor approves the concession, with a reason.
        assertThatThrownBy(() -> as("engineer", () -> evaluation.approveConcession(lot.id(), "fine"))).hasMessageContaining("SUPERVISOR");
        assertThatThrownBy(() -> as("supervisor", () -> evaluation.approveConcession(lot.id(), " "))).hasMessageContaining("reason");
        var approved = as("supervisor", () -> evaluation.approveConcession(lot.id(), "Customer deviation D-17 accepts ±3 %"));
        assertThat(approved.concessionApprovedBy()).contains("supervisor");

        // The frozen results can be recomputed from the stored readings, and the database keeps them as they are.
        var snapshots = evaluation.snapshots(lot.id());
        assertThat(snapshots).hasSize(8);
        for (var unit : evaluation.lotEvaluation(lot.id()).units()) {
            assertThat(evaluation.canonical(unit.result())).isEqualTo(snapshots.get(unit.serial()));
        }
        assertThatThrownBy(() -> jdbc.update("update unit_evaluation_snapshot set unit_verdict = 'PASS' where lot_id = ?", lot.id()))
                .isInstanceOf(DataAccessException.class);
        assertThatThrownBy(() -> jdbc.update("delete from nonconformance_report where lot_id = ?", lot.id()))
                .isInstanceOf(DataAccessException.class);
    }

    @Test
    void anIncompleteSampleCannotBeDispositioned() {
        LotView lot = receiveLot();
        measure(lot, lot.sampledSerials().get(0), 1.0);
        LotEvaluationView partial = evaluation.lotEvaluation(lot.id());
        assertThat(partial.complete()).isFalse();
        assertThat(partial.units().get(0).complete()).isTrue();
        assertThat(partial.units().get(1).result().missing()).isNotEmpty();
        assertThatThrownBy(() -> as("engineer", () -> evaluation.disposition(lot.id(), null, "", false, null, lot.version())))
                .hasMessageContaining("not complete");
    }

    @Test
    void aGoodLotIsAcceptedAndTheSwitchingStateMovesWithIt() {
        LotView lot = receiveLot();
        for (String serial : lot.sampledSerials()) {
            measure(lot, serial, 1.0);
        }
        var result = as("engineer", () -> evaluation.disposition(lot.id(), null, "", false, null, lot.version()));
        assertThat(result.lot().state()).isEqualTo(LotState.DISPOSITIONED_ACCEPTED);
        assertThat(result.nonconformance()).isEmpty();
        assertThat(receiving.switching(lot.supplierId(), lot.modelId())).isPresent();
    }
}
