package org.dockgate.core.evaluation;

import java.util.Objects;
import org.dockgate.core.decision.ExpandedUncertainty;
import org.dockgate.core.decision.Tolerance;
import org.dockgate.core.decision.Verdict;
import org.dockgate.core.series.Direction;
import org.dockgate.core.uncertainty.UncertaintyBudget;

/**
 * The judgement of one reading for a metric judged point by point (accuracy, an RTD's class tolerance):
 * the reading's error, the tolerance at that point, its own uncertainty and verdict.
 *
 * @param input                    the set point (input units)
 * @param direction                the traverse direction
 * @param cycle                    the cycle
 * @param error                    the reading's error in the metric's unit
 * @param tolerance                the tolerance at this point
 * @param uncertainty              U and k of the error
 * @param budget                   the error's uncertainty budget
 * @param verdict                  the verdict under the procedure's decision rule
 * @param probabilityOfConformance p_c (JCGM 106:2012)
 */
public record PointCheck(double input, Direction direction, int cycle, double error, Tolerance tolerance,
        ExpandedUncertainty uncertainty, UncertaintyBudget budget, Verdict verdict,
        double probabilityOfConformance) {

    /** Checks the fields are present. */
    public PointCheck {
        Objects.requireNonNull(direction, "direction");
        Objects.requireNonNull(tolerance, "tolerance");
        Objects.requireNonNull(uncertainty, "uncertainty");
        Objects.requireNonNull(budget, "budget");
        Objects.requireNonNull(verdict, "verdict");
    }
}
