package org.voteworth.spark;

import java.io.FileNotFoundException;
import java.io.IOException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.hadoop.conf.Configuration;
import org.apache.hadoop.fs.FileStatus;
import org.apache.hadoop.fs.FileSystem;
import org.apache.hadoop.fs.LocatedFileStatus;
import org.apache.hadoop.fs.Path;
import org.apache.hadoop.fs.RemoteIterator;
import org.voteworth.source.CategoryFromName;
import org.voteworth.source.DumpFinder;
import org.voteworth.source.DumpFormatException;

/**
 * The cluster job's inputs as dump files on any file system Hadoop reads ({@code file:},
 * {@code hdfs:}, {@code s3a:}, ...), with the rules of {@link DumpFinder}: a file is taken as it
 * is, a folder is searched recursively for the dump name endings, a glob keeps what it matches
 * (Hadoop glob syntax: {@code *}, {@code ?}, {@code [ab]}, {@code {a,b}}; {@code **} does not
 * cross folders). Sorted by name, each file once; an input matching nothing is an error naming it.
 */
final class SparkInputs {
    private SparkInputs() {
    }

    static List<DumpUnit> find(List<String> inputs, CategoryFromName categories, Configuration conf) throws IOException {
        if (inputs.isEmpty()) {
            throw new DumpFormatException("(no input)", 0, "no dump files given: name files, folders or globs such as dump/*.tsv.gz");
        }
        Map<String, FileStatus> found = new LinkedHashMap<>();
        for (String input : inputs) {
            for (FileStatus s : matches(input, conf)) {
                found.putIfAbsent(s.getPath().toString(), s);
            }
        }
        List<FileStatus> sorted = found.values().stream().sorted(Comparator.comparing(SparkInputs::name)).toList();
        List<DumpUnit> units = new ArrayList<>(sorted.size());
        for (FileStatus s : sorted) {
            String name = name(s);
            units.add(new DumpUnit(units.size(), s.getPath().toString(), name, categories.categoryOf(java.nio.file.Path.of(name)),
                    s.getLen(), s.getModificationTime()));
        }
        return List.copyOf(units);
    }

    /** The local path for {@code file:} inputs (as the local engine names them), else the full URI. */
    static String name(FileStatus s) {
        java.net.URI u = s.getPath().toUri();
        return "file".equals(u.getScheme()) ? u.getPath() : u.toString();
    }

    private static List<FileStatus> matches(String input, Configuration conf) throws IOException {
        Path p = new Path(input);
        FileSystem fs = p.getFileSystem(conf);
        if (isGlob(input)) {
            FileStatus[] m = fs.globStatus(p);
            List<FileStatus> files = new ArrayList<>();
            for (FileStatus s : m == null ? new FileStatus[0] : m) {
                if (s.isFile()) {
                    files.add(s);
                }
            }
            if (files.isEmpty()) {
                throw new DumpFormatException(input, 0, "the pattern matches no file");
            }
            return files;
        }
        FileStatus s;
        try {
            s = fs.getFileStatus(p);
        } catch (FileNotFoundException e) {
            throw new DumpFormatException(input, 0, "no such file or folder");
        }
        if (s.isFile()) {
            return List.of(s);
        }
        List<FileStatus> files = new ArrayList<>();
        RemoteIterator<LocatedFileStatus> it = fs.listFiles(s.getPath(), true);
        while (it.hasNext()) {
            LocatedFileStatus f = it.next();
            if (DumpFinder.isDumpName(java.nio.file.Path.of(f.getPath().getName()))) {
                files.add(f);
            }
        }
        if (files.isEmpty()) {
            throw new DumpFormatException(input, 0, "the folder holds no dump files (names ending in "
                    + String.join(", ", DumpFinder.EXTENSIONS) + ")");
        }
        return files;
    }

    private static boolean isGlob(String s) {
        return s.chars().anyMatch(c -> c == '*' || c == '?' || c == '[' || c == '{');
    }
}
