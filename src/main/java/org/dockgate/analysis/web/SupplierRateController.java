package org.dockgate.analysis.web;

import java.math.BigDecimal;
import java.util.List;
import java.util.stream.IntStream;

import org.dockgate.core.spc.PChart;
import org.dockgate.core.spc.ProportionInterval;
import org.springframework.http.MediaType;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.tags.Tag;

/** Reject proportions and p-charts of supplier lots for integrating tools. */
@RestController
@RequestMapping(path = "/api/v1/analysis", produces = MediaType.APPLICATION_JSON_VALUE)
@Tag(name = "Analysis: supplier rates", description = "Wilson intervals and p-charts of reject rates")
class SupplierRateController {

    private static final String EXAMPLE_PROPORTION = """
            {"estimate": 0.0375, "lower": 0.012835, "upper": 0.104547}""";

    private static final String EXAMPLE_P_CHART_REQUEST = """
            {"subgroups": [{"label": "lot 1", "inspected": 120, "rejected": 4},
                           {"label": "lot 2", "inspected": 80, "rejected": 2},
                           {"label": "lot 3", "inspected": 90, "rejected": 8}]}""";

    private static final String EXAMPLE_P_CHART_RESPONSE = """
            {"centerLine": 0.0482759, "subgroups": [
              {"label": "lot 1", "proportion": 0.0333333, "lowerControlLimit": 0, "upperControlLimit": 0.1069776,
               "outOfControl": false},
              {"label": "lot 2", "proportion": 0.025, "lowerControlLimit": 0, "upperControlLimit": 0.1201706,
               "outOfControl": false},
              {"label": "lot 3", "proportion": 0.0888889, "lowerControlLimit": 0, "upperControlLimit": 0.1160588,
               "outOfControl": false}]}""";

    @Operation(summary = "Reject proportion with its Wilson score interval",
            description = """
                    estimate = rejected/inspected; lower and upper from the Wilson (1927) score interval at the \
                    given two-sided confidence (default 0.95). rejected must not exceed inspected; inspected = 0 \
                    cannot be evaluated (422).""")
    @io.swagger.v3.oas.annotations.responses.ApiResponse(responseCode = "200", content = @Content(
            schema = @Schema(implementation = ProportionResponse.class),
            examples = @ExampleObject(name = "3 of 80 rejected", value = EXAMPLE_PROPORTION)))
    @GetMapping("/proportion")
    ProportionResponse proportion(
            @Parameter(description = "Rejected units x ≥ 0", example = "3") @RequestParam long rejected,
            @Parameter(description = "Inspected units n ≥ x", example = "80") @RequestParam long inspected,
            @Parameter(description = "Two-sided confidence, 0 < c < 1", example = "0.95")
            @RequestParam(defaultValue = "0.95") double confidence) {
        ProportionInterval interval = ProportionInterval.wilson(rejected, inspected, confidence);
        return new ProportionResponse(interval.estimate(), interval.lower(), interval.upper());
    }

    @Operation(summary = "p-chart with variable subgroup sizes",
            description = """
                    centerLine = Σrejected/Σinspected; per subgroup 3-sigma limits \
                    centerLine ± 3√(centerLine(1 − centerLine)/inspected), lower floored at 0, upper capped at 1 \
                    (NIST/SEMATECH e-Handbook 6.3.3.2). outOfControl: the proportion lies strictly beyond a \
                    limit (rule 1); a point on a limit is in control.""")
    @io.swagger.v3.oas.annotations.parameters.RequestBody(content = @Content(
            examples = @ExampleObject(name = "three lots", value = EXAMPLE_P_CHART_REQUEST)))
    @io.swagger.v3.oas.annotations.responses.ApiResponse(responseCode = "200", content = @Content(
            schema = @Schema(implementation = PChartResponse.class),
            examples = @ExampleObject(name = "three lots", value = EXAMPLE_P_CHART_RESPONSE)))
    @PostMapping(path = "/p-chart", consumes = MediaType.APPLICATION_JSON_VALUE)
    PChartResponse pChart(@RequestBody PChartRequest request) {
        return PChartResponse.of(PChart.of(request.toSubgroups()));
    }

    /** p̂ and its Wilson interval. */
    record ProportionResponse(double estimate, double lower, double upper) {
    }

    /** The subgroups (e.g. lots) in time order. */
    record PChartRequest(@Schema(description = "At least one subgroup") List<PChartSubgroupRequest> subgroups) {

        List<PChart.Subgroup> toSubgroups() {
            if (subgroups == null || subgroups.isEmpty()) {
                throw new IllegalArgumentException("'subgroups' must list at least one subgroup.");
            }
            return IntStream.range(0, subgroups.size()).mapToObj(i -> {
                PChartSubgroupRequest subgroup = subgroups.get(i);
                String where = "subgroups[" + i + "]";
                if (subgroup == null) {
                    throw new IllegalArgumentException("'" + where + "' must not be null.");
                }
                if (subgroup.label() == null || subgroup.label().isBlank()) {
                    throw new IllegalArgumentException("'" + where + ".label' is required.");
                }
                return new PChart.Subgroup(subgroup.label(), count(subgroup.inspected(), where + ".inspected"),
                        count(subgroup.rejected(), where + ".rejected"));
            }).toList();
        }
    }

    /**
     * A count read exactly: JSON readers would otherwise truncate 4.5 to 4 without a word.
     */
    private static long count(BigDecimal value, String field) {
        if (value == null) {
            throw new IllegalArgumentException("'" + field + "' is required.");
        }
        try {
            return value.longValueExact();
        } catch (ArithmeticException e) {
            throw new IllegalArgumentException("'" + field + "' must be a whole number of units, was "
                    + value.toPlainString() + ".");
        }
    }

    /** One subgroup's counts (whole numbers). */
    record PChartSubgroupRequest(@Schema(example = "lot 1") String label,
            @Schema(type = "integer", format = "int64", example = "120") BigDecimal inspected,
            @Schema(type = "integer", format = "int64", example = "4") BigDecimal rejected) {
    }

    /** The chart. */
    record PChartResponse(double centerLine, List<PChartPointResponse> subgroups) {

        static PChartResponse of(PChart chart) {
            return new PChartResponse(chart.centerLine(), chart.points().stream()
                    .map(point -> new PChartPointResponse(point.label(), point.proportion(), point.lowerControlLimit(),
                            point.upperControlLimit(), point.outOfControl()))
                    .toList());
        }
    }

    /** One plotted subgroup. */
    record PChartPointResponse(String label, double proportion, double lowerControlLimit, double upperControlLimit,
            boolean outOfControl) {
    }
}
