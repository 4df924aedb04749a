package org.dockgate.analysis.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.List;
import java.util.OptionalDouble;
import org.dockgate.core.metrics.NoiseAnalysis;
import org.dockgate.web.ApiNumbers;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RestController;

/** Noise, resolution and dynamic range from zero-input samples: {@code POST /api/v1/analysis/noise}. */
@RestController
@Tag(name = "Sensor metrics")
class NoiseAnalysisController {

    static final String EXAMPLE_REQUEST = """
            {"samples": [1e-6, -2e-6, 3e-6, -1e-6, 0, 2e-6, -3e-6, 1e-6, -1e-6, 0],
             "sensitivity": 0.1, "fullScaleInput": 500}
            """;

    static final String EXAMPLE_RESPONSE = """
            {"mean": 0.0, "rmsNoise": 1.825741858e-6, "peakToPeak": 6.0e-6,
             "resolution": 1.825741858e-5, "minimumDetectable": 5.477225575e-5,
             "dynamicRangeDb": 139.2081875}
            """;

    record NoiseRequest(
            @Schema(description = "Output samples recorded at zero input (output units)") List<Double> samples,
            @Schema(description = "Sensitivity (output units per input unit); its sign is ignored", example = "0.1")
            Double sensitivity,
            @Schema(description = "Full-scale input (input units), for the dynamic range", example = "500")
            Double fullScaleInput) {
    }

    record NoiseResponse(Double mean, Double rmsNoise, Double peakToPeak, Double resolution, Double minimumDetectable,
            Double dynamicRangeDb) {
    }

    @PostMapping("/api/v1/analysis/noise")
    @Operation(summary = "Noise, resolution and dynamic range from zero-input samples",
            description = """
                    RMS noise is the sample standard deviation (n − 1) of the samples; peak-to-peak is max − min; \
                    resolution = RMS / |sensitivity| and minimum detectable input = 3 × RMS / |sensitivity| \
                    (common practice), both in input units; dynamic range = 20·log10(fullScaleInput / minimum \
                    detectable) dB, null without fullScaleInput or when the noise is zero (infinite range). \
                    400 for malformed input (no samples, a non-finite number, zero sensitivity, non-positive \
                    full scale); 422 for a single sample. Any signed-in user.""",
            requestBody = @io.swagger.v3.oas.annotations.parameters.RequestBody(required = true,
                    content = @Content(mediaType = "application/json",
                            examples = @ExampleObject(name = "accelerometer, 100 mV/g, samples in V",
                                    value = EXAMPLE_REQUEST))),
            responses = @ApiResponse(responseCode = "200", description = "The noise figures",
                    content = @Content(mediaType = "application/json",
                            examples = @ExampleObject(name = "result", value = EXAMPLE_RESPONSE))))
    NoiseResponse analyse(@RequestBody NoiseRequest request) {
        if (request == null) {
            throw new IllegalArgumentException("The request body is required.");
        }
        if (request.samples() == null || request.samples().isEmpty()) {
            throw new IllegalArgumentException("'samples' must hold at least one sample.");
        }
        double[] samples = new double[request.samples().size()];
        for (int i = 0; i < samples.length; i++) {
            samples[i] = ApiNumbers.requireFinite(request.samples().get(i), "samples[" + i + "]");
        }
        double sensitivity = ApiNumbers.requireFinite(request.sensitivity(), "sensitivity");
        OptionalDouble fullScale = request.fullScaleInput() == null ? OptionalDouble.empty()
                : OptionalDouble.of(ApiNumbers.requireFinite(request.fullScaleInput(), "fullScaleInput"));
        NoiseAnalysis noise = NoiseAnalysis.of(samples, sensitivity, fullScale);
        return new NoiseResponse(ApiNumbers.finiteOrNull(noise.mean()), ApiNumbers.finiteOrNull(noise.rmsNoise()),
                ApiNumbers.finiteOrNull(noise.peakToPeak()), ApiNumbers.finiteOrNull(noise.resolution()),
                ApiNumbers.finiteOrNull(noise.minimumDetectable()), ApiNumbers.finiteOrNull(noise.dynamicRangeDb()));
    }
}
