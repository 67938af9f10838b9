package org.voteworth.spark;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.voteworth.source.ReviewRow;
import org.voteworth.source.ReviewSink;

/**
 * Passes every accepted row on to a sink and counts, per category, the reviews and their star
 * histogram, for the manifest's {@code categories} entry. A dump has tens of categories and rows
 * of one file mostly share one, so the last category seen is tried first.
 */
final class CategoryCounts implements ReviewSink {
    private final ReviewSink next;
    private final List<byte[]> names = new ArrayList<>();
    /** Per category: reviews, then stars 1 to 5. */
    private final List<long[]> counts = new ArrayList<>();
    private int last = -1;

    CategoryCounts(ReviewSink next) {
        this.next = next;
    }

    @Override
    public void accept(ReviewRow r) {
        next.accept(r);
        long[] c = counts.get(id(r.categoryBuf, r.categoryOff, r.categoryLen));
        c[0]++;
        if (r.stars >= 1 && r.stars <= 5) {
            c[r.stars]++;
        }
    }

    private int id(byte[] b, int off, int len) {
        if (last >= 0 && Arrays.equals(names.get(last), 0, names.get(last).length, b, off, off + len)) {
            return last;
        }
        for (int i = 0; i < names.size(); i++) {
            if (Arrays.equals(names.get(i), 0, names.get(i).length, b, off, off + len)) {
                last = i;
                return i;
            }
        }
        names.add(Arrays.copyOfRange(b, off, off + len));
        counts.add(new long[6]);
        last = names.size() - 1;
        return last;
    }

    /** How many categories were seen. */
    int size() {
        return names.size();
    }

    String name(int i) {
        return new String(names.get(i), StandardCharsets.UTF_8);
    }

    /** Reviews, then stars 1 to 5, of the i-th category seen. */
    long[] counts(int i) {
        return counts.get(i).clone();
    }
}
