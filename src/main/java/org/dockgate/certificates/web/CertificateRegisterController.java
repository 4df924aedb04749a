package org.dockgate.certificates.web;

import java.util.List;
import org.dockgate.certificates.CertificateRegister;
import org.dockgate.certificates.IssuedCertificate;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.server.ResponseStatusException;

/** The certificate register for everyone signed in: search, an entry, its PDF. */
@Controller
@RequestMapping("/certificates")
class CertificateRegisterController {

    private final CertificateRegister register;

    CertificateRegisterController(CertificateRegister register) {
        this.register = register;
    }

    @GetMapping
    String search(@RequestParam(required = false) String number, @RequestParam(required = false) String lot,
                  @RequestParam(required = false) String supplier, @RequestParam(required = false) String serial,
                  @RequestParam(required = false) String from, @RequestParam(required = false) String to,
                  Model model) {
        model.addAttribute("number", number);
        model.addAttribute("lot", lot);
        model.addAttribute("supplier", supplier);
        model.addAttribute("serial", serial);
        model.addAttribute("from", from);
        model.addAttribute("to", to);
        List<IssuedCertificate> found;
        try {
            found = register.search(RegisterQueries.of(number, lot, supplier, serial, from, to, null));
        } catch (IllegalArgumentException e) {
            model.addAttribute("problem", e.getMessage());
            found = List.of();
        }
        model.addAttribute("certificates", found);
        return "certificates/register";
    }

    @GetMapping("/{number}")
    String entry(@PathVariable String number, Model model) {
        IssuedCertificate certificate = register.find(number)
                .orElseThrow(() -> new ResponseStatusException(HttpStatus.NOT_FOUND));
        model.addAttribute("c", certificate);
        return "certificates/entry";
    }

    @GetMapping("/{number}/pdf")
    ResponseEntity<byte[]> pdf(@PathVariable String number) {
        return register.pdf(number).map(bytes -> pdfResponse(number, bytes))
                .orElseThrow(() -> new ResponseStatusException(HttpStatus.NOT_FOUND));
    }

    static ResponseEntity<byte[]> pdfResponse(String number, byte[] bytes) {
        return ResponseEntity.ok().contentType(MediaType.APPLICATION_PDF)
                .header(HttpHeaders.CONTENT_DISPOSITION, ContentDisposition.attachment()
                        .filename(number + ".pdf").build().toString())
                .body(bytes);
    }
}
