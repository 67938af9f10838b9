package org.voteworth.demo;

import java.io.IOException;
import java.nio.file.Path;

/**
 * Regenerates the bundled sample dump until the command line offers {@code voteworth generate}:
 * {@code java -cp target/classes org.voteworth.demo.SampleDump demo-data 40000 20261202}.
 */
public final class SampleDump {
    private SampleDump() {
    }

    /** Arguments: output folder, rows, seed (defaults: demo-data, 40000, {@value DemoOptions#DEFAULT_SEED}). */
    public static void main(String[] args) throws IOException {
        if (args.length > 3) {
            System.err.println("usage: SampleDump [dir] [rows] [seed]");
            System.exit(2);
        }
        Path dir = Path.of(args.length > 0 ? args[0] : "demo-data");
        long rows;
        long seed;
        try {
            rows = args.length > 1 ? Long.parseLong(args[1]) : 40_000;
            seed = args.length > 2 ? Long.parseLong(args[2]) : DemoOptions.DEFAULT_SEED;
        } catch (NumberFormatException e) {
            System.err.println("rows and seed must be whole numbers: " + e.getMessage());
            System.exit(2);
            return;
        }
        long start = System.nanoTime();
        GeneratedDump d = new DemoDumpGenerator().generate(dir, DemoOptions.rows(rows).withSeed(seed));
        System.out.printf("%s: %d files, %,d rows, %,d data lines, %,d bytes on disk (%,d uncompressed) in %.1f s%n",
                dir, d.files().size(), d.rows(), d.physicalLines(), d.bytes(), d.uncompressedBytes(),
                (System.nanoTime() - start) / 1e9);
        System.out.printf("expected: %,d rows accepted, %,d lines rejected%n", d.expectedAcceptedRows(), d.expectedRejectedLines());
        d.malformedByKind().forEach((k, n) -> System.out.printf("  %-22s %d lines%n", k, n));
    }
}
