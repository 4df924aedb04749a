package org.dockgate.core;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The property harness itself: a broken function is caught, with its seed, and a seed replays its cases. */
class PropertyCheckTest {

    /** Absolute value, broken for one value in a thousand: what a property must find. */
    private static int brokenAbs(int x) {
        return x == 437 ? -x : Math.abs(x);
    }

    @Test
    void aPropertyFailsOnADeliberatelyBrokenFunctionAndNamesTheSeed() {
        AssertionError failure = assertThrows(AssertionError.class, () -> PropertyCheck.forAll(20240601L, 20_000, g -> {
            int x = g.ints(-1000, 1000);
            assertThat(brokenAbs(x)).isGreaterThanOrEqualTo(0);
        }));
        assertThat(failure.getMessage()).contains("seed 20240601").contains("-Ddockgate.property.seed=20240601")
                .contains("drawn: [437]");
        // The correct function passes the same property from the same seed.
        PropertyCheck.forAll(20240601L, 20_000, g -> assertThat(Math.abs(g.ints(-1000, 1000))).isNotNegative());
    }

    @Test
    void theSameSeedDrawsTheSameCasesAndStaysInRange() {
        List<Double> first = new ArrayList<>();
        List<Double> second = new ArrayList<>();
        PropertyCheck.forAll(7L, 500, g -> first.add(g.doubles(-2.5, 3.5, 3)));
        PropertyCheck.forAll(7L, 500, g -> second.add(g.doubles(-2.5, 3.5, 3)));
        assertThat(first).isEqualTo(second).allSatisfy(v -> assertThat(v).isBetween(-2.5, 3.5))
                .contains(-2.5, 3.5); // the edges are drawn too
        assertThat(first.stream().distinct().count()).isGreaterThan(400);
    }
}
