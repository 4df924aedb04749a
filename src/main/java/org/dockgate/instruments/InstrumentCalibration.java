package org.dockgate.instruments;

import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Embeddable;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.FetchType;
import jakarta.persistence.GeneratedValue;
import jakarta.persistence.GenerationType;
import jakarta.persistence.Id;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.OrderColumn;
import jakarta.persistence.Table;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.hibernate.annotations.Immutable;

/**
 * One calibration record. Append-only: Hibernate never updates it ({@link Immutable}) and the database
 * refuses UPDATE and DELETE on it and on its bands (V4_2 triggers).
 */
@Entity
@Immutable
@Table(name = "instrument_calibration")
class InstrumentCalibration {

    @Id
    @GeneratedValue(strategy = GenerationType.IDENTITY)
    private Long id;

    @Column(name = "instrument_id", nullable = false, updatable = false)
    private long instrumentId;

    @Column(name = "sequence_no", nullable = false, updatable = false)
    private int sequenceNo;

    @Column(name = "certificate_number", nullable = false, length = 100, updatable = false)
    private String certificateNumber;

    @Column(name = "calibrated_on", nullable = false, updatable = false)
    private LocalDate calibratedOn;

    @Column(name = "due_on", nullable = false, updatable = false)
    private LocalDate dueOn;

    @Column(name = "coverage_factor", nullable = false, updatable = false)
    private double coverageFactor;

    @Column(name = "recorded_at", nullable = false, updatable = false)
    private Instant recordedAt;

    @Column(name = "calibrated_min", updatable = false)
    private Double calibratedMin;

    @Column(name = "calibrated_max", updatable = false)
    private Double calibratedMax;

    @Column(name = "uncertainty_floor", updatable = false)
    private Double uncertaintyFloor;

    @ElementCollection(fetch = FetchType.EAGER)
    @CollectionTable(name = "instrument_uncertainty_band", joinColumns = @JoinColumn(name = "calibration_id"))
    @OrderColumn(name = "band_no")
    private List<Band> bands = new ArrayList<>();

    protected InstrumentCalibration() {
    }

    InstrumentCalibration(long instrumentId, int sequenceNo, NewCalibration calibration, Instant recordedAt) {
        this.instrumentId = instrumentId;
        this.sequenceNo = sequenceNo;
        this.certificateNumber = calibration.certificateNumber();
        this.calibratedOn = calibration.calibratedOn();
        this.dueOn = calibration.dueOn();
        this.coverageFactor = calibration.coverageFactor();
        this.recordedAt = recordedAt;
        this.calibratedMin = calibration.calibratedMin();
        this.calibratedMax = calibration.calibratedMax();
        this.uncertaintyFloor = calibration.uncertaintyFloor();
        calibration.bands().forEach(b -> bands.add(new Band(b.upTo(), b.expandedUncertainty(), b.mode())));
    }

    long getInstrumentId() {
        return instrumentId;
    }

    CalibrationRecord toRecord() {
        return new CalibrationRecord(sequenceNo, certificateNumber, calibratedOn, dueOn, coverageFactor,
                bands.stream().map(Band::toBand).toList(), recordedAt,
                calibratedMin, calibratedMax, uncertaintyFloor);
    }

    @Embeddable
    static class Band {

        @Column(name = "up_to", nullable = false)
        private double upTo;

        @Column(name = "expanded_uncertainty", nullable = false)
        private double expandedUncertainty;

        @Enumerated(EnumType.STRING)
        @Column(nullable = false, length = 32)
        private UncertaintyMode mode;

        protected Band() {
        }

        Band(double upTo, double expandedUncertainty, UncertaintyMode mode) {
            this.upTo = upTo;
            this.expandedUncertainty = expandedUncertainty;
            this.mode = mode;
        }

        UncertaintyBand toBand() {
            return new UncertaintyBand(upTo, expandedUncertainty, mode);
        }
    }
}
