package org.voteworth.demo;

import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.Arrays;
import java.util.SplittableRandom;

/**
 * Review dates from 2019-01-01 to 2025-12-31: the marketplace grows by a quarter a year, and
 * reviews peak after the December holidays and dip in spring and early autumn.
 */
final class ReviewDates {
    static final LocalDate FIRST = LocalDate.of(2019, 1, 1);
    static final LocalDate LAST = LocalDate.of(2025, 12, 31);
    private static final double YEARLY_GROWTH = 1.25;
    /** January to December. */
    private static final double[] SEASON = {1.30, 0.95, 0.92, 0.88, 0.90, 0.92, 0.97, 0.97, 0.88, 1.00, 1.15, 1.40};

    private final double[] cumulative;
    private final byte[][] isoDates;

    ReviewDates() {
        int days = (int) (LAST.toEpochDay() - FIRST.toEpochDay()) + 1;
        cumulative = new double[days];
        isoDates = new byte[days][];
        double sum = 0;
        for (int d = 0; d < days; d++) {
            LocalDate date = FIRST.plusDays(d);
            sum += StrictMath.pow(YEARLY_GROWTH, date.getYear() - FIRST.getYear()) * SEASON[date.getMonthValue() - 1];
            cumulative[d] = sum;
            isoDates[d] = date.toString().getBytes(StandardCharsets.US_ASCII);
        }
    }

    /** One date as {@code yyyy-MM-dd} bytes. */
    byte[] pick(SplittableRandom rng) {
        double u = rng.nextDouble() * cumulative[cumulative.length - 1];
        int i = Arrays.binarySearch(cumulative, u);
        return isoDates[i >= 0 ? i : Math.min(-i - 1, cumulative.length - 1)];
    }
}
