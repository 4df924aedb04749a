package org.dockgate.receiving;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import java.util.UUID;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.SupplierStatus;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.Disposition;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.core.sampling.SamplingPlan;
import org.dockgate.core.sampling.Severity;
import org.dockgate.core.sampling.SingleSamplingPlans;
import org.dockgate.receiving.ReceivingTestSupport.Pair;
import org.dockgate.receiving.ReceivingTestSupport.TestProcedures;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.context.annotation.Import;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.security.test.context.support.WithMockUser;

// Its own in-memory database on every run: these tests fix lots to stand-in procedure revisions (see
// ReceivingTestSupport), which must not appear in a database other test contexts share (the PostgreSQL run).
@SpringBootTest(properties = {"spring.datasource.url=jdbc:h2:mem:receiving-${random.uuid};DB_CLOSE_DELAY=-1",
    "spring.datasource.username=sa", "spring.datasource.password=",
    "dockgate.data-dir=target/test-data/receiving-${random.uuid}"})
@Import(ReceivingTestSupport.Config.class)
@WithMockUser(username = "operator", roles = "OPERATOR")
class ReceivingServiceTest {

    @Autowired ReceivingService receiving;
    @Autowired CatalogueService catalogue;
    @Autowired TestProcedures procedures;
    @Autowired JdbcTemplate jdbc;

    private LotView receive(Pair pair, List<String> serials) {
        ReceiptView receipt = receiving.receive(new NewReceipt("PO-" + UUID.randomUUID().toString().substring(0, 6), "DN-1",
                LocalDate.of(2026, 1, 5), pair.supplier().id(), List.of(new NewLot(pair.model().id(), serials.size(), serials)),
                UUID.randomUUID().toString()));
        return receipt.lots().get(0);
    }

    private int count(String table) {
        return jdbc.queryForObject("select count(*) from " + table, Integer.class);
    }

    @Test
    void theSampleIsTheFisherYatesDrawOfTheRecordedSeedAndReDrawsIdentically() {
        List<String> serials = ReceivingTestSupport.serials("S", 50);
        // Independent oracle: Collections.shuffle documents the same backwards Fisher–Yates over Random (JDK javadoc).
        List<String> oracle = new ArrayList<>(serials);
        Collections.shuffle(oracle, new Random(42L));
        assertThat(SampleDraw.draw(serials, 8, 42L)).isEqualTo(oracle.subList(0, 8));
        assertThat(SampleDraw.draw(serials, 8, 42L)).isEqualTo(SampleDraw.draw(serials, 8, 42L));
        assertThat(SampleDraw.draw(serials, 8, 43L)).isNotEqualTo(SampleDraw.draw(serials, 8, 42L));

        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        LotView lot = receive(pair, serials);
        SamplingPlan expected = SingleSamplingPlans.plan(50, Aql.AQL_6_5, InspectionLevel.II, Severity.NORMAL);
        assertThat(lot.plan().plan()).isEqualTo(expected);
        assertThat(lot.sampledSerials()).hasSize(expected.sampleSize()).doesNotHaveDuplicates();
        assertThat(serials).containsAll(lot.sampledSerials());
        assertThat(receiving.redraw(lot.id())).isEqualTo(lot.sampledSerials());
        assertThat(receiving.sampleReproduces(lot.id())).isTrue();
        assertThat(lot.specificationRevisionId()).isEqualTo(pair.model().latest().id());
        assertThat(lot.procedureRevisionId()).isEqualTo(900_000 + pair.model().id());
        assertThat(lot.state()).isEqualTo(LotState.AWAITING_MEASUREMENT);
        assertThat(receiving.receipt(lot.receiptId()).orElseThrow().receivedBy()).isEqualTo("operator");
    }

    @Test
    void fullInspectionWhenThePlanSampleCoversTheLot() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_0_10, SupplierStatus.APPROVED);
        LotView lot = receive(pair, ReceivingTestSupport.serials("F", 5));
        assertThat(lot.plan().fullInspection()).isTrue();
        assertThat(lot.sampledSerials()).isEqualTo(lot.serials());
    }

    @Test
    void duplicatesBlanksAndCountMismatchesAreRefusedWithNothingSaved() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_1_0, SupplierStatus.APPROVED);
        int receipts = count("receipt");
        int lots = count("receiving_lot");
        int audit = count("audit_entry");
        assertThatThrownBy(() -> receiving.receive(new NewReceipt("PO", "DN", LocalDate.of(2026, 1, 5), pair.supplier().id(),
                List.of(new NewLot(pair.model().id(), 4, List.of("A1", "A2", "A1", "A2"))), null)))
                .isInstanceOf(ReceivingException.class).hasMessageContaining("A1 (lines 1, 3)")
                .hasMessageContaining("A2 (lines 2, 4)");
        List<String> twelve = ReceivingTestSupport.serials("C", 12);
        assertThatThrownBy(() -> receiving.receive(new NewReceipt("PO", "DN", LocalDate.of(2026, 1, 5), pair.supplier().id(),
                List.of(new NewLot(pair.model().id(), 13, twelve)), null)))
                .isInstanceOf(ReceivingException.class).hasMessage("12 serials for a quantity of 13.");
        assertThatThrownBy(() -> receiving.receive(new NewReceipt("PO", "DN", LocalDate.of(2026, 1, 5), pair.supplier().id(),
                List.of(new NewLot(pair.model().id(), 3, List.of("B1", " ", "B3"))), null)))
                .isInstanceOf(ReceivingException.class).hasMessageContaining("line 2");
        assertThat(SerialList.parse("X1\r\nX2\n\nX3\n\n")).containsExactly("X1", "X2", "", "X3");
        assertThat(count("receipt")).isEqualTo(receipts);
        assertThat(count("receiving_lot")).isEqualTo(lots);
        assertThat(count("audit_entry")).isEqualTo(audit);
    }

    @org.junit.jupiter.params.ParameterizedTest
    @org.junit.jupiter.params.provider.ValueSource(strings = {"AB/12", "AB;12", "AB 12", "AB%2F", "AB?1", "ÄB1"})
    void serialsOutsideTheAlphabetAreRefusedByName(String bad) {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        assertThatThrownBy(() -> receive(pair, List.of("OK-1", bad)))
                .isInstanceOf(ReceivingException.class)
                .hasMessageContaining("\"" + bad + "\" on line 2").hasMessageContaining("letters");
    }

    @Test
    void serialsOfLettersDigitsDashUnderscoreAndDotAreAccepted() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        assertThat(receive(pair, List.of("Ab-1_2.3", "zz.09")).serials()).containsExactly("Ab-1_2.3", "zz.09");
    }

    @Test
    void aModelWithoutApprovedProcedureAndADisqualifiedSupplierAreRefused() {
        Pair none = ReceivingTestSupport.pair(catalogue, procedures, null, SupplierStatus.APPROVED);
        assertThatThrownBy(() -> receive(none, List.of("N1")))
                .isInstanceOf(ReceivingException.class).hasMessageContaining("has no approved procedure");
        Pair disqualified = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_1_0, SupplierStatus.DISQUALIFIED);
        assertThatThrownBy(() -> receive(disqualified, List.of("Q1")))
                .isInstanceOf(ReceivingException.class).hasMessageContaining("disqualified");
        Pair other = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_1_0, SupplierStatus.APPROVED);
        assertThatThrownBy(() -> receiving.receive(new NewReceipt("PO", "DN", LocalDate.of(2026, 1, 5),
                other.supplier().id(), List.of(new NewLot(none.model().id(), 1, List.of("Z1"))), null)))
                .isInstanceOf(ReceivingException.class).hasMessageContaining("does not supply");
    }

    @Test
    void theSameClientTokenReturnsTheSavedReceiptInsteadOfACopy() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_1_0, SupplierStatus.APPROVED);
        String token = UUID.randomUUID().toString();
        NewReceipt draft = new NewReceipt("PO-T", "DN-T", LocalDate.of(2026, 1, 5), pair.supplier().id(),
                List.of(new NewLot(pair.model().id(), 2, List.of("T1", "T2"))), token);
        ReceiptView first = receiving.receive(draft);
        int lots = count("receiving_lot");
        ReceiptView second = receiving.receive(draft);
        assertThat(second.id()).isEqualTo(first.id());
        assertThat(count("receiving_lot")).isEqualTo(lots);
    }

    @Test
    void dEqualToAcAcceptsAndDEqualToReRejects() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        LotView first = receive(pair, ReceivingTestSupport.serials("A", 50));
        // ISO 2859-1:1999 Table 1 and Table 2-A: lot 50, level II -> code letter D, n 8; AQL 6.5 -> Ac 1, Re 2.
        assertThat(first.plan().planCodeLetter().name()).isEqualTo("D");
        assertThat(first.plan().sampleSize()).isEqualTo(8);
        assertThat(first.plan().acceptNumber()).isEqualTo(1);
        assertThat(first.plan().rejectNumber()).isEqualTo(2);
        LotResultView accepted = receiving.recordLotResult(first.id(), first.plan().acceptNumber());
        assertThat(accepted.disposition()).isEqualTo(Disposition.ACCEPT);
        assertThat(accepted.lot().state()).isEqualTo(LotState.DISPOSITIONED_ACCEPTED);
        assertThat(accepted.lot().version()).isEqualTo(first.version() + 1);

        LotView second = receive(pair, ReceivingTestSupport.serials("B", 50));
        LotResultView rejected = receiving.recordLotResult(second.id(), second.plan().rejectNumber());
        assertThat(rejected.disposition()).isEqualTo(Disposition.REJECT);
        assertThat(rejected.lot().state()).isEqualTo(LotState.DISPOSITIONED_REJECTED);
        assertThatThrownBy(() -> receiving.recordLotResult(second.id(), 0))
                .isInstanceOf(ReceivingException.class).hasMessageContaining("already been dispositioned");
        assertThat(jdbc.queryForObject("select count(*) from audit_entry where entity_type = 'LOT' and entity_id = ?"
                + " and action = 'DISPOSITION'", Integer.class, String.valueOf(second.id()))).isEqualTo(1);
    }

    @Test
    void twoOfFiveLotsNotAcceptedSwitchToTightenedForTheNextLot() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        // ISO 2859-1:1999 clause 9.3.1 (as in SAMPLING.md): normal -> tightened when 2 of 5 or fewer consecutive
        // lots are not accepted on original inspection.
        boolean[] accept = {true, false, true, false};
        SwitchingView after = null;
        for (int i = 0; i < accept.length; i++) {
            LotView lot = receive(pair, ReceivingTestSupport.serials("L" + i + "-", 50));
            assertThat(lot.plan().severity()).isEqualTo(Severity.NORMAL);
            LotResultView result = receiving.recordLotResult(lot.id(),
                    accept[i] ? lot.plan().acceptNumber() : lot.plan().rejectNumber());
            after = result.switching();
            if (i < 3) {
                assertThat(after.state().severity()).isEqualTo(Severity.NORMAL);
            }
        }
        assertThat(after.state().severity()).isEqualTo(Severity.TIGHTENED);
        assertThat(after.lastExplanation()).contains("ISO 2859-1:1999 clause 9.3.1");
        LotView next = receive(pair, ReceivingTestSupport.serials("N", 50));
        assertThat(next.plan().severity()).isEqualTo(Severity.TIGHTENED);
        assertThat(next.plan().plan())
                .isEqualTo(SingleSamplingPlans.plan(50, Aql.AQL_6_5, InspectionLevel.II, Severity.TIGHTENED));
        assertThat(jdbc.queryForObject("select count(*) from audit_entry where entity_type = 'SWITCHING' and entity_id = ?"
                + " and summary like '%9.3.1%'", Integer.class, String.valueOf(after.id()))).isGreaterThanOrEqualTo(1);
    }

    @Test
    void aStaleSwitchingVersionRollsBackTheLotUpdateToo() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        LotView lot = receive(pair, ReceivingTestSupport.serials("R", 50));
        receiving.recordLotResult(receive(pair, ReceivingTestSupport.serials("P", 50)).id(), 0);
        SwitchingView before = receiving.switching(pair.supplier().id(), pair.model().id()).orElseThrow();
        int audit = count("audit_entry");
        // The lot row is updated first; the stale switching version then fails the same transaction.
        assertThatThrownBy(() -> receiving.recordLotResult(lot.id(), 2, lot.version(), before.version() - 1))
                .isInstanceOf(ObjectOptimisticLockingFailureException.class);
        LotView unchanged = receiving.lot(lot.id()).orElseThrow();
        assertThat(unchanged.state()).isEqualTo(LotState.AWAITING_MEASUREMENT);
        assertThat(unchanged.version()).isEqualTo(lot.version());
        assertThat(unchanged.nonconforming()).isNull();
        assertThat(receiving.switching(pair.supplier().id(), pair.model().id()).orElseThrow()).isEqualTo(before);
        assertThat(count("audit_entry")).isEqualTo(audit);
        assertThatThrownBy(() -> receiving.recordLotResult(lot.id(), 2, lot.version() + 5, before.version()))
                .isInstanceOf(ObjectOptimisticLockingFailureException.class);
    }

    @Test
    @WithMockUser(username = "supervisor", roles = "SUPERVISOR")
    void discontinuedInspectionBlocksNewLotsUntilASupervisorLiftsItWithAReason() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_6_5, SupplierStatus.APPROVED);
        // Two not accepted on normal -> tightened (9.3.1); five not accepted on tightened -> discontinued (9.4).
        for (int i = 0; i < 7; i++) {
            LotView lot = receive(pair, ReceivingTestSupport.serials("D" + i + "-", 50));
            receiving.recordLotResult(lot.id(), lot.plan().rejectNumber());
        }
        SwitchingView blocked = receiving.switching(pair.supplier().id(), pair.model().id()).orElseThrow();
        assertThat(blocked.label()).isEqualTo("DISCONTINUED");
        int lots = count("receiving_lot");
        assertThatThrownBy(() -> receive(pair, List.of("X1")))
                .isInstanceOf(ReceivingException.class).hasMessageContaining("discontinued");
        assertThat(count("receiving_lot")).isEqualTo(lots);
        assertThatThrownBy(() -> receiving.liftBlock(blocked.id(), " ", blocked.version()))
                .isInstanceOf(ReceivingException.class).hasMessageContaining("reason");
        SwitchingView lifted = receiving.liftBlock(blocked.id(), "Supplier 8D report accepted", blocked.version());
        assertThat(lifted.label()).isEqualTo("TIGHTENED");
        assertThat(jdbc.queryForObject("select reason from audit_entry where entity_type = 'SWITCHING' and entity_id = ?"
                + " and action = 'LIFT_BLOCK'", String.class, String.valueOf(blocked.id())))
                .isEqualTo("Supplier 8D report accepted");
        assertThat(receive(pair, ReceivingTestSupport.serials("Y", 50)).plan().severity()).isEqualTo(Severity.TIGHTENED);
    }

    /** Ten lots of 50 at AQL 10, level II: code letter D, n 8, Ac 2, Re 3 (ISO 2859-1:1999 Table 2-A). */
    private List<LotView> tenAcceptedLots(Pair pair, String prefix, LotView first) {
        List<LotView> lots = new ArrayList<>();
        for (int i = 0; i < 10; i++) {
            LotView lot = i == 0 && first != null ? first : receive(pair, ReceivingTestSupport.serials(prefix + i + "-", 50));
            assertThat(lot.plan().severity()).isEqualTo(Severity.NORMAL);
            assertThat(lot.plan().acceptNumber()).isEqualTo(2);
            // d = 0 is also accepted at AQL 6.5 (D, n 8, Ac 1): +3 to the switching score (clause 9.3.3.2 a 1)
            receiving.recordLotResult(lot.id(), 0);
            lots.add(lot);
        }
        return lots;
    }

    @Test
    @WithMockUser(username = "supervisor", roles = "SUPERVISOR")
    void withReducedApprovedTenAcceptedLotsReachingTheScoreMoveToReduced() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_10, SupplierStatus.APPROVED);
        LotView first = receive(pair, ReceivingTestSupport.serials("F", 50));
        SwitchingView start = receiving.switching(pair.supplier().id(), pair.model().id()).orElseThrow();
        assertThat(receiving.reducedInspection(start).readiness().missing())
                .anyMatch(m -> m.contains("switching score 0 of 30")).anyMatch(m -> m.contains("approval"));
        assertThatThrownBy(() -> receiving.approveReducedInspection(start.id(), "Supplier audit passed", false,
                start.version())).isInstanceOf(ReceivingException.class)
                .satisfies(e -> assertThat(((ReceivingException) e).field()).isEqualTo("productionSteady"));
        assertThatThrownBy(() -> receiving.approveReducedInspection(start.id(), " ", true, start.version()))
                .isInstanceOf(ReceivingException.class).hasMessageContaining("reason");
        SwitchingView approved = receiving.approveReducedInspection(start.id(), "Supplier audit passed", true,
                start.version());
        // ISO 2859-1:1999 clause 9.3.3 a): the approval alone does not switch while the score is below 30
        assertThat(approved.state().severity()).isEqualTo(Severity.NORMAL);
        assertThat(receiving.reducedInspection(approved).readiness().missing())
                .containsExactly("switching score 0 of 30 (ISO 2859-1:1999 clause 9.3.3 a)");
        List<LotView> lots = tenAcceptedLots(pair, "A", first);
        SwitchingView after = receiving.switching(pair.supplier().id(), pair.model().id()).orElseThrow();
        // ISO 2859-1:1999 clause 9.3.3: the score reached 30 at the tenth lot, with approval and steady
        // production -> reduced from the next lot
        assertThat(after.state().severity()).isEqualTo(Severity.REDUCED);
        assertThat(after.lastExplanation()).contains("reduced inspection from the next lot (ISO 2859-1:1999 clause 9.3.3)");
        assertThat(receiving.reducedInspection(after).readiness().onReduced()).isTrue();
        LotView next = receive(pair, ReceivingTestSupport.serials("N", 50));
        // ISO 2859-1:1999 Table 2-C, code letter D, AQL 10: n 3, Ac 1, Re 2 (SAMPLING.md section 6.4 generator)
        assertThat(next.plan().plan())
                .isEqualTo(SingleSamplingPlans.plan(50, Aql.AQL_10, InspectionLevel.II, Severity.REDUCED));
        assertThat(lots).hasSize(10);
        assertThat(jdbc.queryForObject("select reason from audit_entry where entity_type = 'SWITCHING' and entity_id = ?"
                + " and action = 'APPROVE_REDUCED'", String.class, String.valueOf(start.id())))
                .isEqualTo("Supplier audit passed");

        // Withdrawing on reduced reinstates normal from the next lot (clause 9.3.4 c), a new row beside the approval.
        SwitchingView withdrawn = receiving.withdrawReducedInspection(after.id(), "Production moved to a new line",
                after.version());
        assertThat(withdrawn.state().severity()).isEqualTo(Severity.NORMAL);
        assertThat(withdrawn.lastExplanation()).contains("9.3.4");
        assertThat(receiving.reducedDecisions(pair.supplier().id(), pair.model().id()))
                .extracting(ReducedInspectionDecision::approved).containsExactly(false, true);
        assertThat(jdbc.queryForObject("select count(*) from audit_entry where entity_type = 'SWITCHING' and entity_id = ?"
                + " and action = 'WITHDRAW_REDUCED' and reason = 'Production moved to a new line'", Integer.class,
                String.valueOf(start.id()))).isEqualTo(1);
    }

    @Test
    @WithMockUser(username = "supervisor", roles = "SUPERVISOR")
    void withoutApprovalTenAcceptedLotsStayOnNormalUntilTheApprovalIsGiven() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_10, SupplierStatus.APPROVED);
        tenAcceptedLots(pair, "B", null);
        SwitchingView after = receiving.switching(pair.supplier().id(), pair.model().id()).orElseThrow();
        // ISO 2859-1:1999 clause 9.3.3 c): score 30, but without the responsible authority's approval
        assertThat(after.state().switchingScore()).isEqualTo(30);
        assertThat(after.state().severity()).isEqualTo(Severity.NORMAL);
        assertThat(after.lastExplanation()).contains("also needs the responsible authority's approval");
        assertThat(receiving.reducedInspection(after).readiness().missing()).singleElement()
                .satisfies(m -> assertThat(m).contains("approval").contains("9.3.3 b and c"));
        // The approval given now, with the score already at 30, switches from the next lot.
        SwitchingView approved = receiving.approveReducedInspection(after.id(), "Ten clean lots", true, after.version());
        assertThat(approved.state().severity()).isEqualTo(Severity.REDUCED);
        assertThatThrownBy(() -> receiving.approveReducedInspection(after.id(), "again", true, approved.version()))
                .isInstanceOf(ReceivingException.class).hasMessageContaining("already approved");
        assertThatThrownBy(() -> receiving.withdrawReducedInspection(after.id(), "stale", after.version()))
                .isInstanceOf(ObjectOptimisticLockingFailureException.class);
    }

    @Test
    void onlyASupervisorDecidesOnReducedInspectionAndDecisionsAreAppendOnly() {
        Pair pair = ReceivingTestSupport.pair(catalogue, procedures, Aql.AQL_10, SupplierStatus.APPROVED);
        receive(pair, ReceivingTestSupport.serials("O", 50));
        SwitchingView state = receiving.switching(pair.supplier().id(), pair.model().id()).orElseThrow();
        int decisions = count("reduced_inspection_decision");
        // signed in as an OPERATOR (class default)
        assertThatThrownBy(() -> receiving.approveReducedInspection(state.id(), "x", true, state.version()))
                .isInstanceOf(org.springframework.security.access.AccessDeniedException.class);
        assertThat(count("reduced_inspection_decision")).isEqualTo(decisions);
        jdbc.update("insert into reduced_inspection_decision (supplier_id, model_id, approved, reason, decided_by,"
                + " decided_at) values (?, ?, true, 'test row', 'supervisor', current_timestamp)",
                pair.supplier().id(), pair.model().id());
        assertThatThrownBy(() -> jdbc.update("update reduced_inspection_decision set approved = false where supplier_id = ?",
                pair.supplier().id())).hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.update("delete from reduced_inspection_decision where supplier_id = ?",
                pair.supplier().id())).hasMessageContaining("append-only");
    }
}
