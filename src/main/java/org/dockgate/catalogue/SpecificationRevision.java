package org.dockgate.catalogue;

import java.time.Instant;
import org.dockgate.core.procedure.SensorSpecification;

/** One immutable revision of a sensor model's datasheet metrics and limits. */
public record SpecificationRevision(long id, long modelId, String partNumber, int revisionNo,
                                    SensorSpecification specification, String reason, String createdBy,
                                    Instant createdAt) {

    /** "QP-250 rev 2", as printed on procedures and certificates. */
    public String label() {
        return partNumber + " rev " + revisionNo;
    }
}
