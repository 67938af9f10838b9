package org.voteworth.demo;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Reviewers planted in every demo dump (with {@link DemoOptions#plantCases()} on) with exactly
 * known votes, so that tests and the demo can show what each ranking rule does with them.
 * Their reviews are spread over the dump at seeded positions and categories.
 */
public final class PlantedCases {
    /**
     * {@value #SMALL_COUNT} reviewers {@code planted-small-01} ... {@code planted-small-40} with
     * 1 to 8 total votes each (1..8, five times over), all helpful except {@code -38}, {@code -39},
     * {@code -40} (5/6, 6/7, 7/8). Under the raw share with a low entry bar they fill the top of
     * the list on tiny samples; a lower confidence bound puts them below the well-evidenced.
     */
    public static final String SMALL_PREFIX = "planted-small-";
    public static final int SMALL_COUNT = 40;
    /** 150 reviews, 896 helpful of 900 votes (99.6 %): the best-evidenced reviewer in the dump. */
    public static final String EXPERT = "planted-expert";
    /** 40 reviews, 299 helpful of 310 votes (96.5 %). */
    public static final String VETERAN_1 = "planted-veteran-1";
    /** 60 reviews, 437 helpful of 450 votes (97.1 %). */
    public static final String VETERAN_2 = "planted-veteran-2";
    /** 80 reviews, 587 helpful of 600 votes (97.8 %). */
    public static final String VETERAN_3 = "planted-veteran-3";
    /**
     * 12 reviews, 1,159 helpful of 1,214 votes, of which one review holds 1,150 of 1,200
     * ({@link #VIRAL_TOP_HELPFUL}/{@link #VIRAL_TOP_TOTAL}, 98.8 % of the votes); the other 11
     * reviews have 9 helpful of 14. Vote-pooling rules rate this reviewer on one review.
     */
    public static final String VIRAL = "planted-viral";
    public static final long VIRAL_TOP_HELPFUL = 1150;
    public static final long VIRAL_TOP_TOTAL = 1200;

    /**
     * One planted reviewer and the sums their reviews carry in the dump.
     *
     * @param id reviewer id as written in the dump
     * @param reviews number of reviews
     * @param helpful sum of helpful votes H
     * @param total sum of total votes T
     */
    public record PlantedReviewer(String id, int reviews, long helpful, long total) {
    }

    private static final List<PlantedReviewer> ALL = build();

    private PlantedCases() {
    }

    /** {@code planted-small-NN} for 1 &lt;= i &lt;= {@value #SMALL_COUNT}. */
    public static String small(int i) {
        if (i < 1 || i > SMALL_COUNT) {
            throw new IllegalArgumentException("planted small reviewers are numbered 1 to " + SMALL_COUNT + ", not " + i);
        }
        return SMALL_PREFIX + (i < 10 ? "0" : "") + i;
    }

    /** Every planted reviewer: the small ones in order, then expert, veterans 1 to 3, viral. */
    public static List<PlantedReviewer> all() {
        return ALL;
    }

    public static Optional<PlantedReviewer> of(String id) {
        return ALL.stream().filter(p -> p.id().equals(id)).findFirst();
    }

    /** Number of planted reviews, all reviewers together. */
    static int reviewCount() {
        return ALL.stream().mapToInt(PlantedReviewer::reviews).sum();
    }

    private static List<PlantedReviewer> build() {
        List<PlantedReviewer> list = new ArrayList<>();
        for (int i = 1; i <= SMALL_COUNT; i++) {
            int total = 1 + (i - 1) % 8;
            int helpful = i > SMALL_COUNT - 3 ? total - 1 : total;
            list.add(new PlantedReviewer(small(i), total <= 3 ? 1 : 2, helpful, total));
        }
        list.add(new PlantedReviewer(EXPERT, 150, 896, 900));
        list.add(new PlantedReviewer(VETERAN_1, 40, 299, 310));
        list.add(new PlantedReviewer(VETERAN_2, 60, 437, 450));
        list.add(new PlantedReviewer(VETERAN_3, 80, 587, 600));
        list.add(new PlantedReviewer(VIRAL, 12, VIRAL_TOP_HELPFUL + 9, VIRAL_TOP_TOTAL + 14));
        return List.copyOf(list);
    }
}
