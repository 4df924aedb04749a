package org.dockgate.bench;

import java.util.List;

/**
 * A lot as the bench needs it: which procedure revision it follows and which units were drawn.
 *
 * @param id                  the lot's id
 * @param label               how people name it, e.g. "Lot 12 · QP-250 (ACME)"
 * @param procedureRevisionId the approved procedure revision fixed at receipt
 * @param sampledSerials      the units to measure, in draw order
 * @param awaitingMeasurement whether readings may still be recorded (the lot is not dispositioned)
 */
public record BenchLot(long id, String label, long procedureRevisionId, List<String> sampledSerials,
                       boolean awaitingMeasurement) {

    public BenchLot {
        sampledSerials = List.copyOf(sampledSerials);
    }
}
