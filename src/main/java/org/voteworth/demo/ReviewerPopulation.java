package org.voteworth.demo;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.voteworth.score.MarsagliaTsangGamma;

/**
 * The crowd behind one chunk of a dump: how many reviews each reviewer writes, their latent
 * helpfulness share, and a shuffled order of who writes each review.
 *
 * <p>Reviews per reviewer follow a discrete power law P(k) ∝ k^−{@value #EXPONENT} on
 * 1..kMax, so most reviewers write one review and a few write hundreds. Shares are
 * Beta({@value #SHARE_ALPHA}, {@value #SHARE_BETA}) (mean 0.74): over-dispersed against a
 * single common share, so an empirical-Bayes fit finds a proper prior.
 */
final class ReviewerPopulation {
    static final double EXPONENT = 2.2;
    static final double SHARE_ALPHA = 5.0;
    static final double SHARE_BETA = 1.8;

    /** Global index of this chunk's first reviewer (ids are derived from it). */
    final long firstIndex;
    final int size;
    final double[] share;
    private final int[] slots;
    private int next;

    private ReviewerPopulation(long firstIndex, int size, double[] share, int[] slots) {
        this.firstIndex = firstIndex;
        this.size = size;
        this.share = share;
        this.slots = slots;
    }

    /** A population writing exactly {@code rows} reviews. */
    static ReviewerPopulation draw(SplittableRandom rng, long firstIndex, int rows) {
        int kMax = Math.max(5, Math.min(1500, rows / 25));
        double[] cumulative = new double[kMax];
        double sum = 0;
        for (int k = 1; k <= kMax; k++) {
            sum += StrictMath.pow(k, -EXPONENT);
            cumulative[k - 1] = sum;
        }
        int[] counts = new int[Math.max(16, rows / 2)];
        int reviewers = 0;
        long written = 0;
        while (written < rows) {
            int i = Arrays.binarySearch(cumulative, rng.nextDouble() * sum);
            int k = (i >= 0 ? i : -i - 1) + 1;
            k = (int) Math.min(k, rows - written);
            if (reviewers == counts.length) {
                counts = Arrays.copyOf(counts, counts.length * 2);
            }
            counts[reviewers++] = k;
            written += k;
        }
        double[] share = new double[reviewers];
        int[] slots = new int[rows];
        int s = 0;
        for (int r = 0; r < reviewers; r++) {
            share[r] = MarsagliaTsangGamma.beta(rng, SHARE_ALPHA, SHARE_BETA);
            for (int j = 0; j < counts[r]; j++) {
                slots[s++] = r;
            }
        }
        for (int i = rows - 1; i > 0; i--) { // Fisher-Yates
            int j = rng.nextInt(i + 1);
            int t = slots[i];
            slots[i] = slots[j];
            slots[j] = t;
        }
        return new ReviewerPopulation(firstIndex, reviewers, share, slots);
    }

    boolean exhausted() {
        return next == slots.length;
    }

    /** The local index (0..size-1) of the writer of the next review. */
    int nextReviewer() {
        return slots[next++];
    }
}
