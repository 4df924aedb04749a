package org.dockgate.catalogue;

/** A supplier's approval status. */
public enum SupplierStatus { APPROVED, ON_PROBATION, DISQUALIFIED }
