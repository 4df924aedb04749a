package org.dockgate.receiving;

import java.time.Instant;

/**
 * One decision of the responsible authority on reduced inspection for a supplier and sensor model
 * (ISO 2859-1:1999 clause 9.3.3 c): approved (which also confirms steady production, 9.3.3 b) or
 * withdrawn, with who, when and why. The latest decision of a pair is in force; decisions are never
 * changed (append-only table, V10_9).
 */
public record ReducedInspectionDecision(long id, long supplierId, long modelId, boolean approved, String reason,
                                        String decidedBy, Instant decidedAt) {
}
