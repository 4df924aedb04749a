package org.dockgate.certificates.web;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import org.dockgate.certificates.CertificateRegister;
import org.dockgate.certificates.CertificateVerifier;
import org.dockgate.certificates.SigningAuthority;
import org.dockgate.certificates.SigningIdentityService;
import org.dockgate.certificates.VerificationResult;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.multipart.MultipartFile;

/**
 * Public (no sign-in): anyone holding a certificate can check it. {@code /verify} takes an upload;
 * {@code /verify/{number}} (the QR code's target) shows the register's entry: number, revision, status,
 * signer, meaning, time and SHA-256, but not the supplier, lot or serials, since numbers are sequential
 * and a stranger could otherwise page through the lab's business.
 */
@Controller
@RequestMapping("/verify")
class VerificationController {

    private final CertificateVerifier verifier;
    private final CertificateRegister register;
    private final SigningIdentityService identities;

    VerificationController(CertificateVerifier verifier, CertificateRegister register,
                           SigningIdentityService identities) {
        this.verifier = verifier;
        this.register = register;
        this.identities = identities;
    }

    @GetMapping
    String form() {
        return "certificates/verify";
    }

    @PostMapping
    String upload(@RequestParam(name = "file", required = false) MultipartFile file, Model model) {
        if (file == null || file.isEmpty()) {
            model.addAttribute("problem", "Choose the certificate's PDF file to check.");
            return "certificates/verify";
        }
        byte[] bytes;
        try {
            bytes = file.getBytes();
        } catch (IOException e) {
            model.addAttribute("problem", "The upload could not be read; try again.");
            return "certificates/verify";
        }
        VerificationResult result = verifier.verify(bytes);
        model.addAttribute("result", result);
        model.addAttribute("fileName", file.getOriginalFilename());
        return "certificates/verify";
    }

    @GetMapping("/{certificateNumber}")
    String entry(@PathVariable String certificateNumber, Model model,
                 jakarta.servlet.http.HttpServletResponse response) {
        model.addAttribute("number", certificateNumber);
        register.find(certificateNumber).ifPresentOrElse(c -> {
            model.addAttribute("c", c);
            // Check the register's stored copy against its own entry: an entry altered behind the
            // application's back shows here as a disagreement, and the signer shown is the signature's.
            register.pdf(c.certificateNumber()).ifPresent(pdf -> model.addAttribute("check", verifier.verify(pdf)));
        }, () -> response.setStatus(HttpStatus.NOT_FOUND.value()));
        return "certificates/public-entry";
    }

    /** The CA certificates this lab trusts, to add to a PDF reader's trust list. */
    @GetMapping("/trust/ca.pem")
    ResponseEntity<byte[]> trustedCas() {
        StringBuilder pem = new StringBuilder();
        for (SigningAuthority authority : identities.authorities()) {
            if (authority.trusted()) {
                pem.append(authority.certificatePem());
            }
        }
        return ResponseEntity.ok().contentType(MediaType.parseMediaType("application/x-pem-file"))
                .body(pem.toString().getBytes(StandardCharsets.US_ASCII));
    }
}
