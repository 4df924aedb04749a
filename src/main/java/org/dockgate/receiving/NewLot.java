package org.dockgate.receiving;

import java.util.List;

/** One lot of a receipt as entered: the sensor model, the quantity on the delivery note and the serials in entry order. */
public record NewLot(Long modelId, Integer quantity, List<String> serials) {
}
