package org.dockgate.catalogue;

import java.util.List;
import org.dockgate.core.procedure.SensorSpecification;

/** What an engineer enters for a new sensor model: its identity and its first specification revision. */
public record NewSensorModel(String partNumber, String name, String measurand, OutputKind outputKind,
                             String excitation, List<String> supplierCodes, SensorSpecification specification) {
}
