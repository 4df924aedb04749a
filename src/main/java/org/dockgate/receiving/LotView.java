package org.dockgate.receiving;

import java.time.Instant;
import java.util.List;

/**
 * A received lot: its receipt, supplier and model, the serials in entry order, the serials drawn for
 * the sample (in draw order) with the seed that reproduces them, the plan, the specification and
 * procedure revisions fixed at receipt, its state and the version to pass back when changing it.
 */
public record LotView(long id, long receiptId, long supplierId, String supplierCode, long modelId, String partNumber,
                      int quantity, List<String> serials, List<String> sampledSerials, long sampleSeed, PlanView plan,
                      long procedureRevisionId, String procedureLabel, long specificationRevisionId, LotState state,
                      Integer nonconforming, String disposition, Instant receivedAt, long version) {

    public LotView {
        serials = List.copyOf(serials);
        sampledSerials = List.copyOf(sampledSerials);
    }

    /** True when the serial is one to pull for the bench. */
    public boolean sampled(String serial) {
        return sampledSerials.contains(serial);
    }
}
