package org.dockgate.catalogue;

import java.util.List;
import org.dockgate.core.procedure.SensorKind;

/** A sensor model with its suppliers and its latest specification revision. */
public record SensorModelView(long id, String partNumber, String name, SensorKind kind, String measurand,
                              OutputKind outputKind, String excitation, List<SupplierView> suppliers,
                              SpecificationRevision latest, long version) {

    public SensorModelView {
        suppliers = List.copyOf(suppliers);
    }
}
