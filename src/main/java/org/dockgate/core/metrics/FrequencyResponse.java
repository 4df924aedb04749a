package org.dockgate.core.metrics;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.OptionalDouble;
import org.dockgate.core.UnevaluableException;

/**
 * Bandwidth and flatness of a measured amplitude response.
 *
 * <p>Levels are L(f) = 20·log₁₀(A(f) / A_ref) dB relative to the reference amplitude A_ref.
 * Between measured points the level is interpolated linearly in dB against log₁₀ f (a power law
 * between neighbours, the straight line of a Bode plot).
 * <ul>
 *   <li><b>reference</b>: the amplitude at the given reference frequency (ISO 16063-21 reports
 *       sensitivity at a reference frequency such as 160 Hz), interpolated as above when the
 *       reference frequency falls between points; without one, the lowest measured frequency;</li>
 *   <li><b>bandwidth</b>: the first frequency above the reference where the level falls to
 *       20·log₁₀(1/√2) = −3.0103 dB (|H|/|H_ref| = 1/√2; Doebelin, <i>Measurement Systems</i>,
 *       from memory), interpolated between the two bracketing points;</li>
 *   <li><b>within sweep</b>: false when no point above the reference falls that far (the
 *       bandwidth is then absent: it lies beyond the sweep);</li>
 *   <li><b>flatness</b>: the largest |L(f)| over a stated band, see {@link #flatness(double, double)}.</li>
 * </ul>
 *
 * @param points               the points, ascending by frequency, unmodifiable
 * @param referenceFrequencyHz the reference frequency
 * @param referenceAmplitude   A_ref
 * @param bandwidthHz          the −3.0103 dB frequency; absent when not within the sweep
 * @param withinSweep          whether the level falls to −3.0103 dB within the sweep
 */
public record FrequencyResponse(
        List<FrequencyPoint> points,
        double referenceFrequencyHz,
        double referenceAmplitude,
        OptionalDouble bandwidthHz,
        boolean withinSweep) {

    /** The −3 dB level exactly: 20·log₁₀(1/√2) = −10·log₁₀ 2 = −3.0102999566... dB. */
    public static final double HALF_POWER_LEVEL_DB = -10.0 * Math.log10(2.0);

    /**
     * Copies the points.
     *
     * @throws IllegalArgumentException when the points or the bandwidth optional are null
     */
    public FrequencyResponse {
        if (points == null || bandwidthHz == null) {
            throw new IllegalArgumentException("A frequency response needs its points and a (possibly empty) bandwidth");
        }
        points = List.copyOf(points);
    }

    /**
     * Evaluates a sweep with the lowest frequency as reference.
     *
     * @param points the measured points
     * @return the response
     * @throws IllegalArgumentException as {@link #of(List, OptionalDouble)}
     * @throws UnevaluableException     as {@link #of(List, OptionalDouble)}
     */
    public static FrequencyResponse of(List<FrequencyPoint> points) {
        return of(points, OptionalDouble.empty());
    }

    /**
     * Evaluates a sweep (definitions in the class description).
     *
     * <p>Edge cases: a point exactly at −3.0103 dB is the bandwidth itself; a resonance above the
     * reference does not stop the search (the first fall below the level counts); the reference
     * must lie within the sweep (no extrapolation).
     *
     * @param points               the measured points, at least two, distinct frequencies, any order
     * @param referenceFrequencyHz the reference frequency, if any: finite, greater than 0
     * @return the response
     * @throws IllegalArgumentException when the points are missing or empty, hold a null or a
     *                                  repeated frequency, or the reference frequency is not a
     *                                  finite number greater than 0
     * @throws UnevaluableException     for a single point, or a reference frequency outside the sweep
     */
    public static FrequencyResponse of(List<FrequencyPoint> points, OptionalDouble referenceFrequencyHz) {
        if (points == null || points.isEmpty()) {
            throw new IllegalArgumentException("A frequency response needs points; none were given");
        }
        if (points.stream().anyMatch(p -> p == null)) {
            throw new IllegalArgumentException("A frequency response must not contain empty (null) points");
        }
        if (referenceFrequencyHz == null) {
            throw new IllegalArgumentException("The reference frequency must be given (possibly empty)");
        }
        List<FrequencyPoint> sorted = new ArrayList<>(points);
        sorted.sort(Comparator.comparingDouble(FrequencyPoint::frequencyHz));
        for (int i = 1; i < sorted.size(); i++) {
            if (sorted.get(i).frequencyHz() == sorted.get(i - 1).frequencyHz()) {
                throw new IllegalArgumentException("The frequency " + sorted.get(i).frequencyHz()
                        + " Hz appears twice in the sweep");
            }
        }
        if (sorted.size() < 2) {
            throw new UnevaluableException("A frequency response needs at least two frequencies, got 1");
        }
        double fLow = sorted.get(0).frequencyHz();
        double fHigh = sorted.get(sorted.size() - 1).frequencyHz();
        double fRef = referenceFrequencyHz.orElse(fLow);
        if (!Double.isFinite(fRef) || !(fRef > 0)) {
            throw new IllegalArgumentException("The reference frequency must be a finite number of hertz greater "
                    + "than 0, got " + fRef);
        }
        if (fRef < fLow || fRef > fHigh) {
            throw new UnevaluableException("The reference frequency " + fRef + " Hz lies outside the sweep ("
                    + fLow + " … " + fHigh + " Hz)");
        }
        double aRef = amplitudeAt(sorted, fRef);

        // Walk upward from the reference: (fPrev, lPrev) is the last point at or above the reference.
        double fPrev = fRef;
        double lPrev = 0.0;
        OptionalDouble bandwidth = OptionalDouble.empty();
        for (FrequencyPoint p : sorted) {
            if (p.frequencyHz() <= fRef) {
                continue;
            }
            double level = levelDb(p.amplitude(), aRef);
            if (level <= HALF_POWER_LEVEL_DB) {
                double logF = Math.log10(fPrev)
                        + (HALF_POWER_LEVEL_DB - lPrev) / (level - lPrev)
                        * (Math.log10(p.frequencyHz()) - Math.log10(fPrev));
                // Clamp against rounding so the result stays inside its bracket.
                double f = Math.min(p.frequencyHz(), Math.max(fPrev, Math.pow(10.0, logF)));
                bandwidth = OptionalDouble.of(f);
                break;
            }
            fPrev = p.frequencyHz();
            lPrev = level;
        }
        return new FrequencyResponse(sorted, fRef, aRef, bandwidth, bandwidth.isPresent());
    }

    /**
     * The level relative to the reference at any frequency within the sweep,
     * L(f) = 20·log₁₀(A(f)/A_ref), interpolated linearly in dB against log₁₀ f between points.
     *
     * @param frequencyHz a frequency within the sweep
     * @return the level in dB
     * @throws IllegalArgumentException when the frequency is not finite and greater than 0
     * @throws UnevaluableException     when the frequency lies outside the sweep
     */
    public double levelDbAt(double frequencyHz) {
        if (!Double.isFinite(frequencyHz) || !(frequencyHz > 0)) {
            throw new IllegalArgumentException("A frequency must be a finite number of hertz greater than 0, got "
                    + frequencyHz);
        }
        double fLow = points.get(0).frequencyHz();
        double fHigh = points.get(points.size() - 1).frequencyHz();
        if (frequencyHz < fLow || frequencyHz > fHigh) {
            throw new UnevaluableException("The frequency " + frequencyHz + " Hz lies outside the sweep (" + fLow
                    + " … " + fHigh + " Hz)");
        }
        return levelDb(amplitudeAt(points, frequencyHz), referenceAmplitude);
    }

    /**
     * Flatness over a band: the largest |L(f)| for fLow ≤ f ≤ fHigh, relative to the reference.
     *
     * <p>The measured points inside the band are examined, and so are the band edges (their
     * levels interpolated as in {@link #levelDbAt(double)}): with linear interpolation the
     * extreme over the band is then found exactly.
     *
     * @param fLowHz  lower band edge, within the sweep
     * @param fHighHz upper band edge, within the sweep, not below fLowHz
     * @return the largest deviation and where it occurs
     * @throws IllegalArgumentException when an edge is not a finite number greater than 0 or
     *                                  fHighHz &lt; fLowHz
     * @throws UnevaluableException     when the band extends beyond the sweep
     */
    public Flatness flatness(double fLowHz, double fHighHz) {
        if (!Double.isFinite(fLowHz) || !(fLowHz > 0) || !Double.isFinite(fHighHz) || !(fHighHz > 0)) {
            throw new IllegalArgumentException("Band edges must be finite numbers of hertz greater than 0, got "
                    + fLowHz + " … " + fHighHz);
        }
        if (fHighHz < fLowHz) {
            throw new IllegalArgumentException("The band's upper edge " + fHighHz + " Hz is below its lower edge "
                    + fLowHz + " Hz");
        }
        double worstF = fLowHz;
        double worstL = levelDbAt(fLowHz);
        double upperL = levelDbAt(fHighHz);
        if (Math.abs(upperL) > Math.abs(worstL)) {
            worstF = fHighHz;
            worstL = upperL;
        }
        for (FrequencyPoint p : points) {
            if (p.frequencyHz() > fLowHz && p.frequencyHz() < fHighHz) {
                double l = levelDb(p.amplitude(), referenceAmplitude);
                if (Math.abs(l) > Math.abs(worstL)) {
                    worstF = p.frequencyHz();
                    worstL = l;
                }
            }
        }
        return new Flatness(Math.abs(worstL), worstL, worstF);
    }

    /**
     * The largest deviation from the reference level within a band.
     *
     * @param maxDeviationDb    the largest |L(f)| in dB
     * @param signedDeviationDb that deviation with its sign (positive above the reference)
     * @param atFrequencyHz     where it occurs
     */
    public record Flatness(double maxDeviationDb, double signedDeviationDb, double atFrequencyHz) {
    }

    private static double levelDb(double amplitude, double reference) {
        return 20.0 * Math.log10(amplitude / reference);
    }

    /** Amplitude at f, interpolating log A linearly in log f (linear in dB against log f). */
    private static double amplitudeAt(List<FrequencyPoint> sorted, double f) {
        for (int i = 0; i < sorted.size(); i++) {
            FrequencyPoint p = sorted.get(i);
            if (p.frequencyHz() == f) {
                return p.amplitude();
            }
            if (p.frequencyHz() > f) {
                FrequencyPoint q = sorted.get(i - 1);
                double fraction = (Math.log10(f) - Math.log10(q.frequencyHz()))
                        / (Math.log10(p.frequencyHz()) - Math.log10(q.frequencyHz()));
                return Math.pow(10.0, Math.log10(q.amplitude())
                        + fraction * (Math.log10(p.amplitude()) - Math.log10(q.amplitude())));
            }
        }
        throw new UnevaluableException("The frequency " + f + " Hz lies outside the sweep");
    }
}
