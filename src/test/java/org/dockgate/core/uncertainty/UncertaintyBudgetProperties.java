package org.dockgate.core.uncertainty;

import static org.dockgate.core.PropertyCheck.forAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.dockgate.core.PropertyCheck;
import org.junit.jupiter.api.Test;

/** Properties of the GUM propagation (5.1.2) and the Welch–Satterthwaite formula (G.4.1, Eq. G.2b). */
class UncertaintyBudgetProperties {

    /** One to eight lines; standard uncertainties log-uniform over seven decades, so tiny and dominant ones meet. */
    private static List<UncertaintyContribution> budgets(PropertyCheck.Gen g) {
        int size = g.ints(1, 8);
        List<UncertaintyContribution> lines = new ArrayList<>(size);
        for (int i = 0; i < size; i++) {
            double value = Math.pow(10.0, g.doubles(-6.0, 1.0, 6));
            double dof = g.bool() ? g.ints(1, 60) : Double.POSITIVE_INFINITY;
            double coefficient = g.doubles(-5.0, 5.0, 4);
            lines.add(new UncertaintyContribution("x", UncertaintyContribution.Basis.STANDARD, value, dof, coefficient));
        }
        return lines;
    }

    @Test
    void expandedUncertaintyScalesLinearlyWithEveryContribution() {
        forAll(1000, g -> {
            List<UncertaintyContribution> lines = budgets(g);
            double factor = g.doubles(1e-3, 1e3, 4);
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
        });
    }

    @Test
    void combinedUncertaintyLiesBetweenTheLargestContributionAndTheirSum() {
        forAll(1000, g -> {
            List<UncertaintyContribution> lines = budgets(g);
            UncertaintyBudget budget = UncertaintyBudget.of(lines, 0.95);
            double largest = lines.stream().mapToDouble(UncertaintyContribution::contribution).max().orElseThrow();
            double sum = lines.stream().mapToDouble(UncertaintyContribution::contribution).sum();
            double uc = budget.combinedStandardUncertainty();
            assertTrue(uc >= largest * (1 - 1e-15) && uc <= sum * (1 + 1e-15), () -> uc + " not in [" + largest + ", " + sum + "]");
        });
    }

    @Test
    void effectiveDegreesOfFreedomLieBetweenTheSmallestAndTheSum() {
        forAll(1000, g -> {
            List<UncertaintyContribution> lines = budgets(g);
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
        });
    }

    @Test
    void orderOfTheLinesDoesNotMatter() {
        forAll(1000, g -> {
            List<UncertaintyContribution> lines = budgets(g);
            List<UncertaintyContribution> reversed = new ArrayList<>(lines);
            Collections.reverse(reversed);
            UncertaintyBudget a = UncertaintyBudget.of(lines, 0.95);
            UncertaintyBudget b = UncertaintyBudget.of(reversed, 0.95);
            assertEquals(a.expandedUncertainty(), b.expandedUncertainty(), 1e-13 * a.expandedUncertainty());
        });
    }

    @Test
    void growingOneContributionNeverShrinksTheCombinedUncertainty() {
        forAll(1000, g -> {
            List<UncertaintyContribution> lines = budgets(g);
            int which = g.ints(0, 7);
            double factor = g.doubles(1.0, 100.0);
            int index = which % lines.size();
            List<UncertaintyContribution> grown = new ArrayList<>(lines);
            UncertaintyContribution l = lines.get(index);
            grown.set(index, new UncertaintyContribution(l.name(), l.basis(), l.standardUncertainty() * factor,
                    l.degreesOfFreedom(), l.sensitivityCoefficient()));
            assertTrue(UncertaintyBudget.of(grown, 0.95).combinedStandardUncertainty()
                    >= UncertaintyBudget.of(lines, 0.95).combinedStandardUncertainty() * (1 - 1e-15));
        });
    }
}
