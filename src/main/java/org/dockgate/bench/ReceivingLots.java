package org.dockgate.bench;

import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import org.dockgate.receiving.LotState;
import org.dockgate.receiving.LotView;
import org.dockgate.receiving.ReceivingService;
import org.springframework.stereotype.Component;

/** The bench's lots are receiving's: the procedure revision fixed at receipt and the drawn sample. */
@Component
class ReceivingLots implements LotSource {

    private final ReceivingService receiving;

    ReceivingLots(ReceivingService receiving) {
        this.receiving = receiving;
    }

    @Override
    public Optional<BenchLot> lot(long lotId) {
        return receiving.lot(lotId).map(ReceivingLots::toBench);
    }

    @Override
    public List<BenchLot> awaitingMeasurement() {
        return receiving.lots(LotState.AWAITING_MEASUREMENT).stream()
                .sorted(Comparator.comparing(LotView::receivedAt).thenComparingLong(LotView::id))
                .map(ReceivingLots::toBench).toList();
    }

    static BenchLot toBench(LotView lot) {
        return new BenchLot(lot.id(), "Lot " + lot.id() + " · " + lot.partNumber() + " (" + lot.supplierCode() + ")",
                lot.procedureRevisionId(), lot.sampledSerials(), lot.state() == LotState.AWAITING_MEASUREMENT);
    }
}
