package org.dockgate.receiving;

import java.util.Optional;
import org.dockgate.procedures.ProcedureService;
import org.springframework.stereotype.Component;

/** The procedure lookup over the procedures module: the model's current (not superseded) approved revision. */
@Component
class ProceduresLookup implements ProcedureLookup {

    private final ProcedureService procedures;

    ProceduresLookup(ProcedureService procedures) {
        this.procedures = procedures;
    }

    @Override
    public Optional<LotProcedure> approvedFor(long modelId) {
        return procedures.approvedFor(modelId).map(p -> new LotProcedure(p.id(), p.specificationRevisionId(), p.label(),
                p.settings().aql(), p.settings().level()));
    }
}
