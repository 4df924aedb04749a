package org.dockgate.receiving;

import java.util.Objects;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;

/** What receiving fixes on a lot from the model's approved procedure revision. */
public record LotProcedure(long procedureRevisionId, long specificationRevisionId, String label, Aql aql,
                           InspectionLevel level) {

    public LotProcedure {
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(aql, "aql");
        Objects.requireNonNull(level, "level");
    }
}
