package org.dockgate.bench.web;

import java.time.Instant;
import org.dockgate.bench.Reading;
import org.dockgate.web.ApiNumbers;

/** A saved reading as JSON; absent values are null. */
record ReadingResponse(long id, long lotId, String serial, String test, Double point, String direction,
                       Integer cycle, int slot, Double value, String unit, Double enteredValue, String enteredUnit,
                       String instrument, String recordedBy, Instant recordedAt, String clientToken, Long supersedes,
                       String correctionReason, Long supersededBy, Long importId, Double applied,
                       String readout, String excitation) {

    static ReadingResponse of(Reading r) {
        return new ReadingResponse(r.id(), r.lotId(), r.serial(), r.test().name(), ApiNumbers.finiteOrNull(r.point()),
                r.direction().map(Enum::name).orElse(null), r.cycle().isPresent() ? r.cycle().getAsInt() : null,
                r.slot(), ApiNumbers.finiteOrNull(r.value()), r.unit(), ApiNumbers.finiteOrNull(r.enteredValue()),
                r.enteredUnit(), r.instrument(), r.recordedBy(), r.recordedAt(), r.clientToken().orElse(null),
                r.supersedes().orElse(null), r.correctionReason().orElse(null), r.supersededBy().orElse(null),
                r.importId().orElse(null), ApiNumbers.finiteOrNull(r.applied()), r.readout().orElse(null),
                r.excitation().orElse(null));
    }
}
