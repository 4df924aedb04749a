/**
 * Conformity decisions with measurement uncertainty: decision rules after ILAC G8:09/2019 (simple acceptance,
 * guard-banded binary and non-binary statements) and JCGM 106:2012 (conformance probability), acceptance limits,
 * and the test uncertainty ratio. Tolerance and acceptance limits are inclusive.
 *
 * <p>Entry point: {@link org.dockgate.core.decision.DecisionPolicy}, e.g.
 * {@code DecisionPolicy.guardBanded(1.0).decide(y, Tolerance.between(-1, 1), ExpandedUncertainty.of(0.25, 2))}.
 */
package org.dockgate.core.decision;
