package org.dockgate.certificates.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.io.IOException;
import java.time.Instant;
import java.util.List;
import org.dockgate.certificates.CertificateRegister;
import org.dockgate.certificates.CertificateVerifier;
import org.dockgate.certificates.IssuedCertificate;
import org.dockgate.certificates.VerificationResult;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RequestPart;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.multipart.MultipartFile;
import org.springframework.http.ProblemDetail;
import org.springframework.web.bind.annotation.ExceptionHandler;

/** The certificate register and verification for scripts and lab systems (any signed-in role). */
@RestController
@RequestMapping("/api/v1/certificates")
@Tag(name = "Certificates", description = "The register of signed certificates, their PDFs, and verification of any PDF")
class CertificatesApiController {

    private final CertificateRegister register;
    private final CertificateVerifier verifier;

    CertificatesApiController(CertificateRegister register, CertificateVerifier verifier) {
        this.register = register;
        this.verifier = verifier;
    }

    /** One register entry as the API shows it. */
    record CertificateResponse(String certificateNumber, int revision, String status, String replacesNumber,
                               String reissueReason, String supersededBy, Instant supersededAt, Long lotId,
                               String lotReference, String supplier, List<String> serials, String signer,
                               String signerUsername, String meaning, Instant signedAt, String sha256, long pdfSize,
                               String pdfUrl) {
        static CertificateResponse of(IssuedCertificate c) {
            return new CertificateResponse(c.certificateNumber(), c.revision(), c.status().name(), c.replacesNumber(),
                    c.reissueReason(), c.supersededBy(), c.supersededAt(), c.lotId(), c.lotReference(), c.supplier(),
                    c.serials(), c.signerName(), c.signerUsername(), c.meaning(), c.signedAt(), c.pdfSha256(),
                    c.pdfSize(), "/api/v1/certificates/" + c.certificateNumber() + "/pdf");
        }
    }

    /** The verification outcome: the fields of issue 6. */
    record VerificationResponse(boolean valid, List<String> reasons, String certificateNumber,
                                @Schema(description = "subject CN of the signing certificate in the signature")
                                String signer,
                                Instant signedAt, boolean superseded,
                                @Schema(description = "fields on which the register contradicts the document")
                                List<VerificationResult.Disagreement> disagreements) {
        static VerificationResponse of(VerificationResult r) {
            return new VerificationResponse(r.valid(), r.reasons(), r.certificateNumber(), r.signer(), r.signedAt(),
                    r.superseded(), r.disagreements());
        }
    }

    @GetMapping
    @Operation(summary = "Search the certificate register",
            description = "Every parameter is optional; text matches case-insensitively as 'contains', a serial matches"
                    + " any unit of the certificate, dates are UTC days (YYYY-MM-DD, both inclusive). Newest first.",
            responses = @ApiResponse(responseCode = "200", content = @Content(mediaType = "application/json",
                    examples = @ExampleObject(value = """
                            [{"certificateNumber":"DG-2026-000123","revision":1,"status":"ISSUED","replacesNumber":null,
                              "reissueReason":null,"supersededBy":null,"supersededAt":null,"lotId":12,
                              "lotReference":"LOT-2026-0042","supplier":"Invented Sensors Ltd",
                              "serials":["AC-1001","AC-1002"],"signer":"Rui Almeida","signerUsername":"engineer",
                              "meaning":"approved for release","signedAt":"2026-03-04T14:05:09Z",
                              "sha256":"5f0c…","pdfSize":48211,"pdfUrl":"/api/v1/certificates/DG-2026-000123/pdf"}]"""))))
    List<CertificateResponse> list(
            @Parameter(description = "part of the certificate number", example = "DG-2026") @RequestParam(required = false) String number,
            @Parameter(description = "part of the lot reference, or the lot id") @RequestParam(required = false) String lot,
            @Parameter(description = "part of the supplier name") @RequestParam(required = false) String supplier,
            @Parameter(description = "part of a unit's serial number") @RequestParam(required = false) String serial,
            @Parameter(description = "signed on or after this UTC day", example = "2026-01-01") @RequestParam(required = false) String from,
            @Parameter(description = "signed on or before this UTC day", example = "2026-12-31") @RequestParam(required = false) String to,
            @Parameter(description = "at most this many entries (1–500, default 200)") @RequestParam(required = false) Integer limit) {
        return register.search(RegisterQueries.of(number, lot, supplier, serial, from, to, limit)).stream()
                .map(CertificateResponse::of).toList();
    }

    @GetMapping("/{number}")
    @Operation(summary = "One register entry")
    CertificateResponse one(@PathVariable String number) {
        return register.find(number).map(CertificateResponse::of).orElseThrow(() -> new NoSuchCertificate(number));
    }

    @GetMapping("/{number}/pdf")
    @Operation(summary = "The signed PDF exactly as issued",
            responses = @ApiResponse(responseCode = "200", content = @Content(mediaType = "application/pdf")))
    ResponseEntity<byte[]> pdf(@PathVariable String number) {
        return register.pdf(number).map(bytes -> CertificateRegisterController.pdfResponse(number, bytes))
                .orElseThrow(() -> new NoSuchCertificate(number));
    }

    @PostMapping(value = "/verify", consumes = MediaType.MULTIPART_FORM_DATA_VALUE)
    @Operation(summary = "Verify any PDF",
            description = "Checks that the signature is cryptographically valid, covers the whole document, was made"
                    + " with a certificate issued by this lab's CA (or a trusted imported CA) by someone whose signing"
                    + " rights were not revoked at the time, and that the file is the one in the register (number,"
                    + " SHA-256) and not superseded. The signer is the subject CN of the signing certificate in the"
                    + " signature; where the register's entry contradicts the document (number, SHA-256, size, signer,"
                    + " signing certificate, time, meaning) the field is listed under disagreements and the file is not"
                    + " valid. Any file gets an answer: one that is not a PDF is simply not valid.",
            responses = @ApiResponse(responseCode = "200", content = @Content(mediaType = "application/json",
                    schema = @Schema(implementation = VerificationResponse.class),
                    examples = {@ExampleObject(name = "valid", value = """
                            {"valid":true,"reasons":[],"certificateNumber":"DG-2026-000123","signer":"Rui Almeida",
                             "signedAt":"2026-03-04T14:05:09Z","superseded":false,"disagreements":[]}"""),
                        @ExampleObject(name = "tampered", value = """
                            {"valid":false,"reasons":["The document was changed after it was signed: its digest does not match the signed digest.",
                             "No certificate in the register has this file's SHA-256 (9a1e…)."],
                             "certificateNumber":"DG-2026-000123","signer":"Rui Almeida","signedAt":"2026-03-04T14:05:09Z",
                             "superseded":false,"disagreements":[]}"""),
                        @ExampleObject(name = "register altered", value = """
                            {"valid":false,"reasons":["The register disagrees with the document about the signer of DG-2026-000123: the document says \\"Rui Almeida\\", the register says \\"Someone Else\\"."],
                             "certificateNumber":"DG-2026-000123","signer":"Rui Almeida","signedAt":"2026-03-04T14:05:09Z",
                             "superseded":false,"disagreements":[{"field":"signer","label":"signer",
                             "document":"Rui Almeida","register":"Someone Else"}]}""")})))
    VerificationResponse verify(@Parameter(description = "the PDF to check") @RequestPart(name = "file") MultipartFile file) {
        if (file.isEmpty()) {
            throw new IllegalArgumentException("The upload part 'file' is empty.");
        }
        try {
            return VerificationResponse.of(verifier.verify(file.getBytes()));
        } catch (IOException e) {
            throw new IllegalArgumentException("The upload could not be read.");
        }
    }

    /** An unknown certificate number: 404 as a problem document (handled here, before the catch-all advice). */
    static final class NoSuchCertificate extends RuntimeException {
        NoSuchCertificate(String number) {
            super("There is no certificate " + number + " in the register.");
        }
    }

    @ExceptionHandler(NoSuchCertificate.class)
    ResponseEntity<ProblemDetail> notFound(NoSuchCertificate e) {
        return ResponseEntity.status(HttpStatus.NOT_FOUND).contentType(MediaType.APPLICATION_PROBLEM_JSON)
                .body(ProblemDetail.forStatusAndDetail(HttpStatus.NOT_FOUND, e.getMessage()));
    }
}
