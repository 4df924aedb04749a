package org.dockgate.core;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Random;
import java.util.function.Consumer;

/**
 * Seeded property checks for plain JUnit 5 tests: {@code forAll(tries, g -> ...)} runs the property with
 * {@code tries} generated cases; a failing case throws an {@link AssertionError} naming the try, the seed
 * and how to replay it ({@code -Ddockgate.property.seed=<seed>}). Without that property every run draws a
 * fresh seed, so repeated runs explore new cases; the seed of a failure is always printed.
 * About one draw in twenty is an edge value of its range (its ends, zero where inside), as case generators
 * commonly do (common practice).
 */
public final class PropertyCheck {

    public static final String SEED_PROPERTY = "dockgate.property.seed";

    private PropertyCheck() {
    }

    public static void forAll(int tries, Consumer<Gen> property) {
        String fixed = System.getProperty(SEED_PROPERTY);
        long seed = fixed != null && !fixed.isBlank() ? Long.parseLong(fixed.strip()) : new Random().nextLong();
        forAll(seed, tries, property);
    }

    /** Runs the property from a given seed: the same seed gives the same cases. */
    public static void forAll(long seed, int tries, Consumer<Gen> property) {
        Gen gen = new Gen(new Random(seed));
        for (int i = 1; i <= tries; i++) {
            gen.clear();
            try {
                property.accept(gen);
            } catch (AssertionError | RuntimeException e) {
                String message = "Property failed on try " + i + " of " + tries + " with seed " + seed
                        + " (replay with -D" + SEED_PROPERTY + "=" + seed + "); drawn: " + gen.drawn() + "; "
                        + e.getMessage();
                System.err.println(message);
                throw new AssertionError(message, e);
            }
        }
    }

    /** The generator handed to each try; it records what it drew, for the failure message. */
    public static final class Gen {
        private final Random random;
        private final StringBuilder drawn = new StringBuilder();

        Gen(Random random) {
            this.random = random;
        }

        void clear() {
            drawn.setLength(0);
        }

        String drawn() {
            return "[" + drawn + "]";
        }

        private <T> T note(T value) {
            if (!drawn.isEmpty()) {
                drawn.append(", ");
            }
            drawn.append(value instanceof String s ? "\"" + s + "\"" : value);
            return value;
        }

        private boolean edge() {
            return random.nextInt(20) == 0;
        }

        /** A whole number in [min, max]. */
        public int ints(int min, int max) {
            return (int) longs(min, max);
        }

        /** A whole number in [min, max]. */
        public long longs(long min, long max) {
            if (edge()) {
                long[] edges = {min, max, min <= 0 && 0 <= max ? 0 : min};
                return note(edges[random.nextInt(edges.length)]);
            }
            return note(min + (long) Math.floor(random.nextDouble() * ((double) max - min + 1)));
        }

        /** Any long (for seeds of derived random data). */
        public long anyLong() {
            return note(random.nextLong());
        }

        public boolean bool() {
            return note(random.nextBoolean());
        }

        /** A decimal in [min, max] with two decimal places. */
        public double doubles(double min, double max) {
            return doubles(min, max, 2);
        }

        /** A decimal in [min, max] rounded to {@code scale} decimal places (kept inside the range). */
        public double doubles(double min, double max, int scale) {
            double value;
            if (edge()) {
                double[] edges = {min, max, min <= 0 && 0 <= max ? 0 : min};
                value = edges[random.nextInt(edges.length)];
            } else {
                value = min + random.nextDouble() * (max - min);
            }
            double rounded = BigDecimal.valueOf(value).setScale(scale, RoundingMode.HALF_UP).doubleValue();
            if (rounded < min || rounded > max) {
                rounded = value; // rounding stepped outside the range: keep the unrounded value
            }
            return note(rounded);
        }

        /** Any double, including the special values and both very small and very large magnitudes. */
        public double anyDouble() {
            double value = switch (random.nextInt(6)) {
                case 0 -> new double[]{0.0, -0.0, 1.0, -1.0, Double.MIN_VALUE, -Double.MIN_VALUE, Double.MAX_VALUE,
                        -Double.MAX_VALUE, Double.MIN_NORMAL, Double.NaN, Double.POSITIVE_INFINITY,
                        Double.NEGATIVE_INFINITY}[random.nextInt(12)];
                case 1 -> (random.nextDouble() - 0.5) * 2000;
                case 2 -> BigDecimal.valueOf((random.nextDouble() - 0.5) * 2e6).setScale(random.nextInt(6),
                        RoundingMode.HALF_UP).doubleValue();
                default -> Double.longBitsToDouble(random.nextLong());
            };
            return note(value);
        }

        /** One of the enum's constants. */
        public <E extends Enum<E>> E oneOf(Class<E> type) {
            E[] values = type.getEnumConstants();
            return note(values[random.nextInt(values.length)]);
        }

        /** One of the given values. */
        @SafeVarargs
        public final <T> T oneOf(T... values) {
            return note(values[random.nextInt(values.length)]);
        }

        /**
         * A string of {@code minLength} to {@code maxLength} characters, mixing letters and digits, CSV-special
         * characters (comma, quote, CR, LF), white space and any other character of the Basic Multilingual Plane.
         */
        public String strings(int minLength, int maxLength) {
            int length = minLength + random.nextInt(maxLength - minLength + 1);
            String special = ",\"\r\n \t;'\\\uFEFF\u00A0";
            StringBuilder text = new StringBuilder(length);
            for (int i = 0; i < length; i++) {
                text.append(switch (random.nextInt(4)) {
                    case 0 -> (char) ('a' + random.nextInt(26));
                    case 1 -> (char) ('0' + random.nextInt(10));
                    case 2 -> special.charAt(random.nextInt(special.length()));
                    default -> {
                        char c;
                        do {
                            c = (char) random.nextInt(0x10000);
                        } while (Character.isSurrogate(c));
                        yield c;
                    }
                });
            }
            return note(text.toString());
        }

        /** The underlying random source, for properties that build larger random data themselves. */
        public Random random() {
            return random;
        }
    }
}
