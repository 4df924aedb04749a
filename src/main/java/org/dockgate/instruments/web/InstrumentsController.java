package org.dockgate.instruments.web;

import java.util.Arrays;
import org.dockgate.instruments.CalibrationStatus;
import org.dockgate.instruments.InstrumentException;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.instruments.InstrumentView;
import org.dockgate.instruments.NewCalibration;
import org.dockgate.instruments.NewInstrument;
import org.dockgate.instruments.Quantity;
import org.dockgate.instruments.UncertaintyMode;
import org.springframework.http.HttpStatus;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.validation.BindingResult;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.ModelAttribute;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.server.ResponseStatusException;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/** The register's pages: list by due date, detail with calibration history, and ADMIN's two forms. */
@Controller
@RequestMapping("/reference-instruments")
class InstrumentsController {

    static final String LIST = "instruments/list";
    static final String DETAIL = "instruments/detail";
    static final String NEW = "instruments/new";
    static final String CALIBRATE = "instruments/calibrate";

    private final InstrumentService instruments;

    InstrumentsController(InstrumentService instruments) {
        this.instruments = instruments;
    }

    @ModelAttribute("num")
    PlainNumbers numbers() {
        return PlainNumbers.INSTANCE;
    }

    @ModelAttribute("quantities")
    Quantity[] quantities() {
        return Quantity.values();
    }

    @ModelAttribute("modes")
    UncertaintyMode[] modes() {
        return UncertaintyMode.values();
    }

    @ModelAttribute("statuses")
    CalibrationStatus[] statuses() {
        return CalibrationStatus.values();
    }

    @GetMapping
    String list(@RequestParam(required = false) String quantity, @RequestParam(required = false) String status,
                Model model) {
        String q = Arrays.stream(Quantity.values()).map(Quantity::label).filter(l -> l.equals(quantity))
                .findFirst().orElse(null);
        CalibrationStatus s = Arrays.stream(CalibrationStatus.values()).filter(v -> v.name().equals(status))
                .findFirst().orElse(null);
        model.addAttribute("instruments", instruments.list(q, s));
        model.addAttribute("selectedQuantity", q == null ? "" : q);
        model.addAttribute("selectedStatus", s == null ? "" : s.name());
        model.addAttribute("today", instruments.today());
        return LIST;
    }

    @GetMapping("/new")
    String newForm(Model model) {
        model.addAttribute("form", InstrumentForm.empty());
        return NEW;
    }

    @PostMapping
    String create(@ModelAttribute("form") InstrumentForm form, BindingResult binding, RedirectAttributes redirect) {
        FormValues values = new FormValues(binding);
        Double min = values.number(form.rangeMin(), "rangeMin");
        Double max = values.number(form.rangeMax(), "rangeMax");
        NewCalibration calibration = values.calibration(form, max);
        if (binding.hasErrors() || min == null || max == null || calibration == null) {
            return NEW;
        }
        try {
            InstrumentView created = instruments.create(new NewInstrument(form.identifier(), form.description(),
                    form.quantity(), min, max, form.unit(), calibration));
            redirect.addFlashAttribute("notice", created.identifier() + " added to the register.");
            return "redirect:/reference-instruments/" + created.identifier();
        } catch (InstrumentException e) {
            values.refused(e, "identifier");
            return NEW;
        }
    }

    @GetMapping("/{identifier}")
    String detail(@PathVariable String identifier, Model model) {
        model.addAttribute("instrument", load(identifier));
        return DETAIL;
    }

    @GetMapping("/{identifier}/calibrations/new")
    String calibrationForm(@PathVariable String identifier, Model model) {
        InstrumentView view = load(identifier);
        model.addAttribute("instrument", view);
        model.addAttribute("form", CalibrationForm.proposedFor(view));
        return CALIBRATE;
    }

    @PostMapping("/{identifier}/calibrations")
    String calibrate(@PathVariable String identifier, @ModelAttribute("form") CalibrationForm form,
                     BindingResult binding, Model model, RedirectAttributes redirect) {
        InstrumentView view = load(identifier);
        model.addAttribute("instrument", view);
        FormValues values = new FormValues(binding);
        NewCalibration calibration = values.calibration(form, view.rangeMax());
        if (form.version() == null) {
            throw new ResponseStatusException(HttpStatus.BAD_REQUEST);
        }
        if (binding.hasErrors() || calibration == null) {
            return CALIBRATE;
        }
        try {
            InstrumentView saved = instruments.recordCalibration(view.identifier(), calibration, form.version());
            redirect.addFlashAttribute("notice", "Calibration of " + saved.identifier() + " recorded (certificate "
                    + saved.current().certificateNumber() + ", due " + saved.current().dueOn() + ").");
            return "redirect:/reference-instruments/" + saved.identifier();
        } catch (InstrumentException e) {
            values.refused(e, "certificateNumber");
            return CALIBRATE;
        } catch (ObjectOptimisticLockingFailureException e) {
            // Keep what the person typed; show the current record and let them check and submit again.
            InstrumentView current = load(identifier);
            model.addAttribute("instrument", current);
            model.addAttribute("form", form.withVersion(current.version()));
            model.addAttribute("problem", "Someone recorded a calibration of " + current.identifier()
                    + " while you were editing (now certificate " + current.current().certificateNumber()
                    + "). Your entries are kept below: check them against the current record and save again.");
            return CALIBRATE;
        }
    }

    private InstrumentView load(String identifier) {
        return instruments.find(identifier).orElseThrow(() -> new ResponseStatusException(HttpStatus.NOT_FOUND));
    }
}
