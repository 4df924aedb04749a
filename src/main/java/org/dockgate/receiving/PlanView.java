package org.dockgate.receiving;

import org.dockgate.core.sampling.Aql;
import org.dockgate.core.sampling.CodeLetter;
import org.dockgate.core.sampling.InspectionLevel;
import org.dockgate.core.sampling.SamplingPlan;
import org.dockgate.core.sampling.Scheme;
import org.dockgate.core.sampling.Severity;

/** The sampling plan fixed on a lot at receipt (ISO 2859-1:1999 single sampling). */
public record PlanView(CodeLetter codeLetter, CodeLetter planCodeLetter, int sampleSize, int acceptNumber,
                       int rejectNumber, Severity severity, boolean fullInspection, Aql aql, InspectionLevel level,
                       Scheme scheme) {

    /** The core plan, for disposition and switching. */
    public SamplingPlan plan() {
        return new SamplingPlan(codeLetter, planCodeLetter, sampleSize, acceptNumber, rejectNumber, fullInspection,
                severity, aql, scheme);
    }
}
