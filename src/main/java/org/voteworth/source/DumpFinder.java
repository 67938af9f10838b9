package org.voteworth.source;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;

/**
 * Turns the inputs as the command line gets them into the dump files to read, sorted by path,
 * each once. An input is a file (taken as it is), a folder (searched recursively for
 * {@code *.tsv}, {@code *.csv}, {@code *.txt} and their {@code .gz}, {@code .zst} and {@code .bz2} forms) or a glob such as
 * {@code dump/*.tsv.gz} or {@code dump/**}{@code /part-*.tsv} ({@code **} crosses folders and
 * also matches none). An input that matches nothing is an error naming it.
 */
public final class DumpFinder {
    /** File name endings a folder search picks up. */
    public static final List<String> EXTENSIONS = List.of(".tsv", ".csv", ".txt", ".tsv.gz", ".csv.gz", ".txt.gz",
            ".tsv.zst", ".csv.zst", ".txt.zst", ".tsv.bz2", ".csv.bz2", ".txt.bz2");

    private DumpFinder() {
    }

    /**
     * @param inputs files, folders and globs, relative to the working directory
     * @param categories how each file's category is read from its name
     * @throws DumpFormatException naming an input that matches no file
     * @throws IOException when a folder cannot be listed
     */
    public static List<DumpFile> find(List<String> inputs, CategoryFromName categories) throws IOException {
        return find(inputs, categories, Path.of(""));
    }

    /** As {@link #find(List, CategoryFromName)}, with relative inputs taken under {@code base}. */
    static List<DumpFile> find(List<String> inputs, CategoryFromName categories, Path base) throws IOException {
        if (inputs.isEmpty()) {
            throw new DumpFormatException("(no input)", 0, "no dump files given: name files, folders or globs such as dump/*.tsv.gz");
        }
        Map<Path, Path> found = new LinkedHashMap<>();
        for (String input : inputs) {
            List<Path> matched = matches(input, base);
            for (Path p : matched) {
                found.putIfAbsent(p.toAbsolutePath().normalize(), p);
            }
        }
        List<DumpFile> files = new ArrayList<>(found.size());
        for (Path p : found.values().stream().sorted(Comparator.comparing(Path::toString)).toList()) {
            files.add(new DumpFile(p, categories.categoryOf(p), DumpFile.Compression.of(p), size(p)));
        }
        return List.copyOf(files);
    }

    private static List<Path> matches(String input, Path base) throws IOException {
        if (isGlob(input)) {
            List<Path> m = glob(input, base);
            if (m.isEmpty()) {
                throw new DumpFormatException(input, 0, "the pattern matches no file");
            }
            return m;
        }
        Path p = base.resolve(input).normalize();
        if (Files.isDirectory(p)) {
            List<Path> m = walk(p, Integer.MAX_VALUE, DumpFinder::isDumpName);
            if (m.isEmpty()) {
                throw new DumpFormatException(input, 0, "the folder holds no dump files (names ending in "
                        + String.join(", ", EXTENSIONS) + ")");
            }
            return m;
        }
        if (Files.isRegularFile(p)) {
            return List.of(p);
        }
        throw new DumpFormatException(input, 0, Files.exists(p) ? "not a regular file or folder" : "no such file or folder");
    }

    private static boolean isGlob(String s) {
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (c == '*' || c == '?' || c == '[' || c == '{') {
                return true;
            }
        }
        return false;
    }

    /** Walks from the glob's last folder without wildcards and keeps the files the glob matches. */
    private static List<Path> glob(String input, Path base) throws IOException {
        String g = input.replace('\\', '/');
        int wild = 0;
        while (wild < g.length() && "*?[{".indexOf(g.charAt(wild)) < 0) {
            wild++;
        }
        int slash = g.lastIndexOf('/', wild);
        String literal = slash < 0 ? "" : g.substring(0, slash + 1);
        String rest = slash < 0 ? g : g.substring(slash + 1);
        Path root = base.resolve(literal.isEmpty() ? "." : literal).normalize();
        if (!Files.isDirectory(root)) {
            return List.of();
        }
        String rootGlob = escapeGlob(root.toAbsolutePath().normalize().toString().replace('\\', '/'));
        String prefix = rootGlob.endsWith("/") ? rootGlob : rootGlob + "/";
        List<PathMatcher> matchers = new ArrayList<>();
        matchers.add(FileSystems.getDefault().getPathMatcher("glob:" + prefix + rest));
        // "**/" also matches no folder at all, as in shells with globstar.
        String zeroDirs = rest.replace("**/", "");
        if (!zeroDirs.equals(rest)) {
            matchers.add(FileSystems.getDefault().getPathMatcher("glob:" + prefix + zeroDirs));
        }
        int depth = rest.contains("**") ? Integer.MAX_VALUE : rest.split("/").length;
        return walk(root, depth, p -> {
            Path abs = p.toAbsolutePath().normalize();
            return matchers.stream().anyMatch(m -> m.matches(abs));
        });
    }

    private static String escapeGlob(String s) {
        StringBuilder b = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if ("*?[]{}\\".indexOf(c) >= 0) {
                b.append('\\');
            }
            b.append(c);
        }
        return b.toString();
    }

    private static List<Path> walk(Path root, int depth, java.util.function.Predicate<Path> keep) throws IOException {
        try (Stream<Path> s = Files.walk(root, depth)) {
            return s.filter(Files::isRegularFile).filter(keep).toList();
        } catch (UncheckedIOException e) {
            throw new IOException("cannot list " + root + ": " + e.getCause().getMessage(), e.getCause());
        } catch (IOException e) {
            throw new IOException("cannot list " + root + ": " + e.getMessage(), e);
        }
    }

    /** Whether a folder search picks up {@code p}: its name ends in one of {@link #EXTENSIONS}. */
    public static boolean isDumpName(Path p) {
        String n = p.getFileName().toString().toLowerCase(Locale.ROOT);
        for (String ext : EXTENSIONS) {
            if (n.endsWith(ext)) {
                return true;
            }
        }
        return false;
    }

    private static long size(Path p) throws IOException {
        try {
            return Files.size(p);
        } catch (IOException e) {
            throw new IOException("cannot read the size of " + p + ": " + e.getMessage(), e);
        }
    }
}
