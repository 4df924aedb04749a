package org.dockgate.core.procedure;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.dockgate.core.rtd.ToleranceClass;

/**
 * The preparation and bench practice a procedure prints for its sensor kind, in the order the technician
 * meets them, with the kind's cautions (pressure, heat, electrical excitation). Each item names its source:
 * a standard only where the practice is the standard's own, otherwise {@link #COMMON_PRACTICE}. Values that
 * depend on the sensor (excitation, RTD measuring current, noise bandwidth, stability threshold) come from
 * the specification and the model's stated excitation where present.
 */
public final class KindPractice {

    /** The source of a trade habit that no one standard prescribes. */
    public static final String COMMON_PRACTICE = "common practice";

    /** Printed with every kind's practice and cautions. */
    public static final String DEFERRAL = "These preparations and cautions defer to local codes and the lab's own"
            + " safety rules: where they differ, the local code or lab rule governs.";

    /** One preparation or practice item, or one caution. */
    public record Item(String title, String text, String source) {
        /** "Title: text (source)", as printed. */
        public String inWords() {
            return title + ": " + text + " (" + source + ")";
        }
    }

    /** A kind's preparation items in order, and its cautions. */
    public record Practice(SensorKind kind, List<Item> items, List<Item> cautions) {
        public Practice {
            items = List.copyOf(items);
            cautions = List.copyOf(cautions);
        }
    }

    private KindPractice() {
    }

    /**
     * The practice for a specification.
     *
     * @param spec       the specification the procedure is derived from
     * @param excitation the model's stated excitation (e.g. "10 V DC", "1 mA measuring current"), or null/blank
     */
    public static Practice of(SensorSpecification spec, String excitation) {
        String stated = excitation == null || excitation.isBlank() ? null : excitation.strip();
        SensorKind kind = spec.kind();
        List<Item> items = new ArrayList<>();
        items.add(warmUp(kind));
        switch (kind) {
            case PRESSURE_TRANSDUCER -> {
                items.add(bridgeExcitation(stated));
                items.add(new Item("Mounting and orientation", "Mount the transducer in its orientation of use, port"
                        + " as in service; tighten on the hex to the fitting's rated torque, never on the housing.",
                        COMMON_PRACTICE));
                items.add(new Item("Exercise cycles", "Before the first run, exercise the transducer three times"
                        + " from zero to full range (" + num(spec.rangeMax()) + " " + spec.inputUnit() + ") and back,"
                        + " holding about 30 s at full range; then vent and read the zero.", COMMON_PRACTICE));
                items.add(new Item("Head-height correction", "Measure the height h between the pressure standard's"
                        + " reference level and the transducer's reference plane; correct each point by Δp = ρ·g·h"
                        + " (ρ: density of the pressure medium, g: local gravity) and record h.", COMMON_PRACTICE));
            }
            case LOAD_CELL -> {
                items.add(bridgeExcitation(stated));
                items.add(new Item("Alignment", "Seat the cell on its specified base and load buttons with the load"
                        + " axis on the cell's axis; check level and centring, as side loads and bending change the"
                        + " output.", COMMON_PRACTICE));
                items.add(new Item("Exercise cycles", "Before the first run, preload three times to the highest test"
                        + " force (" + num(spec.rangeMax()) + " " + spec.inputUnit() + "), holding about 30 s each,"
                        + " then unload and read the zero.", COMMON_PRACTICE));
            }
            case ACCELEROMETER -> {
                items.add(new Item("Excitation", (stated == null ? "Supply the accelerometer as its datasheet states"
                        : "Supply " + stated + " as the datasheet states")
                        + "; check the bias voltage at the connector lies in the datasheet's range before the first"
                        + " point and record it.", COMMON_PRACTICE));
                items.add(new Item("Stud mounting and torque", "Stud-mount back-to-back on the reference"
                        + " accelerometer, sensitive axis on the shaker axis, on a clean flat face with a thin film of"
                        + " coupling grease, tightened to the datasheet's mounting torque with a torque wrench; clamp"
                        + " the cable to the shaker so it cannot whip.", "ISO 16063-21"));
                double bandwidthHz = spec.bandwidth() != null ? spec.bandwidth().upperHz() : Double.NaN;
                items.add(new Item("Noise isolation", "Measure the noise floor with the shaker off and the"
                        + " accelerometer on an isolated block (isolation pad or foam), away from running machines,"
                        + " with the cable clamped.", COMMON_PRACTICE));
                items.add(new Item("Noise bandwidth", "Read the rms noise over a stated noise bandwidth"
                        + (Double.isFinite(bandwidthHz) ? " of the specified band, up to " + num(bandwidthHz) + " Hz"
                        : " equal to the datasheet's band")
                        + ", with the readout's anti-alias filter set to it; record the bandwidth with the result.",
                        COMMON_PRACTICE));
            }
            case RTD -> rtd(spec, stated, items);
            case THERMOCOUPLE -> {
                items.add(immersion());
                items.add(stability(null));
                items.add(new Item("Reference junction", "Keep the reference junction at 0 °C in an ice point, or"
                        + " record the readout's compensation and its uncertainty.", COMMON_PRACTICE));
            }
            case LIGHT_SENSOR, OTHER -> {
                // Warm-up only: no kind-specific practice is modelled for these.
            }
        }
        List<Item> cautions = new ArrayList<>();
        if (kind == SensorKind.PRESSURE_TRANSDUCER) {
            cautions.add(new Item("Pressure", "Vent before connecting or disconnecting; check fitting ratings"
                    + " against the test pressure and keep the shield in place.", COMMON_PRACTICE));
        }
        if (kind == SensorKind.RTD || kind == SensorKind.THERMOCOUPLE) {
            cautions.add(new Item("Heat", "Baths and dry blocks burn: wear gloves and face protection and let probes"
                    + " cool before handling; never put a wet probe into a hot bath.", COMMON_PRACTICE));
        }
        cautions.add(new Item("Electrical excitation", "Switch the excitation supply off before connecting or"
                + " disconnecting the sensor; set its voltage and current limit before connecting"
                + (stated == null ? "" : " (" + stated + ")")
                + " and never exceed the datasheet's maximum excitation; earth mains-powered instruments.",
                COMMON_PRACTICE));
        return new Practice(kind, items, cautions);
    }

    private static void rtd(SensorSpecification spec, String stated, List<Item> items) {
        double r0 = spec.rtd().r0Ohm();
        ToleranceClass cls = ToleranceClass.parse(spec.rtd().toleranceClass());
        items.add(new Item("Ice-point check", "Read R0 at the ice point (0 °C: crushed ice from distilled water,"
                + " topped with water) before and after the run; it must lie within the class " + cls.name()
                + " tolerance of ±" + num(cls.toleranceC(0)) + " °C at 0 °C, and a change between the two shows"
                + " drift or damage.", "IEC 60751"));
        items.add(immersion());
        items.add(stability(cls.toleranceC(0)));
        items.add(new Item("4-wire connection", "Connect the probe 4-wire (separate current and sense leads) so the"
                + " lead resistance does not enter the reading; a 2-wire lead resistance of 0.4 Ω reads about"
                + " 1 °C high on a Pt100.", COMMON_PRACTICE));
        // 1 mA keeps a Pt100's self-heating small; a Pt1000 gives the same signal at a tenth of the current.
        String current = stated != null ? stated
                : (r0 > 200 ? "0.1 mA" : "1 mA") + " measuring current for a Pt" + num(r0);
        items.add(new Item("Measuring current", "Read with " + current + ", from the resistance bridge or"
                + " multimeter, and keep it the same at every point.", stated != null ? "specification"
                : COMMON_PRACTICE));
        items.add(new Item("Self-heating check", "At the ice point, read at the measuring current and at √2 times"
                + " it (twice the power); the difference is the self-heating error at the measuring current and"
                + " must stay below a tenth of the tolerance at 0 °C.", COMMON_PRACTICE));
    }

    private static Item warmUp(SensorKind kind) {
        String what = switch (kind) {
            case RTD, THERMOCOUPLE -> "the readout and the dry block or bath";
            default -> "the sensor and readout, powered,";
        };
        return new Item("Warm-up", "Let " + what + " warm up for the datasheet's warm-up time, at least 30 min"
                + " where none is stated, in the lab's conditions before the first reading.", COMMON_PRACTICE);
    }

    private static Item bridgeExcitation(String stated) {
        return new Item("Excitation", "Set the excitation to " + (stated == null ? "the datasheet's value" : stated)
                + "; measure it at the sensor's connector with the readout before the first point and after the"
                + " last, and record both (a ratiometric readout reads mV/V and cancels its error).", COMMON_PRACTICE);
    }

    private static Item immersion() {
        return new Item("Immersion depth", "Immerse the probe at least 15 sheath diameters plus the element length;"
                + " confirm by withdrawing 2 cm: the reading must not change by more than a tenth of the planned"
                + " uncertainty.", COMMON_PRACTICE);
    }

    private static Item stability(Double toleranceAtZeroC) {
        String limit = toleranceAtZeroC == null ? "a tenth of the planned uncertainty"
                : num(toleranceAtZeroC / 10) + " °C (a tenth of the class tolerance at 0 °C)";
        return new Item("Stability criterion", "Instead of a fixed wait, read at each point once successive readings"
                + " over 60 s change by less than " + limit + "; record the time taken.", COMMON_PRACTICE);
    }

    private static String num(double v) {
        return java.math.BigDecimal.valueOf(v).round(new java.math.MathContext(4)).stripTrailingZeros()
                .toPlainString().toLowerCase(Locale.ROOT);
    }
}
