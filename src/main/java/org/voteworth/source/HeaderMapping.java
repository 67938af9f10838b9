package org.voteworth.source;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.stream.Collectors;

/**
 * Which header names map to which {@link Field}: each field's recognised names (compared in
 * {@link Field#normalise} form) unless the user names its column with {@code --map
 * field=header,...} or a mapping file of {@code field=header} lines ({@code #} starts a comment).
 * Immutable; {@link #resolve} turns it into the column indices of one file.
 */
public final class HeaderMapping {
    private static final HeaderMapping DEFAULTS = new HeaderMapping(new EnumMap<>(Field.class));

    private final Map<Field, String> overrides;

    private HeaderMapping(EnumMap<Field, String> overrides) {
        this.overrides = Collections.unmodifiableMap(overrides);
    }

    /** Only the recognised names of {@link Field}. */
    public static HeaderMapping defaults() {
        return DEFAULTS;
    }

    /**
     * The value of {@code --map}: {@code field=header} pairs separated by commas, e.g.
     * {@code helpful=Up Votes,total=All Votes}. The header is matched exactly first, then in
     * normalised form.
     *
     * @throws IllegalArgumentException naming the bad entry (an unknown field lists the valid ones)
     */
    public static HeaderMapping parse(String mapOption) {
        EnumMap<Field, String> m = new EnumMap<>(Field.class);
        for (String entry : mapOption.split(",")) {
            if (entry.isBlank()) {
                continue;
            }
            String problem = put(m, entry);
            if (problem != null) {
                throw new IllegalArgumentException("--map " + mapOption + ": " + problem);
            }
        }
        return new HeaderMapping(m);
    }

    /**
     * A mapping file: one {@code field=header} per line; blank lines and lines starting with
     * {@code #} are skipped.
     *
     * @throws DumpFormatException naming the file and line of a bad entry
     * @throws IOException if the file cannot be read (the message names it)
     */
    public static HeaderMapping load(Path file) throws IOException {
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new IOException("cannot read mapping file " + file + ": " + e, e);
        }
        EnumMap<Field, String> m = new EnumMap<>(Field.class);
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i).strip();
            if (i == 0 && line.startsWith("\uFEFF")) {
                line = line.substring(1).strip();
            }
            if (line.isEmpty() || line.startsWith("#")) {
                continue;
            }
            String problem = put(m, line);
            if (problem != null) {
                throw new DumpFormatException(file.toString(), i + 1, problem);
            }
        }
        return new HeaderMapping(m);
    }

    /** Records one {@code field=header} entry; returns what is wrong with it, or null. */
    private static String put(EnumMap<Field, String> m, String entry) {
        int eq = entry.indexOf('=');
        if (eq < 0) {
            return "'" + entry.strip() + "' is not field=header (e.g. helpful=Up Votes)";
        }
        String key = entry.substring(0, eq).strip();
        String header = entry.substring(eq + 1).strip();
        var field = Field.ofKey(key);
        if (field.isEmpty()) {
            return "unknown field '" + key + "'; valid fields are " + validKeys();
        }
        if (header.isEmpty()) {
            return "no header name given for " + field.get().key() + " (write " + field.get().key() + "=<header>)";
        }
        if (m.containsKey(field.get())) {
            return field.get().key() + " is mapped twice ('" + m.get(field.get()) + "' and '" + header + "')";
        }
        m.put(field.get(), header);
        return null;
    }

    private static String validKeys() {
        return Arrays.stream(Field.values()).map(Field::key).collect(Collectors.joining(", "));
    }

    /** This mapping with {@code more}'s entries replacing or adding to its own. */
    public HeaderMapping withOverrides(HeaderMapping more) {
        EnumMap<Field, String> m = new EnumMap<>(Field.class);
        m.putAll(overrides);
        m.putAll(more.overrides);
        return new HeaderMapping(m);
    }

    /** The explicit field → header entries (without the recognised names). */
    public Map<Field, String> overrides() {
        return overrides;
    }

    /**
     * The columns of {@code header} (the first line of {@code file}, already split) that hold each
     * field. Explicit entries are placed first; every other field takes the first column, not
     * already taken, whose normalised name is one of its recognised names.
     *
     * @throws DumpFormatException naming the file when an explicit header is not there, two fields
     *     are mapped to one column, or a required field has no column
     */
    public ColumnMapping resolve(List<String> header, Path file) {
        Objects.requireNonNull(file, "file");
        int n = header.size();
        String[] norm = new String[n];
        for (int i = 0; i < n; i++) {
            norm[i] = Field.normalise(header.get(i).strip());
        }
        Field[] taken = new Field[n];
        Map<Field, Integer> cols = new EnumMap<>(Field.class);
        for (Map.Entry<Field, String> e : overrides.entrySet()) {
            int c = find(header, norm, e.getValue());
            if (c < 0) {
                throw new DumpFormatException(file.toString(), 1, "--map " + e.getKey().key() + "=" + e.getValue()
                        + ": no column named '" + e.getValue() + "'; the header has " + listed(header));
            }
            if (taken[c] != null) {
                throw new DumpFormatException(file.toString(), 1, "--map puts both " + taken[c].key() + " and "
                        + e.getKey().key() + " on column " + (c + 1) + " ('" + header.get(c) + "'); map each field to its own column");
            }
            taken[c] = e.getKey();
            cols.put(e.getKey(), c);
        }
        for (Field f : Field.values()) {
            if (cols.containsKey(f)) {
                continue;
            }
            for (int c = 0; c < n && !cols.containsKey(f); c++) {
                if (taken[c] == null && recognises(f, norm[c])) {
                    taken[c] = f;
                    cols.put(f, c);
                }
            }
        }
        List<Field> missing = new ArrayList<>();
        for (Field f : Field.values()) {
            if (f.required() && !cols.containsKey(f)) {
                missing.add(f);
            }
        }
        if (!missing.isEmpty()) {
            throw new DumpFormatException(file.toString(), 1, missingMessage(missing, header));
        }
        return ColumnMapping.of(n, cols);
    }

    private static int find(List<String> header, String[] norm, String wanted) {
        for (int i = 0; i < header.size(); i++) {
            if (header.get(i).strip().equals(wanted)) {
                return i;
            }
        }
        String w = Field.normalise(wanted);
        for (int i = 0; i < norm.length; i++) {
            if (norm[i].equals(w)) {
                return i;
            }
        }
        return -1;
    }

    private static boolean recognises(Field f, String normalisedHeader) {
        for (String name : f.recognisedNames()) {
            if (Field.normalise(name).equals(normalisedHeader)) {
                return true;
            }
        }
        return false;
    }

    private static String missingMessage(List<Field> missing, List<String> header) {
        StringBuilder b = new StringBuilder("no column for required field");
        b.append(missing.size() > 1 ? "s " : " ");
        b.append(missing.stream().map(f -> f.key() + " (recognised names: " + String.join(", ", f.recognisedNames()) + ")")
                .collect(Collectors.joining("; ")));
        b.append("; the header has ").append(listed(header)).append(". ");
        if (header.size() == 1 && header.get(0).indexOf(',') >= 0) {
            b.append("The header is one column with commas in it: if the file is comma-separated, add --csv. ");
        } else if (header.size() == 1 && header.get(0).indexOf('\t') >= 0) {
            b.append("The header is one column with tabs in it: if the file is tab-separated, drop --csv. ");
        }
        b.append("Name the column with --map ").append(missing.stream().map(f -> f.key() + "=<header>")
                .collect(Collectors.joining(",")));
        return b.toString();
    }

    private static String listed(List<String> header) {
        if (header.size() == 1 && header.get(0).isBlank()) {
            return "no column names (the first line is blank; it must be the header)";
        }
        return header.stream().map(h -> "'" + h + "'").collect(Collectors.joining(", "));
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof HeaderMapping m && m.overrides.equals(overrides);
    }

    @Override
    public int hashCode() {
        return overrides.hashCode();
    }

    @Override
    public String toString() {
        return overrides.isEmpty() ? "HeaderMapping[recognised names]"
                : "HeaderMapping" + overrides.entrySet().stream().map(e -> e.getKey().key() + "=" + e.getValue())
                        .collect(Collectors.joining(",", "[", "]"));
    }
}
