package org.dockgate.certificates.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import org.dockgate.certificates.IssuedCertificate;
import org.dockgate.certificates.LotCertificateService;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RestController;

/**
 * The signing API. A {@code @RestController} of its own (not a method of the page controller), so its
 * refusals are problem documents from {@code ApiExceptionHandler}, not HTML error pages.
 */
@RestController
@Tag(name = "Certificates")
class LotSigningApiController {

    private final LotCertificateService certificates;

    LotSigningApiController(LotCertificateService certificates) {
        this.certificates = certificates;
    }

    record SignRequest(String password) {
    }

    @PostMapping("/api/v1/lots/{id}/certificates")
    @Operation(summary = "Approve and sign a dispositioned lot's certificate (ENGINEER or SUPERVISOR)",
            description = "The password is checked again at the moment of signing; whoever recorded readings of the"
                    + " lot cannot sign it. Returns the register entry; the PDF is at /api/v1/certificates/{number}/pdf.")
    IssuedCertificate signApi(@PathVariable long id, @RequestBody SignRequest request) {
        return certificates.approveAndSign(id, request == null ? null : request.password());
    }
}
