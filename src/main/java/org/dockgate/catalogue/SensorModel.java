package org.dockgate.catalogue;

import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.FetchType;
import jakarta.persistence.GeneratedValue;
import jakarta.persistence.GenerationType;
import jakarta.persistence.Id;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.Table;
import jakarta.persistence.Version;
import java.time.Instant;
import java.util.LinkedHashSet;
import java.util.Set;
import org.dockgate.core.procedure.SensorKind;

@Entity
@Table(name = "sensor_model")
class SensorModel {

    @Id
    @GeneratedValue(strategy = GenerationType.IDENTITY)
    private Long id;
    @Column(name = "part_number", nullable = false, length = 64)
    private String partNumber;
    @Column(nullable = false, length = 200)
    private String name;
    @Enumerated(EnumType.STRING)
    @Column(nullable = false, length = 32)
    private SensorKind kind;
    @Column(nullable = false, length = 64)
    private String measurand;
    @Enumerated(EnumType.STRING)
    @Column(name = "output_kind", nullable = false, length = 32)
    private OutputKind outputKind;
    @Column(nullable = false, length = 200)
    private String excitation;
    @Column(name = "created_by", nullable = false, length = 64)
    private String createdBy;
    @Column(name = "created_at", nullable = false)
    private Instant createdAt;
    @Version
    private long version;

    @ElementCollection(fetch = FetchType.EAGER)
    @CollectionTable(name = "sensor_model_supplier", joinColumns = @JoinColumn(name = "model_id"))
    @Column(name = "supplier_id")
    private Set<Long> supplierIds = new LinkedHashSet<>();

    protected SensorModel() {
    }

    SensorModel(String partNumber, String name, SensorKind kind, String measurand, OutputKind outputKind,
                String excitation, Set<Long> supplierIds, String createdBy, Instant createdAt) {
        this.partNumber = partNumber;
        this.name = name;
        this.kind = kind;
        this.measurand = measurand;
        this.outputKind = outputKind;
        this.excitation = excitation;
        this.supplierIds = new LinkedHashSet<>(supplierIds);
        this.createdBy = createdBy;
        this.createdAt = createdAt;
    }

    Long getId() {
        return id;
    }

    String getPartNumber() {
        return partNumber;
    }

    String getName() {
        return name;
    }

    SensorKind getKind() {
        return kind;
    }

    String getMeasurand() {
        return measurand;
    }

    OutputKind getOutputKind() {
        return outputKind;
    }

    String getExcitation() {
        return excitation;
    }

    Set<Long> getSupplierIds() {
        return Set.copyOf(supplierIds);
    }

    long getVersion() {
        return version;
    }
}
