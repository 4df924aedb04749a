package org.dockgate.receiving;

import org.dockgate.core.sampling.Disposition;

/**
 * What {@code recordLotResult} decided: the lot after disposition, the disposition from Ac/Re, the
 * switching state after the lot and the explanation recorded in the audit trail.
 */
public record LotResultView(LotView lot, Disposition disposition, SwitchingView switching, String explanation) {
}
