package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * Reads the CSV files of published check values in {@code reference-checks/} and checks a value
 * to the precision it was published with.
 *
 * <p>Lines starting with '#' are comments; the first other line is the header; fields may be
 * quoted with '"'. The folder is found through the system property {@code voteworth.projectDir}
 * (set by surefire), else the working directory.
 */
final class ReferenceCsv {
    private ReferenceCsv() {
    }

    static Path dir() {
        String base = System.getProperty("voteworth.projectDir", System.getProperty("user.dir"));
        return Path.of(base, "reference-checks");
    }

    /** The rows of {@code file}, each a map from column name to text, in file order. */
    static List<Map<String, String>> read(String file) {
        Path p = dir().resolve(file);
        List<String> lines;
        try {
            lines = Files.readAllLines(p, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read the reference file " + p, e);
        }
        List<String> header = null;
        List<Map<String, String>> rows = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i);
            if (line.isBlank() || line.startsWith("#")) {
                continue;
            }
            List<String> fields = split(line, p, i + 1);
            if (header == null) {
                header = fields;
                continue;
            }
            if (fields.size() != header.size()) {
                throw new IllegalStateException(p + " line " + (i + 1) + ": " + fields.size() + " fields, header has "
                        + header.size());
            }
            Map<String, String> row = new LinkedHashMap<>();
            for (int k = 0; k < header.size(); k++) {
                row.put(header.get(k), fields.get(k));
            }
            row.put("#line", file + ":" + (i + 1));
            rows.add(row);
        }
        return rows;
    }

    private static List<String> split(String line, Path p, int lineNo) {
        List<String> out = new ArrayList<>();
        StringBuilder cur = new StringBuilder();
        boolean quoted = false;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (quoted) {
                if (c == '"' && i + 1 < line.length() && line.charAt(i + 1) == '"') {
                    cur.append('"');
                    i++;
                } else if (c == '"') {
                    quoted = false;
                } else {
                    cur.append(c);
                }
            } else if (c == '"') {
                quoted = true;
            } else if (c == ',') {
                out.add(cur.toString());
                cur.setLength(0);
            } else {
                cur.append(c);
            }
        }
        if (quoted) {
            throw new IllegalStateException(p + " line " + lineNo + ": unclosed quote");
        }
        out.add(cur.toString());
        return out;
    }

    /**
     * The tolerance a published value is held to: the tolerance column when given ("exact",
     * "abs 1e-9", "rel 1e-3"), else half a unit of the last published digit (an integer is exact).
     */
    static double tolerance(String published, String column) {
        double value = Double.parseDouble(published);
        String t = column == null ? "" : column.trim();
        if (t.equals("exact")) {
            return 1e-12;
        }
        if (t.startsWith("abs ")) {
            return Double.parseDouble(t.substring(4));
        }
        if (t.startsWith("rel ")) {
            return Double.parseDouble(t.substring(4)) * Math.abs(value);
        }
        if (!t.isEmpty()) {
            throw new IllegalArgumentException("unknown tolerance '" + column + "'");
        }
        int dot = published.indexOf('.');
        if (dot < 0) {
            return 1e-12;
        }
        int decimals = published.length() - dot - 1;
        // Half a unit of the last digit, plus a hair for the binary representation of both numbers.
        return 0.5 * Math.pow(10, -decimals) * (1 + 1e-9);
    }

    /** Asserts {@code actual} against the published text of a row's column. */
    static void check(Map<String, String> row, String column, String tolerance, double actual) {
        String published = row.get(column);
        double expected = Double.parseDouble(published);
        assertThat(actual)
                .as("%s %s (source: %s, %s)", row.get("#line"), column, row.get("source"), row.get("status"))
                .isCloseTo(expected, within(tolerance(published, tolerance)));
    }

    static void check(Map<String, String> row, String column, double actual) {
        check(row, column, row.getOrDefault("tolerance", ""), actual);
    }
}
