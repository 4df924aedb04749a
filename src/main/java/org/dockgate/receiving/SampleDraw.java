package org.dockgate.receiving;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/** Drawing a lot's sample from its serials with a recorded seed, so an auditor can re-draw it. */
public final class SampleDraw {

    private SampleDraw() {
    }

    /**
     * The first {@code n} serials of a Fisher–Yates shuffle of the serials in entry order, driven by
     * {@code new java.util.Random(seed)}: for i from size − 1 down to 1, swap element i with element
     * {@code random.nextInt(i + 1)} (Knuth, TAOCP vol. 2, Algorithm 3.4.2 P). Written out rather than
     * calling {@code Collections.shuffle} so the draw does not depend on a library's implementation.
     * When n equals the lot size (100 % inspection) every serial is returned, in entry order.
     *
     * @throws IllegalArgumentException when n is not between 1 and the number of serials
     */
    public static List<String> draw(List<String> serials, int n, long seed) {
        if (n < 1 || n > serials.size()) {
            throw new IllegalArgumentException("The sample size must be between 1 and the " + serials.size()
                    + " serials of the lot, was " + n + ".");
        }
        if (n == serials.size()) {
            return List.copyOf(serials);
        }
        List<String> order = new ArrayList<>(serials);
        Random random = new Random(seed);
        for (int i = order.size() - 1; i > 0; i--) {
            int j = random.nextInt(i + 1);
            String held = order.get(i);
            order.set(i, order.get(j));
            order.set(j, held);
        }
        return List.copyOf(order.subList(0, n));
    }
}
