package org.dockgate.demo;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.dockgate.instruments.InstrumentService;
import org.dockgate.instruments.NewCalibration;
import org.dockgate.instruments.NewInstrument;
import org.dockgate.instruments.UncertaintyBand;
import org.dockgate.instruments.UncertaintyMode;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;

/**
 * The demo's reference-instrument register from {@code reference-instruments.csv}, entered by the demo
 * {@code admin}. Dates are relative to the day of loading (see seed-data/README.md), so the demo always
 * has one instrument expired and one due within 30 days.
 */
@Component
@Order(300)
class DemoInstruments implements DemoStep {

    static final String FILE = "reference-instruments.csv";

    private final InstrumentService instruments;

    DemoInstruments(InstrumentService instruments) {
        this.instruments = instruments;
    }

    @Override
    public String name() {
        return "reference-instruments";
    }

    @Override
    public void load(SeedFiles files) {
        if (!files.exists(FILE)) {
            return;
        }
        LocalDate today = instruments.today();
        for (Map<String, String> row : files.csv(FILE)) {
            if (instruments.find(row.get("identifier")).isPresent()) {
                continue;
            }
            double max = Double.parseDouble(row.get("rangeMax"));
            NewCalibration calibration = new NewCalibration(row.get("certificateNumber"),
                    today.minusDays(Long.parseLong(row.get("calibratedOnDaysAgo"))),
                    today.plusDays(Long.parseLong(row.get("dueInDays"))),
                    Double.parseDouble(row.get("coverageFactor")),
                    bands(row.get("segments"), Double.parseDouble(row.get("expandedUncertainty")),
                            UncertaintyMode.valueOf(row.get("uncertaintyMode")), max))
                    .over(optional(row, "calibratedMin"), optional(row, "calibratedMax"), optional(row, "uncertaintyFloor"));
            NewInstrument instrument = new NewInstrument(row.get("identifier"), row.get("description"),
                    row.get("quantity"), Double.parseDouble(row.get("rangeMin")), max, row.get("unit"), calibration,
                    row.get("resolution") == null || row.get("resolution").isBlank() ? null
                            : Double.parseDouble(row.get("resolution")));
            DemoLoader.as("admin", () -> instruments.create(instrument));
        }
    }

    /** An optional number column: absent or empty is null (not stated). */
    static Double optional(Map<String, String> row, String column) {
        String text = row.get(column);
        return text == null || text.isBlank() ? null : Double.valueOf(text.strip());
    }

    /** Segments "upTo:U:MODE; …" below the top of the range, then the row's own U up to the range maximum. */
    static List<UncertaintyBand> bands(String segments, double u, UncertaintyMode mode, double rangeMax) {
        List<UncertaintyBand> bands = new ArrayList<>();
        if (segments != null && !segments.isBlank()) {
            for (String segment : segments.split(";")) {
                String[] parts = segment.strip().split(":");
                if (parts.length != 3) {
                    throw new IllegalArgumentException("A segment in " + FILE + " is upTo:U:MODE, not '" + segment + "'");
                }
                bands.add(new UncertaintyBand(Double.parseDouble(parts[0].strip()), Double.parseDouble(parts[1].strip()),
                        UncertaintyMode.valueOf(parts[2].strip())));
            }
        }
        bands.add(new UncertaintyBand(rangeMax, u, mode));
        return bands;
    }
}
