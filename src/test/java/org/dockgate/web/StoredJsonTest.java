package org.dockgate.web;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.dockgate.platform.StoredJson;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.json.JsonMapper;

/**
 * Request bodies refuse numbers that are not finite, but records the application stored itself (a frozen
 * budget line with ν = ∞) must still read back: both through the same mapper, as in the application.
 */
class StoredJsonTest {

    record Line(double degreesOfFreedom) {
    }

    private final JsonMapper json = JsonMapper.builder().addModule(new FiniteNumbersModule()).build();

    @Test
    void aRequestBodyRefusesInfinityButAStoredRecordKeepsIt() {
        String stored = json.writeValueAsString(new Line(Double.POSITIVE_INFINITY));
        assertThat(stored).contains("Infinity");
        assertThatThrownBy(() -> json.readValue(stored, Line.class))
                .isInstanceOf(FiniteNumbersModule.NotFiniteException.class);
        assertThat(StoredJson.read(json, Line.class, stored).degreesOfFreedom()).isEqualTo(Double.POSITIVE_INFINITY);
        assertThat(StoredJson.read(json, Line.class, "{\"degreesOfFreedom\":12.5,\"removedLater\":1}")
                .degreesOfFreedom()).isEqualTo(12.5);
    }
}
