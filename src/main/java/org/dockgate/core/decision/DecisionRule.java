package org.dockgate.core.decision;

/**
 * How a measured value and its expanded uncertainty U become a verdict (ISO/IEC 17025:2017 7.8.6.1 requires the
 * rule to be documented). The parameters r and α are held by {@link DecisionPolicy}.
 */
public enum DecisionRule {

    /**
     * Binary statement for simple acceptance, guard band w = 0 (ILAC G8:09/2019 §4.2.1): PASS when
     * T_L ≤ y ≤ T_U, else FAIL. The specific false-accept risk at a limit can reach 50 %.
     */
    SIMPLE_ACCEPTANCE,

    /**
     * Binary statement with guard band w = r·U, r ≥ 0, default 1 (ILAC G8:09/2019 §4.2.2): PASS when
     * T_L + w ≤ y ≤ T_U − w, else FAIL. With r = 1, k = 2 and a normal PDF the specific false-accept risk at an
     * acceptance limit is 1 − Φ(2) ≈ 2.3 %.
     */
    GUARD_BANDED,

    /**
     * Non-binary statement with guard band w = U (ILAC G8:09/2019 §4.2.3): PASS inside T_L + U … T_U − U;
     * CONDITIONAL_PASS inside the tolerance but within U of a limit; CONDITIONAL_FAIL outside the tolerance by
     * no more than U; FAIL beyond. Each boundary belongs to the better zone.
     */
    NON_BINARY,

    /**
     * Binary statement from the conformance probability (JCGM 106:2012, normal PDF with u = U/k): PASS when
     * p_c = Φ((T_U − y)/u) − Φ((T_L − y)/u) ≥ 1 − α, α the largest specific false-accept risk accepted
     * (default 0.025). The acceptance limits are the values of y where p_c = 1 − α.
     */
    RISK_BASED
}
