package org.dockgate.receiving;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;

/** A saved receipt with its lots. */
public record ReceiptView(long id, String purchaseOrder, String deliveryNote, LocalDate receivedOn, String receivedBy,
                          long supplierId, String supplierCode, Instant createdAt, List<LotView> lots) {

    public ReceiptView {
        lots = List.copyOf(lots);
    }
}
