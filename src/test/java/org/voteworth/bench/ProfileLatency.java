package org.voteworth.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.voteworth.analysis.ReviewerProfile;
import org.voteworth.report.OutputFormat;
import org.voteworth.report.ProfileWriter;
import org.voteworth.report.IdMask;
import org.voteworth.store.Store;

/**
 * Benchmark: a reviewer profile inside a running process. Opens the store once (outside the
 * measured code), warms up on the first ids, then times each lookup of the rest: the reviewer's
 * reviews read from the store, the profile computed and written as a terminal table. Prints
 * {@code lookups median_ms p90_ms max_ms reviews_found median_cpu_ms}: wall time, and the thread's CPU
 * time (on a machine shared with other jobs, wall time includes waiting for a core).
 * Usage: ProfileLatency STORE IDS_FILE
 */
public final class ProfileLatency {
    private static final int WARM_UP = 20;

    private ProfileLatency() {
    }

    public static void main(String[] args) throws IOException {
        Store store = Store.open(Path.of(args[0]));
        List<String> ids = Files.readAllLines(Path.of(args[1])).stream().filter(s -> !s.isBlank()).toList();
        long found = 0;
        double[] ms = new double[Math.max(0, ids.size() - WARM_UP)];
        double[] cpu = new double[ms.length];
        java.lang.management.ThreadMXBean threads = java.lang.management.ManagementFactory.getThreadMXBean();
        for (int i = 0; i < ids.size(); i++) {
            long c0 = threads.getCurrentThreadCpuTime();
            long t0 = System.nanoTime();
            ReviewerProfile p = ReviewerProfile.of(ids.get(i), store.reviewsOf(ids.get(i)), store.manifest().categories());
            String text = ProfileWriter.write(List.of(p), OutputFormat.TABLE, IdMask.none(), java.util.Map.of());
            long t1 = System.nanoTime();
            long c1 = threads.getCurrentThreadCpuTime();
            if (text.isEmpty()) {
                throw new IllegalStateException("empty profile");
            }
            if (i >= WARM_UP) {
                ms[i - WARM_UP] = (t1 - t0) / 1e6;
                cpu[i - WARM_UP] = (c1 - c0) / 1e6;
                found += p.reviews().size();
            }
        }
        Arrays.sort(ms);
        Arrays.sort(cpu);
        System.out.printf(Locale.ROOT, "%d %.2f %.2f %.2f %d %.2f%n", ms.length, ms[ms.length / 2], ms[(int) (ms.length * 0.9)],
                ms[ms.length - 1], found, cpu[cpu.length / 2]);
    }
}
