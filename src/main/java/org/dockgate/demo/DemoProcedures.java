package org.dockgate.demo;

import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.DecisionRule;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.procedures.ProcedureService;
import org.dockgate.procedures.ProcedureSettings;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;

/**
 * Approved procedures for the demo's sensor models: derived by the engineer with AQL 1.0, level II and
 * the guard-banded rule, justified where a TUR stays below 4:1, and approved by the second engineer
 * (the author may not approve alone).
 */
@Component
@Order(500)
class DemoProcedures implements DemoStep {

    private final CatalogueService catalogue;
    private final ProcedureService procedures;

    DemoProcedures(CatalogueService catalogue, ProcedureService procedures) {
        this.catalogue = catalogue;
        this.procedures = procedures;
    }

    @Override
    public String name() {
        return "procedures";
    }

    @Override
    public void load(SeedFiles files) {
        ProcedureSettings settings = new ProcedureSettings(Aql.of(1.0), InspectionLevel.II, DecisionRule.GUARD_BANDED,
                DecisionPolicy.DEFAULT_GUARD_BAND_FACTOR, DecisionPolicy.DEFAULT_MAX_FALSE_ACCEPT_RISK);
        for (var model : catalogue.models(null, null, null)) {
            if (model.latest() == null || procedures.approvedFor(model.id()).isPresent()) {
                continue;
            }
            long draftId = DemoLoader.as("engineer", () -> procedures.createDraft(model.latest().id(), settings));
            var draft = DemoLoader.as("engineer", () -> procedures.draft(draftId));
            if (!draft.proposal().allTestUncertaintyRatiosAdequate()) {
                draft = DemoLoader.as("engineer", () -> procedures.justify(draftId,
                        "The lab's best reference for this range does not reach 4:1 for every metric; the guard band"
                                + " (w = U) keeps the false-accept risk low and the supplier's own calibration data is"
                                + " reviewed for every lot.", procedures.draft(draftId).version()));
            }
            long version = draft.version();
            DemoLoader.as("engineer2", () -> procedures.approve(draftId, version));
        }
    }
}
