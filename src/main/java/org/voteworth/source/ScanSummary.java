package org.voteworth.source;

import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * The reconciliation of a read: per file and in total, rows read, accepted and rejected, and
 * rejects by reason. Every row read is either accepted or rejected with a reason;
 * {@link #reconciles()} checks that this held.
 *
 * @param files one report per file, in the order read
 */
public record ScanSummary(List<FileReport> files) {
    public ScanSummary {
        files = List.copyOf(files);
    }

    public long rowsRead() {
        return files.stream().mapToLong(FileReport::rowsRead).sum();
    }

    public long accepted() {
        return files.stream().mapToLong(FileReport::accepted).sum();
    }

    public long rejected() {
        return files.stream().mapToLong(FileReport::rejected).sum();
    }

    /** Rejects by reason code over all files, sorted by code. */
    public Map<String, Long> rejectsByReason() {
        Map<String, Long> m = new TreeMap<>();
        for (FileReport f : files) {
            f.rejectsByReason().forEach((k, v) -> m.merge(k, v, Long::sum));
        }
        return m;
    }

    /** read = accepted + rejected for every file and in total (and the reasons add up). */
    public boolean reconciles() {
        for (FileReport f : files) {
            if (!f.reconciles()) {
                return false;
            }
        }
        long byReason = rejectsByReason().values().stream().mapToLong(Long::longValue).sum();
        return rowsRead() == accepted() + rejected() && byReason == rejected();
    }

    /**
     * A short table for people: one line per file (read, accepted, rejected, top reasons), then
     * the total, then whether read = accepted + rejected held.
     */
    public String describe() {
        int w = "total".length();
        for (FileReport f : files) {
            w = Math.max(w, f.file().toString().length());
        }
        String fmt = "%-" + w + "s  %,14d  %,14d  %,12d  %s%n";
        StringBuilder b = new StringBuilder();
        b.append(String.format(Locale.ROOT, "%-" + w + "s  %14s  %14s  %12s  %s%n", "file", "read", "accepted", "rejected", "rejects by reason"));
        for (FileReport f : files) {
            String why = f.noHeader() ? "(empty file: no header, no rows)" : reasons(f.rejectsByReason());
            b.append(String.format(Locale.ROOT, fmt, f.file(), f.rowsRead(), f.accepted(), f.rejected(), why));
        }
        b.append(String.format(Locale.ROOT, fmt, "total", rowsRead(), accepted(), rejected(), reasons(rejectsByReason())));
        if (reconciles()) {
            b.append(String.format(Locale.ROOT, "read = accepted + rejected: %,d = %,d + %,d, holds for %s%n",
                    rowsRead(), accepted(), rejected(), files.size() == 1 ? "the file" : "each of the " + files.size() + " files"));
        } else {
            b.append("read = accepted + rejected does NOT hold for:");
            for (FileReport f : files) {
                if (!f.reconciles()) {
                    b.append(' ').append(f.file());
                }
            }
            b.append(String.format(Locale.ROOT, "%n"));
        }
        return b.toString();
    }

    private static String reasons(Map<String, Long> byReason) {
        StringBuilder b = new StringBuilder();
        byReason.entrySet().stream().sorted(Map.Entry.<String, Long>comparingByValue().reversed())
                .forEach(e -> b.append(b.length() == 0 ? "" : ", ")
                        .append(String.format(Locale.ROOT, "%s %,d", e.getKey(), e.getValue())));
        return b.toString();
    }
}
