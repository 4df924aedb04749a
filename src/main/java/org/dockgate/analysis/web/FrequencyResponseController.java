package org.dockgate.analysis.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.dockgate.core.metrics.FrequencyPoint;
import org.dockgate.core.metrics.FrequencyResponse;
import org.dockgate.web.ApiNumbers;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RestController;

/** Reference amplitude and −3 dB bandwidth of a sweep: {@code POST /api/v1/analysis/frequency-response}. */
@RestController
@Tag(name = "Sensor metrics")
class FrequencyResponseController {

    static final String EXAMPLE_REQUEST = """
            {"points": [{"frequencyHz": 10, "amplitude": 100.0}, {"frequencyHz": 160, "amplitude": 100.2},
                        {"frequencyHz": 1000, "amplitude": 99.0}, {"frequencyHz": 5000, "amplitude": 80.0},
                        {"frequencyHz": 10000, "amplitude": 60.0}],
             "referenceFrequencyHz": 160}
            """;

    static final String EXAMPLE_RESPONSE = """
            {"referenceAmplitude": 100.2, "bandwidthHz": 6699.405501, "withinSweep": true}
            """;

    record FrequencyPointRequest(
            @Schema(description = "Excitation frequency in Hz, greater than 0", example = "1000") Double frequencyHz,
            @Schema(description = "Response amplitude, greater than 0", example = "99.0") Double amplitude) {
    }

    record FrequencyResponseRequest(
            @Schema(description = "The sweep, at least two distinct frequencies, any order") List<FrequencyPointRequest> points,
            @Schema(description = "Reference frequency in Hz within the sweep; the lowest frequency when omitted",
                    example = "160") Double referenceFrequencyHz) {
    }

    record FrequencyResponseResponse(Double referenceAmplitude, Double bandwidthHz, boolean withinSweep) {
    }

    @PostMapping("/api/v1/analysis/frequency-response")
    @Operation(summary = "Reference amplitude and −3 dB bandwidth of a frequency sweep",
            description = """
                    The reference amplitude is the amplitude at referenceFrequencyHz (interpolated linearly in dB \
                    against log10 frequency when it falls between points) or at the lowest frequency. The \
                    bandwidth is the first frequency above the reference where the level falls to −3.0103 dB \
                    (1/√2) of the reference, interpolated the same way between the two bracketing points. \
                    withinSweep is false, and bandwidthHz null, when the sweep never falls that far. 400 for \
                    malformed input (no points, a missing, non-finite or non-positive value, a repeated \
                    frequency); 422 for a single point or a reference frequency outside the sweep. Any \
                    signed-in user.""",
            requestBody = @io.swagger.v3.oas.annotations.parameters.RequestBody(required = true,
                    content = @Content(mediaType = "application/json",
                            examples = @ExampleObject(name = "accelerometer sweep, reference 160 Hz",
                                    value = EXAMPLE_REQUEST))),
            responses = @ApiResponse(responseCode = "200", description = "The response figures",
                    content = @Content(mediaType = "application/json",
                            examples = @ExampleObject(name = "result", value = EXAMPLE_RESPONSE))))
    FrequencyResponseResponse analyse(@RequestBody FrequencyResponseRequest request) {
        if (request == null) {
            throw new IllegalArgumentException("The request body is required.");
        }
        if (request.points() == null || request.points().isEmpty()) {
            throw new IllegalArgumentException("'points' must hold at least one point.");
        }
        List<FrequencyPoint> points = new ArrayList<>();
        for (int i = 0; i < request.points().size(); i++) {
            FrequencyPointRequest p = request.points().get(i);
            if (p == null) {
                throw new IllegalArgumentException("'points[" + i + "]' must be a point, not null.");
            }
            points.add(new FrequencyPoint(ApiNumbers.requireFinite(p.frequencyHz(), "points[" + i + "].frequencyHz"),
                    ApiNumbers.requireFinite(p.amplitude(), "points[" + i + "].amplitude")));
        }
        OptionalDouble reference = request.referenceFrequencyHz() == null ? OptionalDouble.empty()
                : OptionalDouble.of(ApiNumbers.requireFinite(request.referenceFrequencyHz(), "referenceFrequencyHz"));
        FrequencyResponse response = FrequencyResponse.of(points, reference);
        return new FrequencyResponseResponse(ApiNumbers.finiteOrNull(response.referenceAmplitude()),
                ApiNumbers.finiteOrNull(response.bandwidthHz()), response.withinSweep());
    }
}
