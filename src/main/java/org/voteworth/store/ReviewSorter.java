package org.voteworth.store;

import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.PriorityQueue;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import org.apache.parquet.hadoop.ParquetReader;
import org.apache.parquet.hadoop.ParquetWriter;
import org.voteworth.source.ReviewRow;
import org.voteworth.source.ReviewSink;

/**
 * Sorts every review into the store's order within a memory budget: each scanning worker fills a
 * buffer of {@link ReviewRecord}s; a full buffer is sorted and written as one run file per part
 * into the temp folder; at the end each part's runs (and, when appending, the part already in
 * the store) are merged into {@code reviews/part-NNNNN.parquet}. Peak memory is the buffers plus
 * one read buffer per run, whatever the input size.
 */
final class ReviewSorter implements AutoCloseable {
    private static final int IO_BUFFER = 1 << 16;
    private final int parts;
    private final long budget;
    private final Path tmp;
    private final Categories categories;
    private final List<Buffer> buffers = new ArrayList<>();
    private int runs;

    /**
     * @param budgetBytes what all buffers together may hold
     * @param tmp an empty folder of its own, deleted by {@link #close()}
     * @param categories the store's category numbering
     */
    ReviewSorter(int parts, long budgetBytes, Path tmp, Categories categories) {
        this.parts = parts;
        this.budget = budgetBytes;
        this.tmp = tmp;
        this.categories = categories;
    }

    /** A buffer for one scanning worker. */
    synchronized Buffer newBuffer() {
        Buffer b = new Buffer();
        buffers.add(b);
        return b;
    }

    private synchronized long perBuffer() {
        return Math.max(64 << 10, budget / Math.max(1, buffers.size()));
    }

    private synchronized int nextRun() {
        return runs++;
    }

    /** Sorted runs written so far (0 when every buffer fitted until the end). */
    synchronized int runs() {
        return runs;
    }

    /** Per category: reviews and the star histogram (index 1..5), summed over the buffers. */
    long[][] categoryStats() {
        long[][] all = new long[categories.size()][7];
        for (Buffer b : buffers) {
            for (int c = 0; c < b.stats.length; c++) {
                for (int k = 0; k < 7; k++) {
                    all[c][k] += b.stats[c][k];
                }
            }
        }
        return all;
    }

    /** One scanning worker's rows; rows go in through {@link #accept}, after {@link #piece} said where they come from. */
    final class Buffer implements ReviewSink {
        private byte[] arena = new byte[1 << 16];
        private int used;
        private int[] offsets = new int[1 << 12];
        private int count;
        private int file;
        private long piece;
        private final Categories.Cache cache = categories.cache();
        private long[][] stats = new long[0][7];

        /** The rows that follow are from store file number {@code file}, the piece starting at byte {@code start}. */
        void piece(int storeFile, long start) {
            this.file = storeFile;
            this.piece = start;
        }

        @Override
        public void accept(ReviewRow row) {
            int cat = cache.id(row.categoryBuf, row.categoryOff, row.categoryLen);
            if (cat >= stats.length) {
                stats = Arrays.copyOf(stats, cat + 1);
                for (int c = 0; c < stats.length; c++) {
                    if (stats[c] == null) {
                        stats[c] = new long[7];
                    }
                }
            }
            stats[cat][0]++;
            if (row.stars >= 1 && row.stars <= 5) {
                stats[cat][row.stars]++;
            }
            int need = ReviewRecord.size(row);
            if (used + need > arena.length) {
                arena = Arrays.copyOf(arena, Math.max(arena.length * 2, used + need));
            }
            if (count == offsets.length) {
                offsets = Arrays.copyOf(offsets, count * 2);
            }
            offsets[count++] = used;
            int part = ReviewerHash.part(row.buf, row.reviewerOff, row.reviewerLen, parts);
            used = ReviewRecord.encode(row, part, file, piece, cat, arena, used);
            if (used + 4L * count > perBuffer()) {
                try {
                    spill();
                } catch (IOException e) {
                    throw new UncheckedIOException("cannot write sorted reviews to " + tmp + ": " + e.getMessage()
                            + " (free some space there, point --tmp elsewhere, or raise --memory)", e);
                }
            }
        }

        /** Sorts what is buffered and writes it as one run per part. */
        void spill() throws IOException {
            if (count == 0) {
                return;
            }
            int[] order = sorted(offsets, count, arena);
            int run = nextRun();
            DataOutputStream out = null;
            int openPart = -1;
            try {
                for (int at : order) {
                    int p = ReviewRecord.part(arena, at);
                    if (p != openPart) {
                        if (out != null) {
                            out.writeInt(0);
                            out.close();
                        }
                        out = new DataOutputStream(new BufferedOutputStream(Files.newOutputStream(runFile(run, p)), IO_BUFFER));
                        openPart = p;
                    }
                    int len = ReviewRecord.length(arena, at);
                    out.writeInt(len);
                    out.write(arena, at, len);
                }
                out.writeInt(0);
            } finally {
                if (out != null) {
                    out.close();
                }
            }
            used = 0;
            count = 0;
            if (arena.length > 1 << 24) {
                arena = new byte[1 << 16];
                offsets = new int[1 << 12];
            }
        }
    }

    private Path runFile(int run, int part) {
        return tmp.resolve(String.format(Locale.ROOT, "run-%06d-p%05d.bin", run, part));
    }

    /**
     * The offsets of the first {@code count} records of {@code b}, in {@link ReviewRecord#compare}
     * order: a merge sort on a prefix key (part and the reviewer id's first six bytes) that falls back
     * to the whole comparison only when the keys are equal.
     */
    static int[] sorted(int[] offsets, int count, byte[] b) {
        long[] key = new long[count];
        for (int i = 0; i < count; i++) {
            key[i] = ReviewRecord.prefixKey(b, offsets[i]);
        }
        int[] a = new int[count];
        for (int i = 0; i < count; i++) {
            a[i] = i;
        }
        sort(a, new int[count], 0, count, key, offsets, b);
        for (int i = 0; i < count; i++) {
            a[i] = offsets[a[i]];
        }
        return a;
    }

    private static int compare(int x, int y, long[] key, int[] off, byte[] b) {
        int c = Long.compareUnsigned(key[x], key[y]);
        return c != 0 ? c : ReviewRecord.compare(b, off[x], b, off[y]);
    }

    private static void sort(int[] a, int[] t, int lo, int hi, long[] key, int[] off, byte[] b) {
        if (hi - lo <= 16) {
            for (int i = lo + 1; i < hi; i++) {
                int x = a[i];
                int j = i - 1;
                while (j >= lo && compare(a[j], x, key, off, b) > 0) {
                    a[j + 1] = a[j];
                    j--;
                }
                a[j + 1] = x;
            }
            return;
        }
        int mid = (lo + hi) >>> 1;
        sort(a, t, lo, mid, key, off, b);
        sort(a, t, mid, hi, key, off, b);
        if (compare(a[mid - 1], a[mid], key, off, b) <= 0) {
            return;
        }
        System.arraycopy(a, lo, t, lo, hi - lo);
        int i = lo;
        int j = mid;
        for (int k = lo; k < hi; k++) {
            if (j >= hi || (i < mid && compare(t[i], t[j], key, off, b) <= 0)) {
                a[k] = t[i++];
            } else {
                a[k] = t[j++];
            }
        }
    }

    /** A sorted stream of records: a run file, or a part already in the store. */
    private abstract static class Source implements AutoCloseable {
        byte[] rec = new byte[256];

        /** Loads the next record into {@link #record()}; false at the end. */
        abstract boolean advance() throws IOException;

        final byte[] record() {
            return rec;
        }

        @Override
        public abstract void close() throws IOException;
    }

    private static final class RunSource extends Source {
        private final DataInputStream in;

        RunSource(Path f) throws IOException {
            in = new DataInputStream(new BufferedInputStream(Files.newInputStream(f), IO_BUFFER));
        }

        @Override
        boolean advance() throws IOException {
            int len = in.readInt();
            if (len == 0) {
                return false;
            }
            if (rec.length < len) {
                rec = new byte[Math.max(len, 2 * rec.length)];
            }
            in.readFully(rec, 0, len);
            return true;
        }

        @Override
        public void close() throws IOException {
            in.close();
        }
    }

    /** The rows of a part already in the store, as records (file numbers from the manifest, lines as stored). */
    private final class StoredSource extends Source {
        private final ParquetReader<StoredReview> reader;
        private final int part;
        private final java.util.function.ToIntFunction<String> fileNumber;
        private final Path path;
        private byte[] ids = new byte[256];

        StoredSource(Path path, int part, java.util.function.ToIntFunction<String> fileNumber) throws IOException {
            this.path = path;
            this.reader = ParquetFiles.reader(path, ReviewColumns.reading(null), org.apache.parquet.filter2.compat.FilterCompat.NOOP);
            this.part = part;
            this.fileNumber = fileNumber;
        }

        @Override
        boolean advance() throws IOException {
            StoredReview r = Store.read(reader, path);
            if (r == null) {
                return false;
            }
            byte[] a = r.reviewer().getBytes(StandardCharsets.UTF_8);
            byte[] b = r.review().getBytes(StandardCharsets.UTF_8);
            byte[] c = r.item().getBytes(StandardCharsets.UTF_8);
            int n = a.length + b.length + c.length;
            if (ids.length < n) {
                ids = new byte[2 * n];
            }
            System.arraycopy(a, 0, ids, 0, a.length);
            System.arraycopy(b, 0, ids, a.length, b.length);
            System.arraycopy(c, 0, ids, a.length + b.length, c.length);
            if (rec.length < n + 64) {
                rec = new byte[2 * n + 64];
            }
            byte[] cat = r.category().getBytes(StandardCharsets.UTF_8);
            ReviewRecord.encode(part, r.epochDay(), fileNumber.applyAsInt(r.file()), 0, r.line(), ids, 0, a.length, a.length,
                    b.length, a.length + b.length, c.length, categories.id(cat, 0, cat.length), r.stars(), r.verified(),
                    r.incentivised(), r.helpfulVotes(), r.totalVotes(), rec, 0, path.toString());
            return true;
        }

        @Override
        public void close() throws IOException {
            reader.close();
        }
    }

    /**
     * Spills what the buffers still hold and writes every part, {@code threads} at a time, merging
     * its runs with {@code old.apply(part)} when that file exists (an append).
     *
     * @param files the store's file names by file number
     * @param fileNumber a stored file name's number, for rows of old parts
     * @return reviews written per part
     */
    long[] writeParts(Path reviewsDir, List<String> files, LineBases lines, java.util.function.IntFunction<Path> old,
                      java.util.function.ToIntFunction<String> fileNumber, int threads) throws IOException {
        for (Buffer b : buffers) {
            b.spill();
        }
        Files.createDirectories(reviewsDir);
        List<String> names = categories.names();
        long[] written = new long[parts];
        ExecutorService pool = Executors.newFixedThreadPool(Math.max(1, Math.min(threads, parts)), r -> {
            Thread t = new Thread(r, "store-part");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Future<Long>> done = new ArrayList<>();
            for (int p = 0; p < parts; p++) {
                int part = p;
                done.add(pool.submit(() -> writePart(part, Store.partFile(reviewsDir, part), names, files, lines, old.apply(part),
                        fileNumber)));
            }
            for (int p = 0; p < parts; p++) {
                written[p] = Store.await(done.get(p));
            }
        } finally {
            pool.shutdownNow();
        }
        return written;
    }

    private long writePart(int part, Path target, List<String> names, List<String> files, LineBases lines, Path old,
                           java.util.function.ToIntFunction<String> fileNumber) throws IOException {
        List<Source> sources = new ArrayList<>();
        Path partial = target.resolveSibling("." + target.getFileName() + ".partial");
        try {
            String suffix = String.format(Locale.ROOT, "-p%05d.bin", part);
            try (Stream<Path> s = Files.list(tmp)) {
                for (Path f : s.filter(f -> f.getFileName().toString().endsWith(suffix)).sorted().toList()) {
                    sources.add(new RunSource(f));
                }
            }
            if (old != null && Files.exists(old)) {
                sources.add(new StoredSource(old, part, fileNumber));
            }
            PriorityQueue<Source> heads = new PriorityQueue<>(Comparator.comparing(Source::record,
                    (x, y) -> ReviewRecord.compare(x, 0, y, 0)));
            for (Source s : sources) {
                if (s.advance()) {
                    heads.add(s);
                }
            }
            long n = 0;
            ReviewColumns.Cursor c = new ReviewColumns.Cursor();
            try (ParquetWriter<ReviewColumns.Cursor> w = ParquetFiles.writer(partial, new ReviewColumns.Writing(names, files, lines))) {
                while (!heads.isEmpty()) {
                    Source s = heads.poll();
                    c.b = s.record();
                    c.at = 0;
                    w.write(c);
                    n++;
                    if (s.advance()) {
                        heads.add(s);
                    }
                }
            }
            Files.move(partial, target, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
            return n;
        } finally {
            for (Source s : sources) {
                s.close();
            }
            Files.deleteIfExists(partial);
        }
    }

    /** Deletes the run files and the temp folder. */
    @Override
    public void close() throws IOException {
        if (!Files.exists(tmp)) {
            return;
        }
        try (Stream<Path> s = Files.walk(tmp)) {
            for (Path f : s.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(f);
            }
        }
    }
}
