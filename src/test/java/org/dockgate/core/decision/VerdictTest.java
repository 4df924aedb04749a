package org.dockgate.core.decision;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;

class VerdictTest {

    @Test
    void worstFollowsTheSeverityOrder() {
        // order PASS < CONDITIONAL_PASS < CONDITIONAL_FAIL < FAIL (ILAC G8:09/2019 §4.2.3 labels)
        assertEquals(Verdict.PASS, Verdict.worst(Verdict.PASS));
        assertEquals(Verdict.CONDITIONAL_PASS, Verdict.worst(Verdict.PASS, Verdict.CONDITIONAL_PASS, Verdict.PASS));
        assertEquals(Verdict.CONDITIONAL_FAIL, Verdict.worst(Verdict.CONDITIONAL_FAIL, Verdict.CONDITIONAL_PASS));
        assertEquals(Verdict.FAIL, Verdict.worst(List.of(Verdict.PASS, Verdict.FAIL, Verdict.CONDITIONAL_FAIL)));
        assertEquals(Verdict.FAIL, Verdict.CONDITIONAL_PASS.orWorse(Verdict.FAIL));
    }

    @Test
    void worstOfNothingIsAnError() {
        assertThrows(IllegalArgumentException.class, () -> Verdict.worst(List.of()));
    }

    @Test
    void conformingMeansInsideTheTolerance() {
        assertTrue(Verdict.PASS.isConforming());
        assertTrue(Verdict.CONDITIONAL_PASS.isConforming());
        assertFalse(Verdict.CONDITIONAL_FAIL.isConforming());
        assertFalse(Verdict.FAIL.isConforming());
    }
}
