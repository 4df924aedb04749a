package org.dockgate.receiving;

import java.util.Optional;

/** The approved procedure revision of a sensor model, as receiving needs it (implemented over the procedures module). */
public interface ProcedureLookup {

    /** The model's current approved procedure revision, or empty when it has none. */
    Optional<LotProcedure> approvedFor(long modelId);
}
