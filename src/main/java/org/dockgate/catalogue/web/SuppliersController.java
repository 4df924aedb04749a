package org.dockgate.catalogue.web;

import org.dockgate.catalogue.CatalogueException;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.SupplierStatus;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/** Suppliers and their approval status. */
@Controller
@RequestMapping("/suppliers")
class SuppliersController {

    private final CatalogueService catalogue;

    SuppliersController(CatalogueService catalogue) {
        this.catalogue = catalogue;
    }

    @GetMapping
    String list(Model model) {
        model.addAttribute("suppliers", catalogue.suppliers());
        model.addAttribute("statuses", SupplierStatus.values());
        return "catalogue/suppliers";
    }

    @PostMapping
    String create(@RequestParam String code, @RequestParam String name, @RequestParam(defaultValue = "") String contact,
                  @RequestParam SupplierStatus status, RedirectAttributes redirect) {
        try {
            var s = catalogue.createSupplier(code, name, contact, status);
            redirect.addFlashAttribute("notice", "Supplier " + s.code() + " created.");
        } catch (CatalogueException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:/suppliers";
    }

    @PostMapping("/{id}/status")
    String status(@PathVariable long id, @RequestParam SupplierStatus status, @RequestParam String reason,
                  @RequestParam long version, RedirectAttributes redirect) {
        try {
            var s = catalogue.changeSupplierStatus(id, status, reason, version);
            redirect.addFlashAttribute("notice", "Supplier " + s.code() + " is now " + s.status() + ".");
        } catch (CatalogueException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        }
        return "redirect:/suppliers";
    }
}
