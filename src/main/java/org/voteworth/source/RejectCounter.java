package org.voteworth.source;

import java.util.Map;
import java.util.TreeMap;

/** A {@link RejectSink} that only counts, by reason (for {@code --rejects none} and tests). */
public final class RejectCounter implements RejectSink {
    private final Map<String, Long> byReason = new TreeMap<>();
    private long total;

    @Override
    public synchronized void reject(DumpFile file, long line, Reject reject, byte[] row, int start, int end) {
        total++;
        byReason.merge(reject.reason(), 1L, Long::sum);
    }

    public synchronized long total() {
        return total;
    }

    /** Reject counts by reason code, sorted by code; a copy. */
    public synchronized Map<String, Long> byReason() {
        return new TreeMap<>(byReason);
    }
}
