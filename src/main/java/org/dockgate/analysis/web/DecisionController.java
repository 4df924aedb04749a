package org.dockgate.analysis.web;

import org.dockgate.core.decision.Decision;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.DecisionRule;
import org.dockgate.core.decision.ExpandedUncertainty;
import org.dockgate.core.decision.Tolerance;
import org.dockgate.core.decision.Verdict;
import org.dockgate.web.ApiNumbers;
import org.springframework.http.MediaType;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.tags.Tag;

/** Applies a decision rule to one measured value for integrating tools. */
@RestController
@RequestMapping(path = "/api/v1/analysis", produces = MediaType.APPLICATION_JSON_VALUE)
@Tag(name = "Analysis: decision rules", description = "Conformity decisions after ILAC G8:09/2019 and JCGM 106:2012")
class DecisionController {

    private static final String EXAMPLE_REQUEST = """
            {"measured": 0.80, "lowerLimit": -1.0, "upperLimit": 1.0, "expandedUncertainty": 0.25,
             "coverageFactor": 2, "rule": "NON_BINARY"}""";

    private static final String EXAMPLE_RESPONSE = """
            {"verdict": "CONDITIONAL_PASS", "acceptanceLower": -0.75, "acceptanceUpper": 0.75,
             "probabilityOfConformance": 0.945200708, "testUncertaintyRatio": 4.0, "turAdequate": true}""";

    @Operation(summary = "Verdict for a measured value under a decision rule",
            description = """
                    Give `lowerLimit`, `upperLimit` or both (limits inclusive). `rule`: SIMPLE_ACCEPTANCE \
                    (w = 0), GUARD_BANDED (w = guardBandFactor·U, factor default 1), NON_BINARY (ILAC G8 w = U: \
                    PASS, CONDITIONAL_PASS, CONDITIONAL_FAIL, FAIL), RISK_BASED (JCGM 106: PASS when the \
                    probability of conformance with u = U/k is at least 1 − maxFalseAcceptRisk, default 0.025). \
                    `coverageFactor` defaults to 2. `guardBandFactor` is accepted only with GUARD_BANDED and \
                    `maxFalseAcceptRisk` only with RISK_BASED. The acceptance limits are null where the tolerance \
                    has no such limit, and both null when the guard band leaves no acceptance zone (nothing can \
                    PASS). testUncertaintyRatio = (upperLimit − lowerLimit)/(2U) is null for a one-sided \
                    tolerance (not defined) and when U = 0 (infinite); turAdequate (TUR ≥ 4) is null when the \
                    ratio is not defined.""")
    @io.swagger.v3.oas.annotations.parameters.RequestBody(content = @Content(
            examples = @ExampleObject(name = "ILAC G8 non-binary", value = EXAMPLE_REQUEST)))
    @io.swagger.v3.oas.annotations.responses.ApiResponse(responseCode = "200", content = @Content(
            schema = @Schema(implementation = DecisionResponse.class),
            examples = @ExampleObject(name = "ILAC G8 non-binary", value = EXAMPLE_RESPONSE)))
    @PostMapping(path = "/decision", consumes = MediaType.APPLICATION_JSON_VALUE)
    DecisionResponse decide(@RequestBody DecisionRequest request) {
        double measured = ApiNumbers.requireFinite(request.measured(), "measured");
        double expanded = ApiNumbers.requireFinite(request.expandedUncertainty(), "expandedUncertainty");
        double k = request.coverageFactor() == null ? 2.0
                : ApiNumbers.requireFinite(request.coverageFactor(), "coverageFactor");
        Tolerance tolerance = Tolerance.of(optional(request.lowerLimit(), "lowerLimit"),
                optional(request.upperLimit(), "upperLimit"));
        Decision decision = request.policy().decide(measured, tolerance, ExpandedUncertainty.of(expanded, k));
        return DecisionResponse.of(decision);
    }

    private static Double optional(Double value, String field) {
        return value == null ? null : ApiNumbers.requireFinite(value, field);
    }

    /** A measured value, its tolerance and uncertainty, and the rule to apply. */
    record DecisionRequest(
            @Schema(description = "Measured value y", example = "0.80") Double measured,
            @Schema(description = "Lower tolerance limit T_L (inclusive)", example = "-1.0") Double lowerLimit,
            @Schema(description = "Upper tolerance limit T_U (inclusive)", example = "1.0") Double upperLimit,
            @Schema(description = "Expanded uncertainty U ≥ 0", example = "0.25") Double expandedUncertainty,
            @Schema(description = "Coverage factor k of U, default 2", example = "2") Double coverageFactor,
            @Schema(description = "Decision rule") DecisionRule rule,
            @Schema(description = "Guard band w = factor·U for GUARD_BANDED, ≥ 0, default 1") Double guardBandFactor,
            @Schema(description = "Largest specific false-accept risk α for RISK_BASED, 0 < α < 0.5, default 0.025")
            Double maxFalseAcceptRisk) {

        DecisionPolicy policy() {
            if (rule == null) {
                throw new IllegalArgumentException("'rule' is required: one of SIMPLE_ACCEPTANCE, GUARD_BANDED,"
                        + " NON_BINARY, RISK_BASED.");
            }
            if (guardBandFactor != null && rule != DecisionRule.GUARD_BANDED) {
                throw new IllegalArgumentException("'guardBandFactor' applies only to rule GUARD_BANDED, not " + rule
                        + ".");
            }
            if (maxFalseAcceptRisk != null && rule != DecisionRule.RISK_BASED) {
                throw new IllegalArgumentException("'maxFalseAcceptRisk' applies only to rule RISK_BASED, not "
                        + rule + ".");
            }
            return new DecisionPolicy(rule,
                    guardBandFactor == null ? DecisionPolicy.DEFAULT_GUARD_BAND_FACTOR
                            : ApiNumbers.requireFinite(guardBandFactor, "guardBandFactor"),
                    maxFalseAcceptRisk == null ? DecisionPolicy.DEFAULT_MAX_FALSE_ACCEPT_RISK
                            : ApiNumbers.requireFinite(maxFalseAcceptRisk, "maxFalseAcceptRisk"));
        }
    }

    /** The verdict with its acceptance limits, p_c and TUR; absent or infinite values are null. */
    record DecisionResponse(Verdict verdict, Double acceptanceLower, Double acceptanceUpper,
            double probabilityOfConformance, Double testUncertaintyRatio, Boolean turAdequate) {

        static DecisionResponse of(Decision decision) {
            return new DecisionResponse(decision.verdict(), ApiNumbers.finiteOrNull(decision.acceptanceLower()),
                    ApiNumbers.finiteOrNull(decision.acceptanceUpper()), decision.probabilityOfConformance(),
                    ApiNumbers.finiteOrNull(decision.testUncertaintyRatio()),
                    decision.testUncertaintyRatio().isPresent() ? decision.turAdequate() : null);
        }
    }
}
