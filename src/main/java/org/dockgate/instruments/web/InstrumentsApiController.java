package org.dockgate.instruments.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.net.URI;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.dockgate.instruments.CalibrationRecord;
import org.dockgate.instruments.CalibrationStatus;
import org.dockgate.instruments.InstrumentException;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.instruments.InstrumentView;
import org.dockgate.instruments.NewCalibration;
import org.dockgate.instruments.NewInstrument;
import org.dockgate.instruments.UncertaintyBand;
import org.dockgate.instruments.UncertaintyMode;
import org.dockgate.web.ApiNumbers;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** The register as JSON: everyone reads, ADMIN adds instruments and records calibrations. */
@RestController
@RequestMapping("/api/v1/reference-instruments")
@Tag(name = "Reference instruments", description = "The reference-instrument register: ranges, expanded"
        + " uncertainties, calibration certificates and due-date status (EXPIRED instruments cannot be selected;"
        + " DUE_SOON means due within 30 days).")
class InstrumentsApiController {

    private static final String PROBLEM = MediaType.APPLICATION_PROBLEM_JSON_VALUE;

    private static final String CREATE_EXAMPLE = """
            {"identifier": "RI-PRS-03", "description": "Pressure controller 0 to 10 bar", "quantity": "pressure",
             "rangeMin": 0, "rangeMax": 10, "unit": "bar", "certificateNumber": "NBL-C-24190",
             "calibratedOn": "2026-11-20", "dueOn": "2027-11-20", "coverageFactor": 2,
             "expandedUncertainty": 0.015, "uncertaintyMode": "PERCENT_OF_READING",
             "calibratedMin": 0, "calibratedMax": 10, "uncertaintyFloor": 0.0002}""";
    private static final String BANDS_EXAMPLE = """
            {"identifier": "RI-RES-02", "description": "Resistance standard set", "quantity": "resistance",
             "rangeMin": 0, "rangeMax": 1000, "unit": "ohm", "certificateNumber": "NBL-C-24191",
             "calibratedOn": "2026-11-20", "dueOn": "2027-11-20", "coverageFactor": 2,
             "bands": [{"upTo": 100, "expandedUncertainty": 0.002, "mode": "ABSOLUTE"},
                       {"expandedUncertainty": 0.002, "mode": "PERCENT_OF_READING"}]}""";
    private static final String CALIBRATION_EXAMPLE = """
            {"version": 0, "certificateNumber": "NBL-C-25001", "calibratedOn": "2026-11-30",
             "dueOn": "2027-11-30", "coverageFactor": 2, "expandedUncertainty": 0.01,
             "uncertaintyMode": "PERCENT_OF_READING", "calibratedMin": 0.2, "calibratedMax": 10,
             "uncertaintyFloor": 0.0001}""";
    private static final String INSTRUMENT_EXAMPLE = """
            {"identifier": "RI-PRS-02", "description": "Hand-held pressure calibrator 0 to 30 bar",
             "quantity": "pressure", "rangeMin": 0, "rangeMax": 30, "unit": "bar", "status": "EXPIRED",
             "dueSoon": false, "daysUntilDue": -15, "expiredSince": "2026-11-17", "selectable": false,
             "asOf": "2026-12-02", "version": 0,
             "current": {"sequenceNo": 1, "certificateNumber": "NBL-C-23019", "calibratedOn": "2025-11-17",
                         "dueOn": "2026-11-17", "coverageFactor": 2,
                         "bands": [{"upTo": 30, "expandedUncertainty": 0.05, "mode": "PERCENT_OF_FULL_SCALE"}],
                         "recordedAt": "2026-12-02T08:00:00Z", "calibratedMin": 0, "calibratedMax": 30,
                         "uncertaintyFloor": 0.015, "uncertaintyFloorDerived": false},
             "calibrations": []}""";
    private static final String PROBLEM_EXAMPLE = """
            {"type": "about:blank", "title": "Bad Request", "status": 400,
             "detail": "The unit 'V' does not fit a pressure: 'V' is a unit of voltage, a pressure needs a unit such as Pa, kPa, bar or psi."}""";

    private final InstrumentService instruments;

    InstrumentsApiController(InstrumentService instruments) {
        this.instruments = instruments;
    }

    @Schema(description = "One segment of the range with its expanded uncertainty: it applies above the previous"
            + " band's upTo (or from rangeMin) up to and including its own upTo, in the range unit.")
    record BandDto(@Schema(description = "Upper end of the segment in the range unit; may be omitted (null) on the"
                           + " last band, which ends at rangeMax", example = "100") Double upTo,
                   @Schema(description = "U: in the range unit (ABSOLUTE) or in percent", example = "0.002")
                   Double expandedUncertainty,
                   @Schema(description = "How U is stated", example = "ABSOLUTE") UncertaintyMode mode) {
    }

    @Schema(description = "A new instrument with its first calibration. Give either expandedUncertainty and"
            + " uncertaintyMode (one U for the whole range) or bands (U by range segment).")
    record CreateInstrumentRequest(
            @Schema(description = "Unique identifier (stored in upper case)", example = "RI-PRS-03") String identifier,
            @Schema(example = "Pressure controller 0 to 10 bar") String description,
            @Schema(description = "pressure, acceleration, temperature, voltage, current, resistance, force,"
                    + " illuminance, frequency, charge, time, length, mass, torque or ratio", example = "pressure")
            String quantity,
            @Schema(example = "0") Double rangeMin,
            @Schema(example = "10") Double rangeMax,
            @Schema(description = "Range unit; must fit the quantity (bar, psi, kPa… for a pressure)", example = "bar")
            String unit,
            @Schema(example = "NBL-C-24190") String certificateNumber,
            @Schema(example = "2026-11-20") LocalDate calibratedOn,
            @Schema(description = "The day recalibration is due: from that day the instrument is EXPIRED",
                    example = "2027-11-20") LocalDate dueOn,
            @Schema(description = "Coverage factor k", example = "2") Double coverageFactor,
            @Schema(example = "0.015") Double expandedUncertainty,
            @Schema(example = "PERCENT_OF_READING") UncertaintyMode uncertaintyMode,
            @Schema(description = "Lower end of the range the certificate covers, in the range unit; omitted: rangeMin."
                    + " The instrument is not used for a test point outside its calibrated range.", example = "0.2")
            Double calibratedMin,
            @Schema(description = "Upper end of the calibrated range; omitted: rangeMax", example = "10")
            Double calibratedMax,
            @Schema(description = "The smallest U anywhere in the range, in the range unit, > 0: U(x) = max(floor,"
                    + " band figure). Omitted: derived, the percent-of-reading figure at 10 % of full scale",
                    example = "0.0002") Double uncertaintyFloor,
            List<BandDto> bands,
            @Schema(description = "For a readout (multimeter, DAQ, bridge): its resolution in the range unit, the"
                    + " digit of the range used; optional", example = "0.000001") Double resolution) {
    }

    @Schema(description = "A new calibration (new certificate) of an instrument; earlier records are kept."
            + " Give either expandedUncertainty and uncertaintyMode or bands.")
    record RecordCalibrationRequest(
            @Schema(description = "The instrument's version as last read (optimistic locking); a stale one gets 409",
                    example = "0") Long version,
            @Schema(example = "NBL-C-25001") String certificateNumber,
            @Schema(example = "2026-11-30") LocalDate calibratedOn,
            @Schema(example = "2027-11-30") LocalDate dueOn,
            @Schema(example = "2") Double coverageFactor,
            @Schema(example = "0.01") Double expandedUncertainty,
            @Schema(example = "PERCENT_OF_READING") UncertaintyMode uncertaintyMode,
            @Schema(description = "Lower end of the range the certificate covers, in the range unit; omitted: rangeMin."
                    + " The instrument is not used for a test point outside its calibrated range.", example = "0.2")
            Double calibratedMin,
            @Schema(description = "Upper end of the calibrated range; omitted: rangeMax", example = "10")
            Double calibratedMax,
            @Schema(description = "The smallest U anywhere in the range, in the range unit, > 0: U(x) = max(floor,"
                    + " band figure). Omitted: derived, the percent-of-reading figure at 10 % of full scale",
                    example = "0.0002") Double uncertaintyFloor,
            List<BandDto> bands) {
    }

    record CalibrationResponse(int sequenceNo, String certificateNumber, LocalDate calibratedOn, LocalDate dueOn,
                               Double coverageFactor, List<BandDto> bands, Instant recordedAt,
                               @Schema(description = "Lower end of the calibrated range (as stated, or rangeMin)")
                               Double calibratedMin,
                               @Schema(description = "Upper end of the calibrated range (as stated, or rangeMax)")
                               Double calibratedMax,
                               @Schema(description = "The floor of U in the range unit: U(x) = max(floor, band figure)")
                               Double uncertaintyFloor,
                               @Schema(description = "true when the record states no floor and it was derived")
                               boolean uncertaintyFloorDerived) {
        static CalibrationResponse of(InstrumentView v, CalibrationRecord c) {
            return new CalibrationResponse(c.sequenceNo(), c.certificateNumber(), c.calibratedOn(), c.dueOn(),
                    ApiNumbers.finiteOrNull(c.coverageFactor()),
                    c.bands().stream().map(b -> new BandDto(ApiNumbers.finiteOrNull(b.upTo()),
                            ApiNumbers.finiteOrNull(b.expandedUncertainty()), b.mode())).toList(),
                    c.recordedAt(), ApiNumbers.finiteOrNull(v.calibratedMin(c)), ApiNumbers.finiteOrNull(v.calibratedMax(c)),
                    ApiNumbers.finiteOrNull(v.uncertaintyFloor(c)), v.uncertaintyFloorDerived(c));
        }
    }

    @Schema(description = "A register entry with its status on asOf (UTC date). calibrations: newest first.")
    record InstrumentResponse(String identifier, String description, String quantity, Double rangeMin,
                              Double rangeMax, String unit, CalibrationStatus status,
                              @Schema(description = "Due within 30 days: flag it") boolean dueSoon,
                              long daysUntilDue,
                              @Schema(description = "The due date, when EXPIRED; else null") LocalDate expiredSince,
                              @Schema(description = "May be chosen for a test today (not EXPIRED)") boolean selectable,
                              LocalDate asOf, long version, CalibrationResponse current,
                              List<CalibrationResponse> calibrations,
                              @Schema(description = "A readout's resolution in the range unit; null when not recorded")
                              Double resolution) {
        static InstrumentResponse of(InstrumentView v) {
            return new InstrumentResponse(v.identifier(), v.description(), v.quantity(),
                    ApiNumbers.finiteOrNull(v.rangeMin()), ApiNumbers.finiteOrNull(v.rangeMax()), v.unit(),
                    v.status(), v.dueSoon(), v.daysUntilDue(), v.expiredSince().orElse(null), v.selectable(),
                    v.asOf(), v.version(), CalibrationResponse.of(v, v.current()),
                    v.calibrations().stream().map(c -> CalibrationResponse.of(v, c)).toList(),
                    v.resolution().isPresent() ? v.resolution().getAsDouble() : null);
        }
    }

    @GetMapping
    @Operation(summary = "List the register, ordered by due date (expired first)",
            description = "Every role may read. Filter by quantity (e.g. pressure) and by status"
                    + " (IN_CALIBRATION, DUE_SOON, EXPIRED).")
    @ApiResponse(responseCode = "200", description = "The instruments")
    @ApiResponse(responseCode = "400", description = "Unknown quantity or status",
            content = @Content(mediaType = PROBLEM, examples = @ExampleObject(value = """
                    {"type": "about:blank", "title": "Bad Request", "status": 400,
                     "detail": "Unknown quantity 'presure': use one of pressure, acceleration, temperature, ..."}""")))
    List<InstrumentResponse> list(
            @Parameter(description = "Quantity label", example = "pressure") @RequestParam(required = false) String quantity,
            @Parameter(description = "Status", example = "DUE_SOON") @RequestParam(required = false)
            CalibrationStatus status) {
        return instruments.list(quantity, status).stream().map(InstrumentResponse::of).toList();
    }

    @GetMapping("/{identifier}")
    @Operation(summary = "One instrument with its calibration history (newest first)")
    @ApiResponse(responseCode = "200", description = "The instrument",
            content = @Content(mediaType = "application/json", examples = @ExampleObject(value = INSTRUMENT_EXAMPLE)))
    @ApiResponse(responseCode = "404", description = "No such instrument", content = @Content(mediaType = PROBLEM))
    InstrumentResponse get(@Parameter(example = "RI-PRS-01") @PathVariable String identifier) {
        return InstrumentResponse.of(instruments.find(identifier).orElseThrow(() -> new NoSuchInstrument(identifier)));
    }

    @PostMapping
    @Operation(summary = "Add an instrument with its first calibration (ADMIN)",
            description = "The unit must fit the quantity (checked by dimension); the identifier must be new; the"
                    + " due date must come after the calibration date, which may not be in the future.")
    @io.swagger.v3.oas.annotations.parameters.RequestBody(content = @Content(mediaType = "application/json",
            examples = {@ExampleObject(name = "one uncertainty", value = CREATE_EXAMPLE),
                @ExampleObject(name = "uncertainty by range segment", value = BANDS_EXAMPLE)}))
    @ApiResponse(responseCode = "201", description = "Added; Location names the new entry")
    @ApiResponse(responseCode = "400", description = "Malformed or inconsistent input, named in detail",
            content = @Content(mediaType = PROBLEM, examples = @ExampleObject(value = PROBLEM_EXAMPLE)))
    @ApiResponse(responseCode = "403", description = "Needs the role ADMIN", content = @Content(mediaType = PROBLEM))
    ResponseEntity<InstrumentResponse> create(@RequestBody CreateInstrumentRequest request) {
        double max = ApiNumbers.requireFinite(request.rangeMax(), "rangeMax");
        double min = ApiNumbers.requireFinite(request.rangeMin(), "rangeMin");
        NewCalibration calibration = calibration(request.certificateNumber(), request.calibratedOn(),
                request.dueOn(), request.coverageFactor(), request.expandedUncertainty(), request.uncertaintyMode(),
                request.bands(), max).over(request.calibratedMin(), request.calibratedMax(), request.uncertaintyFloor());
        InstrumentView created = instruments.create(new NewInstrument(request.identifier(), request.description(),
                request.quantity(), min, max, request.unit(), calibration, request.resolution()));
        return ResponseEntity.created(URI.create("/api/v1/reference-instruments/" + created.identifier()))
                .body(InstrumentResponse.of(created));
    }

    @PostMapping("/{identifier}/calibrations")
    @Operation(summary = "Record a new calibration of an instrument (ADMIN)",
            description = "Adds a calibration record (new certificate number and dates); earlier records are kept"
                    + " unchanged. Send the version last read: a stale one is refused with 409.")
    @io.swagger.v3.oas.annotations.parameters.RequestBody(content = @Content(mediaType = "application/json",
            examples = @ExampleObject(value = CALIBRATION_EXAMPLE)))
    @ApiResponse(responseCode = "201", description = "Recorded; the instrument with its new current calibration")
    @ApiResponse(responseCode = "400", description = "Malformed or inconsistent input", content = @Content(mediaType = PROBLEM))
    @ApiResponse(responseCode = "404", description = "No such instrument", content = @Content(mediaType = PROBLEM))
    @ApiResponse(responseCode = "409", description = "The instrument changed since the version sent",
            content = @Content(mediaType = PROBLEM))
    ResponseEntity<InstrumentResponse> recordCalibration(@PathVariable String identifier,
                                                         @RequestBody RecordCalibrationRequest request) {
        InstrumentView view = instruments.find(identifier).orElseThrow(() -> new NoSuchInstrument(identifier));
        if (request.version() == null) {
            throw new IllegalArgumentException("'version' is required: send the version of " + view.identifier()
                    + " you last read (it is " + view.version() + " now).");
        }
        NewCalibration calibration = calibration(request.certificateNumber(), request.calibratedOn(),
                request.dueOn(), request.coverageFactor(), request.expandedUncertainty(), request.uncertaintyMode(),
                request.bands(), view.rangeMax())
                .over(request.calibratedMin(), request.calibratedMax(), request.uncertaintyFloor());
        InstrumentView saved = instruments.recordCalibration(view.identifier(), calibration, request.version());
        return ResponseEntity.status(HttpStatus.CREATED)
                .location(URI.create("/api/v1/reference-instruments/" + saved.identifier()))
                .body(InstrumentResponse.of(saved));
    }

    private static NewCalibration calibration(String certificateNumber, LocalDate calibratedOn, LocalDate dueOn,
                                              Double coverageFactor, Double expandedUncertainty,
                                              UncertaintyMode mode, List<BandDto> bands, double rangeMax) {
        double k = ApiNumbers.requireFinite(coverageFactor, "coverageFactor");
        List<UncertaintyBand> stated = new ArrayList<>();
        boolean hasBands = bands != null && !bands.isEmpty();
        if (hasBands == (expandedUncertainty != null || mode != null)) {
            throw new IllegalArgumentException("Give either 'expandedUncertainty' with 'uncertaintyMode' (one U for"
                    + " the whole range) or 'bands' (U by range segment).");
        }
        if (hasBands) {
            for (int i = 0; i < bands.size(); i++) {
                BandDto band = bands.get(i);
                if (band == null) {
                    throw new IllegalArgumentException("'bands[" + i + "]' must not be null.");
                }
                double upTo = band.upTo() == null && i == bands.size() - 1 ? rangeMax
                        : ApiNumbers.requireFinite(band.upTo(), "bands[" + i + "].upTo");
                double u = ApiNumbers.requireFinite(band.expandedUncertainty(), "bands[" + i + "].expandedUncertainty");
                if (band.mode() == null) {
                    throw new IllegalArgumentException("'bands[" + i + "].mode' is required: ABSOLUTE,"
                            + " PERCENT_OF_READING or PERCENT_OF_FULL_SCALE.");
                }
                stated.add(new UncertaintyBand(upTo, u, band.mode()));
            }
        } else {
            double u = ApiNumbers.requireFinite(expandedUncertainty, "expandedUncertainty");
            if (mode == null) {
                throw new IllegalArgumentException("'uncertaintyMode' is required: ABSOLUTE, PERCENT_OF_READING or"
                        + " PERCENT_OF_FULL_SCALE.");
            }
            stated.add(new UncertaintyBand(rangeMax, u, mode));
        }
        return new NewCalibration(certificateNumber, calibratedOn, dueOn, k, stated);
    }

    /** An identifier the register does not hold: 404, not the 400 of malformed input. */
    static final class NoSuchInstrument extends RuntimeException {
        NoSuchInstrument(String identifier) {
            super("There is no reference instrument '" + identifier + "' in the register.");
        }
    }

    /** A refused input: 400 with the message, and the request field it concerns as {@code field}. */
    @ExceptionHandler(InstrumentException.class)
    ResponseEntity<ProblemDetail> refused(InstrumentException e) {
        ProblemDetail body = ProblemDetail.forStatusAndDetail(HttpStatus.BAD_REQUEST, e.getMessage());
        if (e.field() != null) {
            body.setProperty("field", e.field());
        }
        return ResponseEntity.badRequest().contentType(MediaType.APPLICATION_PROBLEM_JSON).body(body);
    }

    @ExceptionHandler(NoSuchInstrument.class)
    ResponseEntity<ProblemDetail> notFound(NoSuchInstrument e) {
        return ResponseEntity.status(HttpStatus.NOT_FOUND).contentType(MediaType.APPLICATION_PROBLEM_JSON)
                .body(ProblemDetail.forStatusAndDetail(HttpStatus.NOT_FOUND, e.getMessage()));
    }
}
