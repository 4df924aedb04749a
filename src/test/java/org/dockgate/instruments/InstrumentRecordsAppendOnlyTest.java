package org.dockgate.instruments;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.LocalDate;
import java.util.List;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.dao.DataAccessException;
import org.springframework.jdbc.core.JdbcTemplate;

/** The database itself refuses to change or remove a calibration record or its uncertainty bands (V4_2). */
@SpringBootTest
class InstrumentRecordsAppendOnlyTest {

    @Autowired InstrumentService service;
    @Autowired JdbcTemplate jdbc;

    @Test
    void calibrationRecordsRefuseUpdateAndDelete() {
        String id = "RI-TAPP-" + UUID.randomUUID().toString().substring(0, 8).toUpperCase();
        LocalDate today = service.today();
        // Expired already, so that no other test finds it qualifying on a shared database.
        service.create(new NewInstrument(id, "Append-only check", "voltage", -1, 1, "V",
                new NewCalibration("CERT-" + id, today.minusDays(400), today.minusDays(35), 2, List.of(
                        new UncertaintyBand(0, 0.0001, UncertaintyMode.ABSOLUTE),
                        new UncertaintyBand(1, 0.01, UncertaintyMode.PERCENT_OF_READING)))));
        long calibrationId = jdbc.queryForObject("select c.id from instrument_calibration c join reference_instrument i"
                + " on i.id = c.instrument_id where i.identifier = ?", Long.class, id);

        assertThatThrownBy(() -> jdbc.update("update instrument_calibration set due_on = due_on + 365 where id = ?",
                calibrationId)).isInstanceOf(DataAccessException.class).hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.update("delete from instrument_calibration where id = ?", calibrationId))
                .isInstanceOf(DataAccessException.class);
        assertThatThrownBy(() -> jdbc.update("update instrument_uncertainty_band set expanded_uncertainty = 0.000001"
                + " where calibration_id = ?", calibrationId))
                .isInstanceOf(DataAccessException.class).hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.update("delete from instrument_uncertainty_band where calibration_id = ?",
                calibrationId)).isInstanceOf(DataAccessException.class).hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.execute("truncate table instrument_uncertainty_band"))
                .isInstanceOf(DataAccessException.class);
        assertThatThrownBy(() -> jdbc.execute("truncate table instrument_calibration"))
                .isInstanceOf(DataAccessException.class);

        InstrumentView after = service.find(id).orElseThrow();
        assertThat(after.current().dueOn()).isEqualTo(today.minusDays(35));
        assertThat(after.current().bands()).hasSize(2);
        assertThat(after.status()).isEqualTo(CalibrationStatus.EXPIRED);
    }
}
