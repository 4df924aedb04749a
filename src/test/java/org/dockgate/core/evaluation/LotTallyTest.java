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

    @Test
    void theSameUnitResultsGiveADifferentLotDecisionUnderTheTwoSettings() {
        // ISO 2859-1:1999 Table 2-A, code letter J, AQL 1.0: n 80, Ac 2, Re 3; clause 11.2: accept when d <= Ac.
        var plan = org.dockgate.core.sampling.SingleSamplingPlans.plan(1000, org.dockgate.core.sampling.Aql.AQL_1_0,
                org.dockgate.core.sampling.InspectionLevel.II, org.dockgate.core.sampling.Severity.NORMAL);
        assertThat(plan.acceptNumber()).isEqualTo(2);
        List<Verdict> units = new java.util.ArrayList<>(java.util.Collections.nCopies(77, Verdict.PASS));
        units.addAll(List.of(Verdict.FAIL, Verdict.CONDITIONAL_PASS, Verdict.CONDITIONAL_PASS));
        int byDefault = LotTally.count(units, ConditionalCounting.DEFAULT);
        int strict = LotTally.count(units, ConditionalCounting.STRICT);
        assertThat(byDefault).isEqualTo(1);
        assertThat(strict).isEqualTo(3);
        assertThat(org.dockgate.core.sampling.SingleSamplingPlans.disposition(plan, byDefault).accepted()).isTrue();
        assertThat(org.dockgate.core.sampling.SingleSamplingPlans.disposition(plan, strict).accepted()).isFalse();
    }

    @Test
    void aSettingIsStoredByNameAndStatedInWords() {
        for (ConditionalCounting c : List.of(ConditionalCounting.DEFAULT, ConditionalCounting.STRICT,
                ConditionalCounting.LENIENT, new ConditionalCounting(true, false))) {
            assertThat(ConditionalCounting.parse(c.key())).isEqualTo(c);
        }
        // Procedures approved before the setting existed have none: they counted as DEFAULT.
        assertThat(ConditionalCounting.parse(null)).isEqualTo(ConditionalCounting.DEFAULT);
        assertThat(ConditionalCounting.parse(" strict ")).isEqualTo(ConditionalCounting.STRICT);
        assertThatThrownBy(() -> ConditionalCounting.parse("SOMETIMES")).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("DEFAULT, STRICT or LENIENT");
        assertThat(ConditionalCounting.DEFAULT.inWords()).isEqualTo("Counting toward Ac/Re: a FAIL counts as"
                + " nonconforming, a CONDITIONAL FAIL counts, a CONDITIONAL PASS does not count; a PASS never counts.");
        assertThat(ConditionalCounting.STRICT.inWords()).contains("a CONDITIONAL PASS counts;");
    }
}
