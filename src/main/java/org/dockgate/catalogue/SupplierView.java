package org.dockgate.catalogue;

/** A supplier as other modules and pages see it. */
public record SupplierView(long id, String code, String name, String contact, SupplierStatus status, long version) {
}
