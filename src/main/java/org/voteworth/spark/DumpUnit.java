package org.voteworth.spark;

import java.io.Serializable;
import java.nio.file.Path;
import org.voteworth.source.DumpFile;

/**
 * One dump file as a unit of cluster work: where Spark reads it, how reports name it, and its
 * category from the file name (worked out on the driver, so a name the pattern does not match
 * stops the run before any task starts).
 *
 * @param index position in the sorted input list: the order of the reconciliation and the rejects
 * @param uri the fully qualified location, e.g. {@code hdfs://nn/dump/books.tsv.gz}
 * @param name how reports and the rejects file name it: the local path for {@code file:} inputs, else the URI
 * @param category the category taken from the file name
 * @param sizeBytes size as stored
 * @param modified last modification, milliseconds since the epoch
 */
record DumpUnit(int index, String uri, String name, String category, long sizeBytes, long modified)
        implements Serializable {
    /** The file as the project's scanner sees it. */
    DumpFile file() {
        Path p = Path.of(name);
        return new DumpFile(p, category, DumpFile.Compression.of(p), sizeBytes);
    }
}
