package org.dockgate.core.spc;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * A p-chart (fraction nonconforming) with variable subgroup sizes: centre line p̄ = Σx_i/Σn_i (the pooled
 * estimate, not the mean of the p_i), and per subgroup 3-sigma limits p̄ ± 3√(p̄(1 − p̄)/n_i) ("stepped
 * limits"), the lower one floored at 0 and the upper one capped at 1 (NIST/SEMATECH e-Handbook 6.3.3.2;
 * Montgomery, Introduction to Statistical Quality Control, ch. 6).
 *
 * @param centerLine p̄
 * @param points     one point per subgroup, in the order given
 */
public record PChart(double centerLine, List<PChartPoint> points) {

    /** Copies the points. */
    public PChart {
        points = List.copyOf(points);
    }

    /** One inspected subgroup, e.g. one lot. */
    public record Subgroup(String label, long inspected, long rejected) {

        /**
         * @throws IllegalArgumentException when the label is null, n &lt; 1, x &lt; 0 or x &gt; n
         */
        public Subgroup {
            Objects.requireNonNull(label, "label");
            if (inspected < 1) {
                throw new IllegalArgumentException("subgroup '" + label + "': inspected must be at least 1, was "
                        + inspected);
            }
            if (rejected < 0 || rejected > inspected) {
                throw new IllegalArgumentException("subgroup '" + label + "': rejected must lie between 0 and "
                        + "inspected (" + inspected + "), was " + rejected);
            }
        }
    }

    /**
     * One plotted subgroup.
     *
     * @param outOfControl rule 1: the proportion lies strictly beyond a control limit. A point on a limit is in
     *                     control — with the lower limit floored at 0, counting "on the limit" would flag every
     *                     subgroup without rejects.
     */
    public record PChartPoint(String label, long inspected, long rejected, double proportion,
            double lowerControlLimit, double upperControlLimit, boolean outOfControl) {
    }

    /**
     * Builds the chart, see the class comment. When no subgroup has a reject (p̄ = 0) or every unit was rejected
     * (p̄ = 1), σ = 0 and both limits equal p̄: no point is beyond them, and the chart says nothing until the
     * proportion changes. A single subgroup gives a chart against its own limits; it is allowed but tells little.
     *
     * @param subgroups at least one
     * @return the chart
     * @throws IllegalArgumentException when there are no subgroups, or their total count overflows a long
     */
    public static PChart of(List<Subgroup> subgroups) {
        if (subgroups == null || subgroups.isEmpty()) {
            throw new IllegalArgumentException("a p-chart needs at least one subgroup");
        }
        long totalInspected = 0;
        long totalRejected = 0;
        for (Subgroup subgroup : subgroups) {
            if (totalInspected > Long.MAX_VALUE - subgroup.inspected()) {
                throw new IllegalArgumentException("the subgroups' total inspected count is too large");
            }
            totalInspected += subgroup.inspected();
            totalRejected += subgroup.rejected(); // rejected ≤ inspected, so this cannot overflow first
        }
        double centre = (double) totalRejected / totalInspected;
        double spread = centre * (1.0 - centre);
        List<PChartPoint> points = new ArrayList<>(subgroups.size());
        for (Subgroup subgroup : subgroups) {
            double proportion = (double) subgroup.rejected() / subgroup.inspected();
            double threeSigma = 3.0 * Math.sqrt(spread / subgroup.inspected());
            double lcl = Math.max(0.0, centre - threeSigma);
            double ucl = Math.min(1.0, centre + threeSigma);
            points.add(new PChartPoint(subgroup.label(), subgroup.inspected(), subgroup.rejected(), proportion,
                    lcl, ucl, proportion > ucl || proportion < lcl));
        }
        return new PChart(centre, points);
    }
}
