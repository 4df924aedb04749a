package org.dockgate.bench.web;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.dockgate.bench.BenchLot;
import org.dockgate.bench.BenchPlan;
import org.dockgate.bench.BenchService;
import org.dockgate.bench.ExpectedReading;
import org.dockgate.bench.ImportOutcome;
import org.dockgate.bench.ImportProgress;
import org.dockgate.bench.NewConditions;
import org.dockgate.bench.NewReading;
import org.dockgate.bench.Reading;
import org.dockgate.bench.ReadingImport;
import org.dockgate.bench.ReadingTest;
import org.dockgate.instruments.InstrumentView;
import org.springframework.http.HttpStatus;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.multipart.MultipartFile;
import org.springframework.web.server.ResponseStatusException;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;
import org.springframework.web.util.UriUtils;

/**
 * The bench pages: the work queue and the unit page. The unit page saves each value as it is entered
 * (bench.js posts it to {@link BenchPageApi}); without script, the same form posts here and every
 * filled value is saved.
 */
@Controller
class BenchController {

    static final String QUEUE = "bench/queue";
    static final String UNIT = "bench/unit";

    private final BenchService bench;
    private final ReadingImport imports;

    BenchController(BenchService bench, ReadingImport imports) {
        this.bench = bench;
        this.imports = imports;
    }

    /** One line of the work queue. */
    public record QueueRow(BenchLot lot, String serial, int done, int total) {
        public boolean complete() {
            return done >= total;
        }
    }

    /** One expected reading on the unit page, with its current reading if it has one. */
    public record Row(ExpectedReading expected, String label, String token, Reading current) {
        public String inputId() {
            return "r-" + expected.slot();
        }

        /** The applied-value field of a static point. */
        public String appliedId() {
            return "a-" + expected.slot();
        }
    }

    @GetMapping("/bench")
    String queue(Model model) {
        List<QueueRow> rows = new ArrayList<>();
        for (BenchLot lot : bench.lotsAwaitingMeasurement()) {
            BenchPlan plan = bench.planFor(lot);
            Map<String, Integer> progress = bench.progress(lot.id());
            for (String serial : lot.sampledSerials()) {
                rows.add(new QueueRow(lot, serial, progress.getOrDefault(serial, 0), plan.readingsPerUnit()));
            }
        }
        model.addAttribute("rows", rows);
        return QUEUE;
    }

    @GetMapping("/bench/find")
    String find(@RequestParam(defaultValue = "") String serial, RedirectAttributes redirect) {
        String wanted = serial.strip();
        for (BenchLot lot : bench.lotsAwaitingMeasurement()) {
            if (lot.sampledSerials().contains(wanted)) {
                return "redirect:" + unitPath(lot.id(), wanted);
            }
        }
        redirect.addFlashAttribute("problem", "No lot awaiting measurement has the sampled unit '" + wanted + "'.");
        return "redirect:/bench";
    }

    /** Readings per page of the unit's history table. */
    static final int PAGE_SIZE = 200;

    /** One link of the history table's pager. */
    public record PageLink(int number, String href, boolean current) {
    }

    @GetMapping("/bench/lots/{lotId}/units/{serial}")
    String unit(@PathVariable long lotId, @PathVariable String serial, @RequestParam(defaultValue = "1") int page,
                Model model) {
        BenchLot lot = bench.lot(lotId).orElseThrow(() -> new ResponseStatusException(HttpStatus.NOT_FOUND));
        if (!lot.sampledSerials().contains(serial)) {
            throw new ResponseStatusException(HttpStatus.NOT_FOUND);
        }
        BenchPlan plan = bench.planFor(lot);
        // Only the keyed points are loaded one by one; the noise samples (tens of thousands) are counted,
        // summarised and shown a page at a time.
        List<Reading> current = bench.currentKeyedReadings(lotId, serial, plan.keyed().size());
        Map<Integer, Reading> bySlot = new HashMap<>();
        for (Reading r : current) {
            bySlot.put(r.slot(), r);
        }
        long noiseDone = plan.noiseSamples() > 0 ? bench.currentCount(lotId, serial, ReadingTest.NOISE) : 0;
        long historyCount = bench.historyCount(lotId, serial);
        int pages = (int) Math.max(1, (historyCount + PAGE_SIZE - 1) / PAGE_SIZE);
        int shown = Math.min(Math.max(page, 1), pages);
        List<PageLink> pageLinks = new ArrayList<>();
        if (pages > 1) {
            for (int p = 1; p <= pages; p++) {
                if (p == 1 || p == pages || Math.abs(p - shown) <= 3 || p % 50 == 0) {
                    pageLinks.add(new PageLink(p, unitPath(lotId, serial) + "?page=" + p + "#history-section", p == shown));
                }
            }
        }
        String pageToken = UUID.randomUUID().toString();
        List<Row> rows = new ArrayList<>();
        Integer firstEmpty = null;
        for (ExpectedReading e : plan.keyed()) {
            Reading r = bySlot.get(e.slot());
            if (r == null && firstEmpty == null) {
                firstEmpty = e.slot();
            }
            rows.add(new Row(e, plan.describe(e.slot()), pageToken + "-" + e.slot(), r));
        }
        List<InstrumentView> instruments = lot.awaitingMeasurement() ? bench.selectableInstruments(plan) : List.of();
        String chosen = instruments.stream().map(InstrumentView::identifier)
                .filter(id -> id.equals(plan.suggestedInstrument())).findFirst()
                .orElse(instruments.isEmpty() ? null : instruments.get(0).identifier());
        model.addAttribute("pageToken", pageToken);
        model.addAttribute("lot", lot);
        model.addAttribute("serial", serial);
        model.addAttribute("plan", plan);
        model.addAttribute("rows", rows);
        model.addAttribute("firstEmpty", firstEmpty);
        model.addAttribute("done", bench.progress(lotId, serial));
        model.addAttribute("noiseDone", noiseDone);
        model.addAttribute("instruments", instruments);
        model.addAttribute("chosenInstrument", chosen);
        List<InstrumentView> chain = lot.awaitingMeasurement() ? bench.chainInstruments() : List.of();
        model.addAttribute("chainInstruments", chain);
        Reading last = current.isEmpty() ? null : current.get(current.size() - 1);
        model.addAttribute("chosenReadout", last == null ? null : last.readout().orElse(null));
        model.addAttribute("chosenExcitation", last == null ? null : last.excitation().orElse(null));
        model.addAttribute("appliedWindow", org.dockgate.bench.Plain.number(plan.appliedWindow()));
        model.addAttribute("conditions", bench.conditions(lotId, serial).orElse(null));
        model.addAttribute("limits", bench.limitsOf(lot));
        model.addAttribute("history", bench.history(lotId, serial, (long) (shown - 1) * PAGE_SIZE, PAGE_SIZE));
        model.addAttribute("historyCount", historyCount);
        model.addAttribute("historyFrom", historyCount == 0 ? 0 : (long) (shown - 1) * PAGE_SIZE + 1);
        model.addAttribute("historyTo", Math.min(historyCount, (long) shown * PAGE_SIZE));
        model.addAttribute("page", shown);
        model.addAttribute("pages", pages);
        model.addAttribute("pageLinks", pageLinks);
        model.addAttribute("summaries", bench.summaries(lotId, serial));
        model.addAttribute("open", lot.awaitingMeasurement());
        model.addAttribute("unitPath", unitPath(lotId, serial));
        return UNIT;
    }

    /** Without script: every filled value of the form is saved (tokens make a repeated post harmless). */
    @PostMapping("/bench/lots/{lotId}/units/{serial}/readings")
    String saveAll(@PathVariable long lotId, @PathVariable String serial, @RequestParam Map<String, String> form,
                   RedirectAttributes redirect) {
        BenchLot lot = bench.lot(lotId).orElseThrow(() -> new ResponseStatusException(HttpStatus.NOT_FOUND));
        BenchPlan plan = bench.planFor(lot);
        String instrument = form.get("instrument");
        String pageToken = form.getOrDefault("pageToken", UUID.randomUUID().toString());
        int saved = 0;
        List<String> problems = new ArrayList<>();
        for (ExpectedReading e : plan.keyed()) {
            String text = form.get("r-" + e.slot());
            if (text == null || text.isBlank()) {
                continue;
            }
            try {
                ValueText v = ValueText.parse(text);
                String appliedText = form.get("a-" + e.slot());
                Double applied = appliedText == null || appliedText.isBlank() ? null : appliedNumber(appliedText);
                bench.record(lotId, new NewReading(serial, e.test(), e.point(), e.direction().orElse(null),
                        e.cycle().isPresent() ? e.cycle().getAsInt() : null, v.value(), v.unit(), instrument,
                        pageToken + "-" + e.slot(), applied, form.get("readout"), form.get("excitation")));
                saved++;
            } catch (IllegalArgumentException | IllegalStateException ex) {
                problems.add(plan.describe(e.slot()) + ": " + ex.getMessage());
            }
        }
        redirect.addFlashAttribute("notice", saved + " reading(s) saved.");
        if (!problems.isEmpty()) {
            redirect.addFlashAttribute("problem", String.join(" · ", problems));
        }
        return "redirect:" + unitPath(lotId, serial);
    }

    /** An applied value as typed: a plain number in the procedure's input unit. */
    static Double appliedNumber(String text) {
        try {
            double v = Double.parseDouble(text.strip());
            if (!Double.isFinite(v)) {
                throw new NumberFormatException();
            }
            return v;
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("The applied value '" + text.strip() + "' is not a number.");
        }
    }

    @PostMapping("/bench/lots/{lotId}/units/{serial}/conditions")
    String conditions(@PathVariable long lotId, @PathVariable String serial, @RequestParam String ambientC,
                      @RequestParam String relativeHumidityPercent,
                      @RequestParam(required = false) String pressureKPa,
                      @RequestParam(required = false) String deviationReason, RedirectAttributes redirect) {
        try {
            var saved = bench.recordConditions(lotId, serial, new NewConditions(
                    ValueText.number(ambientC, "ambient temperature"),
                    ValueText.number(relativeHumidityPercent, "relative humidity"),
                    pressureKPa == null || pressureKPa.isBlank() ? null : ValueText.number(pressureKPa, "pressure"),
                    deviationReason));
            redirect.addFlashAttribute("notice", saved.deviation()
                    ? "Conditions saved as a deviation from the procedure: " + saved.departure().orElse("") + "."
                    : "Conditions saved.");
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:" + unitPath(lotId, serial);
    }

    /** The correction form of one reading, opened from its "Correct" link. */
    @GetMapping("/bench/lots/{lotId}/units/{serial}/readings/{readingId}/correct")
    String correctionForm(@PathVariable long lotId, @PathVariable String serial, @PathVariable long readingId,
                          Model model) {
        BenchLot lot = bench.lot(lotId).orElseThrow(() -> new ResponseStatusException(HttpStatus.NOT_FOUND));
        Reading reading = bench.reading(readingId)
                .filter(r -> r.lotId() == lotId && r.serial().equals(serial))
                .orElseThrow(() -> new ResponseStatusException(HttpStatus.NOT_FOUND));
        BenchPlan plan = bench.planFor(lot);
        model.addAttribute("lot", lot);
        model.addAttribute("serial", serial);
        model.addAttribute("reading", reading);
        model.addAttribute("point", plan.describe(reading.slot()));
        model.addAttribute("open", lot.awaitingMeasurement());
        model.addAttribute("unitPath", unitPath(lotId, serial));
        return "bench/correct";
    }

    @PostMapping("/bench/lots/{lotId}/units/{serial}/corrections")
    String correct(@PathVariable long lotId, @PathVariable String serial, @RequestParam long readingId,
                   @RequestParam String value, @RequestParam(defaultValue = "") String reason,
                   RedirectAttributes redirect) {
        try {
            ValueText v = ValueText.parse(value);
            Reading r = bench.correct(readingId, v.value(), v.unit(), reason);
            redirect.addFlashAttribute("notice", "Reading " + readingId + " corrected by reading " + r.id() + ".");
        } catch (ObjectOptimisticLockingFailureException e) {
            redirect.addFlashAttribute("problem", "This reading changed while you were editing: someone corrected"
                    + " it already. Check the history below and correct the current reading if needed.");
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:" + unitPath(lotId, serial);
    }

    /** Without script: the import runs while the page waits. */
    @PostMapping("/bench/lots/{lotId}/units/{serial}/import")
    String importFile(@PathVariable long lotId, @PathVariable String serial, @RequestParam("file") MultipartFile file,
                      @RequestParam(defaultValue = "") String instrument,
                      @RequestParam(defaultValue = "false") boolean preview, RedirectAttributes redirect) {
        try {
            ImportOutcome outcome = imports.importFile(lotId, file, instrument, preview, ImportProgress.NONE);
            if (outcome.valid()) {
                redirect.addFlashAttribute("notice", preview
                        ? "The file is valid: " + outcome.validRows() + " readings would be imported. Nothing was saved."
                        : outcome.validRows() + " readings imported.");
            } else {
                redirect.addFlashAttribute("problem", "The file has " + outcome.errorCount() + " error(s); nothing was"
                        + " saved. " + String.join(" · ", outcome.errors().subList(0, Math.min(10, outcome.errors().size()))));
            }
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:" + unitPath(lotId, serial);
    }

    static String unitPath(long lotId, String serial) {
        return "/bench/lots/" + lotId + "/units/" + UriUtils.encodePathSegment(serial, java.nio.charset.StandardCharsets.UTF_8);
    }
}
