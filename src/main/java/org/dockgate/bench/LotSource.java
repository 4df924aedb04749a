package org.dockgate.bench;

import java.util.List;
import java.util.Optional;

/**
 * Where the bench finds lots (implemented over receiving). Kept narrow so the bench depends only on
 * what it uses: the procedure revision and the sample.
 */
public interface LotSource {

    /** The lot, or empty when there is none with this id. */
    Optional<BenchLot> lot(long lotId);

    /** Lots whose sample is waiting for the bench, oldest first. */
    List<BenchLot> awaitingMeasurement();
}
