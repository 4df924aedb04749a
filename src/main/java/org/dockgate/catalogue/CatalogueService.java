package org.dockgate.catalogue;

import org.dockgate.platform.CurrentActor;

import java.time.Clock;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import org.dockgate.audit.AuditEvent;
import org.dockgate.audit.AuditEvent.FieldChange;
import org.dockgate.core.procedure.SensorKind;
import org.dockgate.core.procedure.SensorSpecification;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.databind.json.JsonMapper;

/**
 * The catalogue's face: suppliers, sensor models and their specification revisions. A revision never
 * changes once written (the database refuses it too); a changed datasheet is the next revision, with its
 * reason.
 */
@Service
public class CatalogueService {

    private final SupplierRepository suppliers;
    private final SensorModelRepository models;
    private final SpecificationRevisionRepository revisions;
    private final ApplicationEventPublisher events;
    private final Clock clock;
    private final JsonMapper json;

    CatalogueService(SupplierRepository suppliers, SensorModelRepository models,
                     SpecificationRevisionRepository revisions, ApplicationEventPublisher events, Clock clock,
                     JsonMapper json) {
        this.suppliers = suppliers;
        this.models = models;
        this.revisions = revisions;
        this.events = events;
        this.clock = clock;
        this.json = json;
    }

    // ---- suppliers

    @Transactional
    public SupplierView createSupplier(String code, String name, String contact, SupplierStatus status) {
        String c = code == null ? "" : code.trim().toUpperCase(Locale.ROOT);
        if (!c.matches("[A-Z0-9-]{2,16}")) {
            throw new CatalogueException("code", "A supplier code is 2 to 16 letters, digits or dashes.");
        }
        if (suppliers.findByCode(c).isPresent()) {
            throw new CatalogueException("code", "The supplier code " + c + " is already used.");
        }
        if (name == null || name.isBlank()) {
            throw new CatalogueException("name", "Enter the supplier's name.");
        }
        Supplier s = suppliers.save(new Supplier(c, name.trim(), contact == null ? "" : contact.trim(),
                status == null ? SupplierStatus.APPROVED : status, clock.instant()));
        events.publishEvent(AuditEvent.of("SUPPLIER", s.getId(), "CREATE", "Supplier " + c + " created")
                .withChanges(List.of(FieldChange.of("code", null, c), FieldChange.of("name", null, name.trim()),
                        FieldChange.of("status", null, s.getStatus()))));
        return s.view();
    }

    /** Changes a supplier's approval status; the reason is recorded. */
    @Transactional
    public SupplierView changeSupplierStatus(long id, SupplierStatus status, String reason, long expectedVersion) {
        Supplier s = suppliers.findById(id).orElseThrow(() -> new CatalogueException(null, "No supplier " + id + "."));
        if (s.getVersion() != expectedVersion) {
            throw new ObjectOptimisticLockingFailureException(Supplier.class, id);
        }
        if (reason == null || reason.isBlank()) {
            throw new CatalogueException("reason", "Give the reason for changing the supplier's status.");
        }
        SupplierStatus before = s.getStatus();
        s.setStatus(status);
        suppliers.flush();
        events.publishEvent(new AuditEvent("SUPPLIER", String.valueOf(id), "CHANGE_STATUS",
                List.of(FieldChange.of("status", before, status)), "Supplier " + s.getCode() + " now " + status,
                reason, null));
        return s.view();
    }

    @Transactional(readOnly = true)
    public List<SupplierView> suppliers() {
        return suppliers.findAllByOrderByCodeAsc().stream().map(Supplier::view).toList();
    }

    @Transactional(readOnly = true)
    public Optional<SupplierView> supplier(long id) {
        return suppliers.findById(id).map(Supplier::view);
    }

    @Transactional(readOnly = true)
    public Optional<SupplierView> supplierByCode(String code) {
        return suppliers.findByCode(code).map(Supplier::view);
    }

    // ---- sensor models and revisions

    /** Creates a model and its first specification revision (the specification was validated by the core). */
    @Transactional
    public SensorModelView createModel(NewSensorModel draft) {
        String part = draft.partNumber() == null ? "" : draft.partNumber().trim();
        if (part.isEmpty() || part.length() > 64) {
            throw new CatalogueException("partNumber", "Enter the part number (up to 64 characters).");
        }
        if (models.findByPartNumber(part).isPresent()) {
            throw new CatalogueException("partNumber", "The part number " + part + " is already in the catalogue.");
        }
        if (draft.name() == null || draft.name().isBlank()) {
            throw new CatalogueException("name", "Enter the model's name or description.");
        }
        if (draft.specification() == null) {
            throw new CatalogueException(null, "The model needs its datasheet specification.");
        }
        Set<Long> supplierIds = new LinkedHashSet<>();
        for (String code : draft.supplierCodes() == null ? List.<String>of() : draft.supplierCodes()) {
            supplierIds.add(suppliers.findByCode(code.trim().toUpperCase(Locale.ROOT))
                    .orElseThrow(() -> new CatalogueException("suppliers", "There is no supplier with code " + code + "."))
                    .getId());
        }
        if (supplierIds.isEmpty()) {
            throw new CatalogueException("suppliers", "Choose at least one supplier.");
        }
        SensorModel model = models.save(new SensorModel(part, draft.name().trim(), draft.specification().kind(),
                blankTo(draft.measurand(), draft.specification().kind().inputDimension()),
                draft.outputKind() == null ? OutputKind.VOLTAGE : draft.outputKind(),
                draft.excitation() == null ? "" : draft.excitation().trim(), supplierIds, CurrentActor.username(), clock.instant()));
        events.publishEvent(AuditEvent.of("SENSOR_MODEL", model.getId(), "CREATE", "Sensor model " + part + " created")
                .withChanges(List.of(FieldChange.of("partNumber", null, part), FieldChange.of("kind", null, model.getKind()),
                        FieldChange.of("suppliers", null, draft.supplierCodes()))));
        writeRevision(model, 1, draft.specification(), "First revision from the datasheet");
        return view(model);
    }

    /**
     * Records the next specification revision of a model. The expected revision number guards against
     * two engineers revising at once; the reason is required.
     */
    @Transactional
    public SpecificationRevision revise(long modelId, SensorSpecification specification, String reason,
                                        int expectedLatestRevision) {
        SensorModel model = models.findById(modelId)
                .orElseThrow(() -> new CatalogueException(null, "There is no sensor model " + modelId + "."));
        if (reason == null || reason.isBlank()) {
            throw new CatalogueException("reason", "Give the reason for the new revision (e.g. the datasheet edition).");
        }
        if (specification.kind() != model.getKind()) {
            throw new CatalogueException("kind", "A revision cannot change the kind of sensor (" + model.getKind() + ").");
        }
        int latest = revisions.findFirstByModelIdOrderByRevisionNoDesc(modelId).map(SpecificationRevisionRow::getRevisionNo)
                .orElse(0);
        if (latest != expectedLatestRevision) {
            throw new ObjectOptimisticLockingFailureException(SpecificationRevisionRow.class, modelId);
        }
        return writeRevision(model, latest + 1, specification, reason.trim());
    }

    private SpecificationRevision writeRevision(SensorModel model, int number, SensorSpecification spec, String reason) {
        SpecificationRevisionRow row = revisions.saveAndFlush(new SpecificationRevisionRow(model.getId(), number,
                json.writeValueAsString(spec), reason, CurrentActor.username(), clock.instant()));
        events.publishEvent(new AuditEvent("SPECIFICATION_REVISION", String.valueOf(row.getId()), "CREATE",
                List.of(FieldChange.of("specification", null, row.getSpecificationJson())),
                model.getPartNumber() + " rev " + number, reason, null));
        return toRevision(row, model.getPartNumber());
    }

    @Transactional(readOnly = true)
    public List<SensorModelView> models(String text, SensorKind kind, Long supplierId) {
        String needle = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
        List<SensorModelView> found = new ArrayList<>();
        for (SensorModel m : models.findAllByOrderByPartNumberAsc()) {
            if (kind != null && m.getKind() != kind) {
                continue;
            }
            if (supplierId != null && !m.getSupplierIds().contains(supplierId)) {
                continue;
            }
            if (!needle.isEmpty() && !(m.getPartNumber().toLowerCase(Locale.ROOT).contains(needle)
                    || m.getName().toLowerCase(Locale.ROOT).contains(needle))) {
                continue;
            }
            found.add(view(m));
        }
        return found;
    }

    @Transactional(readOnly = true)
    public Optional<SensorModelView> model(long id) {
        return models.findById(id).map(this::view);
    }

    @Transactional(readOnly = true)
    public Optional<SensorModelView> modelByPartNumber(String partNumber) {
        return models.findByPartNumber(partNumber).map(this::view);
    }

    @Transactional(readOnly = true)
    public List<SpecificationRevision> revisions(long modelId) {
        String part = models.findById(modelId).map(SensorModel::getPartNumber).orElse("?");
        return revisions.findByModelIdOrderByRevisionNoDesc(modelId).stream().map(r -> toRevision(r, part)).toList();
    }

    @Transactional(readOnly = true)
    public Optional<SpecificationRevision> revision(long revisionId) {
        return revisions.findById(revisionId).map(r -> toRevision(r,
                models.findById(r.getModelId()).map(SensorModel::getPartNumber).orElse("?")));
    }

    private SensorModelView view(SensorModel m) {
        List<SupplierView> supplierViews = suppliers.findAllById(m.getSupplierIds()).stream().map(Supplier::view)
                .sorted(Comparator.comparing(SupplierView::code)).toList();
        SpecificationRevision latest = revisions.findFirstByModelIdOrderByRevisionNoDesc(m.getId())
                .map(r -> toRevision(r, m.getPartNumber())).orElse(null);
        return new SensorModelView(m.getId(), m.getPartNumber(), m.getName(), m.getKind(), m.getMeasurand(),
                m.getOutputKind(), m.getExcitation(), supplierViews, latest, m.getVersion());
    }

    private SpecificationRevision toRevision(SpecificationRevisionRow r, String partNumber) {
        return new SpecificationRevision(r.getId(), r.getModelId(), partNumber, r.getRevisionNo(),
                org.dockgate.platform.StoredJson.reader(json, SensorSpecification.class).readValue(r.getSpecificationJson()), r.getReason(), r.getCreatedBy(),
                r.getCreatedAt());
    }


    private static String blankTo(String value, String fallback) {
        return value == null || value.isBlank() ? (fallback == null ? "other" : fallback) : value.trim();
    }
}
