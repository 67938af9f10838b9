package org.voteworth.source;

import java.util.Collections;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;

/**
 * What one scan of a file (or of a byte range of it) read.
 *
 * @param file the file
 * @param rowsRead data rows read (the header is not a row; a blank line is a row, rejected)
 * @param accepted rows handed to the {@link ReviewSink}
 * @param rejected rows handed to the {@link RejectSink}
 * @param rejectsByReason rejected rows by {@link Reject#reason()} code, sorted by code
 * @param noHeader the file was empty: no header, no rows
 */
public record FileReport(DumpFile file, long rowsRead, long accepted, long rejected,
                         Map<String, Long> rejectsByReason, boolean noHeader) {
    public FileReport {
        Objects.requireNonNull(file, "file");
        rejectsByReason = Collections.unmodifiableMap(new TreeMap<>(rejectsByReason));
    }

    public FileReport(DumpFile file, long rowsRead, long accepted, long rejected, Map<String, Long> rejectsByReason) {
        this(file, rowsRead, accepted, rejected, rejectsByReason, false);
    }

    /** read = accepted + rejected, and the reasons add up to the rejected rows. */
    public boolean reconciles() {
        long byReason = 0;
        for (long n : rejectsByReason.values()) {
            byReason += n;
        }
        return rowsRead == accepted + rejected && byReason == rejected;
    }

    /** Rejected rows as a share of rows read; 0 for no rows. */
    public double rejectRate() {
        return rowsRead == 0 ? 0 : (double) rejected / rowsRead;
    }
}
