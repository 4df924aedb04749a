package org.dockgate.procedures;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.dockgate.accounts.AccountService;
import org.dockgate.accounts.Person;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.core.procedure.KindPractice;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.procedures.document.ProcedureDocument;
import org.dockgate.procedures.document.ProcedurePdf;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** Assembles an approved revision's printable document from the register, the catalogue and the accounts. */
@Service
public class ProcedureDocuments {

    private final ProcedureService procedures;
    private final CatalogueService catalogue;
    private final InstrumentService instruments;
    private final AccountService accounts;
    private final ProcedurePdf pdf;
    private final String labName;
    private final String labAddress;

    ProcedureDocuments(ProcedureService procedures, CatalogueService catalogue, InstrumentService instruments,
                       AccountService accounts, ProcedurePdf pdf, @Value("${dockgate.lab.name}") String labName,
                       @Value("${dockgate.lab.address}") String labAddress) {
        this.procedures = procedures;
        this.catalogue = catalogue;
        this.instruments = instruments;
        this.accounts = accounts;
        this.pdf = pdf;
        this.labName = labName;
        this.labAddress = labAddress;
    }

    @Transactional(readOnly = true)
    public byte[] render(ApprovedProcedure revision) {
        var model = catalogue.model(revision.modelId()).orElseThrow();
        List<ProcedureDocument.ReferenceInstrument> refs = new ArrayList<>();
        for (String id : ProcedureService.plannedInstruments(revision.content())) {
            instruments.find(id).ifPresent(v -> refs.add(new ProcedureDocument.ReferenceInstrument(v.identifier(),
                    v.description(), v.current().certificateNumber(), v.current().dueOn())));
        }
        List<ProcedureDocument.RevisionEntry> history = new ArrayList<>();
        for (ApprovedProcedure r : procedures.revisions(revision.modelId())) {
            history.add(new ProcedureDocument.RevisionEntry(r.revisionNo(), r.status(), r.approvedAt(), name(r.approvedBy()),
                    "Derived from " + r.partNumber() + " specification rev " + r.specificationRevisionNo()));
        }
        return pdf.render(new ProcedureDocument(labName, labAddress, revision.partNumber() + " procedure",
                revision.revisionNo(), revision.status(), revision.partNumber(), model.name(),
                model.kind().name().toLowerCase().replace('_', ' '),
                revision.partNumber() + " rev " + revision.specificationRevisionNo(), revision.settings().aql().label(),
                revision.settings().level().name(),
                // The counting of conditional results changes lot decisions, so the procedure states it with the rule.
                revision.settings().ruleInWords() + " " + revision.settings().conditionalCounting().inWords(),
                revision.content(), refs,
                Optional.ofNullable(revision.justification()), name(revision.author()),
                Optional.of(new ProcedureDocument.Approval(name(revision.approvedBy()), revision.approvedAt())), history,
                catalogue.revision(revision.specificationRevisionId())
                        .map(spec -> KindPractice.of(spec.specification(), model.excitation())).orElse(null),
                procedures.edits(revision).stream().map(e -> new ProcedureDocument.EditEntry(e.field(), e.oldValue(),
                        e.newValue(), e.reason(), name(e.editedBy()), e.editedAt())).toList()));
    }

    private String name(String username) {
        return accounts.byUsername(username).map(Person::displayName).orElse(username);
    }
}
