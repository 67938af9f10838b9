package org.voteworth.demo;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/**
 * What the demo generator wrote, counted so a reader's reconciliation can be checked exactly:
 * {@code physicalLines == expectedAcceptedRows + expectedRejectedLines}.
 *
 * @param files the dump files in writing order (categories largest first, parts in order)
 * @param rows logical rows written, planted and malformed included (a row broken by a stray
 *     newline counts once)
 * @param physicalLines data lines in all files, without the one header line per file (a row
 *     broken by a stray newline counts twice)
 * @param bytes size of the files on disk
 * @param malformedByKind physical lines of each {@link MalformedKind}, by {@link MalformedKind#key()}
 *     in declaration order; empty when malformed rows were off. Includes the valid
 *     {@code stray-quotes} rows.
 * @param expectedRejectedLines lines a correct reader rejects (both halves of a broken row)
 * @param expectedAcceptedRows rows a correct reader accepts, stray-quote rows included
 * @param uncompressedBytes bytes of all files after decompression, headers included
 * @param plantedLines where each malformed or stray-quote line is, in writing order
 */
public record GeneratedDump(List<Path> files, long rows, long physicalLines, long bytes,
                            Map<String, Long> malformedByKind, long expectedRejectedLines,
                            long expectedAcceptedRows, long uncompressedBytes, List<PlantedLine> plantedLines) {
    public GeneratedDump {
        files = List.copyOf(files);
        malformedByKind = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(malformedByKind));
        plantedLines = List.copyOf(plantedLines);
    }

    /**
     * A planted line's position.
     *
     * @param file the dump file
     * @param line 1-based physical line number (the header is line 1), as a reader counts it
     * @param kind what was planted there
     */
    public record PlantedLine(Path file, long line, MalformedKind kind) {
    }

    /** Every line of every file, headers included (what {@code zcat | wc -l} prints). */
    public long linesIncludingHeaders() {
        return physicalLines + files.size();
    }
}
