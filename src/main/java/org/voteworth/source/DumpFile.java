package org.voteworth.source;

import java.nio.file.Path;

/**
 * One input file of a dump and the category its rows belong to when the dump has no category
 * column (taken from the file name, so part files of one category stay together).
 *
 * @param path the file
 * @param category category derived from the file name; the category column, when mapped, wins
 * @param compression how the bytes are stored
 * @param sizeBytes size on disk
 */
public record DumpFile(Path path, String category, Compression compression, long sizeBytes) {
    /** How a dump file is stored on disk, judged by its name. */
    public enum Compression {
        NONE, GZIP, ZSTD, BZIP2;

        public static Compression of(Path p) {
            String n = p.getFileName().toString().toLowerCase(java.util.Locale.ROOT);
            if (n.endsWith(".gz")) {
                return GZIP;
            }
            if (n.endsWith(".zst") || n.endsWith(".zstd")) {
                return ZSTD;
            }
            return n.endsWith(".bz2") ? BZIP2 : NONE;
        }

        /** The name people know the format by, for messages. */
        public String label() {
            return switch (this) {
                case NONE -> "plain";
                case GZIP -> "gzip";
                case ZSTD -> "zstd";
                case BZIP2 -> "bzip2";
            };
        }
    }

    @Override
    public String toString() {
        return path.toString();
    }
}
