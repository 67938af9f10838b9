package org.voteworth.spark;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.StandardCopyOption;
import org.apache.hadoop.conf.Configuration;
import org.apache.hadoop.fs.FileSystem;
import org.apache.hadoop.fs.Path;

/**
 * The store folder the cluster job writes, on any Hadoop file system. The small files the driver
 * writes itself (rejects, reconciliation, manifest, the optional CSV table) are made in a local
 * staging folder and then put in place; on a local store they are moved there, so no checksum
 * side files appear beside them.
 */
final class StoreOutput implements AutoCloseable {
    private final Path dir;
    private final FileSystem fs;
    private final java.nio.file.Path staging;

    private StoreOutput(Path dir, FileSystem fs, java.nio.file.Path staging) {
        this.dir = dir;
        this.fs = fs;
        this.staging = staging;
    }

    /** Creates the folder if needed. */
    static StoreOutput open(String dir, Configuration conf) throws IOException {
        Path p = new Path(dir);
        FileSystem fs = p.getFileSystem(conf);
        Path qualified = fs.makeQualified(p);
        if (fs.exists(qualified) && !fs.getFileStatus(qualified).isDirectory()) {
            throw new IOException(dir + ": the store must be a folder, but a file of that name exists");
        }
        if (!fs.mkdirs(qualified)) {
            throw new IOException("cannot create the store folder " + dir);
        }
        return new StoreOutput(qualified, fs, Files.createTempDirectory("voteworth-spark-"));
    }

    /** Where {@code name} goes in the store, as a URI Spark writes to. */
    String uri(String name) {
        return new Path(dir, name).toString();
    }

    /** The store folder as given to Spark, qualified. */
    String dir() {
        return dir.toString();
    }

    /** The local file the driver writes {@code name} into before {@link #publish}. */
    java.nio.file.Path staged(String name) {
        return staging.resolve(name);
    }

    /** Puts the staged {@code name} into the store, replacing what was there. */
    void publish(String name) throws IOException {
        Path target = new Path(dir, name);
        if ("file".equals(fs.getUri().getScheme())) {
            java.nio.file.Path local = java.nio.file.Path.of(target.toUri());
            Files.move(staged(name), local, StandardCopyOption.REPLACE_EXISTING);
        } else {
            fs.copyFromLocalFile(true, true, new Path(staged(name).toUri()), target);
        }
    }

    /** Removes {@code name} from the store if it is there. */
    void remove(String name) throws IOException {
        fs.delete(new Path(dir, name), true);
    }

    @Override
    public void close() throws IOException {
        try (java.util.stream.Stream<java.nio.file.Path> s = Files.walk(staging)) {
            for (java.nio.file.Path p : s.sorted(java.util.Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }
}
