package org.dockgate.analysis.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.dockgate.core.metrics.StaticCharacteristics;
import org.dockgate.core.series.CalibrationPoint;
import org.dockgate.core.series.CalibrationSeries;
import org.dockgate.core.series.Direction;
import org.dockgate.web.ApiNumbers;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RestController;

/** Static characteristics of one calibration series: {@code POST /api/v1/analysis/static}. */
@RestController
@Tag(name = "Sensor metrics", description = "Static characteristics, noise and frequency response; nothing is saved")
class StaticAnalysisController {

    static final String EXAMPLE_REQUEST = """
            {"rangeMin": 0, "rangeMax": 10, "points": [
              {"input": 0, "output": 0.05}, {"input": 5, "output": 50.12}, {"input": 10, "output": 100.05},
              {"input": 10, "output": 100.05, "direction": "DOWN"}, {"input": 5, "output": 50.30, "direction": "DOWN"},
              {"input": 0, "output": 0.09, "direction": "DOWN"},
              {"input": 0, "output": 0.04}, {"input": 5, "output": 50.14}, {"input": 10, "output": 100.07}]}
            """;

    static final String EXAMPLE_RESPONSE = """
            {"sensitivity": 9.999666667, "offset": 0.1027777778,
             "sensitivityStdUncertainty": 0.007176165724, "offsetStdUncertainty": 0.04632195056,
             "residualStdDev": 0.08788972167, "rSquared": 0.999996395,
             "fullScaleOutput": 99.99666667, "nonlinearityBestFitPctFso": 0.0855584075,
             "nonlinearityTerminalPctFso": 0.1283376113, "hysteresisPctFso": 0.1700056669,
             "repeatabilityStdDev": 0.01224744871, "repeatabilityPctFso": 0.01224785698}
            """;

    /** One reading; {@code direction} defaults to UP. */
    record CalibrationPointRequest(
            @Schema(description = "Reference stimulus (input units)", example = "5") Double input,
            @Schema(description = "Sensor output (output units)", example = "50.12") Double output,
            @Schema(description = "Traverse direction; UP when omitted", example = "UP") Direction direction) {
    }

    record StaticRequest(
            @Schema(description = "Lower range value (input units)", example = "0") Double rangeMin,
            @Schema(description = "Upper range value (input units)", example = "10") Double rangeMax,
            @Schema(description = "The readings; repeated input and direction pairs count as repeats")
            List<CalibrationPointRequest> points) {
    }

    record StaticResponse(
            Double sensitivity,
            Double offset,
            Double sensitivityStdUncertainty,
            Double offsetStdUncertainty,
            Double residualStdDev,
            Double rSquared,
            Double fullScaleOutput,
            Double nonlinearityBestFitPctFso,
            Double nonlinearityTerminalPctFso,
            Double hysteresisPctFso,
            Double repeatabilityStdDev,
            Double repeatabilityPctFso) {

        static StaticResponse of(StaticCharacteristics sc) {
            return new StaticResponse(
                    ApiNumbers.finiteOrNull(sc.sensitivity()),
                    ApiNumbers.finiteOrNull(sc.offset()),
                    ApiNumbers.finiteOrNull(sc.sensitivityStdUncertainty()),
                    ApiNumbers.finiteOrNull(sc.offsetStdUncertainty()),
                    ApiNumbers.finiteOrNull(sc.residualStdDev()),
                    ApiNumbers.finiteOrNull(sc.rSquared()),
                    ApiNumbers.finiteOrNull(sc.fullScaleOutput()),
                    ApiNumbers.finiteOrNull(sc.nonlinearityBestFitPercentFso()),
                    ApiNumbers.finiteOrNull(sc.nonlinearityTerminalPercentFso()),
                    ApiNumbers.finiteOrNull(sc.hysteresisPercentFso()),
                    ApiNumbers.finiteOrNull(sc.repeatabilityStdDev()),
                    ApiNumbers.finiteOrNull(sc.repeatabilityPercentFso()));
        }
    }

    @PostMapping("/api/v1/analysis/static")
    @Operation(summary = "Static characteristics of a calibration series",
            description = """
                    Least-squares sensitivity and offset with their standard uncertainties, residual standard \
                    deviation and R² over all readings; FSO = |sensitivity| × (rangeMax − rangeMin); best-fit and \
                    terminal nonlinearity from the mean output at each input (both directions), hysteresis from \
                    the mean UP and DOWN outputs at each input, and repeatability as the pooled standard deviation \
                    of repeated readings at the same input and direction, all in % of FSO. Absent values are \
                    null: hysteresis without an input read both ways, repeatability without repeats, the \
                    uncertainties and residual standard deviation with only two readings. 400 for malformed \
                    input (missing or non-finite numbers, no points, rangeMax below rangeMin, unknown \
                    direction); 422 when it cannot be evaluated (fewer than two distinct inputs, zero span, zero \
                    sensitivity). Any signed-in user.""",
            requestBody = @io.swagger.v3.oas.annotations.parameters.RequestBody(required = true,
                    content = @Content(mediaType = "application/json",
                            examples = @ExampleObject(name = "0-10 bar transducer, two cycles up, one down",
                                    value = EXAMPLE_REQUEST))),
            responses = @ApiResponse(responseCode = "200", description = "The characteristics",
                    content = @Content(mediaType = "application/json",
                            examples = @ExampleObject(name = "result", value = EXAMPLE_RESPONSE))))
    StaticResponse analyse(@RequestBody StaticRequest request) {
        if (request == null) {
            throw new IllegalArgumentException("The request body is required.");
        }
        double rangeMin = ApiNumbers.requireFinite(request.rangeMin(), "rangeMin");
        double rangeMax = ApiNumbers.requireFinite(request.rangeMax(), "rangeMax");
        if (request.points() == null || request.points().isEmpty()) {
            throw new IllegalArgumentException("'points' must hold at least one reading.");
        }
        List<CalibrationPoint> points = new ArrayList<>();
        // The API has no cycle field: the k-th reading at one input and direction is cycle k.
        Map<String, Integer> cycles = new HashMap<>();
        for (int i = 0; i < request.points().size(); i++) {
            CalibrationPointRequest p = request.points().get(i);
            if (p == null) {
                throw new IllegalArgumentException("'points[" + i + "]' must be a reading, not null.");
            }
            double input = ApiNumbers.requireFinite(p.input(), "points[" + i + "].input");
            double output = ApiNumbers.requireFinite(p.output(), "points[" + i + "].output");
            Direction direction = p.direction() == null ? Direction.UP : p.direction();
            int cycle = cycles.merge((input + 0.0) + "/" + direction, 1, Integer::sum);
            points.add(new CalibrationPoint(input, output, direction, cycle));
        }
        return StaticResponse.of(StaticCharacteristics.of(CalibrationSeries.of(points), rangeMin, rangeMax));
    }
}
