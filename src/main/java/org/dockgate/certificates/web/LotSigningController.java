package org.dockgate.certificates.web;

import io.swagger.v3.oas.annotations.tags.Tag;
import org.dockgate.certificates.CertificatePdfWriter;
import org.dockgate.certificates.IssuedCertificate;
import org.dockgate.certificates.LotCertificateService;
import org.dockgate.evaluation.EvaluationService;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/** Approve and sign a dispositioned lot's certificate, re-entering the password; reissue with a reason. */
@Controller
@Tag(name = "Certificates")
class LotSigningController {

    private final LotCertificateService certificates;
    private final EvaluationService evaluation;
    private final CertificatePdfWriter pdfs;

    LotSigningController(LotCertificateService certificates, EvaluationService evaluation, CertificatePdfWriter pdfs) {
        this.certificates = certificates;
        this.evaluation = evaluation;
        this.pdfs = pdfs;
    }

    @GetMapping("/certificates/lots/{id}")
    String page(@PathVariable long id, Model model) {
        model.addAttribute("ev", evaluation.lotEvaluation(id));
        model.addAttribute("issued", certificates.forLot(id));
        if (evaluation.lotEvaluation(id).lot().state() != org.dockgate.receiving.LotState.AWAITING_MEASUREMENT) {
            model.addAttribute("meaning", certificates.meaning(id));
            model.addAttribute("documentTitle", certificates.documentTitle(id));
        }
        // The QR code would point to this computer only: the signer sees it before signing.
        model.addAttribute("localBaseUrl", pdfs.pointsToLocalhost() ? pdfs.publicBaseUrl() : null);
        return "certificates/lot-sign";
    }

    @PostMapping("/certificates/lots/{id}/sign")
    String sign(@PathVariable long id, @RequestParam String password, RedirectAttributes redirect) {
        try {
            IssuedCertificate issued = certificates.approveAndSign(id, password);
            redirect.addFlashAttribute("notice", "Certificate " + issued.certificateNumber() + " signed: " + issued.meaning() + ".");
            return "redirect:/certificates/" + issued.certificateNumber();
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
            return "redirect:/certificates/lots/" + id;
        }
    }

    @PostMapping("/certificates/lots/{id}/reissue")
    String reissue(@PathVariable long id, @RequestParam String number, @RequestParam String reason,
                   @RequestParam String password, RedirectAttributes redirect) {
        try {
            IssuedCertificate issued = certificates.reissue(number, reason, password);
            redirect.addFlashAttribute("notice", "Certificate " + issued.certificateNumber() + " issued, replacing " + number + ".");
            return "redirect:/certificates/" + issued.certificateNumber();
        } catch (IllegalArgumentException | IllegalStateException e) {
            redirect.addFlashAttribute("problem", e.getMessage());
            return "redirect:/certificates/lots/" + id;
        }
    }
}
