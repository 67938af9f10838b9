package org.voteworth.score;

import java.math.BigDecimal;
import java.math.RoundingMode;

/** Confidences and quantiles as people read them in labels: 0.95 as "95 %", 0.975 as "97.5 %". */
final class Percent {
    private Percent() {
    }

    static String of(double fraction) {
        // Six decimals of a percent hide binary noise (0.95 * 100 = 95.00000000000001).
        BigDecimal p = BigDecimal.valueOf(fraction * 100).setScale(6, RoundingMode.HALF_EVEN).stripTrailingZeros();
        return (p.scale() < 0 ? p.setScale(0) : p).toPlainString() + " %";
    }

    /** A probability argument checked at the door: strictly between 0 and 1. */
    static double checkOpenUnit(String what, double value) {
        if (!(value > 0 && value < 1)) {
            throw new IllegalArgumentException(what + " must lie strictly between 0 and 1 (e.g. 0.95), got " + value);
        }
        return value;
    }
}
