package org.dockgate.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import org.dockgate.core.procedure.ProcedureProposal;
import org.dockgate.core.series.Direction;

/**
 * What one approved procedure revision expects at the bench from each sampled unit, in the order the
 * technician works: for each cycle, the static points UP in the listed order, then DOWN in reverse (the
 * usual ascending-then-descending run for hysteresis, common practice); then the sweep frequencies; then
 * the noise samples (which come from a data-acquisition file rather than the keyboard).
 *
 * @param procedureRevisionId the procedure revision
 * @param procedureLabel      e.g. "QP-250 procedure rev 2"
 * @param inputUnit           the unit of static set points
 * @param outputUnit          the unit every value is stored in
 * @param quantity            what the reference instruments must measure or generate (e.g. "pressure"); null when none
 * @param rangeMin            the lowest static point (in the input unit)
 * @param rangeMax            the highest static point
 * @param suggestedInstrument the instrument the procedure names for the static test, if any
 * @param keyed               the static and sweep readings, in order (entered by keyboard or file)
 * @param noiseSamples        how many noise samples (slots after the keyed ones), 0 when there is no noise capture
 * @param appliedWindow       how far (±, input unit) a static reading's applied value may lie from its set point
 */
public record BenchPlan(long procedureRevisionId, String procedureLabel, String inputUnit, String outputUnit,
                        String quantity, double rangeMin, double rangeMax, String suggestedInstrument,
                        List<ExpectedReading> keyed, int noiseSamples, List<Double> staticPoints,
                        List<Direction> directions, int cycles, List<Double> frequenciesHz, double appliedWindow) {

    /**
     * Points closer than this fraction of the static span (or of the frequency) to a procedure point are
     * that point: 29.0075 psi written for 2 bar is 1.99999 bar. Test points lie at least several percent
     * of the span apart, so this never picks the wrong one.
     */
    static final double POINT_TOLERANCE = 1e-4;

    public BenchPlan {
        keyed = List.copyOf(keyed);
        staticPoints = List.copyOf(staticPoints);
        directions = List.copyOf(directions);
        frequenciesHz = List.copyOf(frequenciesHz);
    }

    /**
     * The plan of a procedure's content.
     *
     * @param procedureRevisionId the revision
     * @param label               its label
     * @param content             the approved content
     * @param outputUnit          the specification's output unit
     * @param quantity            the input quantity for instruments, or null
     * @param appliedWindow       the window for applied values (± input unit), see
     *                            {@link ProcedureProposal.StaticCalibration#appliedWindowFor}
     * @return the plan
     */
    public static BenchPlan of(long procedureRevisionId, String label, ProcedureProposal content, String outputUnit,
                               String quantity, double appliedWindow) {
        List<ExpectedReading> keyed = new ArrayList<>();
        ProcedureProposal.StaticCalibration sc = content.staticCalibration();
        List<Double> points = sc == null ? List.of() : sc.pointsInput();
        List<Direction> directions = sc == null ? List.of() : sc.directions();
        int cycles = sc == null ? 0 : sc.cycles();
        String inputUnit = sc == null ? outputUnit : sc.inputUnit();
        for (int c = 1; c <= cycles; c++) {
            for (Direction d : directions) {
                for (int i = 0; i < points.size(); i++) {
                    double p = d == Direction.DOWN ? points.get(points.size() - 1 - i) : points.get(i);
                    keyed.add(new ExpectedReading(keyed.size(), ReadingTest.STATIC, p, inputUnit, Optional.of(d),
                            OptionalInt.of(c)));
                }
            }
        }
        List<Double> frequencies = content.frequencySweep() == null ? List.of() : content.frequencySweep().frequenciesHz();
        for (double f : frequencies) {
            keyed.add(new ExpectedReading(keyed.size(), ReadingTest.SWEEP, f, "Hz", Optional.empty(), OptionalInt.empty()));
        }
        int noise = content.noiseCapture() == null ? 0 : content.noiseCapture().samples();
        double min = points.stream().mapToDouble(Double::doubleValue).min().orElse(0);
        double max = points.stream().mapToDouble(Double::doubleValue).max().orElse(0);
        return new BenchPlan(procedureRevisionId, label, inputUnit, outputUnit, quantity, min, max,
                sc == null ? null : sc.referenceInstrument(), keyed, noise, points, directions, cycles, frequencies,
                appliedWindow);
    }

    /** @return every reading expected from one unit: the keyed ones and the noise samples */
    public int readingsPerUnit() {
        return keyed.size() + noiseSamples;
    }

    /** @return the expected reading at a slot (noise samples are made on demand) */
    public ExpectedReading expected(int slot) {
        if (slot < keyed.size()) {
            return keyed.get(slot);
        }
        int index = slot - keyed.size();
        return new ExpectedReading(slot, ReadingTest.NOISE, index, "", Optional.empty(), OptionalInt.empty());
    }

    /**
     * The slot of a reading, with its point as the procedure states it.
     *
     * @param test      the test
     * @param point     the point as given
     * @param direction STATIC only
     * @param cycle     STATIC only
     * @return the expected reading it fills
     * @throws IllegalArgumentException when the procedure expects no such reading, naming what it does expect
     */
    public ExpectedReading slotOf(ReadingTest test, double point, Direction direction, Integer cycle) {
        if (test == null) {
            throw new IllegalArgumentException("Say which test the reading belongs to (STATIC, NOISE or SWEEP).");
        }
        if (!Double.isFinite(point)) {
            throw new IllegalArgumentException("The point must be a finite number.");
        }
        switch (test) {
            case STATIC -> {
                if (staticPoints.isEmpty()) {
                    throw new IllegalArgumentException(procedureLabel + " has no static calibration.");
                }
                if (direction == null || !directions.contains(direction)) {
                    throw new IllegalArgumentException("A static reading needs its direction: " + directions + ".");
                }
                if (cycle == null || cycle < 1 || cycle > cycles) {
                    throw new IllegalArgumentException("A static reading needs its cycle, 1 to " + cycles + ".");
                }
                double span = Math.max(rangeMax - rangeMin, Math.max(Math.abs(rangeMax), Math.abs(rangeMin)));
                int n = staticPoints.size();
                for (int i = 0; i < n; i++) {
                    if (Math.abs(staticPoints.get(i) - point) <= POINT_TOLERANCE * span) {
                        int inRun = direction == Direction.DOWN ? n - 1 - i : i;
                        int slot = (cycle - 1) * directions.size() * n + directions.indexOf(direction) * n + inRun;
                        return keyed.get(slot);
                    }
                }
                throw new IllegalArgumentException(Plain.number(point) + " " + inputUnit
                        + " is not a test point of " + procedureLabel + " (" + Plain.list(staticPoints) + " "
                        + inputUnit + ").");
            }
            case SWEEP -> {
                if (direction != null || cycle != null && cycle != 0) {
                    throw new IllegalArgumentException("A sweep reading has no direction and no cycle.");
                }
                int base = staticPoints.size() * directions.size() * cycles;
                for (int i = 0; i < frequenciesHz.size(); i++) {
                    if (Math.abs(frequenciesHz.get(i) - point) <= POINT_TOLERANCE * frequenciesHz.get(i)) {
                        return keyed.get(base + i);
                    }
                }
                throw new IllegalArgumentException(frequenciesHz.isEmpty() ? procedureLabel + " has no frequency sweep."
                        : Plain.number(point) + " Hz is not a sweep frequency of " + procedureLabel + " ("
                                + Plain.list(frequenciesHz) + " Hz).");
            }
            default -> {
                if (direction != null || cycle != null && cycle != 0) {
                    throw new IllegalArgumentException("A noise sample has no direction and no cycle.");
                }
                if (noiseSamples == 0) {
                    throw new IllegalArgumentException(procedureLabel + " has no noise capture.");
                }
                if (point != Math.rint(point) || point < 0 || point >= noiseSamples) {
                    throw new IllegalArgumentException("A noise sample index is a whole number from 0 to "
                            + (noiseSamples - 1) + ", got " + Plain.number(point) + ".");
                }
                return expected(keyed.size() + (int) point);
            }
        }
    }

    /**
     * The value applied at a static set point, checked against the procedure's window.
     *
     * @param slot    the expected reading (its point is the set point)
     * @param applied the applied value in the input unit, null for "at the set point"
     * @return the applied value (the set point when none was given)
     * @throws IllegalArgumentException when it is not finite, is given for a noise or sweep reading, or lies
     *                                  outside the window (the message names both values)
     */
    public double appliedAt(ExpectedReading slot, Double applied) {
        if (applied == null) {
            return slot.point();
        }
        if (slot.test() != ReadingTest.STATIC) {
            throw new IllegalArgumentException("'applied' is for static readings only; a " + slot.test()
                    + " reading has none.");
        }
        if (!Double.isFinite(applied)) {
            throw new IllegalArgumentException("'applied' must be a finite number.");
        }
        // a hair of tolerance so a window of exactly ±0.5 accepts 10.5 at 10 despite binary rounding
        if (Math.abs(applied - slot.point()) > appliedWindow * (1 + 1e-9)) {
            throw new IllegalArgumentException("The applied value " + Plain.number(applied) + " " + inputUnit
                    + " lies more than ±" + Plain.number(appliedWindow) + " " + inputUnit + " from the set point "
                    + Plain.number(slot.point()) + " " + inputUnit + " (" + procedureLabel + "): set the point again"
                    + " and record what the reference then applies.");
        }
        return applied;
    }

    /** "10 bar UP, cycle 1", "160 Hz", "noise sample 12": how people name a slot. */
    public String describe(int slot) {
        ExpectedReading e = expected(slot);
        return switch (e.test()) {
            case STATIC -> Plain.number(e.point()) + " " + e.pointUnit() + " " + e.direction().orElseThrow()
                    + ", cycle " + e.cycle().getAsInt();
            case SWEEP -> Plain.number(e.point()) + " Hz";
            case NOISE -> "noise sample " + (long) e.point();
        };
    }
}
