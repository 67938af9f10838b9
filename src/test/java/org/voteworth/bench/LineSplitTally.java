package org.voteworth.bench;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;

/**
 * Benchmark baseline: the plain Java a user would write first: readLine, split on tabs, a
 * HashMap of per-reviewer sums. Prints {@code rows reviewers helpful total}.
 */
public final class LineSplitTally {
    private LineSplitTally() {
    }

    public static void main(String[] args) throws IOException {
        Map<String, long[]> byReviewer = new HashMap<>();
        long rows = 0;
        for (String f : args) {
            try (BufferedReader r = Files.newBufferedReader(Path.of(f), StandardCharsets.UTF_8)) {
                String line = r.readLine();
                while ((line = r.readLine()) != null) {
                    String[] c = line.split("\t", -1);
                    long[] t = byReviewer.computeIfAbsent(c[0], k -> new long[2]);
                    t[0] += Long.parseLong(c[5]);
                    t[1] += Long.parseLong(c[6]);
                    rows++;
                }
            }
        }
        long h = 0;
        long t = 0;
        for (long[] v : byReviewer.values()) {
            h += v[0];
            t += v[1];
        }
        System.out.println(rows + " " + byReviewer.size() + " " + h + " " + t);
    }
}
