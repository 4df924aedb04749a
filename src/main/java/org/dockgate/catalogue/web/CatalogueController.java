package org.dockgate.catalogue.web;

import java.util.List;
import org.dockgate.catalogue.CatalogueException;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.NewSensorModel;
import org.dockgate.catalogue.OutputKind;
import org.dockgate.catalogue.SupplierView;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.ModelAttribute;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/** The sensor-model catalogue: search, detail with revisions, new model, next revision (ENGINEER). */
@Controller
@RequestMapping("/catalogue")
class CatalogueController {

    private final CatalogueService catalogue;

    CatalogueController(CatalogueService catalogue) {
        this.catalogue = catalogue;
    }

    @ModelAttribute("kinds")
    SensorKind[] kinds() {
        return SensorKind.values();
    }

    @ModelAttribute("rtdConstructions")
    org.dockgate.core.rtd.RtdConstruction[] rtdConstructions() {
        return org.dockgate.core.rtd.RtdConstruction.values();
    }

    @ModelAttribute("outputKinds")
    OutputKind[] outputKinds() {
        return OutputKind.values();
    }

    @ModelAttribute("allSuppliers")
    List<SupplierView> allSuppliers() {
        return catalogue.suppliers();
    }

    @GetMapping
    String list(@RequestParam(required = false) String q, @RequestParam(required = false) SensorKind kind,
                @RequestParam(required = false) Long supplier, Model model) {
        model.addAttribute("models", catalogue.models(q, kind, supplier));
        model.addAttribute("q", q);
        model.addAttribute("kind", kind);
        model.addAttribute("supplier", supplier);
        return "catalogue/list";
    }

    @GetMapping("/new")
    String newForm(Model model) {
        model.addAttribute("form", SpecificationForm.empty());
        model.addAttribute("revising", false);
        return "catalogue/form";
    }

    @PostMapping("/new")
    String create(@ModelAttribute("form") SpecificationForm form, Model model, RedirectAttributes redirect) {
        var problems = new SpecificationForm.Problems();
        SensorSpecification spec = form.toSpecification(problems);
        OutputKind outputKind = form.outputKindValue(problems);
        if (spec != null && !problems.any()) {
            try {
                var created = catalogue.createModel(new NewSensorModel(form.partNumber(), form.name(), form.measurand(),
                        outputKind, form.excitation(), form.supplierCodes(), spec));
                redirect.addFlashAttribute("notice", "Sensor model " + created.partNumber() + " created with revision 1.");
                return "redirect:/catalogue/" + created.id();
            } catch (CatalogueException e) {
                problems.byField.put(e.field() == null ? "specification" : e.field(), e.getMessage());
            }
        }
        model.addAttribute("errors", problems.byField);
        model.addAttribute("revising", false);
        return "catalogue/form";
    }

    @GetMapping("/{id}")
    String detail(@PathVariable long id, Model model) {
        var found = catalogue.model(id).orElseThrow(() -> new org.dockgate.web.NotFoundException("There is no sensor model " + id + "."));
        model.addAttribute("sensorModel", found);
        model.addAttribute("revisions", catalogue.revisions(id));
        return "catalogue/detail";
    }

    @GetMapping("/{id}/revise")
    String reviseForm(@PathVariable long id, Model model) {
        var found = catalogue.model(id).orElseThrow(() -> new org.dockgate.web.NotFoundException("There is no sensor model " + id + "."));
        model.addAttribute("form", SpecificationForm.of(found.partNumber(), found.name(), found.measurand(),
                found.outputKind(), found.excitation(), found.suppliers().stream().map(SupplierView::code).toList(),
                found.latest().specification(), found.latest().revisionNo()));
        model.addAttribute("revising", true);
        model.addAttribute("sensorModel", found);
        return "catalogue/form";
    }

    @PostMapping("/{id}/revise")
    String revise(@PathVariable long id, @ModelAttribute("form") SpecificationForm form, Model model,
                  RedirectAttributes redirect) {
        var found = catalogue.model(id).orElseThrow(() -> new org.dockgate.web.NotFoundException("There is no sensor model " + id + "."));
        var problems = new SpecificationForm.Problems();
        SensorSpecification spec = form.toSpecification(problems);
        if (spec != null && !problems.any()) {
            try {
                var revision = catalogue.revise(id, spec, form.reason(),
                        form.expectedRevision() == null ? -1 : form.expectedRevision());
                redirect.addFlashAttribute("notice", "Revision " + revision.revisionNo() + " of "
                        + found.partNumber() + " recorded.");
                return "redirect:/catalogue/" + id;
            } catch (CatalogueException e) {
                problems.byField.put(e.field() == null ? "specification" : e.field(), e.getMessage());
            }
        }
        model.addAttribute("errors", problems.byField);
        model.addAttribute("revising", true);
        model.addAttribute("sensorModel", found);
        return "catalogue/form";
    }
}
