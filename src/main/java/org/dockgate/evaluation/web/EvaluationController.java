package org.dockgate.evaluation.web;

import java.time.LocalDate;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.evaluation.Charts;
import org.dockgate.evaluation.DispositionAction;
import org.dockgate.evaluation.EvaluationService;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.ReceivingService;
import org.springframework.format.annotation.DateTimeFormat;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/** Results per lot and unit, with budgets and charts; the disposition of a complete lot; concessions. */
@Controller
@RequestMapping("/evaluation")
class EvaluationController {

    private final EvaluationService evaluation;
    private final ReceivingService receiving;
    private final CatalogueService catalogue;

    EvaluationController(EvaluationService evaluation, ReceivingService receiving, CatalogueService catalogue) {
        this.evaluation = evaluation;
        this.receiving = receiving;
        this.catalogue = catalogue;
    }

    @GetMapping
    String lots(Model model) {
        model.addAttribute("awaiting", receiving.lots(LotState.AWAITING_MEASUREMENT));
        model.addAttribute("accepted", receiving.lots(LotState.DISPOSITIONED_ACCEPTED));
        model.addAttribute("rejected", receiving.lots(LotState.DISPOSITIONED_REJECTED));
        return "evaluation/lots";
    }

    @GetMapping("/lots/{id}")
    String lot(@PathVariable long id, Model model) {
        model.addAttribute("ev", evaluation.lotEvaluation(id));
        model.addAttribute("actions", DispositionAction.values());
        return "evaluation/lot";
    }

    @GetMapping("/lots/{id}/recheck")
    String recheck(@PathVariable long id, Model model) {
        model.addAttribute("ev", evaluation.lotEvaluation(id));
        model.addAttribute("actions", DispositionAction.values());
        try {
            model.addAttribute("recheck", evaluation.recheck(id));
        } catch (IllegalStateException e) {
            model.addAttribute("problem", e.getMessage());
        }
        return "evaluation/lot";
    }

    @GetMapping("/lots/{id}/units/{serial}")
    String unit(@PathVariable long id, @PathVariable String serial, Model model) {
        var unit = evaluation.unit(id, serial);
        var lot = receiving.lot(id).orElseThrow();
        var spec = catalogue.revision(lot.specificationRevisionId()).orElseThrow().specification();
        model.addAttribute("lot", lot);
        model.addAttribute("unit", unit);
        model.addAttribute("spec", spec);
        return "evaluation/unit";
    }

    @GetMapping(value = "/lots/{id}/units/{serial}/calibration.svg", produces = "image/svg+xml")
    ResponseEntity<String> calibrationChart(@PathVariable long id, @PathVariable String serial) {
        var lot = receiving.lot(id).orElseThrow();
        var ev = evaluation.lotEvaluation(id);
        var unit = evaluation.unit(id, serial);
        var spec = catalogue.revision(lot.specificationRevisionId()).orElseThrow().specification();
        return ResponseEntity.ok().contentType(MediaType.valueOf("image/svg+xml"))
                .body(Charts.svg(Charts.calibration(spec, ev.procedure().content(), unit.staticPoints()), 720, 380));
    }

    @GetMapping(value = "/lots/{id}/units/{serial}/frequency.svg", produces = "image/svg+xml")
    ResponseEntity<String> frequencyChart(@PathVariable long id, @PathVariable String serial) {
        var lot = receiving.lot(id).orElseThrow();
        var unit = evaluation.unit(id, serial);
        var spec = catalogue.revision(lot.specificationRevisionId()).orElseThrow().specification();
        return ResponseEntity.ok().contentType(MediaType.valueOf("image/svg+xml"))
                .body(Charts.svg(Charts.frequencyResponse(spec, unit.sweepPoints()), 720, 320));
    }

    @PostMapping("/lots/{id}/disposition")
    String disposition(@PathVariable long id, @RequestParam(required = false) DispositionAction action,
                       @RequestParam(defaultValue = "") String notes,
                       @RequestParam(defaultValue = "false") boolean correctiveAction,
                       @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate correctiveActionDue,
                       @RequestParam long version, RedirectAttributes redirect) {
        try {
            var result = evaluation.disposition(id, action, notes, correctiveAction, correctiveActionDue, version);
            redirect.addFlashAttribute("notice", "Lot " + id + " " + (result.lot().state() == LotState.DISPOSITIONED_ACCEPTED
                    ? "accepted" : "rejected") + ".");
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:/evaluation/lots/" + id;
    }

    @PostMapping("/lots/{id}/concession")
    String concession(@PathVariable long id, @RequestParam String reason, RedirectAttributes redirect) {
        try {
            var report = evaluation.approveConcession(id, reason);
            redirect.addFlashAttribute("notice", "Concession approved for " + report.number() + ".");
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:/evaluation/lots/" + id;
    }
}
