package org.dockgate.catalogue;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.GeneratedValue;
import jakarta.persistence.GenerationType;
import jakarta.persistence.Id;
import jakarta.persistence.Table;
import java.time.Instant;
import org.hibernate.annotations.Immutable;

/** One immutable revision of a model's datasheet (the database refuses updates and deletes). */
@Entity
@Immutable
@Table(name = "specification_revision")
class SpecificationRevisionRow {

    @Id
    @GeneratedValue(strategy = GenerationType.IDENTITY)
    private Long id;
    @Column(name = "model_id", nullable = false)
    private long modelId;
    @Column(name = "revision_no", nullable = false)
    private int revisionNo;
    @Column(name = "specification_json", nullable = false)
    private String specificationJson;
    @Column(nullable = false, length = 2000)
    private String reason;
    @Column(name = "created_by", nullable = false, length = 64)
    private String createdBy;
    @Column(name = "created_at", nullable = false)
    private Instant createdAt;

    protected SpecificationRevisionRow() {
    }

    SpecificationRevisionRow(long modelId, int revisionNo, String specificationJson, String reason, String createdBy,
                             Instant createdAt) {
        this.modelId = modelId;
        this.revisionNo = revisionNo;
        this.specificationJson = specificationJson;
        this.reason = reason;
        this.createdBy = createdBy;
        this.createdAt = createdAt;
    }

    Long getId() {
        return id;
    }

    long getModelId() {
        return modelId;
    }

    int getRevisionNo() {
        return revisionNo;
    }

    String getSpecificationJson() {
        return specificationJson;
    }

    String getReason() {
        return reason;
    }

    String getCreatedBy() {
        return createdBy;
    }

    Instant getCreatedAt() {
        return createdAt;
    }
}
