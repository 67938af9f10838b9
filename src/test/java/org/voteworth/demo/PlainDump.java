package org.voteworth.demo;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.time.format.ResolverStyle;
import java.util.ArrayList;
import java.util.List;
import java.util.zip.GZIPInputStream;

/**
 * Reads a generated dump with plain Java (decompress, split on line breaks and tabs) and judges
 * each line on its own, independently of the generator and of the project's real reader.
 */
final class PlainDump {
    static final int FIELDS = 12;
    private static final DateTimeFormatter ISO_STRICT = DateTimeFormatter.ofPattern("uuuu-MM-dd")
            .withResolverStyle(ResolverStyle.STRICT);

    /** One physical data line. {@code fields} is null when the line has the wrong field count. */
    record Line(Path file, long number, String text, String[] fields, boolean valid) {
        String reviewer() {
            return fields[0];
        }

        int stars() {
            return Integer.parseInt(fields[4]);
        }

        long helpful() {
            return Long.parseLong(fields[5]);
        }

        long total() {
            return Long.parseLong(fields[6]);
        }
    }

    final List<String> headers = new ArrayList<>();
    final List<Line> lines = new ArrayList<>();
    long uncompressedBytes;
    boolean sawCarriageReturn;

    static PlainDump read(List<Path> files) throws IOException {
        PlainDump d = new PlainDump();
        for (Path f : files) {
            byte[] bytes;
            try (InputStream in = f.getFileName().toString().endsWith(".gz")
                    ? new GZIPInputStream(Files.newInputStream(f)) : Files.newInputStream(f)) {
                bytes = in.readAllBytes();
            }
            d.uncompressedBytes += bytes.length;
            String all = new String(bytes, StandardCharsets.UTF_8);
            d.sawCarriageReturn |= all.indexOf('\r') >= 0;
            if (!all.endsWith("\n")) {
                throw new AssertionError(f + " does not end with a line break");
            }
            String[] parts = all.substring(0, all.length() - 1).split("\n", -1);
            d.headers.add(parts[0]);
            for (int i = 1; i < parts.length; i++) {
                d.lines.add(judge(f, i + 1, parts[i]));
            }
        }
        return d;
    }

    List<Line> valid() {
        return lines.stream().filter(Line::valid).toList();
    }

    List<Line> rejected() {
        return lines.stream().filter(l -> !l.valid()).toList();
    }

    private static Line judge(Path f, long number, String text) {
        String[] x = text.split("\t", -1);
        if (x.length != FIELDS) {
            return new Line(f, number, text, null, false);
        }
        boolean ok = isCount(x[5]) && isCount(x[6]) && Long.parseLong(x[5]) <= Long.parseLong(x[6])
                && isDate(x[11]);
        return new Line(f, number, text, x, ok);
    }

    private static boolean isCount(String s) {
        return !s.isEmpty() && s.length() < 19 && s.chars().allMatch(c -> c >= '0' && c <= '9');
    }

    private static boolean isDate(String s) {
        try {
            LocalDate.parse(s, ISO_STRICT);
            return true;
        } catch (DateTimeParseException e) {
            return false;
        }
    }
}
