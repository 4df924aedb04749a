package org.dockgate.receiving;

import java.time.Instant;
import org.dockgate.core.sampling.SwitchingState;

/** The switching state for one supplier and sensor model, with the last explanation and its version. */
public record SwitchingView(long id, long supplierId, String supplierCode, long modelId, String partNumber,
                            SwitchingState state, String lastExplanation, Instant updatedAt, long version) {

    /** NORMAL, TIGHTENED, REDUCED or DISCONTINUED, as shown on the pages. */
    public String label() {
        return state.discontinued() ? "DISCONTINUED" : state.severity().name();
    }
}
