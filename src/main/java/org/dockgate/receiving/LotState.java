package org.dockgate.receiving;

/** Where a lot stands: sampled and waiting for the bench, or dispositioned from its sample's result. */
public enum LotState { AWAITING_MEASUREMENT, DISPOSITIONED_ACCEPTED, DISPOSITIONED_REJECTED }
