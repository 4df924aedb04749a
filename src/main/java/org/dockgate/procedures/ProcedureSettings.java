package org.dockgate.procedures;

import org.dockgate.core.decision.DecisionPolicy;
import org.dockgate.core.decision.DecisionRule;
import org.dockgate.core.evaluation.ConditionalCounting;
import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.InspectionLevel;

/**
 * The engineer's choices a procedure is derived with, including how conditional verdicts count toward
 * Ac/Re ({@code conditionalCounting}; null means {@link ConditionalCounting#DEFAULT}, what procedures
 * approved before it was a setting used).
 */
public record ProcedureSettings(Aql aql, InspectionLevel level, DecisionRule rule, double guardBandFactor,
                                double maxFalseAcceptRisk, ConditionalCounting conditionalCounting) {

    public ProcedureSettings {
        if (aql == null || level == null || rule == null) {
            throw new IllegalArgumentException("Choose the AQL, the inspection level and the decision rule.");
        }
        policyOf(rule, guardBandFactor, maxFalseAcceptRisk); // validates the numbers
        if (conditionalCounting == null) {
            conditionalCounting = ConditionalCounting.DEFAULT;
        }
    }

    /** With the default counting of conditional results. */
    public ProcedureSettings(Aql aql, InspectionLevel level, DecisionRule rule, double guardBandFactor,
                             double maxFalseAcceptRisk) {
        this(aql, level, rule, guardBandFactor, maxFalseAcceptRisk, ConditionalCounting.DEFAULT);
    }

    public DecisionPolicy policy() {
        return policyOf(rule, guardBandFactor, maxFalseAcceptRisk);
    }

    private static DecisionPolicy policyOf(DecisionRule rule, double guardBandFactor, double maxFalseAcceptRisk) {
        return new DecisionPolicy(rule, guardBandFactor, maxFalseAcceptRisk);
    }

    /** The decision rule in words, as procedures and certificates state it. */
    public String ruleInWords() {
        return switch (rule) {
            case SIMPLE_ACCEPTANCE -> "Simple acceptance (ILAC G8:2019, w = 0): a result passes when the measured value"
                    + " lies within the tolerance; the measurement uncertainty is reported but not deducted.";
            case GUARD_BANDED -> "Guard-banded acceptance (ILAC G8:2019, w = " + trim(guardBandFactor)
                    + " × U): a result passes only when the measured value lies within the tolerance narrowed on each"
                    + " side by the guard band w.";
            case NON_BINARY -> "Non-binary statement (ILAC G8:2019, w = U): pass inside the tolerance narrowed by U;"
                    + " conditional pass within U inside a limit; conditional fail within U outside a limit; fail beyond.";
            case RISK_BASED -> "Risk-based acceptance (JCGM 106:2012): a result passes when the probability that the"
                    + " true value conforms is at least " + trim(100 * (1 - maxFalseAcceptRisk))
                    + " % (false-accept risk at most " + trim(100 * maxFalseAcceptRisk) + " %).";
        };
    }

    private static String trim(double v) {
        return v == Math.rint(v) ? String.valueOf((long) v) : String.valueOf(v);
    }
}
