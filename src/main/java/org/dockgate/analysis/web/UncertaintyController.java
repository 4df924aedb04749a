package org.dockgate.analysis.web;

import java.util.List;
import java.util.stream.IntStream;

import org.dockgate.core.uncertainty.Distribution;
import org.dockgate.core.uncertainty.UncertaintyBudget;
import org.dockgate.core.uncertainty.UncertaintyContribution;
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

/** Evaluates an uncertainty budget after JCGM 100:2008 (GUM) for integrating tools. */
@RestController
@RequestMapping(path = "/api/v1/analysis", produces = MediaType.APPLICATION_JSON_VALUE)
@Tag(name = "Analysis: uncertainty", description = "Measurement uncertainty after JCGM 100:2008 (GUM)")
class UncertaintyController {

    private static final String EXAMPLE_REQUEST = """
            {"contributions": [
              {"name": "repeatability", "standardUncertainty": 0.00687, "degreesOfFreedom": 9},
              {"name": "readout resolution", "halfWidth": 0.005, "distribution": "RECTANGULAR"},
              {"name": "reference certificate", "expandedUncertainty": 0.030, "coverageFactor": 2},
              {"name": "temperature", "halfWidth": 0.04, "distribution": "RECTANGULAR", "sensitivityCoefficient": 0.5}
            ], "coverageProbability": 0.9545}""";

    private static final String EXAMPLE_RESPONSE = """
            {"combinedStandardUncertainty": 0.020344, "effectiveDegreesOfFreedom": 692.04,
             "coverageFactor": 2.0036, "expandedUncertainty": 0.040761,
             "contributions": [
              {"name": "repeatability", "standardUncertainty": 0.00687, "contribution": 0.00687},
              {"name": "readout resolution", "standardUncertainty": 0.0028868, "contribution": 0.0028868},
              {"name": "reference certificate", "standardUncertainty": 0.015, "contribution": 0.015},
              {"name": "temperature", "standardUncertainty": 0.023094, "contribution": 0.011547}]}""";

    @Operation(summary = "Combined and expanded uncertainty of a budget",
            description = """
                    Each contribution gives exactly one of: a `standardUncertainty` (with optional \
                    `degreesOfFreedom`, infinite when omitted); a `halfWidth` with its `distribution` \
                    (RECTANGULAR a/√3, TRIANGULAR a/√6, U_SHAPED a/√2; GUM 4.3.7, 4.3.9); or an \
                    `expandedUncertainty` with its `coverageFactor` (u = U/k, GUM 4.3.3). \
                    `sensitivityCoefficient` defaults to 1; contribution = |c|·u. u_c = √Σ(c·u)² (GUM 5.1.2, \
                    uncorrelated inputs); ν_eff by Welch–Satterthwaite (GUM G.4.1), null when infinite; \
                    k = t_p(⌊ν_eff⌋) for coverage probability p (GUM G.6.4), the normal quantile when ν_eff \
                    is infinite; U = k·u_c. Use p = 0.9545 (or 0.954499736) for the k = 2 column of GUM Table G.2.""")
    @io.swagger.v3.oas.annotations.parameters.RequestBody(content = @Content(
            examples = @ExampleObject(name = "calibration point", value = EXAMPLE_REQUEST)))
    @io.swagger.v3.oas.annotations.responses.ApiResponse(responseCode = "200", content = @Content(
            schema = @Schema(implementation = UncertaintyResponse.class),
            examples = @ExampleObject(name = "calibration point", value = EXAMPLE_RESPONSE)))
    @PostMapping(path = "/uncertainty", consumes = MediaType.APPLICATION_JSON_VALUE)
    UncertaintyResponse evaluate(@RequestBody UncertaintyRequest request) {
        List<UncertaintyContribution> lines = request.toContributions();
        double p = ApiNumbers.requireFinite(request.coverageProbability(), "coverageProbability");
        return UncertaintyResponse.of(UncertaintyBudget.of(lines, p));
    }

    /** The budget to evaluate. */
    record UncertaintyRequest(
            @Schema(description = "The budget lines, at least one") List<UncertaintyContributionRequest> contributions,
            @Schema(description = "Coverage probability p, strictly between 0 and 1", example = "0.95")
            Double coverageProbability) {

        List<UncertaintyContribution> toContributions() {
            if (contributions == null || contributions.isEmpty()) {
                throw new IllegalArgumentException("'contributions' must list at least one contribution.");
            }
            return IntStream.range(0, contributions.size())
                    .mapToObj(i -> {
                        UncertaintyContributionRequest line = contributions.get(i);
                        if (line == null) {
                            throw new IllegalArgumentException("'contributions[" + i + "]' must not be null.");
                        }
                        return line.toContribution("contributions[" + i + "]");
                    })
                    .toList();
        }
    }

    /** One budget line: give exactly one kind of uncertainty. */
    record UncertaintyContributionRequest(
            @Schema(description = "What the input is", example = "reference certificate") String name,
            @Schema(description = "A standard uncertainty u, stated directly") Double standardUncertainty,
            @Schema(description = "Degrees of freedom of standardUncertainty, ≥ 1; omit for infinite")
            Double degreesOfFreedom,
            @Schema(description = "Half-width a of the interval, with distribution") Double halfWidth,
            @Schema(description = "Distribution of halfWidth") Distribution distribution,
            @Schema(description = "Expanded uncertainty U, with coverageFactor") Double expandedUncertainty,
            @Schema(description = "Coverage factor k of expandedUncertainty") Double coverageFactor,
            @Schema(description = "Sensitivity coefficient c = ∂f/∂x, default 1") Double sensitivityCoefficient) {

        UncertaintyContribution toContribution(String where) {
            if (name == null || name.isBlank()) {
                throw new IllegalArgumentException("'" + where + ".name' is required.");
            }
            boolean standard = standardUncertainty != null;
            boolean halfWidthKind = halfWidth != null || distribution != null;
            boolean expandedKind = expandedUncertainty != null || coverageFactor != null;
            int kinds = (standard ? 1 : 0) + (halfWidthKind ? 1 : 0) + (expandedKind ? 1 : 0);
            if (kinds != 1) {
                throw new IllegalArgumentException("Contribution '" + name + "' (" + where + ") must give exactly one"
                        + " of: standardUncertainty (with optional degreesOfFreedom), halfWidth with distribution,"
                        + " or expandedUncertainty with coverageFactor; it gives " + kinds + ".");
            }
            if (degreesOfFreedom != null && !standard) {
                throw new IllegalArgumentException("Contribution '" + name + "' (" + where
                        + "): degreesOfFreedom applies only to a standardUncertainty.");
            }
            UncertaintyContribution line;
            if (standard) {
                double nu = degreesOfFreedom == null ? Double.POSITIVE_INFINITY
                        : ApiNumbers.requireFinite(degreesOfFreedom, where + ".degreesOfFreedom");
                line = UncertaintyContribution.standard(name,
                        ApiNumbers.requireFinite(standardUncertainty, where + ".standardUncertainty"), nu);
            } else if (halfWidthKind) {
                if (distribution == null) {
                    throw new IllegalArgumentException("'" + where + ".distribution' is required with halfWidth:"
                            + " one of RECTANGULAR, TRIANGULAR, U_SHAPED.");
                }
                line = UncertaintyContribution.halfWidth(name,
                        ApiNumbers.requireFinite(halfWidth, where + ".halfWidth"), distribution);
            } else {
                line = UncertaintyContribution.expanded(name,
                        ApiNumbers.requireFinite(expandedUncertainty, where + ".expandedUncertainty"),
                        ApiNumbers.requireFinite(coverageFactor, where + ".coverageFactor"));
            }
            return sensitivityCoefficient == null ? line : line.withSensitivityCoefficient(
                    ApiNumbers.requireFinite(sensitivityCoefficient, where + ".sensitivityCoefficient"));
        }
    }

    /** The evaluated budget; an infinite ν_eff is null. */
    record UncertaintyResponse(double combinedStandardUncertainty, Double effectiveDegreesOfFreedom,
            double coverageFactor, double expandedUncertainty, List<UncertaintyContributionResponse> contributions) {

        static UncertaintyResponse of(UncertaintyBudget budget) {
            return new UncertaintyResponse(budget.combinedStandardUncertainty(),
                    ApiNumbers.finiteOrNull(budget.effectiveDegreesOfFreedom()), budget.coverageFactor(),
                    budget.expandedUncertainty(), budget.contributions().stream()
                            .map(line -> new UncertaintyContributionResponse(line.name(), line.standardUncertainty(),
                                    line.contribution()))
                            .toList());
        }
    }

    /** One evaluated line: u(x_i) and its contribution |c_i|·u(x_i). */
    record UncertaintyContributionResponse(String name, double standardUncertainty, double contribution) {
    }
}
