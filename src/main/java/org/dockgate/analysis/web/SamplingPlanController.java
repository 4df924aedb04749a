package org.dockgate.analysis.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.core.sampling.SamplingPlan;
import org.dockgate.core.sampling.Severity;
import org.dockgate.core.sampling.SingleSamplingPlans;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/**
 * {@code GET /api/v1/sampling-plan}: the ISO 2859-1:1999 single sampling plan for a lot. A thin layer
 * over {@link SingleSamplingPlans}; malformed input becomes a 400 problem document through the shared
 * API exception handler.
 */
@RestController
@Tag(name = "Lot sampling", description = "ISO 2859-1:1999 single sampling plans by attributes")
class SamplingPlanController {

    /** The plan as the API returns it; field names are the published contract. */
    @Schema(name = "SamplingPlan", example = """
            {"codeLetter": "J", "planCodeLetter": "K", "sampleSize": 125, "acceptNumber": 1, "rejectNumber": 2, \
            "fullInspection": false}""")
    record SamplingPlanResponse(
            @Schema(description = "Sample-size code letter from ISO 2859-1 Table 1 for the lot size and level",
                    example = "J") String codeLetter,
            @Schema(description = "Code letter whose plan is used after following the table's arrows "
                    + "(S only for tightened inspection at AQL 0.025)", example = "K") String planCodeLetter,
            @Schema(description = "Number of items to inspect; equals the lot size under 100 % inspection",
                    example = "125") int sampleSize,
            @Schema(description = "Ac: accept the lot when at most this many items are nonconforming",
                    example = "1") int acceptNumber,
            @Schema(description = "Re: do not accept the lot when at least this many items are nonconforming",
                    example = "2") int rejectNumber,
            @Schema(description = "True when the tabulated sample size reaches or exceeds the lot size: inspect "
                    + "every item and judge the lot with the plan's Ac and Re", example = "false")
            boolean fullInspection) {

        static SamplingPlanResponse of(SamplingPlan plan) {
            return new SamplingPlanResponse(plan.codeLetter().name(), plan.planCodeLetter().name(), plan.sampleSize(),
                    plan.acceptNumber(), plan.rejectNumber(), plan.fullInspection());
        }
    }

    private static final String PROBLEM_EXAMPLE = """
            {"type": "about:blank", "title": "Bad Request", "status": 400, \
            "detail": "AQL 0.5 is not in the ISO 2859-1 series; valid values are 0.010, 0.015, 0.025, 0.040, \
            0.065, 0.10, 0.15, 0.25, 0.40, 0.65, 1.0, 1.5, 2.5, 4.0, 6.5, 10 (percent nonconforming).", \
            "instance": "/api/v1/sampling-plan"}""";

    @GetMapping("/api/v1/sampling-plan")
    @Operation(summary = "Single sampling plan for a lot (ISO 2859-1:1999)",
            description = "Looks up the sample-size code letter for the lot size and inspection level (Table 1), "
                    + "then the plan in Table 2-A (normal), 2-B (tightened) or 2-C (reduced, the 1999 table without "
                    + "gaps) for the AQL, following the table's arrows to the first plan below or above; the sample "
                    + "size and letter of the row where the plan is found are used. When that sample size reaches the "
                    + "lot size, every item is inspected (fullInspection) and the plan's Ac and Re still decide. "
                    + "Any signed-in user.",
            responses = {
                @ApiResponse(responseCode = "200", description = "The plan", content = @Content(
                        mediaType = "application/json", schema = @Schema(implementation = SamplingPlanResponse.class),
                        examples = {
                            @ExampleObject(name = "arrow down (lot 1000, AQL 0.40)", value = """
                                    {"codeLetter": "J", "planCodeLetter": "K", "sampleSize": 125, "acceptNumber": 1, \
                                    "rejectNumber": 2, "fullInspection": false}"""),
                            @ExampleObject(name = "100 % inspection (lot 120, AQL 0.065)", value = """
                                    {"codeLetter": "F", "planCodeLetter": "L", "sampleSize": 120, "acceptNumber": 0, \
                                    "rejectNumber": 1, "fullInspection": true}""")})),
                @ApiResponse(responseCode = "400", description = "Lot size below 1 or not a whole number, AQL not in "
                        + "the series, unknown level or severity", content = @Content(
                        mediaType = "application/problem+json", examples = @ExampleObject(value = PROBLEM_EXAMPLE))),
                @ApiResponse(responseCode = "401", description = "Not signed in (HTTP Basic)", content = @Content(
                        mediaType = "application/problem+json"))})
    SamplingPlanResponse samplingPlan(
            @Parameter(description = "Number of items in the lot, at least 1", example = "1000", required = true)
            @RequestParam Integer lotSize,
            @Parameter(description = "Acceptance quality limit in percent nonconforming, one of the ISO 2859-1 series",
                    example = "0.40", required = true,
                    schema = @Schema(type = "number", allowableValues = {"0.010", "0.015", "0.025", "0.040", "0.065",
                        "0.10", "0.15", "0.25", "0.40", "0.65", "1.0", "1.5", "2.5", "4.0", "6.5", "10"}))
            @RequestParam String aql,
            @Parameter(description = "Inspection level (case-insensitive; S-1 … S-4 also accepted)", example = "II",
                    schema = @Schema(allowableValues = {"S1", "S2", "S3", "S4", "I", "II", "III"}, defaultValue = "II"))
            @RequestParam(defaultValue = "II") String level,
            @Parameter(description = "Severity of inspection (case-insensitive)", example = "NORMAL",
                    schema = @Schema(allowableValues = {"NORMAL", "TIGHTENED", "REDUCED"}, defaultValue = "NORMAL"))
            @RequestParam(defaultValue = "NORMAL") String severity) {
        SamplingPlan plan = SingleSamplingPlans.plan(lotSize, Aql.parse(aql), InspectionLevel.parse(level),
                Severity.parse(severity));
        return SamplingPlanResponse.of(plan);
    }
}
