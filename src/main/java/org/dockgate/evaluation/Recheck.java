package org.dockgate.evaluation;

import java.util.List;

/**
 * The outcome of recomputing a dispositioned lot's unit results from the stored readings and the
 * calibration records in force, compared with the results frozen at disposition.
 *
 * @param identical   true when every frozen figure, verdict and calibration record is reproduced exactly
 * @param differences what differs, one line per serial, metric and field
 */
public record Recheck(long lotId, boolean identical, List<Difference> differences) {

    public Recheck {
        differences = List.copyOf(differences);
    }

    /**
     * One figure that the recomputation does not reproduce.
     *
     * @param serial     the unit
     * @param metric     the metric (e.g. SENSITIVITY), or {@code UNIT} for the unit's verdict, completeness
     *                   and calibration records
     * @param field      what differs: measured, U, k, nuEff, acceptanceLower, acceptanceUpper, pc, verdict,
     *                   budget, tolerance, calibration RI-…, unitVerdict, complete, present
     * @param frozen     the value frozen at disposition (null when there was none)
     * @param recomputed the value recomputed now (null when there is none)
     */
    public record Difference(String serial, String metric, String field, String frozen, String recomputed) {
    }
}
