package org.dockgate.analysis.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import org.dockgate.core.rtd.CallendarVanDusen;
import org.dockgate.core.rtd.ToleranceClass;
import org.dockgate.web.ApiNumbers;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** IEC 60751 platinum RTDs: {@code GET /api/v1/analysis/rtd/resistance} and {@code /temperature}. */
@RestController
@Tag(name = "RTDs", description = "IEC 60751 platinum resistance thermometers")
class RtdController {

    record ResistanceResponse(Double resistanceOhm, Double sensitivityOhmPerC, Double toleranceC,
            Boolean classValid) {
    }

    record TemperatureResponse(Double temperatureC) {
    }

    @GetMapping("/api/v1/analysis/rtd/resistance")
    @Operation(summary = "Resistance, sensitivity and class tolerance of a platinum RTD at a temperature",
            description = """
                    IEC 60751 Callendar–Van Dusen equation (A = 3.9083e-3, B = −5.775e-7, C = −4.183e-12 below \
                    0 °C) for −200 … 850 °C and any R0: R(t), dR/dt, and with toleranceClass the class tolerance \
                    ±(c0 + c1·|t|) °C (AA 0.10 + 0.0017|t|, A 0.15 + 0.002|t|, B 0.30 + 0.005|t|, \
                    C 0.60 + 0.01|t|). classValid tells whether t lies in the class's validity range (wire-wound: \
                    AA −50 … 250, A −100 … 450, B and C −196 … 600 °C); outside it the formula value is still \
                    given but the class is not defined there. toleranceC and classValid are null without a \
                    class. 400 for a missing or non-finite number, a non-positive R0 or an unknown class; 422 \
                    outside −200 … 850 °C. Any signed-in user.""",
            responses = @ApiResponse(responseCode = "200", description = "The values",
                    content = @Content(mediaType = "application/json",
                            examples = @ExampleObject(name = "Pt100 at 100 °C, class A", value = """
                                    {"resistanceOhm": 138.5055, "sensitivityOhmPerC": 0.37928, \
                                    "toleranceC": 0.35, "classValid": true}"""))))
    ResistanceResponse resistance(
            @Parameter(description = "Temperature in °C, −200 … 850", example = "100")
            @RequestParam Double temperatureC,
            @Parameter(description = "Resistance at 0 °C in ohms (100 for Pt100, 1000 for Pt1000)", example = "100")
            @RequestParam(defaultValue = "100") Double r0,
            @Parameter(description = "IEC 60751 tolerance class: AA, A, B or C", example = "A")
            @RequestParam(required = false) ToleranceClass toleranceClass) {
        double t = ApiNumbers.requireFinite(temperatureC, "temperatureC");
        CallendarVanDusen curve = CallendarVanDusen.iec60751(ApiNumbers.requireFinite(r0, "r0"));
        double resistance = curve.resistanceOhm(t);
        double sensitivity = curve.sensitivityOhmPerC(t);
        Double tolerance = toleranceClass == null ? null : ApiNumbers.finiteOrNull(toleranceClass.toleranceC(t));
        Boolean valid = toleranceClass == null ? null : toleranceClass.isValidAt(t);
        return new ResistanceResponse(ApiNumbers.finiteOrNull(resistance), ApiNumbers.finiteOrNull(sensitivity),
                tolerance, valid);
    }

    @GetMapping("/api/v1/analysis/rtd/temperature")
    @Operation(summary = "Temperature of a platinum RTD from its resistance",
            description = """
                    Inverse of the IEC 60751 Callendar–Van Dusen equation: closed form at and above R0 (0 °C), \
                    Newton iteration below. 400 for a missing or non-finite number or a non-positive R0; 422 \
                    for a resistance outside R(−200 °C) … R(850 °C). Any signed-in user.""",
            responses = @ApiResponse(responseCode = "200", description = "The temperature",
                    content = @Content(mediaType = "application/json",
                            examples = @ExampleObject(name = "Pt100 at 175.86 Ω",
                                    value = "{\"temperatureC\": 200.0108776}"))))
    TemperatureResponse temperature(
            @Parameter(description = "Resistance in ohms", example = "175.86") @RequestParam Double resistanceOhm,
            @Parameter(description = "Resistance at 0 °C in ohms (100 for Pt100, 1000 for Pt1000)", example = "100")
            @RequestParam(defaultValue = "100") Double r0) {
        CallendarVanDusen curve = CallendarVanDusen.iec60751(ApiNumbers.requireFinite(r0, "r0"));
        return new TemperatureResponse(ApiNumbers.finiteOrNull(
                curve.temperatureC(ApiNumbers.requireFinite(resistanceOhm, "resistanceOhm"))));
    }
}
