package org.dockgate.bench.web;

import org.dockgate.bench.NewConditions;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Conditions as a client sends them (field names of the contract). */
record ConditionsRequest(Double ambientC, Double relativeHumidityPercent, Double pressureKPa, String deviationReason) {

    /** Reads the body; a wrongly typed or unknown field is named. */
    static ConditionsRequest of(JsonMapper json, JsonNode node) {
        if (node == null || !node.isObject()) {
            throw new IllegalArgumentException("Send the conditions as a JSON object with 'ambientC' and"
                    + " 'relativeHumidityPercent' (optional 'pressureKPa', 'deviationReason').");
        }
        try {
            return json.treeToValue(node, ConditionsRequest.class);
        } catch (JacksonException e) {
            String field = e.getPath().isEmpty() ? "" : e.getPath().get(e.getPath().size() - 1).getPropertyName();
            throw new IllegalArgumentException("The field '" + field + "' has the wrong type or an unknown name"
                    + " (fields: ambientC, relativeHumidityPercent, pressureKPa, deviationReason).");
        }
    }

    NewConditions toNewConditions() {
        return new NewConditions(ambientC, relativeHumidityPercent, pressureKPa, deviationReason);
    }
}
