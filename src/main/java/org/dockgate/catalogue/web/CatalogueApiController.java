package org.dockgate.catalogue.web;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.net.URI;
import java.util.List;
import org.dockgate.catalogue.CatalogueService;
import org.dockgate.catalogue.NewSensorModel;
import org.dockgate.catalogue.OutputKind;
import org.dockgate.catalogue.SensorModelView;
import org.dockgate.catalogue.SpecificationRevision;
import org.dockgate.catalogue.SupplierStatus;
import org.dockgate.catalogue.SupplierView;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(name = "Catalogue", description = "Suppliers, sensor models and their specification revisions")
class CatalogueApiController {

    private final CatalogueService catalogue;

    CatalogueApiController(CatalogueService catalogue) {
        this.catalogue = catalogue;
    }

    record NewModelRequest(String partNumber, String name, String measurand, OutputKind outputKind, String excitation,
                           List<String> supplierCodes, SensorSpecification specification) {
    }

    record RevisionRequest(SensorSpecification specification, String reason, Integer expectedLatestRevision) {
    }

    record NewSupplierRequest(String code, String name, String contact, SupplierStatus status) {
    }

    @GetMapping("/api/v1/sensor-models")
    @Operation(summary = "List sensor models", description = "Optional filters: q (part number or name), kind, supplierId.")
    List<SensorModelView> list(@RequestParam(required = false) String q, @RequestParam(required = false) SensorKind kind,
                               @RequestParam(required = false) Long supplierId) {
        return catalogue.models(q, kind, supplierId);
    }

    @GetMapping("/api/v1/sensor-models/{id}")
    @Operation(summary = "One sensor model with its latest specification revision")
    ResponseEntity<SensorModelView> one(@PathVariable long id) {
        return ResponseEntity.ok(catalogue.model(id).orElseThrow(org.dockgate.web.NotFoundException.of("There is no sensor model " + id + ".")));
    }

    @GetMapping("/api/v1/sensor-models/{id}/revisions")
    @Operation(summary = "All specification revisions of a model, newest first")
    List<SpecificationRevision> revisions(@PathVariable long id) {
        if (catalogue.model(id).isEmpty()) {
            throw org.dockgate.web.NotFoundException.of("There is no sensor model " + id + ".").get();
        }
        return catalogue.revisions(id);
    }

    @PostMapping("/api/v1/sensor-models")
    @Operation(summary = "Create a sensor model with its first specification revision (ENGINEER)")
    ResponseEntity<SensorModelView> create(@RequestBody NewModelRequest request) {
        if (request.specification() == null) {
            throw new IllegalArgumentException("'specification' is required.");
        }
        SensorModelView created = catalogue.createModel(new NewSensorModel(request.partNumber(), request.name(),
                request.measurand(), request.outputKind(), request.excitation(), request.supplierCodes(),
                request.specification()));
        return ResponseEntity.created(URI.create("/api/v1/sensor-models/" + created.id())).body(created);
    }

    @PostMapping("/api/v1/sensor-models/{id}/revisions")
    @Operation(summary = "Record the next specification revision (ENGINEER); expectedLatestRevision guards concurrent edits")
    SpecificationRevision revise(@PathVariable long id, @RequestBody RevisionRequest request) {
        if (request.specification() == null || request.expectedLatestRevision() == null) {
            throw new IllegalArgumentException("'specification' and 'expectedLatestRevision' are required.");
        }
        return catalogue.revise(id, request.specification(), request.reason(), request.expectedLatestRevision());
    }

    @GetMapping("/api/v1/suppliers")
    @Operation(summary = "List suppliers with their approval status")
    List<SupplierView> suppliers() {
        return catalogue.suppliers();
    }

    @PostMapping("/api/v1/suppliers")
    @Operation(summary = "Create a supplier (ENGINEER or SUPERVISOR)")
    SupplierView createSupplier(@RequestBody NewSupplierRequest request) {
        return catalogue.createSupplier(request.code(), request.name(), request.contact(), request.status());
    }
}
