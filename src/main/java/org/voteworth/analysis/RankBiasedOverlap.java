package org.voteworth.analysis;

import java.util.HashSet;
import java.util.Set;

/**
 * Rank-biased overlap of two ranked lists, extrapolated from their evaluated prefixes: RBO_EXT of
 * Webber, Moffat &amp; Zobel (2010), "A similarity measure for indefinite rankings", ACM TOIS
 * 28(4):20, equation (32). With S the shorter list (length s), L the longer (length l) and X_d
 * the overlap of their first d items (S contributing at most its s items),
 * <pre>
 *   RBO_EXT = (1−p)/p · [ Σ_{d=1..l} X_d/d · p^d + Σ_{d=s+1..l} X_s(d−s)/(s·d) · p^d ]
 *             + [ (X_l − X_s)/l + X_s/s ] · p^l
 * </pre>
 * which for lists of equal length k reduces to (1−p)/p · Σ_{d=1..k} X_d/d · p^d + X_k/k · p^k.
 * The persistence p (default 0.9) sets how top-weighted the measure is: the first d ranks carry
 * 1 − p^(d−1) + ... of the weight. Identical lists give 1, disjoint lists 0.
 */
public final class RankBiasedOverlap {
    /** The default persistence. */
    public static final double DEFAULT_PERSISTENCE = 0.9;

    private RankBiasedOverlap() {
    }

    /**
     * @param a a ranked list of distinct items (table slots), best first
     * @param b another
     * @param p persistence, strictly between 0 and 1
     */
    public static double extrapolated(int[] a, int[] b, double p) {
        if (!(p > 0 && p < 1)) {
            throw new IllegalArgumentException("the RBO persistence p must lie strictly between 0 and 1 (e.g. 0.9), got " + p);
        }
        int[] shortList = a.length <= b.length ? a : b;
        int[] longList = a.length <= b.length ? b : a;
        int s = shortList.length;
        int l = longList.length;
        if (s == 0) {
            return l == 0 ? 1.0 : 0.0;
        }
        Set<Integer> seenShort = new HashSet<>();
        Set<Integer> seenLong = new HashSet<>();
        double sum = 0;
        int overlap = 0;
        int overlapAtS = 0;
        double pd = 1;
        for (int d = 1; d <= l; d++) {
            pd *= p;
            int y = longList[d - 1];
            if (d <= s) {
                int x = shortList[d - 1];
                if (x == y) {
                    overlap++;
                } else {
                    if (seenLong.contains(x)) {
                        overlap++;
                    }
                    if (seenShort.contains(y)) {
                        overlap++;
                    }
                }
                seenShort.add(x);
                seenLong.add(y);
                if (d == s) {
                    overlapAtS = overlap;
                }
            } else if (seenShort.contains(y)) {
                overlap++;
            }
            sum += (double) overlap / d * pd;
            if (d > s) {
                sum += (double) overlapAtS * (d - s) / ((double) s * d) * pd;
            }
        }
        return (1 - p) / p * sum + ((double) (overlap - overlapAtS) / l + (double) overlapAtS / s) * pd;
    }
}
