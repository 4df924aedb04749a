package org.dockgate.procedures.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.List;
import java.util.Map;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.DecisionRule;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.procedures.ApprovedProcedure;
import org.dockgate.procedures.ProcedureService;
import org.dockgate.procedures.ProcedureSettings;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(name = "Procedures", description = "Inspection procedures derived from specification revisions")
class ProceduresApiController {

    private final ProcedureService procedures;

    ProceduresApiController(ProcedureService procedures) {
        this.procedures = procedures;
    }

    record DeriveRequest(Long specificationRevisionId, String aql, String level, DecisionRule rule, Double guardBandFactor,
                         Double maxFalseAcceptRisk, Map<String, String> overrides) {
    }

    @PostMapping("/api/v1/procedures/derive")
    @Operation(summary = "Propose a procedure for a specification revision without saving it",
            description = "aql from the ISO 2859-1 series (e.g. \"1.0\"), level S1…S4, I, II, III (default II), rule"
                    + " SIMPLE_ACCEPTANCE, GUARD_BANDED, NON_BINARY or RISK_BASED (default GUARD_BANDED).")
    ProcedureProposal derive(@RequestBody DeriveRequest request) {
        if (request.specificationRevisionId() == null) {
            throw new IllegalArgumentException("'specificationRevisionId' is required.");
        }
        ProcedureSettings settings = new ProcedureSettings(Aql.parse(request.aql() == null ? "1.0" : request.aql()),
                InspectionLevel.parse(request.level() == null ? "II" : request.level()),
                request.rule() == null ? DecisionRule.GUARD_BANDED : request.rule(),
                request.guardBandFactor() == null ? DecisionPolicy.DEFAULT_GUARD_BAND_FACTOR : request.guardBandFactor(),
                request.maxFalseAcceptRisk() == null ? DecisionPolicy.DEFAULT_MAX_FALSE_ACCEPT_RISK : request.maxFalseAcceptRisk());
        return procedures.propose(request.specificationRevisionId(), settings, request.overrides());
    }

    @GetMapping("/api/v1/procedures")
    @Operation(summary = "Approved procedure revisions of a sensor model, newest first")
    List<ApprovedProcedure> list(@RequestParam long modelId) {
        return procedures.revisions(modelId);
    }

    @GetMapping("/api/v1/procedures/{id}")
    @Operation(summary = "One approved procedure revision")
    ResponseEntity<ApprovedProcedure> one(@PathVariable long id) {
        return ResponseEntity.ok(procedures.revision(id).orElseThrow(org.dockgate.web.NotFoundException.of("There is no procedure revision " + id + ".")));
    }
}
