package org.dockgate.core.uncertainty;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Scale;

/** Properties of the GUM propagation (5.1.2) and the Welch–Satterthwaite formula (G.4.1, Eq. G.2b). */
class UncertaintyBudgetProperties {

    @Provide
    Arbitrary<List<UncertaintyContribution>> budgets() {
        // log-uniform over seven decades, so that tiny and dominant contributions meet
        Arbitrary<Double> u = Arbitraries.doubles().between(-6.0, 1.0).ofScale(6).map(e -> Math.pow(10.0, e));
        Arbitrary<Double> nu = Arbitraries.oneOf(Arbitraries.integers().between(1, 60).map(Integer::doubleValue),
                Arbitraries.just(Double.POSITIVE_INFINITY));
        Arbitrary<Double> c = Arbitraries.doubles().between(-5.0, 5.0).ofScale(4);
        Arbitrary<UncertaintyContribution> line = Combinators.combine(u, nu, c)
                .as((value, dof, coefficient) -> new UncertaintyContribution("x", UncertaintyContribution.Basis.STANDARD,
                        value, dof, coefficient));
        return line.list().ofMinSize(1).ofMaxSize(8);
    }

    @Property
    void expandedUncertaintyScalesLinearlyWithEveryContribution(@ForAll("budgets") List<UncertaintyContribution> lines,
            @ForAll @DoubleRange(min = 1e-3, max = 1e3) @Scale(4) double factor) {
        UncertaintyBudget base = UncertaintyBudget.of(lines, 0.95);
        List<UncertaintyContribution> scaled = lines.stream()
                .map(l -> new UncertaintyContribution(l.name(), l.basis(), l.standardUncertainty() * factor,
                        l.degreesOfFreedom(), l.sensitivityCoefficient()))
                .toList();
        UncertaintyBudget budget = UncertaintyBudget.of(scaled, 0.95);
        assertEquals(base.combinedStandardUncertainty() * factor, budget.combinedStandardUncertainty(),
                1e-12 * budget.combinedStandardUncertainty());
        assertEquals(base.expandedUncertainty() * factor, budget.expandedUncertainty(),
                1e-12 * budget.expandedUncertainty());
        // ν_eff is homogeneous of degree 0; k may only differ if ν_eff sits on an integer boundary
        assertEquals(base.effectiveDegreesOfFreedom(), budget.effectiveDegreesOfFreedom(),
                1e-9 * Math.min(budget.effectiveDegreesOfFreedom(), 1e300));
    }

    @Property
    void combinedUncertaintyLiesBetweenTheLargestContributionAndTheirSum(
            @ForAll("budgets") List<UncertaintyContribution> lines) {
        UncertaintyBudget budget = UncertaintyBudget.of(lines, 0.95);
        double largest = lines.stream().mapToDouble(UncertaintyContribution::contribution).max().orElseThrow();
        double sum = lines.stream().mapToDouble(UncertaintyContribution::contribution).sum();
        double uc = budget.combinedStandardUncertainty();
        assertTrue(uc >= largest * (1 - 1e-15) && uc <= sum * (1 + 1e-15), () -> uc + " not in [" + largest + ", " + sum + "]");
    }

    @Property
    void effectiveDegreesOfFreedomLieBetweenTheSmallestAndTheSum(
            @ForAll("budgets") List<UncertaintyContribution> lines) {
        // follows from Eq. G.2b by Cauchy–Schwarz (lines with zero contribution excluded)
        UncertaintyBudget budget = UncertaintyBudget.of(lines, 0.95);
        if (lines.stream().allMatch(l -> l.contribution() == 0)) {
            assertTrue(budget.hasInfiniteDegreesOfFreedom(), "nothing uncertain: ν_eff reported as infinite");
            return;
        }
        double smallest = lines.stream().filter(l -> l.contribution() > 0)
                .mapToDouble(UncertaintyContribution::degreesOfFreedom).min().orElseThrow();
        double sum = lines.stream().filter(l -> l.contribution() > 0)
                .mapToDouble(UncertaintyContribution::degreesOfFreedom).sum();
        double nu = budget.effectiveDegreesOfFreedom();
        assertTrue(nu >= smallest && nu <= sum * (1 + 1e-12), () -> nu + " not in [" + smallest + ", " + sum + "]");
    }

    @Property
    void orderOfTheLinesDoesNotMatter(@ForAll("budgets") List<UncertaintyContribution> lines) {
        List<UncertaintyContribution> reversed = new ArrayList<>(lines);
        Collections.reverse(reversed);
        UncertaintyBudget a = UncertaintyBudget.of(lines, 0.95);
        UncertaintyBudget b = UncertaintyBudget.of(reversed, 0.95);
        assertEquals(a.expandedUncertainty(), b.expandedUncertainty(), 1e-13 * a.expandedUncertainty());
    }

    @Property
    void growingOneContributionNeverShrinksTheCombinedUncertainty(
            @ForAll("budgets") List<UncertaintyContribution> lines, @ForAll @IntRange(min = 0, max = 7) int which,
            @ForAll @DoubleRange(min = 1.0, max = 100.0) double factor) {
        int index = which % lines.size();
        List<UncertaintyContribution> grown = new ArrayList<>(lines);
        UncertaintyContribution l = lines.get(index);
        grown.set(index, new UncertaintyContribution(l.name(), l.basis(), l.standardUncertainty() * factor,
                l.degreesOfFreedom(), l.sensitivityCoefficient()));
        assertTrue(UncertaintyBudget.of(grown, 0.95).combinedStandardUncertainty()
                >= UncertaintyBudget.of(lines, 0.95).combinedStandardUncertainty() * (1 - 1e-15));
    }
}
