package org.dockgate.bench.web;

import org.dockgate.bench.NewReading;
import org.dockgate.bench.ReadingTest;
import org.dockgate.core.series.Direction;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * A reading as a client sends it (fields of the contract). {@code applied} is optional (absent: the set
 * point); {@code readout} and {@code excitation} name the other instruments of the measurement chain.
 */
record ReadingRequest(String serial, String test, Double point, String direction, Integer cycle, Double value,
                      String unit, String instrument, String clientToken, Double applied, String readout,
                      String excitation) {

    /** Reads one element; a wrongly typed field is named ("[2].value: …"). */
    static ReadingRequest of(JsonMapper json, JsonNode node, String where) {
        if (node == null || !node.isObject()) {
            throw new IllegalArgumentException((where.isEmpty() ? "The reading" : "Reading " + where)
                    + " must be a JSON object.");
        }
        try {
            return json.treeToValue(node, ReadingRequest.class);
        } catch (JacksonException e) {
            String field = e.getPath().isEmpty() ? "" : e.getPath().get(e.getPath().size() - 1).getPropertyName();
            if (org.dockgate.web.FiniteNumbersModule.notFinite(e)) {
                throw new IllegalArgumentException((where.isEmpty() ? "" : "Reading " + where + ": ") + "'" + field
                        + "' must be a finite number.");
            }
            throw new IllegalArgumentException((where.isEmpty() ? "" : "Reading " + where + ": ") + "the field '"
                    + field + "' has the wrong type or an unknown name.");
        }
    }

    NewReading toNewReading() {
        if (test == null || test.isBlank()) {
            throw new IllegalArgumentException("'test' is missing: STATIC, NOISE or SWEEP.");
        }
        Direction d = null;
        if (direction != null && !direction.isBlank()) {
            try {
                d = Direction.valueOf(direction.strip().toUpperCase(java.util.Locale.ROOT));
            } catch (IllegalArgumentException e) {
                throw new IllegalArgumentException("'direction' must be UP or DOWN, got '" + direction + "'.");
            }
        }
        return new NewReading(serial, ReadingTest.of(test), point, d, cycle, value, unit, instrument, clientToken,
                applied, readout, excitation);
    }
}
