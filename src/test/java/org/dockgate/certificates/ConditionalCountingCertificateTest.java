package org.dockgate.certificates;

import static org.assertj.core.api.Assertions.assertThat;

import org.dockgate.bench.BenchService;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.evaluation.ConditionalCounting;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.procedures.ApprovedProcedure;
import org.dockgate.procedures.ProcedureDocuments;
import org.dockgate.procedures.ProcedureService;
import org.dockgate.procedures.ProcedureSettings;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.ReceivingService;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;

/**
 * The counting of conditional results toward Ac/Re is a procedure setting: stored on the revision, stated in
 * the procedure's PDF and on the lot certificate (section 3). The effect on a lot decision is checked in
 * {@code LotTallyTest}.
 */
// Its own in-memory database: the test approves a new QP-250 procedure revision, which must not supersede the
// demo procedure other test contexts use.
@SpringBootTest(properties = {"spring.datasource.url=jdbc:h2:mem:counting-${random.uuid};DB_CLOSE_DELAY=-1",
    "spring.datasource.username=sa", "spring.datasource.password=",
    "dockgate.data-dir=target/test-data/counting-${random.uuid}"})
class ConditionalCountingCertificateTest {

    @Autowired LotCertificateService certificates;
    @Autowired CertificateRegister register;
    @Autowired EvaluationService evaluation;
    @Autowired ReceivingService receiving;
    @Autowired CatalogueService catalogue;
    @Autowired BenchService bench;
    @Autowired ProcedureService procedures;
    @Autowired ProcedureDocuments documents;

    private String certificateText(LotView lot) throws Exception {
        IssuedCertificate issued = LotFixtures.as("engineer2", () -> certificates.approveAndSign(lot.id(),
                LotCertificateTest.ENGINEER2_PASSWORD));
        // Table cells wrap where they like: compared with white space removed, as LotCertificateTest does.
        return LotCertificateTest.compact(IndependentSignatureCheck.textWithFields(
                register.pdf(issued.certificateNumber()).orElseThrow()));
    }

    @Test
    void theProcedureAndTheCertificateSayWhichCountingApplied() throws Exception {
        var model = catalogue.modelByPartNumber("QP-250").orElseThrow();
        // The demo procedure was approved with the default counting.
        ApprovedProcedure demo = procedures.approvedFor(model.id()).orElseThrow();
        assertThat(demo.settings().conditionalCounting()).isEqualTo(ConditionalCounting.DEFAULT);
        String first = certificateText(LotFixtures.acceptedLot(receiving, catalogue, bench, evaluation, "operator"));
        assertThat(first).contains(LotCertificateTest.compact("Conditional results " + ConditionalCounting.DEFAULT.inWords()))
                .contains(LotCertificateTest.compact("a CONDITIONAL PASS does not count"));

        // A new revision that counts both conditional results.
        var settings = new ProcedureSettings(demo.settings().aql(), demo.settings().level(), demo.settings().rule(),
                demo.settings().guardBandFactor(), demo.settings().maxFalseAcceptRisk(), ConditionalCounting.STRICT);
        long draftId = LotFixtures.as("engineer", () -> procedures.createDraft(model.latest().id(), settings));
        var draft = LotFixtures.as("engineer", () -> procedures.draft(draftId));
        assertThat(draft.settings().conditionalCounting()).isEqualTo(ConditionalCounting.STRICT);
        if (!draft.proposal().allTestUncertaintyRatiosAdequate()) {
            draft = LotFixtures.as("engineer", () -> procedures.justify(draftId, "Same references as revision "
                    + demo.revisionNo() + "; guard band w = U.", procedures.draft(draftId).version()));
        }
        long version = draft.version();
        ApprovedProcedure strict = LotFixtures.as("engineer2", () -> procedures.approve(draftId, version));
        assertThat(procedures.revision(strict.id()).orElseThrow().settings().conditionalCounting())
                .isEqualTo(ConditionalCounting.STRICT);
        String procedurePdf = LotCertificateTest.compact(IndependentSignatureCheck.text(documents.render(strict)));
        assertThat(procedurePdf)
                .contains(LotCertificateTest.compact(ConditionalCounting.STRICT.inWords()));

        LotView lot = LotFixtures.acceptedLot(receiving, catalogue, bench, evaluation, "operator");
        assertThat(lot.procedureRevisionId()).isEqualTo(strict.id());
        String second = certificateText(lot);
        assertThat(second).contains(LotCertificateTest.compact("Conditional results " + ConditionalCounting.STRICT.inWords()))
                .contains(LotCertificateTest.compact("a CONDITIONAL PASS counts;"));
    }
}
