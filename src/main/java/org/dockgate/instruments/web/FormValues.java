package org.dockgate.instruments.web;

import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import org.dockgate.instruments.InstrumentException;
import org.dockgate.instruments.NewCalibration;
import org.dockgate.instruments.UncertaintyBand;
import org.dockgate.instruments.UncertaintyMode;
import org.springframework.validation.BindingResult;

/**
 * Reads typed form values into numbers, dates and bands, putting a field error beside each that is not
 * one, and maps the service's field names back to the form's.
 */
final class FormValues {

    static final String REFUSED = "instruments.refused";

    private final BindingResult binding;
    /** Form rows (1–3) of the segments used, in band order; the main U is the band after them. */
    private final List<Integer> segmentRows = new ArrayList<>();

    FormValues(BindingResult binding) {
        this.binding = binding;
    }

    Double number(String text, String field) {
        if (text == null || text.isBlank()) {
            binding.rejectValue(field, REFUSED, "Enter a number.");
            return null;
        }
        try {
            double value = Double.parseDouble(text.strip().replace('\u2212', '-'));
            if (Double.isFinite(value)) {
                return value;
            }
        } catch (NumberFormatException e) {
            // answered below
        }
        binding.rejectValue(field, REFUSED, "'" + text.strip() + "' is not a number; write it like 20 or 0.01.");
        return null;
    }

    LocalDate date(String text, String field) {
        if (text == null || text.isBlank()) {
            binding.rejectValue(field, REFUSED, "Enter the date as YYYY-MM-DD.");
            return null;
        }
        try {
            return LocalDate.parse(text.strip());
        } catch (DateTimeParseException e) {
            binding.rejectValue(field, REFUSED, "'" + text.strip() + "' is not a date; write it as YYYY-MM-DD,"
                    + " e.g. 2026-11-17.");
            return null;
        }
    }

    UncertaintyMode mode(String text, String field) {
        try {
            return UncertaintyMode.valueOf(text == null ? "" : text.strip());
        } catch (IllegalArgumentException e) {
            binding.rejectValue(field, REFUSED, "Choose how U is stated.");
            return null;
        }
    }

    /**
     * The calibration typed in a form, or null when a value is not readable (the errors are in the binding).
     *
     * @param rangeMax the top of the instrument's range, where the main U ends (null when unreadable)
     */
    NewCalibration calibration(CalibrationInput input, Double rangeMax) {
        LocalDate calibratedOn = date(input.calibratedOn(), "calibratedOn");
        LocalDate dueOn = date(input.dueOn(), "dueOn");
        Double k = number(input.coverageFactor(), "coverageFactor");
        Double u = number(input.expandedUncertainty(), "expandedUncertainty");
        UncertaintyMode mode = mode(input.uncertaintyMode(), "uncertaintyMode");
        List<UncertaintyBand> bands = new ArrayList<>();
        boolean readable = true;
        for (int row = 1; row <= 3; row++) {
            String[] cells = input.bandRow(row);
            if (blank(cells[0]) && blank(cells[1])) {
                continue;
            }
            Double upTo = number(cells[0], "band" + row + "UpTo");
            Double bandU = number(cells[1], "band" + row + "U");
            UncertaintyMode bandMode = mode(cells[2], "band" + row + "Mode");
            if (upTo == null || bandU == null || bandMode == null) {
                readable = false;
                continue;
            }
            segmentRows.add(row);
            bands.add(band(upTo, bandU, bandMode, "band" + row + "U"));
        }
        if (u != null && mode != null && rangeMax != null) {
            bands.add(band(rangeMax, u, mode, "expandedUncertainty"));
        }
        if (!readable || calibratedOn == null || dueOn == null || k == null || u == null || mode == null
                || rangeMax == null || bands.contains(null)) {
            return null;
        }
        Double calibratedMin = optionalNumber(input.calibratedMin(), "calibratedMin");
        Double calibratedMax = optionalNumber(input.calibratedMax(), "calibratedMax");
        Double floor = optionalNumber(input.uncertaintyFloor(), "uncertaintyFloor");
        if (binding.hasFieldErrors("calibratedMin") || binding.hasFieldErrors("calibratedMax")
                || binding.hasFieldErrors("uncertaintyFloor")) {
            return null;
        }
        return new NewCalibration(input.certificateNumber(), calibratedOn, dueOn, k, bands, calibratedMin,
                calibratedMax, floor);
    }

    /** A number that may be left blank (null then); a typed value that is not a number gets a field error. */
    private Double optionalNumber(String text, String field) {
        return blank(text) ? null : number(text, field);
    }

    private UncertaintyBand band(double upTo, double u, UncertaintyMode mode, String uField) {
        try {
            return new UncertaintyBand(upTo, u, mode);
        } catch (IllegalArgumentException e) {
            binding.rejectValue(uField, REFUSED, e.getMessage());
            return null;
        }
    }

    /** Puts a refusal of the service beside the form field it concerns (or as a global error). */
    void refused(InstrumentException e, String fallbackField) {
        String field = formField(e.field());
        binding.rejectValue(field == null ? fallbackField : field, REFUSED, e.getMessage());
    }

    private String formField(String serviceField) {
        if (serviceField == null || !serviceField.startsWith("bands[")) {
            return serviceField;
        }
        int index = Integer.parseInt(serviceField.substring("bands[".length(), serviceField.indexOf(']')));
        boolean upTo = serviceField.endsWith(".upTo");
        if (index < segmentRows.size()) {
            int row = segmentRows.get(index);
            return "band" + row + (upTo ? "UpTo" : "U");
        }
        // The main U: its upper end is the range maximum, so an error about it concerns the last segment.
        if (upTo && !segmentRows.isEmpty()) {
            return "band" + segmentRows.get(segmentRows.size() - 1) + "UpTo";
        }
        return "expandedUncertainty";
    }

    private static boolean blank(String s) {
        return s == null || s.isBlank();
    }
}
