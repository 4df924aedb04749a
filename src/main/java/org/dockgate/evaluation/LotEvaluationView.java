package org.dockgate.evaluation;

import java.util.List;
import java.util.Optional;
import org.dockgate.procedures.ApprovedProcedure;
import org.dockgate.receiving.LotView;

/**
 * A lot's evaluation: every sampled unit, how many are nonconforming under the procedure's counting of
 * conditional verdicts, and the result Ac/Re give once the sample is complete.
 */
public record LotEvaluationView(LotView lot, ApprovedProcedure procedure, List<UnitEvaluationView> units,
                                boolean complete, int nonconforming, Optional<Boolean> wouldAccept,
                                Optional<NonconformanceReport> nonconformance) {
}
