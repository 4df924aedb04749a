package org.dockgate.bench.web;

import org.dockgate.bench.NewConditions;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Conditions as a client sends them (field names of the contract). */
record ConditionsRequest(Double ambientC, Double relativeHumidityPercent, Double pressureKPa, String deviationReason) {

    static final java.util.Set<String> FIELDS = java.util.Set.of("ambientC", "relativeHumidityPercent", "pressureKPa",
            "deviationReason");

    /** Reads the body; a wrongly typed or unknown field is named. */
    static ConditionsRequest of(JsonMapper json, JsonNode node) {
        if (node == null || !node.isObject()) {
            throw new IllegalArgumentException("Send the conditions as a JSON object with 'ambientC' and"
                    + " 'relativeHumidityPercent' (optional 'pressureKPa', 'deviationReason').");
        }
        for (String name : node.propertyNames()) {
            if (!FIELDS.contains(name)) {
                throw new IllegalArgumentException("'" + name + "' is not a field of conditions (fields: ambientC,"
                        + " relativeHumidityPercent, pressureKPa, deviationReason).");
            }
        }
        try {
            return json.treeToValue(node, ConditionsRequest.class);
        } catch (JacksonException e) {
            String field = e.getPath().isEmpty() ? "" : e.getPath().get(e.getPath().size() - 1).getPropertyName();
            if (org.dockgate.web.FiniteNumbersModule.notFinite(e)) {
                throw new IllegalArgumentException("'" + field + "' must be a finite number.");
            }
            throw new IllegalArgumentException("The field '" + field + "' has the wrong type or an unknown name"
                    + " (fields: ambientC, relativeHumidityPercent, pressureKPa, deviationReason).");
        }
    }

    NewConditions toNewConditions() {
        return new NewConditions(ambientC, relativeHumidityPercent, pressureKPa, deviationReason);
    }
}
