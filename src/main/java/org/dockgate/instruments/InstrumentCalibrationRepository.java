package org.dockgate.instruments;

import java.util.List;
import org.springframework.data.jpa.repository.JpaRepository;

interface InstrumentCalibrationRepository extends JpaRepository<InstrumentCalibration, Long> {

    List<InstrumentCalibration> findByInstrumentId(long instrumentId);
}
