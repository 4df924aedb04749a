package org.dockgate.bench.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.parameters.RequestBody;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.ImportJobs;
import org.dockgate.bench.ImportOutcome;
import org.dockgate.bench.ImportProgress;
import org.dockgate.bench.NewReading;
import org.dockgate.bench.Reading;
import org.dockgate.bench.ReadingImport;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.multipart.MultipartFile;
import org.springframework.web.bind.annotation.ExceptionHandler;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Readings as JSON: record one or many, import a data-acquisition file, correct, read back. */
@RestController
@Tag(name = "Bench readings", description = "Readings of a lot's sampled units: recorded one at a time or in"
        + " batches (a repeated client token is recognised and not stored twice), imported from a data-acquisition"
        + " CSV (all or nothing), corrected by a superseding reading with a reason. Saved readings never change.")
class BenchApiController {

    private static final String PROBLEM = MediaType.APPLICATION_PROBLEM_JSON_VALUE;

    static final String READING_EXAMPLE = """
            {"serial": "PX-24-0007", "test": "STATIC", "point": 10, "direction": "UP", "cycle": 1,
             "value": 1001.2, "unit": "mV", "instrument": "RI-ACC-01", "clientToken": "7d0c6f0e-0007-s3"}""";
    static final String BATCH_EXAMPLE = """
            [{"serial": "PX-24-0007", "test": "STATIC", "point": 0, "direction": "UP", "cycle": 1,
              "value": 0.4, "unit": "mV", "instrument": "RI-ACC-01", "clientToken": "b1-0"},
             {"serial": "PX-24-0007", "test": "SWEEP", "point": 160, "value": 1.0012, "unit": "V",
              "instrument": "RI-ACC-01", "clientToken": "b1-1"}]""";
    static final String SAVED_EXAMPLE = """
            {"id": 812, "lotId": 3, "serial": "PX-24-0007", "test": "STATIC", "point": 10, "direction": "UP",
             "cycle": 1, "slot": 1, "value": 1001.2, "unit": "mV", "enteredValue": 1.0012, "enteredUnit": "V",
             "instrument": "RI-ACC-01", "recordedBy": "operator", "recordedAt": "2026-12-02T09:14:03.120Z",
             "clientToken": "7d0c6f0e-0007-s3", "supersedes": null, "correctionReason": null, "supersededBy": null}""";
    static final String IMPORT_EXAMPLE = """
            {"preview": true, "saved": false, "importId": null, "rowsRead": 3, "validRows": 2,
             "errors": ["line 4, column 'value': 'abc' is not a number"], "errorCount": 1,
             "fileSha256": "9f2c…", "firstRows": [{"line": 2, "serial": "PX-24-0007", "test": "STATIC",
             "point": "0 g UP, cycle 1", "value": 0.4, "unit": "mV"}]}""";
    static final String PROBLEM_EXAMPLE = """
            {"type": "about:blank", "title": "Bad Request", "status": 400,
             "detail": "12.5 g is not a test point of PX-4410 procedure rev 1 (-50, -25, 0, 25, 50 g)."}""";

    private final BenchService bench;
    private final ReadingImport imports;
    private final ImportJobs jobs;
    private final JsonMapper json;

    BenchApiController(BenchService bench, ReadingImport imports, ImportJobs jobs, JsonMapper json) {
        this.bench = bench;
        this.imports = imports;
        this.jobs = jobs;
        this.json = json;
    }

    @PostMapping(path = "/api/v1/lots/{id}/readings", consumes = MediaType.APPLICATION_JSON_VALUE,
            produces = MediaType.APPLICATION_JSON_VALUE)
    @Operation(summary = "Record one reading or several",
            description = "Send one reading object, or an array of them (saved together or not at all). The value"
                    + " is converted to the procedure's output unit and kept as entered too. The instrument must be"
                    + " in calibration today; only sampled units of a lot awaiting measurement can be recorded. A"
                    + " reading whose clientToken was already used with the same content by the same user is returned as"
                    + " saved, not stored twice; the token with other content or from another user is a 409. A point"
                    + " that already has a reading is refused with 409: correct it instead.",
            requestBody = @RequestBody(content = @Content(mediaType = "application/json", examples = {
                @ExampleObject(name = "one", value = READING_EXAMPLE),
                @ExampleObject(name = "several", value = BATCH_EXAMPLE)})),
            responses = {
                @ApiResponse(responseCode = "201", description = "Saved (an object for an object, an array for an array)",
                        content = @Content(mediaType = "application/json", examples = @ExampleObject(value = SAVED_EXAMPLE))),
                @ApiResponse(responseCode = "400", description = "Malformed reading, unknown point, unit or instrument",
                        content = @Content(mediaType = PROBLEM, examples = @ExampleObject(value = PROBLEM_EXAMPLE))),
                @ApiResponse(responseCode = "403", description = "Needs OPERATOR or ENGINEER", content = @Content(mediaType = PROBLEM)),
                @ApiResponse(responseCode = "404", description = "No such lot", content = @Content(mediaType = PROBLEM)),
                @ApiResponse(responseCode = "409", description = "Instrument out of calibration, lot closed, or the"
                        + " point was recorded meanwhile, or the clientToken was used for a different reading", content = @Content(mediaType = PROBLEM))})
    ResponseEntity<Object> record(@PathVariable long id, @org.springframework.web.bind.annotation.RequestBody JsonNode body) {
        requireLot(id);
        if (body == null || !(body.isObject() || body.isArray())) {
            throw new IllegalArgumentException("Send a reading object or an array of readings.");
        }
        if (body.isArray()) {
            List<NewReading> inputs = new ArrayList<>();
            for (int i = 0; i < body.size(); i++) {
                inputs.add(ReadingRequest.of(json, body.get(i), "[" + i + "]").toNewReading());
            }
            List<ReadingResponse> saved = bench.recordMany(id, inputs).stream().map(ReadingResponse::of).toList();
            return ResponseEntity.status(HttpStatus.CREATED).body(saved);
        }
        Reading saved = bench.record(id, ReadingRequest.of(json, body, "").toNewReading());
        return ResponseEntity.status(HttpStatus.CREATED).body(ReadingResponse.of(saved));
    }

    @GetMapping(path = "/api/v1/lots/{id}/readings", produces = MediaType.APPLICATION_JSON_VALUE)
    @Operation(summary = "A unit's readings", description = "The readings that count (superseded ones excluded),"
            + " or with history=true every reading, corrections and superseded readings included, in the procedure's order.")
    List<ReadingResponse> readings(@PathVariable long id, @RequestParam String serial,
                                   @RequestParam(defaultValue = "false") boolean history) {
        requireLot(id);
        return (history ? bench.history(id, serial) : bench.currentReadings(id, serial)).stream()
                .map(ReadingResponse::of).toList();
    }

    @PostMapping(path = "/api/v1/lots/{id}/readings:import", consumes = MediaType.MULTIPART_FORM_DATA_VALUE,
            produces = MediaType.APPLICATION_JSON_VALUE)
    @Operation(summary = "Import a data-acquisition CSV",
            description = "Multipart field 'file': header 'serial,test,point,direction,cycle,value,unit', one reading"
                    + " per line. preview=true checks every row and saves nothing. Otherwise the whole file is saved in"
                    + " one transaction, or nothing when any row is wrong (400 with every error by line and column)."
                    + " One audit entry per import names the file's SHA-256.",
            responses = {
                @ApiResponse(responseCode = "200", description = "Preview, or saved", content = @Content(
                        mediaType = "application/json", examples = @ExampleObject(value = IMPORT_EXAMPLE))),
                @ApiResponse(responseCode = "400", description = "The file has errors; nothing saved (property 'errors')",
                        content = @Content(mediaType = PROBLEM)),
                @ApiResponse(responseCode = "409", description = "Instrument out of calibration or lot closed",
                        content = @Content(mediaType = PROBLEM))})
    ResponseEntity<Object> importFile(@PathVariable long id, @RequestParam("file") MultipartFile file,
                                      @Parameter(description = "reference instrument identifier", example = "RI-ACC-01")
                                      @RequestParam String instrument,
                                      @RequestParam(defaultValue = "false") boolean preview) {
        requireLot(id);
        ImportOutcome outcome = imports.importFile(id, file, instrument, preview, ImportProgress.NONE);
        if (!preview && !outcome.valid()) {
            ProblemDetail problem = ProblemDetail.forStatusAndDetail(HttpStatus.BAD_REQUEST, "The file has "
                    + outcome.errorCount() + " error(s); nothing was saved. First: " + outcome.errors().get(0));
            problem.setProperty("errors", outcome.errors());
            problem.setProperty("errorCount", outcome.errorCount());
            return ResponseEntity.badRequest().contentType(MediaType.APPLICATION_PROBLEM_JSON).body(problem);
        }
        return ResponseEntity.ok(outcome);
    }

    @PostMapping(path = "/api/v1/lots/{id}/import-jobs", consumes = MediaType.MULTIPART_FORM_DATA_VALUE,
            produces = MediaType.APPLICATION_JSON_VALUE)
    @Operation(summary = "Start an import in the background", description = "As readings:import, but answers at"
            + " once with a job to poll at GET /api/v1/import-jobs/{id}.")
    ResponseEntity<ImportJobs.Job> startJob(@PathVariable long id, @RequestParam("file") MultipartFile file,
                                            @RequestParam String instrument,
                                            @RequestParam(defaultValue = "false") boolean preview) {
        requireLot(id);
        try {
            return ResponseEntity.status(HttpStatus.ACCEPTED).body(jobs.start(id, file.getInputStream(), instrument, preview));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @GetMapping(path = {"/api/v1/import-jobs/{jobId}", "/bench/import-jobs/{jobId}"},
            produces = MediaType.APPLICATION_JSON_VALUE)
    @Operation(summary = "An import job's progress", description = "state RUNNING, DONE or FAILED; percent 0–100;"
            + " the outcome once done.")
    ImportJobs.Job job(@PathVariable String jobId) {
        return jobs.job(jobId).orElseThrow(() -> new NotFound("There is no import job " + jobId + "."));
    }

    @PostMapping(path = "/api/v1/readings/{readingId}/corrections", consumes = MediaType.APPLICATION_JSON_VALUE,
            produces = MediaType.APPLICATION_JSON_VALUE)
    @Operation(summary = "Correct a reading", description = "Saves a new reading at the same point that supersedes"
            + " this one, with the reason; both stay. 409 when the reading was corrected meanwhile.",
            requestBody = @RequestBody(content = @Content(mediaType = "application/json", examples = @ExampleObject(
                    value = "{\"value\": 1001.9, \"unit\": \"mV\", \"reason\": \"Transposed digits when typing\"}"))))
    ResponseEntity<ReadingResponse> correct(@PathVariable long readingId,
                                            @org.springframework.web.bind.annotation.RequestBody CorrectionRequest body) {
        if (body == null) {
            throw new IllegalArgumentException("Send the corrected value and the reason.");
        }
        Reading saved = bench.correct(readingId, body.value(), body.unit(), body.reason());
        return ResponseEntity.status(HttpStatus.CREATED).body(ReadingResponse.of(saved));
    }

    static final String CONDITIONS_EXAMPLE = """
            {"ambientC": 22.8, "relativeHumidityPercent": 45, "pressureKPa": 101.2}""";
    static final String DEVIATION_EXAMPLE = """
            {"ambientC": 29.4, "relativeHumidityPercent": 47,
             "deviationReason": "Air conditioning out of service; the supplier's lot is needed on the line today"}""";

    @PostMapping(path = "/api/v1/lots/{id}/units/{serial}/conditions", consumes = MediaType.APPLICATION_JSON_VALUE,
            produces = MediaType.APPLICATION_JSON_VALUE)
    @Operation(summary = "Record a unit's environmental conditions",
            description = "ambientC (°C) and relativeHumidityPercent (% RH) are required, pressureKPa is optional."
                    + " Values outside the limits of the lot's procedure revision are refused (400, the message names"
                    + " the value and the limit), unless deviationReason says why the unit is measured anyway: then"
                    + " they are saved as a deviation from the procedure, which the certificate states. Impossible"
                    + " values (not finite, below −273.15 °C, humidity outside 0 … 100 %, negative pressure) are always"
                    + " refused. Append-only: the latest record applies, earlier ones stay. A lot cannot be"
                    + " dispositioned while a sampled unit has no conditions.",
            requestBody = @RequestBody(content = @Content(mediaType = "application/json", examples = {
                @ExampleObject(name = "within limits", value = CONDITIONS_EXAMPLE),
                @ExampleObject(name = "deviation", value = DEVIATION_EXAMPLE)})),
            responses = {
                @ApiResponse(responseCode = "201", description = "Saved"),
                @ApiResponse(responseCode = "400", description = "Missing or impossible value, outside the limits"
                        + " without a deviation reason, or a unit not in the sample", content = @Content(mediaType = PROBLEM)),
                @ApiResponse(responseCode = "403", description = "Needs OPERATOR or ENGINEER", content = @Content(mediaType = PROBLEM)),
                @ApiResponse(responseCode = "404", description = "No such lot", content = @Content(mediaType = PROBLEM)),
                @ApiResponse(responseCode = "409", description = "The lot is closed", content = @Content(mediaType = PROBLEM))})
    ResponseEntity<ConditionsResponse> recordConditions(@PathVariable long id, @PathVariable String serial,
            @org.springframework.web.bind.annotation.RequestBody JsonNode body) {
        requireLot(id);
        var saved = bench.recordConditions(id, serial, ConditionsRequest.of(json, body).toNewConditions());
        return ResponseEntity.status(HttpStatus.CREATED).body(ConditionsResponse.of(saved));
    }

    @GetMapping(path = "/api/v1/lots/{id}/units/{serial}/conditions", produces = MediaType.APPLICATION_JSON_VALUE)
    @Operation(summary = "A unit's latest environmental conditions", description = "404 when none are recorded.")
    ConditionsResponse conditions(@PathVariable long id, @PathVariable String serial) {
        requireLot(id);
        return bench.conditions(id, serial).map(ConditionsResponse::of).orElseThrow(
                () -> new NotFound("No conditions are recorded for " + serial + " of lot " + id + "."));
    }

    @PostMapping(path = "/api/v1/lots/{id}/conditions:import", consumes = MediaType.MULTIPART_FORM_DATA_VALUE,
            produces = MediaType.APPLICATION_JSON_VALUE)
    @Operation(summary = "Import the conditions file that accompanies a data-acquisition CSV",
            description = "Multipart field 'file': header 'serial,ambientC,relativeHumidityPercent,pressureKPa,"
                    + "deviationReason', one line per unit. Each row is checked as a single POST of conditions is;"
                    + " preview=true saves nothing. Otherwise all rows are saved in one transaction, or none when any"
                    + " row is wrong (400 with every error by line and column).")
    ResponseEntity<Object> importConditions(@PathVariable long id, @RequestParam("file") MultipartFile file,
                                            @RequestParam(defaultValue = "false") boolean preview) {
        requireLot(id);
        org.dockgate.bench.ConditionsImport outcome;
        try (var reader = new java.io.InputStreamReader(file.getInputStream(), java.nio.charset.StandardCharsets.UTF_8)) {
            outcome = bench.importConditions(id, reader, preview);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        if (!preview && !outcome.valid()) {
            ProblemDetail problem = ProblemDetail.forStatusAndDetail(HttpStatus.BAD_REQUEST, "The conditions file has "
                    + outcome.errors().size() + " error(s); nothing was saved. First: " + outcome.errors().get(0));
            problem.setProperty("errors", outcome.errors());
            return ResponseEntity.badRequest().contentType(MediaType.APPLICATION_PROBLEM_JSON).body(problem);
        }
        return ResponseEntity.ok(outcome);
    }

    private void requireLot(long id) {
        if (bench.lot(id).isEmpty()) {
            throw new NotFound("There is no lot " + id + ".");
        }
    }

    @ExceptionHandler(NotFound.class)
    ResponseEntity<ProblemDetail> notFound(NotFound e) {
        return ResponseEntity.status(HttpStatus.NOT_FOUND).contentType(MediaType.APPLICATION_PROBLEM_JSON)
                .body(ProblemDetail.forStatusAndDetail(HttpStatus.NOT_FOUND, e.getMessage()));
    }

    static final class NotFound extends RuntimeException {
        NotFound(String message) {
            super(message);
        }
    }

    record CorrectionRequest(Double value, String unit, String reason) {
    }
}
