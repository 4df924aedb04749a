package org.dockgate.receiving.web;

import java.time.Clock;
import java.time.LocalDate;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Supplier;
import java.util.UUID;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.SupplierStatus;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.NewLot;
import org.dockgate.receiving.NewReceipt;
import org.dockgate.receiving.ReceiptView;
import org.dockgate.receiving.ReceivingException;
import org.dockgate.receiving.ReceivingService;
import org.dockgate.receiving.ReducedInspectionStatus;
import org.dockgate.receiving.SwitchingView;
import org.dockgate.receiving.SerialList;
import org.springframework.http.HttpStatus;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.server.ResponseStatusException;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/** Receiving pages: the list, the new-receipt form, the lot page and the switching states. */
@Controller
@RequestMapping("/receiving")
class ReceivingController {

    private final ReceivingService receiving;
    private final CatalogueService catalogue;
    private final Clock clock;

    ReceivingController(ReceivingService receiving, CatalogueService catalogue, Clock clock) {
        this.receiving = receiving;
        this.catalogue = catalogue;
        this.clock = clock;
    }

    /** What the form posts; the serials as typed, scanned or pasted, one per line. */
    record ReceiptForm(String purchaseOrder, String deliveryNote, LocalDate receivedOn, Long supplierId, Long modelId,
                       Integer quantity, String serials, String clientToken) {
    }

    @GetMapping
    String list(Model model) {
        List<ReceiptView> receipts = receiving.receipts();
        model.addAttribute("receipts", receipts);
        model.addAttribute("awaiting", receiving.lots(LotState.AWAITING_MEASUREMENT));
        return "receiving/list";
    }

    @GetMapping("/new")
    String form(Model model) {
        return form(model, new ReceiptForm(null, null, LocalDate.now(clock), null, null, null, null,
                UUID.randomUUID().toString()), null, null);
    }

    private String form(Model model, ReceiptForm form, String problem, String field) {
        model.addAttribute("form", form);
        model.addAttribute("problem", problem);
        model.addAttribute("problemField", field);
        model.addAttribute("suppliers", catalogue.suppliers().stream()
                .filter(s -> s.status() != SupplierStatus.DISQUALIFIED).toList());
        model.addAttribute("models", catalogue.models(null, null, null));
        return "receiving/new";
    }

    @PostMapping
    String receive(ReceiptForm form, Model model) {
        try {
            ReceiptView saved = receiving.receive(new NewReceipt(form.purchaseOrder(), form.deliveryNote(),
                    form.receivedOn(), form.supplierId(),
                    List.of(new NewLot(form.modelId(), form.quantity(), SerialList.parse(form.serials()))),
                    form.clientToken()));
            return "redirect:/receiving/lots/" + saved.lots().get(0).id();
        } catch (ReceivingException e) {
            return form(model, form, e.getMessage(), e.field());
        }
    }

    @GetMapping("/lots/{id}")
    String lot(@PathVariable long id, Model model) {
        LotView lot = receiving.lot(id).orElseThrow(() -> new ResponseStatusException(HttpStatus.NOT_FOUND));
        model.addAttribute("lot", lot);
        model.addAttribute("receipt", receiving.receipt(lot.receiptId()).orElseThrow());
        model.addAttribute("reproduces", receiving.sampleReproduces(id));
        model.addAttribute("switching", receiving.switching(lot.supplierId(), lot.modelId()).orElse(null));
        return "receiving/lot";
    }

    @GetMapping("/switching")
    String switching(Model model) {
        List<SwitchingView> states = receiving.switchingStates();
        Map<Long, ReducedInspectionStatus> reduced = new HashMap<>();
        states.forEach(s -> reduced.put(s.id(), receiving.reducedInspection(s)));
        model.addAttribute("states", states);
        model.addAttribute("reduced", reduced);
        return "receiving/switching";
    }

    /** A SUPERVISOR approves reduced inspection (ISO 2859-1:1999 clause 9.3.3 b and c) with a reason. */
    @PostMapping("/switching/{id}/reduced/approve")
    String approveReduced(@PathVariable long id, @RequestParam(defaultValue = "") String reason,
                          @RequestParam(defaultValue = "false") boolean productionSteady, @RequestParam long version,
                          RedirectAttributes redirect) {
        return decideReduced(redirect, () -> {
            var s = receiving.approveReducedInspection(id, reason, productionSteady, version);
            return "Reduced inspection approved: " + s.partNumber() + " from " + s.supplierCode() + ". "
                    + s.lastExplanation();
        });
    }

    /** A SUPERVISOR withdraws the approval of reduced inspection with a reason (clause 9.3.4). */
    @PostMapping("/switching/{id}/reduced/withdraw")
    String withdrawReduced(@PathVariable long id, @RequestParam(defaultValue = "") String reason,
                           @RequestParam long version, RedirectAttributes redirect) {
        return decideReduced(redirect, () -> {
            var s = receiving.withdrawReducedInspection(id, reason, version);
            return "Approval of reduced inspection withdrawn: " + s.partNumber() + " from " + s.supplierCode() + ". "
                    + s.lastExplanation();
        });
    }

    private String decideReduced(RedirectAttributes redirect, Supplier<String> decision) {
        try {
            redirect.addFlashAttribute("notice", decision.get());
        } catch (ReceivingException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        } catch (ObjectOptimisticLockingFailureException e) {
            redirect.addFlashAttribute("problem", "This changed while you were editing; look again and retry.");
        }
        return "redirect:/receiving/switching";
    }

    @PostMapping("/switching/{id}/lift")
    String lift(@PathVariable long id, @RequestParam(defaultValue = "") String reason, @RequestParam long version,
                RedirectAttributes redirect) {
        try {
            var s = receiving.liftBlock(id, reason, version);
            redirect.addFlashAttribute("notice", "Block lifted: " + s.partNumber() + " from " + s.supplierCode()
                    + " resumes on tightened inspection.");
        } catch (ReceivingException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
        } catch (ObjectOptimisticLockingFailureException e) {
            redirect.addFlashAttribute("problem", "This changed while you were editing; look again and retry.");
        }
        return "redirect:/receiving/switching";
    }
}
