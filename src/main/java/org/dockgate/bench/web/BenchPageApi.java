package org.dockgate.bench.web;

import java.io.IOException;
import java.io.UncheckedIOException;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.ImportJobs;
import org.dockgate.bench.NewReading;
import org.dockgate.bench.Reading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.core.series.Direction;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.multipart.MultipartFile;

/**
 * JSON for the bench page's script, in the page's session (CSRF header from the layout's meta tags):
 * the same service calls as the API, which itself takes HTTP Basic only.
 */
@RestController
class BenchPageApi {

    private final BenchService bench;
    private final ImportJobs jobs;

    BenchPageApi(BenchService bench, ImportJobs jobs) {
        this.bench = bench;
        this.jobs = jobs;
    }

    /** What the page sends for one input: the slot's point and the text typed ("20.11" or "0.02011 V"). */
    record Autosave(String serial, String test, Double point, String direction, Integer cycle, String text,
                    String instrument, String clientToken, String applied, String readout, String excitation) {
    }

    @PostMapping(path = "/bench/lots/{lotId}/autosave", consumes = MediaType.APPLICATION_JSON_VALUE,
            produces = MediaType.APPLICATION_JSON_VALUE)
    ResponseEntity<ReadingResponse> autosave(@PathVariable long lotId, @RequestBody Autosave body) {
        if (body == null) {
            throw new IllegalArgumentException("Nothing to save.");
        }
        ValueText v = ValueText.parse(body.text());
        Direction d = body.direction() == null || body.direction().isBlank() ? null : direction(body.direction());
        Reading saved = bench.record(lotId, new NewReading(body.serial(), ReadingTest.of(body.test()), body.point(), d,
                body.cycle(), v.value(), v.unit(), body.instrument(), body.clientToken(),
                body.applied() == null || body.applied().isBlank() ? null : BenchController.appliedNumber(body.applied()),
                body.readout(), body.excitation()));
        return ResponseEntity.status(HttpStatus.CREATED).body(ReadingResponse.of(saved));
    }

    private static Direction direction(String text) {
        try {
            return Direction.valueOf(text.trim().toUpperCase(java.util.Locale.ROOT));
        } catch (IllegalArgumentException e) {
            throw new org.dockgate.platform.RefusedField("direction", "'direction' must be UP or DOWN (or empty for noise and"
                    + " sweep readings), not '" + text + "'.");
        }
    }

    @PostMapping(path = "/bench/lots/{lotId}/import-jobs", produces = MediaType.APPLICATION_JSON_VALUE)
    ResponseEntity<ImportJobs.Job> startJob(@PathVariable long lotId, @RequestParam("file") MultipartFile file,
                                            @RequestParam(defaultValue = "") String instrument,
                                            @RequestParam(defaultValue = "false") boolean preview) {
        if (bench.lot(lotId).isEmpty()) {
            throw new IllegalArgumentException("There is no lot " + lotId + ".");
        }
        try {
            return ResponseEntity.accepted().body(jobs.start(lotId, file.getInputStream(), instrument, preview));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
