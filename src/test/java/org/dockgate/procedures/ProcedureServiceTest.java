package org.dockgate.procedures;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.function.Supplier;
import org.dockgate.audit.AuditReader;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.NewSensorModel;
import org.dockgate.catalogue.OutputKind;
import org.dockgate.core.decision.DecisionRule;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.Sensitivity;
import org.dockgate.core.procedure.SensorSpecification.ToleranceMode;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.instruments.NewCalibration;
import org.dockgate.instruments.NewInstrument;
import org.dockgate.instruments.UncertaintyMode;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.dao.DataAccessException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.AuthorityUtils;
import org.springframework.security.core.context.SecurityContextHolder;

@SpringBootTest
class ProcedureServiceTest {

    @Autowired ProcedureService procedures;
    @Autowired CatalogueService catalogue;
    @Autowired AuditReader audit;
    @Autowired JdbcTemplate jdbc;
    @Autowired InstrumentService instruments;

    static final ProcedureSettings SETTINGS = new ProcedureSettings(Aql.of(1.0), InspectionLevel.II,
            DecisionRule.GUARD_BANDED, 1.0, 0.025);

    static <T> T as(String user, Supplier<T> work) {
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(user, null,
                AuthorityUtils.NO_AUTHORITIES));
        try {
            return work.get();
        } finally {
            SecurityContextHolder.clearContext();
        }
    }

    long newModel() {
        String part = "T-" + UUID.randomUUID().toString().substring(0, 8);
        var spec = new SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "bar", 0, 10, "mV",
                new Sensitivity(10, "mV/bar", 1, ToleranceMode.PERCENT), null, 0.5, 0.25, null, 0.1, 0.2, null, null, null, null);
        return as("engineer", () -> catalogue.createModel(new NewSensorModel(part, "Test transducer", "pressure",
                OutputKind.VOLTAGE, "10 V", List.of("QSL"), spec))).latest().id();
    }

    @Test
    void aDraftIsEditedWithReasonsAndApprovedIntoAnImmutableRevision() {
        long spec = newModel();
        long draftId = as("engineer", () -> procedures.createDraft(spec, SETTINGS));
        var draft = procedures.draft(draftId);
        // The demo register's piston gauge (0.01 % of reading) serves 0 … 10 bar.
        assertThat(draft.proposal().staticCalibration().referenceInstrument()).isEqualTo("RI-PRS-01");
        var edited = as("engineer", () -> procedures.edit(draftId, "static.settleSeconds", "45", "creep seen on the last lot",
                draft.version()));
        assertThat(edited.proposal().staticCalibration().settleSeconds()).isEqualTo(45);
        assertThat(edited.edits()).singleElement().satisfies(e -> assertThat(e.reason()).isEqualTo("creep seen on the last lot"));
        assertThatThrownBy(() -> as("engineer", () -> procedures.edit(draftId, "static.cycles", "2", "fewer", edited.version())))
                .hasMessageContaining("at least 3 cycles");
        assertThatThrownBy(() -> as("engineer", () -> procedures.edit(draftId, "static.points", "0, 5, 12", "x", edited.version())))
                .hasMessageContaining("outside the input range");
        // The author cannot approve alone while a second engineer exists.
        assertThatThrownBy(() -> as("engineer", () -> procedures.approve(draftId, edited.version())))
                .hasMessageContaining("another engineer");
        var approved = as("engineer2", () -> procedures.approve(draftId, edited.version()));
        assertThat(approved.status()).isEqualTo("APPROVED");
        assertThat(approved.content().staticCalibration().settleSeconds()).isEqualTo(45);
        assertThat(audit.history("PROCEDURE_DRAFT", String.valueOf(draftId))).extracting(e -> e.action())
                .contains("CREATE", "EDIT_WITH_REASON");
        // Approved: no further edits, and the database refuses changes too.
        assertThatThrownBy(() -> as("engineer", () -> procedures.edit(draftId, "benchMinutes", "90", "x", edited.version() + 1)))
                .hasMessageContaining("approved revision never changes");
        assertThatThrownBy(() -> jdbc.update("update procedure_revision set content_json = '{}' where id = ?", approved.id()))
                .isInstanceOf(DataAccessException.class);
        assertThatThrownBy(() -> jdbc.update("update specification_revision set reason = 'x' where id = ?", spec))
                .isInstanceOf(DataAccessException.class);
    }

    @Test
    void aNewApprovalSupersedesThePreviousRevision() {
        long spec = newModel();
        long first = as("engineer", () -> procedures.createDraft(spec, SETTINGS));
        var rev1 = as("supervisor", () -> procedures.approve(first, 0));
        long second = as("engineer", () -> procedures.createDraft(spec, SETTINGS));
        var rev2 = as("engineer2", () -> procedures.approve(second, 0));
        assertThat(rev2.revisionNo()).isEqualTo(rev1.revisionNo() + 1);
        assertThat(procedures.revision(rev1.id()).orElseThrow().superseded()).isTrue();
        assertThat(procedures.approvedFor(rev2.modelId()).orElseThrow().id()).isEqualTo(rev2.id());
    }

    @Test
    void aLowTurNeedsAJustificationBeforeApproval() {
        // ±0.05 % sensitivity tolerance against a 0.01 % reference gives TUR 5 — but a ±0.015 % tolerance gives 1.5.
        String part = "T-" + UUID.randomUUID().toString().substring(0, 8);
        var spec = new SensorSpecification(SensorKind.PRESSURE_TRANSDUCER, "bar", 0, 10, "mV",
                new Sensitivity(10, "mV/bar", 0.015, ToleranceMode.PERCENT), null, null, null, null, null, null, null, null,
                null, null);
        long specId = as("engineer", () -> catalogue.createModel(new NewSensorModel(part, "Tight", "pressure",
                OutputKind.VOLTAGE, "10 V", List.of("QSL"), spec))).latest().id();
        long draftId = as("engineer", () -> procedures.createDraft(specId, SETTINGS));
        assertThat(procedures.draft(draftId).proposal().allTestUncertaintyRatiosAdequate()).isFalse();
        assertThatThrownBy(() -> as("engineer2", () -> procedures.approve(draftId, 0))).hasMessageContaining("justification");
        var justified = as("engineer", () -> procedures.justify(draftId, "Supplier data reviewed per lot", 0));
        assertThat(as("engineer2", () -> procedures.approve(draftId, justified.version())).justification())
                .isEqualTo("Supplier data reviewed per lot");
    }

    @Test
    void anExpiredInstrumentCannotBeChosen() {
        long spec = newModel();
        long draftId = as("engineer", () -> procedures.createDraft(spec, SETTINGS));
        // RI-PRS-02 is the demo's expired pressure calibrator.
        assertThatThrownBy(() -> as("engineer", () -> procedures.edit(draftId, "static.instrument", "RI-PRS-02",
                "try the hand-held", 0))).hasMessageContaining("RI-PRS-02");
    }

    @Test
    void theDerivationApiDoesNotSave() {
        long spec = newModel();
        Integer before = jdbc.queryForObject("select count(*) from procedure_draft", Integer.class);
        var proposal = procedures.propose(spec, SETTINGS, Map.of("static.cycles", "5"));
        assertThat(proposal.staticCalibration().cycles()).isEqualTo(5);
        assertThat(jdbc.queryForObject("select count(*) from procedure_draft", Integer.class)).isEqualTo(before);
    }

    @Test
    void anInstrumentCalibratedAboveZeroIsNotPlannedForTheZeroPoint() {
        // A force reference finer than the demo's RI-LOD-01, but calibrated over 50 … 1000 N only.
        String id = "RI-T-" + UUID.randomUUID().toString().substring(0, 8).toUpperCase();
        var today = instruments.today();
        as("admin", () -> instruments.create(new NewInstrument(id, "Force standard, calibrated from 50 N", "force", 0,
                1000, "N", new NewCalibration("C-" + id, today.minusDays(5), today.plusDays(300), 2.0,
                        List.of(new org.dockgate.instruments.UncertaintyBand(1000, 0.001,
                                UncertaintyMode.PERCENT_OF_READING)), 50.0, 1000.0, 0.001))));
        String part = "T-" + UUID.randomUUID().toString().substring(0, 8);
        var spec = new SensorSpecification(SensorKind.LOAD_CELL, "N", 0, 500, "mV/V",
                new Sensitivity(0.004, "mV/V/N", 0.25, ToleranceMode.PERCENT), null, null, 0.05, null, null, null,
                null, null, null, null);
        long specId = as("engineer", () -> catalogue.createModel(new NewSensorModel(part, "Test load cell", "force",
                OutputKind.VOLTAGE, "10 V", List.of("QSL"), spec))).latest().id();
        // Left to itself, the derivation passes over it for the register's 0 … 1000 N instrument.
        var proposal = procedures.propose(specId, SETTINGS, Map.of());
        assertThat(proposal.staticCalibration().referenceInstrument()).isNotEqualTo(id).isNotNull();
        // Chosen by hand, it qualifies for no plan, and the reasoning names the point and the range.
        var chosen = procedures.propose(specId, SETTINGS, Map.of("static.instrument", id));
        assertThat(chosen.staticCalibration().referenceInstrument()).isNull();
        assertThat(chosen.staticCalibration().reasoning()).anyMatch(r -> r.contains(id
                + " is calibrated over 50 … 1000 N only: 0 N lies outside."));
    }
}
