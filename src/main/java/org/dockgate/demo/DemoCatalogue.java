package org.dockgate.demo;

import java.util.ArrayList;
import java.util.List;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.NewSensorModel;
import org.dockgate.catalogue.OutputKind;
import org.dockgate.catalogue.SupplierStatus;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.dockgate.core.procedure.SensorSpecification.Bandwidth;
import org.dockgate.core.procedure.SensorSpecification.NoiseFloor;
import org.dockgate.core.procedure.SensorSpecification.NonlinearityReference;
import org.dockgate.core.procedure.SensorSpecification.Referred;
import org.dockgate.core.procedure.SensorSpecification.RtdClass;
import org.dockgate.core.rtd.RtdConstruction;
import org.dockgate.core.procedure.SensorSpecification.Sensitivity;
import org.dockgate.core.procedure.SensorSpecification.ToleranceMode;
import org.dockgate.core.procedure.SensorSpecification.ZeroOffset;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The demo's suppliers and sensor models (seed-data/suppliers.csv, seed-data/sensor-models.json), entered by the engineer. */
@Component
@Order(200)
class DemoCatalogue implements DemoStep {

    private final CatalogueService catalogue;
    private final JsonMapper json;

    DemoCatalogue(CatalogueService catalogue, JsonMapper json) {
        this.catalogue = catalogue;
        this.json = json;
    }

    @Override
    public String name() {
        return "catalogue";
    }

    @Override
    public void load(SeedFiles files) {
        DemoLoader.as("engineer", () -> {
            for (var row : files.csv("suppliers.csv")) {
                if (catalogue.supplierByCode(row.get("code")).isEmpty()) {
                    catalogue.createSupplier(row.get("code"), row.get("name"), row.get("contact"),
                            SupplierStatus.valueOf(row.get("status")));
                }
            }
            for (JsonNode m : json.readTree(files.text("sensor-models.json"))) {
                if (catalogue.modelByPartNumber(m.get("partNumber").asString()).isPresent()) {
                    continue;
                }
                List<String> suppliers = new ArrayList<>();
                m.get("suppliers").forEach(s -> suppliers.add(s.asString()));
                catalogue.createModel(new NewSensorModel(m.get("partNumber").asString(), m.get("name").asString(),
                        m.get("measurand").asString(), OutputKind.valueOf(m.get("outputKind").asString()),
                        m.get("excitation").asString(), suppliers, specification(m)));
            }
            return null;
        });
    }

    /** Reads the seed file's metric block (documented in seed-data/README.md) into a specification. */
    static SensorSpecification specification(JsonNode m) {
        JsonNode metrics = m.get("metrics");
        JsonNode s = metrics.get("sensitivity");
        JsonNode z = metrics.get("zeroOffset");
        JsonNode n = metrics.get("noiseFloor");
        JsonNode b = metrics.get("bandwidth");
        JsonNode r = metrics.get("rtd");
        JsonNode nl = metrics.has("nonlinearityBestFit") ? metrics.get("nonlinearityBestFit") : metrics.get("nonlinearityTerminal");
        return new SensorSpecification(SensorKind.valueOf(m.get("kind").asString()), m.get("inputUnit").asString(),
                m.get("rangeMin").asDouble(), m.get("rangeMax").asDouble(), m.get("outputUnit").asString(),
                s == null ? null : new Sensitivity(s.get("nominal").asDouble(), s.get("unit").asString(),
                        s.get("tolerance").asDouble(), ToleranceMode.valueOf(s.get("toleranceMode").asString())),
                z == null ? null : new ZeroOffset(z.get("nominal").asDouble(), z.get("tolerance").asDouble(), z.get("unit").asString()),
                limit(metrics, "accuracy"), nl == null ? null : nl.get("limitPctFso").asDouble(),
                nl == null ? null : metrics.has("nonlinearityBestFit") ? NonlinearityReference.BEST_FIT : NonlinearityReference.TERMINAL,
                limit(metrics, "hysteresis"), limit(metrics, "repeatability"),
                n == null ? null : new NoiseFloor(n.get("limit").asDouble(), n.get("unit").asString(),
                        Referred.valueOf(n.get("referred").asString())),
                metrics.has("resolution") ? metrics.get("resolution").get("limit").asDouble() : null,
                b == null ? null : new Bandwidth(number(b, "minus3dBHz"), number(b, "flatnessPercent"), number(b, "upToHz"),
                        number(b, "referenceHz")),
                r == null ? null : new RtdClass(r.get("r0Ohm").asDouble(), r.get("toleranceClass").asString(),
                        r.has("construction") ? RtdConstruction.parse(r.get("construction").asString()) : null));
    }

    private static Double limit(JsonNode metrics, String name) {
        return metrics.has(name) ? metrics.get(name).get("limitPctFso").asDouble() : null;
    }

    private static Double number(JsonNode node, String name) {
        return node.has(name) && !node.get(name).isNull() ? node.get(name).asDouble() : null;
    }
}
