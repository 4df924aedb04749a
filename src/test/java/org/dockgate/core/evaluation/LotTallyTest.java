package org.dockgate.core.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import org.dockgate.core.decision.Verdict;
import org.junit.jupiter.api.Test;

class LotTallyTest {

    static final List<Verdict> SAMPLE = List.of(Verdict.PASS, Verdict.CONDITIONAL_PASS, Verdict.CONDITIONAL_FAIL,
            Verdict.FAIL, Verdict.PASS, Verdict.CONDITIONAL_FAIL);

    @Test
    void byDefaultConditionalFailCountsAndConditionalPassDoesNot() {
        // common practice: the measured value decides which side of the tolerance the unit is on
        assertThat(LotTally.count(SAMPLE, ConditionalCounting.DEFAULT)).isEqualTo(3);
    }

    @Test
    void aStrictProcedureCountsBothConditionalVerdicts() {
        assertThat(LotTally.count(SAMPLE, ConditionalCounting.STRICT)).isEqualTo(4);
    }

    @Test
    void aLenientProcedureCountsOnlyFails() {
        assertThat(LotTally.count(SAMPLE, ConditionalCounting.LENIENT)).isEqualTo(1);
    }

    @Test
    void passNeverCountsAndFailAlwaysDoes() {
        for (boolean cp : new boolean[] {false, true}) {
            for (boolean cf : new boolean[] {false, true}) {
                ConditionalCounting rule = new ConditionalCounting(cp, cf);
                assertThat(rule.isNonconforming(Verdict.PASS)).isFalse();
                assertThat(rule.isNonconforming(Verdict.FAIL)).isTrue();
            }
        }
        assertThat(LotTally.count(List.of(), ConditionalCounting.DEFAULT)).isZero();
    }

    @Test
    void malformedInputIsRefused() {
        assertThatThrownBy(() -> LotTally.count(java.util.Arrays.asList(Verdict.PASS, null), ConditionalCounting.DEFAULT))
                .isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> LotTally.count(SAMPLE, null)).isInstanceOf(IllegalArgumentException.class);
    }
}
