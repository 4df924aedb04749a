package org.dockgate.instruments;

import java.math.BigDecimal;

/** Numbers in messages as people write them: 20, not 20.0; 0.0001, not 1.0E-4. */
final class Numbers {

    private Numbers() {
    }

    static String plain(double value) {
        if (!Double.isFinite(value)) {
            return String.valueOf(value);
        }
        return BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
    }
}
