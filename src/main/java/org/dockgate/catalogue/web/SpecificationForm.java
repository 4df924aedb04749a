package org.dockgate.catalogue.web;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.dockgate.catalogue.OutputKind;
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

/**
 * The datasheet form: every field as typed, so a non-number comes back with its own message instead of
 * a binding error, and nothing typed is lost when the page is shown again.
 */
record SpecificationForm(String partNumber, String name, String kind, String measurand, String outputKind,
                         String excitation, List<String> suppliers, String inputUnit, String rangeMin,
                         String rangeMax, String outputUnit, String sensitivityNominal, String sensitivityUnit,
                         String sensitivityTolerance, String sensitivityToleranceMode, String offsetNominal,
                         String offsetTolerance, String offsetUnit, String accuracyPctFso, String nonlinearityPctFso,
                         String nonlinearityReference, String hysteresisPctFso, String repeatabilityPctFso,
                         String noiseLimit, String noiseUnit, String noiseReferred, String resolution,
                         String bandwidthMinus3dBHz, String flatnessPercent, String flatnessUpToHz, String referenceHz,
                         String rtdR0Ohm, String rtdClass, String rtdConstruction, String reason,
                         Integer expectedRevision) {

    static SpecificationForm empty() {
        return new SpecificationForm("", "", "PRESSURE_TRANSDUCER", "", "VOLTAGE", "", List.of(), "", "", "", "", "", "",
                "", "PERCENT", "", "", "", "", "", "BEST_FIT", "", "", "", "", "OUTPUT", "", "", "", "", "", "", "",
                "WIRE_WOUND", "", null);
    }

    static SpecificationForm of(String partNumber, String name, String measurand, OutputKind outputKind,
                                String excitation, List<String> suppliers, SensorSpecification s, int revision) {
        return new SpecificationForm(partNumber, name, s.kind().name(), measurand, outputKind.name(), excitation, suppliers,
                s.inputUnit(), num(s.rangeMin()), num(s.rangeMax()), s.outputUnit(),
                s.sensitivity() == null ? "" : num(s.sensitivity().nominal()),
                s.sensitivity() == null ? "" : s.sensitivity().unit(),
                s.sensitivity() == null ? "" : num(s.sensitivity().tolerance()),
                s.sensitivity() == null ? "PERCENT" : s.sensitivity().mode().name(),
                s.zeroOffset() == null ? "" : num(s.zeroOffset().nominal()),
                s.zeroOffset() == null ? "" : num(s.zeroOffset().tolerance()),
                s.zeroOffset() == null ? "" : s.zeroOffset().unit(), num(s.accuracyPctFso()), num(s.nonlinearityPctFso()),
                s.nonlinearityReference() == null ? "BEST_FIT" : s.nonlinearityReference().name(),
                num(s.hysteresisPctFso()), num(s.repeatabilityPctFso()),
                s.noiseFloor() == null ? "" : num(s.noiseFloor().limit()),
                s.noiseFloor() == null ? "" : s.noiseFloor().unit(),
                s.noiseFloor() == null ? "OUTPUT" : s.noiseFloor().referred().name(), num(s.resolution()),
                s.bandwidth() == null ? "" : num(s.bandwidth().minus3dBHz()),
                s.bandwidth() == null ? "" : num(s.bandwidth().flatnessPercent()),
                s.bandwidth() == null ? "" : num(s.bandwidth().upToHz()),
                s.bandwidth() == null ? "" : num(s.bandwidth().referenceHz()),
                s.rtd() == null ? "" : num(s.rtd().r0Ohm()), s.rtd() == null ? "" : s.rtd().toleranceClass(),
                s.rtd() == null ? "WIRE_WOUND" : s.rtd().construction().name(), "", revision);
    }

    /** Field errors found while reading the form; empty when the form could be read. */
    static final class Problems {
        final Map<String, String> byField = new LinkedHashMap<>();

        boolean any() {
            return !byField.isEmpty();
        }
    }

    /** Reads the numbers and choices; the core then checks the specification as a whole. */
    SensorSpecification toSpecification(Problems problems) {
        SensorKind k = choice(SensorKind.class, kind, "kind", problems);
        Double min = number(rangeMin, "rangeMin", true, problems);
        Double max = number(rangeMax, "rangeMax", true, problems);
        required(inputUnit, "inputUnit", problems);
        required(outputUnit, "outputUnit", problems);
        Sensitivity sensitivity = null;
        Double sNom = number(sensitivityNominal, "sensitivityNominal", false, problems);
        if (sNom != null) {
            Double tol = number(sensitivityTolerance, "sensitivityTolerance", true, problems);
            if (blank(sensitivityUnit)) {
                problems.byField.putIfAbsent("sensitivityUnit",
                        "Enter the unit of the sensitivity (e.g. mV/V), or clear the nominal sensitivity.");
            }
            ToleranceMode mode = choice(ToleranceMode.class, sensitivityToleranceMode, "sensitivityToleranceMode", problems);
            if (tol != null && mode != null && !blank(sensitivityUnit)) {
                sensitivity = new Sensitivity(sNom, sensitivityUnit.trim(), tol, mode);
            }
        }
        ZeroOffset offset = null;
        Double oNom = number(offsetNominal, "offsetNominal", false, problems);
        if (oNom != null) {
            Double tol = number(offsetTolerance, "offsetTolerance", true, problems);
            String unit = blank(offsetUnit) ? outputUnit : offsetUnit.trim();
            if (tol != null) {
                offset = new ZeroOffset(oNom, tol, unit);
            }
        }
        NoiseFloor noise = null;
        Double nLimit = number(noiseLimit, "noiseLimit", false, problems);
        if (nLimit != null) {
            required(noiseUnit, "noiseUnit", problems);
            Referred referred = choice(Referred.class, noiseReferred, "noiseReferred", problems);
            if (!blank(noiseUnit) && referred != null) {
                noise = new NoiseFloor(nLimit, noiseUnit.trim(), referred);
            }
        }
        Double minus3 = number(bandwidthMinus3dBHz, "bandwidthMinus3dBHz", false, problems);
        Double flat = number(flatnessPercent, "flatnessPercent", false, problems);
        Double upTo = number(flatnessUpToHz, "flatnessUpToHz", false, problems);
        Double ref = number(referenceHz, "referenceHz", false, problems);
        Bandwidth bandwidth = minus3 == null && flat == null && upTo == null ? null : new Bandwidth(minus3, flat, upTo, ref);
        RtdClass rtd = null;
        Double r0 = number(rtdR0Ohm, "rtdR0Ohm", false, problems);
        if (r0 != null) {
            required(rtdClass, "rtdClass", problems);
            // The construction sets each class's validity range (IEC 60751:2008 Table 3); the form offers both.
            RtdConstruction construction = choice(RtdConstruction.class, rtdConstruction, "rtdConstruction", problems);
            rtd = blank(rtdClass) || construction == null ? null
                    : new RtdClass(r0, rtdClass.trim().toUpperCase(Locale.ROOT), construction);
        }
        Double accuracy = number(accuracyPctFso, "accuracyPctFso", false, problems);
        Double nonlinearity = number(nonlinearityPctFso, "nonlinearityPctFso", false, problems);
        Double hysteresis = number(hysteresisPctFso, "hysteresisPctFso", false, problems);
        Double repeatability = number(repeatabilityPctFso, "repeatabilityPctFso", false, problems);
        Double res = number(resolution, "resolution", false, problems);
        NonlinearityReference nlRef = nonlinearity == null ? null
                : choice(NonlinearityReference.class, nonlinearityReference, "nonlinearityReference", problems);
        if (problems.any() || k == null) {
            return null;
        }
        try {
            return new SensorSpecification(k, inputUnit.trim(), min, max, outputUnit.trim(), sensitivity, offset, accuracy,
                    nonlinearity, nlRef, hysteresis, repeatability, noise, res, bandwidth, rtd);
        } catch (IllegalArgumentException e) {
            problems.byField.put("specification", e.getMessage());
            return null;
        }
    }

    OutputKind outputKindValue(Problems problems) {
        return choice(OutputKind.class, outputKind, "outputKind", problems);
    }

    private static boolean blank(String s) {
        return s == null || s.isBlank();
    }

    private static void required(String value, String field, Problems problems) {
        if (blank(value)) {
            problems.byField.putIfAbsent(field, "Required.");
        }
    }

    private static Double number(String text, String field, boolean required, Problems problems) {
        if (blank(text)) {
            if (required) {
                problems.byField.putIfAbsent(field, "Required.");
            }
            return null;
        }
        try {
            double v = Double.parseDouble(text.trim().replace(',', '.'));
            if (!Double.isFinite(v)) {
                problems.byField.put(field, "'" + text + "' is not a finite number.");
                return null;
            }
            return v;
        } catch (NumberFormatException e) {
            problems.byField.put(field, "'" + text + "' is not a number.");
            return null;
        }
    }

    private static <E extends Enum<E>> E choice(Class<E> type, String text, String field, Problems problems) {
        try {
            return Enum.valueOf(type, text == null ? "" : text.trim());
        } catch (IllegalArgumentException e) {
            problems.byField.put(field, "Choose one of the offered values.");
            return null;
        }
    }

    private static String num(Double value) {
        if (value == null) {
            return "";
        }
        return value == Math.rint(value) && Math.abs(value) < 1e15 ? String.valueOf(value.longValue())
                : String.valueOf(value);
    }

    List<String> supplierCodes() {
        return suppliers == null ? List.of() : new ArrayList<>(suppliers);
    }
}
