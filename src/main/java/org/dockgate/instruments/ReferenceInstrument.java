package org.dockgate.instruments;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.GeneratedValue;
import jakarta.persistence.GenerationType;
import jakarta.persistence.Id;
import jakarta.persistence.Table;
import jakarta.persistence.Version;
import java.time.Instant;

/** A register entry. Persistence type: stays inside the instruments module. Never deleted. */
@Entity
@Table(name = "reference_instrument")
class ReferenceInstrument {

    @Id
    @GeneratedValue(strategy = GenerationType.IDENTITY)
    private Long id;

    @Column(nullable = false, unique = true, length = 40)
    private String identifier;

    @Column(nullable = false, length = 500)
    private String description;

    @Column(nullable = false, length = 32)
    private String quantity;

    @Column(name = "range_min", nullable = false)
    private double rangeMin;

    @Column(name = "range_max", nullable = false)
    private double rangeMax;

    @Column(nullable = false, length = 32)
    private String unit;

    /** How many calibration records it has; raised with each one, so a recalibration bumps the version. */
    @Column(name = "calibration_count", nullable = false)
    private int calibrationCount;

    /** A readout's resolution (its digit on the range used, in {@link #unit}); null when not recorded. */
    @Column(name = "resolution")
    private Double resolution;

    @Column(name = "created_at", nullable = false)
    private Instant createdAt;

    @Version
    private long version;

    protected ReferenceInstrument() {
    }

    ReferenceInstrument(String identifier, String description, String quantity, double rangeMin, double rangeMax,
                        String unit, Instant createdAt) {
        this.identifier = identifier;
        this.description = description;
        this.quantity = quantity;
        this.rangeMin = rangeMin;
        this.rangeMax = rangeMax;
        this.unit = unit;
        this.createdAt = createdAt;
    }

    Long getId() {
        return id;
    }

    String getIdentifier() {
        return identifier;
    }

    String getDescription() {
        return description;
    }

    String getQuantity() {
        return quantity;
    }

    double getRangeMin() {
        return rangeMin;
    }

    double getRangeMax() {
        return rangeMax;
    }

    String getUnit() {
        return unit;
    }

    Double getResolution() {
        return resolution;
    }

    void setResolution(Double resolution) {
        this.resolution = resolution;
    }

    int getCalibrationCount() {
        return calibrationCount;
    }

    long getVersion() {
        return version;
    }

    /** @return the sequence number of the calibration record being added */
    int nextCalibration() {
        calibrationCount++;
        return calibrationCount;
    }
}
