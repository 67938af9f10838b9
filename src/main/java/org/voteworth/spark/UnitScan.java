package org.voteworth.spark;

import java.io.IOException;
import java.io.InputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.NoSuchElementException;
import org.apache.hadoop.fs.FSDataInputStream;
import org.apache.hadoop.fs.FileSystem;
import org.apache.hadoop.fs.Path;
import org.apache.spark.api.java.function.FlatMapFunction;
import org.apache.spark.broadcast.Broadcast;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;
import org.apache.spark.util.SerializableConfiguration;
import org.voteworth.source.DumpScanner;
import org.voteworth.source.FileReport;
import org.voteworth.tally.TallyTable;

/**
 * The task of the cluster job: scans whole dump files with the project's own
 * {@link DumpScanner} (header mapping, row parser, validation, reject reasons and the per-file
 * reject limit exactly as {@code voteworth tally} applies them) into a {@link TallyTable}, and
 * emits, per file, one report row (counts, fingerprint, reviews and stars per category), its
 * rejects in line order, then its partial tallies.
 *
 * <p>A file is one unit: compressed files cannot be split anyway, and a whole file keeps every
 * line number exact and the reject limit checked on the file as a whole.
 */
final class UnitScan implements FlatMapFunction<Iterator<DumpUnit>, Row> {
    private static final long serialVersionUID = 1L;

    static final int TALLY = 0;
    static final int REJECT = 1;
    static final int REPORT = 2;
    /** The bytes hashed at each end of a file for the manifest's sha256HeadTail. */
    static final int HEAD_TAIL = 64 << 10;

    private static final StructType COUNT = new StructType(new StructField[] {
        DataTypes.createStructField("reason", DataTypes.StringType, false),
        DataTypes.createStructField("rows", DataTypes.LongType, false)});
    static final StructType REJECT_SCHEMA = new StructType(new StructField[] {
        DataTypes.createStructField("line", DataTypes.LongType, false),
        DataTypes.createStructField("field", DataTypes.StringType, false),
        DataTypes.createStructField("reason", DataTypes.StringType, false),
        DataTypes.createStructField("value", DataTypes.StringType, false),
        DataTypes.createStructField("message", DataTypes.StringType, false),
        DataTypes.createStructField("row", DataTypes.BinaryType, false)});
    private static final StructType CATEGORY_COUNT = new StructType(new StructField[] {
        DataTypes.createStructField("category", DataTypes.StringType, false),
        DataTypes.createStructField("reviews", DataTypes.LongType, false),
        DataTypes.createStructField("stars", DataTypes.createArrayType(DataTypes.LongType, false), false)});
    static final StructType REPORT_SCHEMA = new StructType(new StructField[] {
        DataTypes.createStructField("rows_read", DataTypes.LongType, false),
        DataTypes.createStructField("accepted", DataTypes.LongType, false),
        DataTypes.createStructField("rejected", DataTypes.LongType, false),
        DataTypes.createStructField("reasons", DataTypes.createArrayType(COUNT, false), false),
        DataTypes.createStructField("no_header", DataTypes.BooleanType, false),
        DataTypes.createStructField("sha256_head_tail", DataTypes.StringType, false),
        DataTypes.createStructField("categories", DataTypes.createArrayType(CATEGORY_COUNT, false), false)});
    /** One output row: its kind, the file's index, and the part that kind fills. */
    static final StructType SCHEMA = new StructType(new StructField[] {
        DataTypes.createStructField("kind", DataTypes.IntegerType, false),
        DataTypes.createStructField("unit", DataTypes.IntegerType, false),
        DataTypes.createStructField("tally", TallyRows.SCHEMA, true),
        DataTypes.createStructField("reject", REJECT_SCHEMA, true),
        DataTypes.createStructField("report", REPORT_SCHEMA, true)});

    private final ReadSettings settings;
    private final Broadcast<SerializableConfiguration> conf;

    UnitScan(ReadSettings settings, Broadcast<SerializableConfiguration> conf) {
        this.settings = settings;
        this.conf = conf;
    }

    @Override
    public Iterator<Row> call(Iterator<DumpUnit> units) {
        DumpScanner scanner = new DumpScanner(settings.options());
        return new Iterator<>() {
            private Iterator<Row> current = java.util.Collections.emptyIterator();

            @Override
            public boolean hasNext() {
                while (!current.hasNext() && units.hasNext()) {
                    current = scan(scanner, units.next());
                }
                return current.hasNext();
            }

            @Override
            public Row next() {
                if (!hasNext()) {
                    throw new NoSuchElementException();
                }
                return current.next();
            }
        };
    }

    /** The report and rejects of one file, then its tallies made row by row as they are consumed. */
    private Iterator<Row> scan(DumpScanner scanner, DumpUnit u) {
        try {
            Path path = new Path(u.uri());
            FileSystem fs = path.getFileSystem(conf.value().value());
            TallyTable table = new TallyTable();
            List<Row> head = new ArrayList<>();
            head.add(null);
            CategoryCounts categories = new CategoryCounts(table);
            FileReport r = scanner.scan(u.file(), fs.open(path), categories, (file, line, reject, row, s, e) ->
                    head.add(RowFactory.create(REJECT, u.index(), null, RowFactory.create(line, reject.field(),
                            reject.reason(), reject.value(), reject.message(), Arrays.copyOfRange(row, s, e)), null)));
            List<Row> reasons = new ArrayList<>();
            for (Map.Entry<String, Long> e : r.rejectsByReason().entrySet()) {
                reasons.add(RowFactory.create(e.getKey(), e.getValue()));
            }
            List<Row> byCategory = new ArrayList<>();
            for (int c = 0; c < categories.size(); c++) {
                long[] n = categories.counts(c);
                List<Long> stars = List.of(n[1], n[2], n[3], n[4], n[5]);
                byCategory.add(RowFactory.create(categories.name(c), n[0], seq(stars)));
            }
            head.set(0, RowFactory.create(REPORT, u.index(), null, null, RowFactory.create(r.rowsRead(), r.accepted(),
                    r.rejected(), seq(reasons), r.noHeader(), headTail(fs, path, u), seq(byCategory))));
            Iterator<Row> first = head.iterator();
            return new Iterator<>() {
                private int slot;

                @Override
                public boolean hasNext() {
                    return first.hasNext() || slot < table.size();
                }

                @Override
                public Row next() {
                    if (first.hasNext()) {
                        return first.next();
                    }
                    if (slot >= table.size()) {
                        throw new NoSuchElementException();
                    }
                    return RowFactory.create(TALLY, u.index(), TallyRows.row(table.get(slot++)), null, null);
                }
            };
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(u.name() + ": " + e.getMessage(), e);
        }
    }

    /** A Java list as the Scala sequence Spark's rows take for an array column. */
    static <T> scala.collection.Seq<T> seq(List<T> list) {
        return scala.jdk.javaapi.CollectionConverters.asScala(list).toSeq();
    }

    /**
     * SHA-256 over the first {@value #HEAD_TAIL} bytes of the file as stored and the last
     * {@value #HEAD_TAIL} bytes after them (the whole file, once, when it is at most twice that):
     * a cheap fingerprint that tells a replaced or grown file from the one tallied.
     */
    static String headTail(FileSystem fs, Path path, DumpUnit u) throws IOException {
        MessageDigest sha;
        try {
            sha = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java runtime has SHA-256", e);
        }
        long size = u.sizeBytes();
        long head = Math.min(size, HEAD_TAIL);
        long tailStart = Math.max(head, size - HEAD_TAIL);
        try (FSDataInputStream in = fs.open(path)) {
            digest(in, head, sha);
            in.seek(tailStart);
            digest(in, size - tailStart, sha);
        }
        return HexFormat.of().formatHex(sha.digest());
    }

    private static void digest(InputStream in, long n, MessageDigest sha) throws IOException {
        byte[] b = new byte[8192];
        long left = n;
        while (left > 0) {
            int r = in.read(b, 0, (int) Math.min(b.length, left));
            if (r < 0) {
                throw new IOException("the file ended " + left + " bytes early while fingerprinting it");
            }
            sha.update(b, 0, r);
            left -= r;
        }
    }
}
