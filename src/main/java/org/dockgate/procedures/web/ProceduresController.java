package org.dockgate.procedures.web;

import java.util.List;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.DecisionRule;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.procedures.ProcedureService;
import org.dockgate.procedures.ProcedureSettings;
import org.dockgate.core.evaluation.ConditionalCounting;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/** Procedures: per model, the approved revisions and open drafts; the draft editor; approval; the PDF. */
@Controller
@RequestMapping("/procedures")
class ProceduresController {

    private final ProcedureService procedures;
    private final CatalogueService catalogue;
    private final org.dockgate.procedures.ProcedureDocuments documents;

    ProceduresController(ProcedureService procedures, CatalogueService catalogue,
                         org.dockgate.procedures.ProcedureDocuments documents) {
        this.procedures = procedures;
        this.catalogue = catalogue;
        this.documents = documents;
    }

    @GetMapping("/{id}/pdf")
    org.springframework.http.ResponseEntity<byte[]> pdf(@PathVariable long id) {
        var revision = procedures.revision(id)
                .orElseThrow(() -> new org.dockgate.web.NotFoundException("There is no procedure revision " + id + "."));
        return org.springframework.http.ResponseEntity.ok().contentType(org.springframework.http.MediaType.APPLICATION_PDF)
                .header(org.springframework.http.HttpHeaders.CONTENT_DISPOSITION, "inline; filename=\""
                        + revision.partNumber() + "-procedure-rev" + revision.revisionNo() + ".pdf\"")
                .body(documents.render(revision));
    }

    @GetMapping
    String list(@RequestParam(required = false) Long model, Model page) {
        var models = catalogue.models(null, null, null);
        page.addAttribute("models", models);
        if (model != null) {
            var found = catalogue.model(model).orElseThrow(() -> new org.dockgate.web.NotFoundException("There is no sensor model " + model + "."));
            page.addAttribute("sensorModel", found);
            page.addAttribute("revisions", procedures.revisions(model));
            page.addAttribute("drafts", procedures.openDrafts(model));
            page.addAttribute("specRevisions", catalogue.revisions(model));
            page.addAttribute("aqls", Aql.values());
            page.addAttribute("levels", InspectionLevel.values());
            page.addAttribute("rules", DecisionRule.values());
            page.addAttribute("countings", List.of("DEFAULT", "STRICT", "LENIENT"));
        }
        return "procedures/list";
    }

    @PostMapping("/drafts")
    String create(@RequestParam long specificationRevisionId, @RequestParam Aql aql, @RequestParam InspectionLevel level,
                  @RequestParam DecisionRule rule,
                  @RequestParam(defaultValue = "" + DecisionPolicy.DEFAULT_GUARD_BAND_FACTOR) double guardBandFactor,
                  @RequestParam(defaultValue = "" + DecisionPolicy.DEFAULT_MAX_FALSE_ACCEPT_RISK) double maxFalseAcceptRisk,
                  @RequestParam(defaultValue = "DEFAULT") String conditionalCounting,
                  RedirectAttributes redirect) {
        long id = procedures.createDraft(specificationRevisionId,
                new ProcedureSettings(aql, level, rule, guardBandFactor, maxFalseAcceptRisk,
                        ConditionalCounting.parse(conditionalCounting)));
        redirect.addFlashAttribute("notice", "Procedure proposed. Review each value; edits need a reason.");
        return "redirect:/procedures/drafts/" + id;
    }

    @GetMapping("/drafts/{id}")
    String draft(@PathVariable long id, Model page) {
        var draft = procedures.draft(id);
        page.addAttribute("draft", draft);
        page.addAttribute("proposal", draft.proposal());
        var spec = catalogue.revision(draft.specificationRevisionId()).orElseThrow();
        page.addAttribute("spec", spec);
        page.addAttribute("practice", practice(spec));
        page.addAttribute("editable", ProcedureFields.EDITABLE);
        return "procedures/draft";
    }

    @PostMapping("/drafts/{id}/edit")
    String edit(@PathVariable long id, @RequestParam String field, @RequestParam String value,
                @RequestParam String reason, @RequestParam long version, RedirectAttributes redirect) {
        try {
            procedures.edit(id, field, value, reason, version);
            redirect.addFlashAttribute("notice", "Changed " + field + ".");
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:/procedures/drafts/" + id;
    }

    @PostMapping("/drafts/{id}/justify")
    String justify(@PathVariable long id, @RequestParam String justification, @RequestParam long version,
                   RedirectAttributes redirect) {
        try {
            procedures.justify(id, justification, version);
            redirect.addFlashAttribute("notice", "Justification recorded.");
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:/procedures/drafts/" + id;
    }

    @PostMapping("/drafts/{id}/approve")
    String approve(@PathVariable long id, @RequestParam long version, RedirectAttributes redirect) {
        try {
            var approved = procedures.approve(id, version);
            redirect.addFlashAttribute("notice", approved.label() + " approved.");
            return "redirect:/procedures/" + approved.id();
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
            return "redirect:/procedures/drafts/" + id;
        }
    }

    @GetMapping("/{id}")
    String revision(@PathVariable long id, Model page) {
        var revision = procedures.revision(id).orElseThrow(() -> new org.dockgate.web.NotFoundException("There is no procedure revision " + id + "."));
        page.addAttribute("revision", revision);
        page.addAttribute("proposal", revision.content());
        var spec = catalogue.revision(revision.specificationRevisionId()).orElseThrow();
        page.addAttribute("spec", spec);
        page.addAttribute("practice", practice(spec));
        page.addAttribute("history", procedures.revisions(revision.modelId()));
        page.addAttribute("edits", procedures.edits(revision));
        return "procedures/revision";
    }

    /** The kind's preparation and cautions, with the model's stated excitation, as the PDF prints them. */
    private org.dockgate.core.procedure.KindPractice.Practice practice(org.dockgate.catalogue.SpecificationRevision spec) {
        String excitation = catalogue.model(spec.modelId()).map(m -> m.excitation()).orElse(null);
        return org.dockgate.core.procedure.KindPractice.of(spec.specification(), excitation);
    }

    /** For the edit form's field list. */
    static final class ProcedureFields {
        static final List<String> EDITABLE = List.of("static.points", "static.cycles", "static.settleSeconds",
                "static.appliedWindow", "static.instrument", "noise.samples", "noise.sampleRateHz", "sweep.frequencies", "sweep.instrument",
                "benchMinutes");
    }
}
