package org.dockgate.evaluation.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.time.LocalDate;
import org.dockgate.evaluation.DispositionAction;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.evaluation.NonconformanceReport;
import org.dockgate.evaluation.Recheck;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(name = "Evaluation", description = "Unit results, lot dispositions and nonconformance reports")
class EvaluationApiController {

    private final EvaluationService evaluation;

    EvaluationApiController(EvaluationService evaluation) {
        this.evaluation = evaluation;
    }

    record DispositionRequest(DispositionAction action, String notes, Boolean correctiveActionRequested,
                              LocalDate correctiveActionDue, Long expectedLotVersion) {
    }

    record ConcessionRequest(String reason) {
    }

    @GetMapping("/api/v1/lots/{id}/evaluation")
    @Operation(summary = "Each sampled unit's metrics and verdicts, and the lot's tally so far",
            description = "Compact by default: per unit its verdict and per metric value, U, k, ν_eff, tolerance and"
                    + " acceptance limits, verdict and p_c. detail=budgets adds each metric's budget lines, its note,"
                    + " the per-point checks and the chart points. Absent or infinite figures (ν_eff = ∞) are null."
                    + " After disposition the answer is the frozen record (frozen: true).")
    EvaluationResponse evaluation(@PathVariable long id,
                                  @Parameter(description = "budgets for the budget lines; absent for the compact answer")
                                  @RequestParam(required = false) String detail) {
        EvaluationResponse.Detail level = EvaluationResponse.Detail.of(detail);
        return EvaluationResponse.of(evaluation.lotEvaluation(id), level);
    }

    @GetMapping("/api/v1/lots/{id}/evaluation/recheck")
    @Operation(summary = "Recompute a dispositioned lot's unit results and compare them with the frozen record",
            description = "Recomputes every sampled unit from the stored readings and the calibration records in force"
                    + " when they were taken, and names each figure that differs from the results frozen at disposition"
                    + " (serial, metric, field, frozen value, recomputed value). Changes nothing.")
    Recheck recheck(@PathVariable long id) {
        return evaluation.recheck(id);
    }

    @PostMapping("/api/v1/lots/{id}/disposition")
    @Operation(summary = "Disposition a lot whose sample is complete (ENGINEER)",
            description = "Accept or reject follows from Ac/Re; for a rejected lot give the action. Lot state, switching"
                    + " state, frozen unit results and the nonconformance report commit together.")
    EvaluationResponse disposition(@PathVariable long id, @RequestBody DispositionRequest request) {
        if (request.expectedLotVersion() == null) {
            throw new IllegalArgumentException("'expectedLotVersion' is required (the lot's version you have seen).");
        }
        return EvaluationResponse.of(evaluation.disposition(id, request.action(), request.notes(),
                Boolean.TRUE.equals(request.correctiveActionRequested()), request.correctiveActionDue(),
                request.expectedLotVersion()), EvaluationResponse.Detail.SUMMARY);
    }

    @PostMapping("/api/v1/lots/{id}/concession")
    @Operation(summary = "Approve a use-as-is concession (SUPERVISOR), with its reason")
    NonconformanceReport concession(@PathVariable long id, @RequestBody ConcessionRequest request) {
        return evaluation.approveConcession(id, request.reason());
    }
}
