package org.voteworth.source;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.zip.GZIPOutputStream;

/** Small invented marketplace dumps for the tests (not real data). */
final class SampleDump {
    /** A 12-column header; every Field but ITEM's alternatives is recognised by name. */
    static final List<String> COLUMNS = List.of("reviewer_id", "review_id", "item_id", "category", "stars",
            "helpful_votes", "total_votes", "verified", "incentivised", "review_date", "headline", "body");
    static final String HEADER = String.join("\t", COLUMNS);

    private SampleDump() {
    }

    /** A valid TSV row with the given reviewer and votes. */
    static String row(String reviewer, long helpful, long total) {
        return String.join("\t", reviewer, "V" + reviewer + helpful, "ITEM-7", "garden", "4", Long.toString(helpful),
                Long.toString(total), "Y", "N", "2021-03-14", "Sturdy \"rake\"", "Works; the handle's fine");
    }

    /** The same columns with one replaced. */
    static String rowWith(int column, String value) {
        String[] f = row("R1", 1, 2).split("\t", -1);
        f[column] = value;
        return String.join("\t", f);
    }

    static ColumnMapping mapping() {
        return HeaderMapping.defaults().resolve(COLUMNS, Path.of("sample.tsv"));
    }

    static Path write(Path file, String text) throws IOException {
        return write(file, text.getBytes(StandardCharsets.UTF_8));
    }

    static Path write(Path file, byte[] bytes) throws IOException {
        Files.createDirectories(file.toAbsolutePath().getParent());
        if (file.getFileName().toString().endsWith(".gz")) {
            try (OutputStream o = new GZIPOutputStream(Files.newOutputStream(file))) {
                o.write(bytes);
            }
        } else {
            Files.write(file, bytes);
        }
        return file;
    }

    static DumpFile dumpFile(Path p) throws IOException {
        return new DumpFile(p, CategoryFromName.defaults().categoryOf(p), DumpFile.Compression.of(p), Files.size(p));
    }
}
