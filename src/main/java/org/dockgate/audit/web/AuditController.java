package org.dockgate.audit.web;

import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.dockgate.platform.CsvCells;
import org.dockgate.audit.AuditFilter;
import org.dockgate.audit.AuditReader;
import org.dockgate.audit.AuditSealer;
import org.dockgate.audit.ChainVerifier;
import org.springframework.format.annotation.DateTimeFormat;
import org.springframework.http.HttpHeaders;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/** AUDITOR and ADMIN: browse, filter and export the trail, open a record's history, verify and seal. */
@Controller
@RequestMapping("/audit")
class AuditController {

    private final AuditReader reader;
    private final ChainVerifier verifier;
    private final AuditSealer sealer;

    AuditController(AuditReader reader, ChainVerifier verifier, AuditSealer sealer) {
        this.reader = reader;
        this.verifier = verifier;
        this.sealer = sealer;
    }

    @GetMapping
    String list(@RequestParam(required = false) String actor, @RequestParam(required = false) String entityType,
                @RequestParam(required = false) String entityId, @RequestParam(required = false) String action,
                @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate from,
                @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate to,
                @RequestParam(required = false) Long before, @RequestParam(defaultValue = "50") int size,
                Model model) {
        AuditFilter filter;
        try {
            filter = new AuditFilter(actor, entityType, entityId, action, from, to);
        } catch (IllegalArgumentException e) {
            model.addAttribute("problem", e.getMessage());
            filter = new AuditFilter(actor, entityType, entityId, action, null, null);
        }
        model.addAttribute("filter", filter);
        model.addAttribute("page", reader.page(filter, before, size));
        model.addAttribute("entityTypes", reader.entityTypes());
        model.addAttribute("actions", reader.actions());
        return "audit/list";
    }

    @GetMapping("/history/{entityType}/{entityId}")
    String history(@PathVariable String entityType, @PathVariable String entityId, Model model) {
        model.addAttribute("entityType", entityType);
        model.addAttribute("entityId", entityId);
        model.addAttribute("entries", reader.history(entityType, entityId));
        return "audit/history";
    }

    @GetMapping(value = "/export.csv")
    void export(@RequestParam(required = false) String actor, @RequestParam(required = false) String entityType,
                @RequestParam(required = false) String entityId, @RequestParam(required = false) String action,
                @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate from,
                @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate to,
                HttpServletResponse response) throws IOException {
        AuditFilter filter = new AuditFilter(actor, entityType, entityId, action, from, to);
        response.setContentType("text/csv");
        response.setCharacterEncoding(StandardCharsets.UTF_8.name());
        response.setHeader(HttpHeaders.CONTENT_DISPOSITION, "attachment; filename=\"audit-trail.csv\"");
        Writer writer = response.getWriter();
        try (CSVPrinter csv = new CSVPrinter(writer, CSVFormat.DEFAULT.builder().setHeader("sequence", "occurredAtUtc",
                "actorId", "actorName", "channel", "client", "entityType", "entityId", "action", "summary", "changes",
                "reason", "previousHash", "entryHash").get())) {
            reader.forEach(filter, e -> {
                try {
                    CsvCells.printRecord(csv, e.sequenceNo(), e.occurredAt(), e.actorId(), e.actorName(), e.channel(),
                            e.client(), e.entityType(), e.entityId(), e.action(), e.summary(), e.changes(),
                            e.reason(), e.previousHash(), e.entryHash());
                } catch (IOException io) {
                    throw new java.io.UncheckedIOException(io);
                }
            });
        }
    }

    @GetMapping("/verify")
    String verify(Model model) {
        model.addAttribute("result", verifier.verify());
        model.addAttribute("seals", sealer.seals());
        return "audit/verify";
    }

    @PostMapping("/seals")
    String seal(RedirectAttributes redirect) {
        var seal = sealer.seal("on demand");
        redirect.addFlashAttribute("notice", "Sealed " + seal.sealedCount() + " entries.");
        return "redirect:/audit/verify";
    }

    @GetMapping(value = "/seals/{sequenceNo}.txt", produces = MediaType.TEXT_PLAIN_VALUE)
    ResponseEntity<String> sealText(@PathVariable long sequenceNo) {
        return sealer.seal(sequenceNo)
                .map(s -> ResponseEntity.ok()
                        .header(HttpHeaders.CONTENT_DISPOSITION,
                                "attachment; filename=\"audit-seal-" + s.sealedCount() + ".txt\"")
                        .contentType(MediaType.TEXT_PLAIN).body(s.text()))
                .orElse(ResponseEntity.notFound().build());
    }

    @PostMapping("/seals/check")
    String checkSeal(@RequestParam String sealText, RedirectAttributes redirect) {
        redirect.addFlashAttribute("sealCheck", sealer.checkText(sealText));
        return "redirect:/audit/verify";
    }
}
