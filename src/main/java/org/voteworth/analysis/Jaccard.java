package org.voteworth.analysis;

import java.util.HashSet;
import java.util.Set;

/**
 * The Jaccard overlap |A ∩ B| / |A ∪ B| of two sets (Jaccard 1901, Bull. Soc. Vaud. Sci. Nat.
 * 37:547-579); of two top-k lists it ignores order. Two empty sets overlap fully (1).
 */
public final class Jaccard {
    private Jaccard() {
    }

    /** The overlap of two sets of table slots (duplicates within one array count once). */
    public static double of(int[] a, int[] b) {
        Set<Integer> sa = new HashSet<>();
        for (int x : a) {
            sa.add(x);
        }
        Set<Integer> union = new HashSet<>(sa);
        int both = 0;
        Set<Integer> sb = new HashSet<>();
        for (int x : b) {
            if (sb.add(x)) {
                union.add(x);
                if (sa.contains(x)) {
                    both++;
                }
            }
        }
        return union.isEmpty() ? 1.0 : (double) both / union.size();
    }
}
