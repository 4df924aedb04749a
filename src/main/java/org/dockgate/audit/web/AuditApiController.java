package org.dockgate.audit.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.List;
import org.dockgate.audit.ChainVerifier;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(name = "Audit trail")
class AuditApiController {

    private final ChainVerifier verifier;

    AuditApiController(ChainVerifier verifier) {
        this.verifier = verifier;
    }

    record VerifyResponse(boolean intact, long entries, Long firstBrokenEntry, List<String> problems) {
    }

    @GetMapping("/api/v1/audit/verify")
    @Operation(summary = "Recompute the audit trail's hash chain and check its seals",
            description = "Returns whether the chain is intact, how many entries were checked and the sequence"
                    + " number of the first entry that does not match (null when intact). AUDITOR or ADMIN.")
    VerifyResponse verify() {
        var result = verifier.verify();
        return new VerifyResponse(result.intact(), result.entries(), result.firstBrokenEntry(), result.problems());
    }
}
