package org.dockgate.catalogue;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.GeneratedValue;
import jakarta.persistence.GenerationType;
import jakarta.persistence.Id;
import jakarta.persistence.Table;
import jakarta.persistence.Version;
import java.time.Instant;

@Entity
@Table(name = "supplier")
class Supplier {

    @Id
    @GeneratedValue(strategy = GenerationType.IDENTITY)
    private Long id;
    @Column(nullable = false, length = 16)
    private String code;
    @Column(nullable = false, length = 200)
    private String name;
    @Column(nullable = false, length = 200)
    private String contact;
    @Enumerated(EnumType.STRING)
    @Column(nullable = false, length = 20)
    private SupplierStatus status;
    @Column(name = "created_at", nullable = false)
    private Instant createdAt;
    @Version
    private long version;

    protected Supplier() {
    }

    Supplier(String code, String name, String contact, SupplierStatus status, Instant createdAt) {
        this.code = code;
        this.name = name;
        this.contact = contact;
        this.status = status;
        this.createdAt = createdAt;
    }

    Long getId() {
        return id;
    }

    String getCode() {
        return code;
    }

    SupplierStatus getStatus() {
        return status;
    }

    void setStatus(SupplierStatus status) {
        this.status = status;
    }

    long getVersion() {
        return version;
    }

    SupplierView view() {
        return new SupplierView(id, code, name, contact, status, version);
    }
}
