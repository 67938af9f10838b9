package org.voteworth.source;

import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.Map;

/** The running counts of one scan, with the first example of each reject reason for messages. */
final class ScanCounts {
    /** The first row rejected for one reason: where, why, and what the row looked like. */
    record Example(long line, Reject reject, String row, int tabs, int commas) {
    }

    long rowsRead;
    long accepted;
    long rejected;
    final Map<String, long[]> byReason = new LinkedHashMap<>();
    final Map<String, Example> examples = new LinkedHashMap<>();

    void reject(long line, Reject r, byte[] b, int s, int e) {
        rejected++;
        long[] n = byReason.get(r.reason());
        if (n == null) {
            byReason.put(r.reason(), new long[] {1});
            examples.put(r.reason(), example(line, r, b, s, e));
        } else {
            n[0]++;
        }
    }

    private static Example example(long line, Reject r, byte[] b, int s, int e) {
        int tabs = ByteScan.count(b, s, e, (byte) '\t', ByteScan.pattern((byte) '\t'));
        int commas = ByteScan.count(b, s, e, (byte) ',', ByteScan.pattern((byte) ','));
        int n = Math.min(e - s, 160);
        String row = new String(b, s, n, StandardCharsets.UTF_8).replace("\t", "\\t").replace("\r", "\\r");
        return new Example(line, r, n < e - s ? row + "..." : row, tabs, commas);
    }

    Map<String, Long> reasons() {
        Map<String, Long> m = new LinkedHashMap<>();
        byReason.forEach((k, v) -> m.put(k, v[0]));
        return m;
    }

    FileReport report(DumpFile file, boolean noHeader) {
        return new FileReport(file, rowsRead, accepted, rejected, reasons(), noHeader);
    }
}
