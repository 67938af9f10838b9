package org.voteworth.demo;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.function.LongConsumer;
import java.util.regex.Pattern;
import java.util.zip.Deflater;
import java.util.zip.GZIPOutputStream;
import org.voteworth.score.MarsagliaTsangGamma;

/**
 * Writes a review dump of {@value #MARKETPLACE}, a fictional online marketplace: one
 * tab-separated file per product category (the largest split into numbered part files), with
 * the distributions of a real dump and, on request, {@link PlantedCases planted reviewers} and
 * {@link MalformedKind malformed rows} at known positions.
 *
 * <p>What the crowd looks like (shapes of the trade, see REFERENCES.md §7):
 * J-shaped stars (5★ 58 %, 4★ 14 %, 3★ 8 %, 2★ 6 %, 1★ 14 %); 70 % of reviews without votes and
 * a Pareto tail (index {@value #VOTE_TAIL}, capped at {@value #MAX_VOTES}) on the rest; reviews
 * per reviewer from {@link ReviewerPopulation}; each review's helpful votes
 * Binomial(T, p) with p ~ Beta(κs, κ(1−s)), κ = {@value #REVIEW_CONCENTRATION}, around the
 * reviewer's latent share s; 80 % verified, 0.4 % incentivised; dates 2019-2025 with a
 * year-end peak; text about nine tenths of the bytes.
 *
 * <p>Same seed and options give the same uncompressed bytes on every JVM (one seeded
 * {@link SplittableRandom}, {@link StrictMath}); compressed bytes also depend on the zlib
 * the JVM uses. Dumps estimated above {@value #FAST_GZIP_ABOVE} bytes are compressed at the
 * fastest level. Not thread-safe; a generator may be reused for several dumps.
 */
public final class DemoDumpGenerator {
    public static final String MARKETPLACE = "Quarrendale Market";
    /** The header row, in order. */
    public static final List<String> COLUMNS = List.of("reviewer_id", "review_id", "item_id", "category",
            "star_rating", "helpful_votes", "total_votes", "verified_purchase", "incentivised", "headline",
            "body", "review_date");

    /** Measured mean row size (554 bytes for 40,000 rows on the default seed), used only to plan. */
    static final int ESTIMATED_ROW_BYTES = 555;
    static final long PART_BYTES = 256L << 20;
    static final long FAST_GZIP_ABOVE = 64L << 20;
    static final int MIN_PARTS = 3;
    static final int MAX_PARTS = 99;
    static final int CHUNK_ROWS = 1 << 22;
    static final int PROGRESS_EVERY = 1 << 16;
    /** Shares of 1★ to 5★. */
    static final double[] STAR_SHARES = {0.14, 0.06, 0.08, 0.14, 0.58};
    static final double ZERO_VOTES = 0.70;
    static final double VOTE_TAIL = 1.15;
    static final long MAX_VOTES = 20_000;
    static final double REVIEW_CONCENTRATION = 40;
    static final double VERIFIED = 0.80;
    static final double INCENTIVISED = 0.004;
    /** Each planted or malformed row needs this many ordinary rows around it. */
    static final int ROWS_PER_SPECIAL = 5;

    /** Crowd reviewer ids are 8 digits from a bijective mix of a 26-bit index. */
    private static final int REVIEWER_BITS = 26;
    /** Review ids are 10 digits from a bijective mix of a 33-bit row counter. */
    private static final int REVIEW_BITS = 33;
    /** The malformed rows' reviewers count down from the top index, so they never share a crowd id. */
    private static final long SPARE_REVIEWERS = (1L << REVIEWER_BITS) - 1;
    private static final long MAX_CROWD_REVIEWERS = SPARE_REVIEWERS - 1_000;

    private static final Pattern DUMP_NAME;

    static {
        StringBuilder slugs = new StringBuilder();
        for (MarketCategory c : MarketCategory.ALL) {
            slugs.append(slugs.length() == 0 ? "" : "|").append(Pattern.quote(c.slug()));
        }
        DUMP_NAME = Pattern.compile("(" + slugs + ")(\\.part-\\d{2})?\\.tsv(\\.gz)?");
    }

    private final LongConsumer progress;

    public DemoDumpGenerator() {
        this(rows -> { });
    }

    /** @param progress told the number of rows written every {@value #PROGRESS_EVERY} rows and at the end */
    public DemoDumpGenerator(LongConsumer progress) {
        this.progress = java.util.Objects.requireNonNull(progress, "progress");
    }

    /**
     * Writes a dump into {@code dir}, creating it if needed. Earlier demo dump files in it
     * (category slugs, {@code .tsv} or {@code .tsv.gz}) are replaced and a {@code README.md} is
     * kept; anything else makes it refuse.
     *
     * @throws IOException when {@code dir} holds other files, or on a write error
     * @throws IllegalArgumentException when the dump is too small for its planted rows
     */
    public GeneratedDump generate(Path dir, DemoOptions o) throws IOException {
        Run run = new Run(dir, o, progress);
        prepare(dir);
        return run.write();
    }

    /** Part files for the largest category: one per {@value #PART_BYTES} bytes, 3 to 99. */
    static int partsFor(double largestCategoryBytes) {
        return (int) Math.max(MIN_PARTS, Math.min(MAX_PARTS, Math.ceil(largestCategoryBytes / PART_BYTES)));
    }

    static boolean isDumpFileName(String name) {
        return DUMP_NAME.matcher(name).matches();
    }

    private static void prepare(Path dir) throws IOException {
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new IOException("Cannot write the demo dump to " + dir + ": it is a file. Give a new or empty folder.");
        }
        Files.createDirectories(dir);
        List<Path> stale = new ArrayList<>();
        try (DirectoryStream<Path> entries = Files.newDirectoryStream(dir)) {
            for (Path p : entries) {
                String n = p.getFileName().toString();
                boolean file = Files.isRegularFile(p);
                if (file && n.equals("README.md")) {
                    continue;
                }
                if (file && isDumpFileName(n)) {
                    stale.add(p);
                    continue;
                }
                throw new IOException("Refusing to write the demo dump into " + dir + ": it already holds '" + n
                        + "', which is not a demo dump file. Give a new or empty folder, or move it away.");
            }
        }
        for (Path p : stale) {
            Files.delete(p);
        }
    }

    /** A planted review or malformed row, waiting for its position. */
    private record Special(byte[] reviewer, long helpful, long total, MalformedKind kind, int variant) {
        boolean planted() {
            return kind == null;
        }
    }

    /** One output file and what has gone into it; bytes go out in chunks through the compressor. */
    private static final class Out {
        final Path path;
        final OutputStream stream;
        final CompressorThread compressor;
        byte[] chunk;
        int used;
        long lines;
        long bytes;

        Out(Path path, boolean gzip, int level, CompressorThread compressor) throws IOException {
            this.path = path;
            this.compressor = compressor;
            OutputStream file = Files.newOutputStream(path);
            if (!gzip) {
                this.stream = file;
                return;
            }
            try {
                this.stream = new GZIPOutputStream(file, 1 << 16) {
                    {
                        def.setLevel(level);
                    }
                };
            } catch (IOException e) {
                file.close();
                throw e;
            }
        }

        void write(byte[] b, int len, int rowLines) throws IOException {
            int off = 0;
            while (off < len) {
                if (chunk == null) {
                    chunk = compressor.chunk();
                }
                int n = Math.min(len - off, chunk.length - used);
                System.arraycopy(b, off, chunk, used, n);
                used += n;
                off += n;
                if (used == chunk.length) {
                    flush();
                }
            }
            bytes += len;
            lines += rowLines;
        }

        void write(RowBytes row, int rowLines) throws IOException {
            write(row.array(), row.length(), rowLines);
        }

        private void flush() throws IOException {
            if (chunk != null) {
                compressor.write(stream, chunk, used);
                chunk = null;
                used = 0;
            }
        }

        /** Hands over the last chunk and the close; the compressor does both in order. */
        void finish() throws IOException {
            flush();
            compressor.close(stream);
        }
    }

    /** State of one dump being written; every random draw comes from {@link #rng}, in order. */
    private static final class Run {
        final Path dir;
        final DemoOptions o;
        final LongConsumer progress;
        final SplittableRandom rng;
        final List<MarketCategory> categories;
        final byte[][] categoryNames;
        final double[] categoryCumulative;
        final int[] itemCount;
        final long estimatedRows;
        final ReviewText text;
        final ReviewDates dates = new ReviewDates();
        final RowBytes line = new RowBytes();
        final List<Out> outs = new ArrayList<>();
        final Out[][] outsByCategory;
        final int parts;
        final int level;
        long largestCategoryRows;
        long reviewSeq;
        long rows;
        long headerBytes;
        long nextReviewerIndex;
        long spareReviewer = SPARE_REVIEWERS;
        final Map<MalformedKind, Long> linesByKind = new LinkedHashMap<>();
        final List<GeneratedDump.PlantedLine> planted = new ArrayList<>();

        Run(Path dir, DemoOptions o, LongConsumer progress) {
            this.dir = dir;
            this.o = o;
            this.progress = progress;
            this.rng = new SplittableRandom(o.seed());
            this.categories = MarketCategory.first(o.categories());
            this.text = new ReviewText(categories);
            this.estimatedRows = o.sizedByRows() ? o.rows() : Math.max(1, o.targetBytes() / ESTIMATED_ROW_BYTES);
            int n = categories.size();
            categoryNames = new byte[n][];
            categoryCumulative = new double[n];
            itemCount = new int[n];
            double weights = categories.stream().mapToDouble(MarketCategory::weight).sum();
            double cum = 0;
            for (int c = 0; c < n; c++) {
                MarketCategory mc = categories.get(c);
                categoryNames[c] = mc.name().getBytes(StandardCharsets.UTF_8);
                cum += mc.weight() / weights;
                categoryCumulative[c] = cum;
                itemCount[c] = (int) Math.max(30, Math.min(99_999, estimatedRows * mc.weight() / weights / 5));
            }
            categoryCumulative[n - 1] = 1.0;
            outsByCategory = new Out[n][];
            parts = partsFor((double) estimatedRows * ESTIMATED_ROW_BYTES * categories.get(0).weight() / weights);
            boolean big = (double) estimatedRows * ESTIMATED_ROW_BYTES > FAST_GZIP_ABOVE;
            level = big ? Deflater.BEST_SPEED : Deflater.DEFAULT_COMPRESSION;
            int specials = specialCount();
            if ((long) specials * ROWS_PER_SPECIAL > estimatedRows) {
                throw new IllegalArgumentException("A demo dump of " + describeSize()
                        + " is too small for its " + specials + " planted and malformed rows: it needs at least "
                        + (long) specials * ROWS_PER_SPECIAL + " rows (about "
                        + (long) specials * ROWS_PER_SPECIAL * ESTIMATED_ROW_BYTES / 1000 + " kB)."
                        + " Ask for more rows, or turn the planted cases and malformed rows off.");
            }
        }

        GeneratedDump write() throws IOException {
            try (CompressorThread compressor = new CompressorThread(parts + categories.size() - 1)) {
                try {
                    openFiles(compressor);
                    writeRows();
                } finally {
                    finishAll();
                }
            }
            return summary();
        }

        /** Hands every file's last chunk and close to the compressor, even after a failure. */
        private void finishAll() throws IOException {
            IOException first = null;
            for (Out out : outs) {
                try {
                    out.finish();
                } catch (IOException e) {
                    first = first == null ? e : first;
                }
            }
            if (first != null) {
                throw first;
            }
        }

        private String describeSize() {
            return o.sizedByRows() ? o.rows() + " rows" : o.targetBytes() + " bytes";
        }

        private int specialCount() {
            int n = o.plantCases() ? PlantedCases.reviewCount() : 0;
            if (o.malformedRows()) {
                for (MalformedKind k : MalformedKind.values()) {
                    n += k.rowsPlanted();
                }
            }
            return n;
        }

        private void openFiles(CompressorThread compressor) throws IOException {
            String ext = o.gzip() ? ".tsv.gz" : ".tsv";
            byte[] header = (String.join("\t", COLUMNS) + "\n").getBytes(StandardCharsets.US_ASCII);
            for (int c = 0; c < categories.size(); c++) {
                int count = c == 0 ? parts : 1;
                outsByCategory[c] = new Out[count];
                for (int p = 0; p < count; p++) {
                    String slug = categories.get(c).slug();
                    String name = c == 0 ? slug + ".part-" + (p < 9 ? "0" : "") + (p + 1) + ext : slug + ext;
                    Out out = new Out(dir.resolve(name), o.gzip(), level, compressor);
                    outs.add(out);
                    outsByCategory[c][p] = out;
                    out.write(header, header.length, 0);
                    headerBytes += header.length;
                }
            }
        }

        private void writeRows() throws IOException {
            List<Special> specials = specials();
            for (int i = specials.size() - 1; i > 0; i--) {
                int j = rng.nextInt(i + 1);
                specials.set(i, specials.set(j, specials.get(i)));
            }
            int s = specials.size();
            long[] position = new long[s];
            for (int j = 0; j < s; j++) { // one position in each of s equal stretches
                long lo = j * estimatedRows / s;
                long hi = (j + 1) * estimatedRows / s;
                position[j] = lo + rng.nextLong(Math.max(1, hi - lo));
            }
            ReviewerPopulation pop = null;
            int next = 0;
            while (true) {
                if (o.sizedByRows()) {
                    if (rows == o.rows()) {
                        break;
                    }
                } else if (writtenBytes() + (s - next) * meanRowBytes() >= o.targetBytes()) {
                    break;
                }
                if (next < s && position[next] <= rows) {
                    writeSpecial(specials.get(next++));
                } else {
                    if (pop == null || pop.exhausted()) {
                        pop = ReviewerPopulation.draw(rng, nextReviewerIndex, chunkRows(s - next));
                        nextReviewerIndex += pop.size;
                        if (nextReviewerIndex > MAX_CROWD_REVIEWERS) {
                            throw new IllegalArgumentException("A demo dump of " + describeSize()
                                    + " needs more than " + MAX_CROWD_REVIEWERS + " reviewers, the most its 8-digit ids"
                                    + " can number; ask for a smaller dump.");
                        }
                    }
                    writeCrowd(pop);
                }
                if (++rows % PROGRESS_EVERY == 0) {
                    progress.accept(rows);
                }
            }
            while (next < s) { // sized by bytes: the rest of the planted rows close the dump
                writeSpecial(specials.get(next++));
                rows++;
            }
            progress.accept(rows);
        }

        private int chunkRows(int specialsLeft) {
            long left;
            if (o.sizedByRows()) {
                left = o.rows() - rows - specialsLeft;
            } else {
                left = Math.max(1024, (o.targetBytes() - writtenBytes()) / meanRowBytes() - specialsLeft + 1);
            }
            return (int) Math.max(1, Math.min(CHUNK_ROWS, left));
        }

        private long writtenBytes() {
            long b = 0;
            for (Out out : outs) {
                b += out.bytes;
            }
            return b;
        }

        private long meanRowBytes() {
            return rows < 1000 ? ESTIMATED_ROW_BYTES : Math.max(1, (writtenBytes() - headerBytes) / rows);
        }

        private List<Special> specials() {
            List<Special> list = new ArrayList<>();
            if (o.plantCases()) {
                for (PlantedCases.PlantedReviewer p : PlantedCases.all()) {
                    byte[] id = p.id().getBytes(StandardCharsets.US_ASCII);
                    long[][] split = p.id().equals(PlantedCases.VIRAL) ? splitViral(p) : split(p.reviews(), p.helpful(), p.total());
                    for (int r = 0; r < p.reviews(); r++) {
                        list.add(new Special(id, split[0][r], split[1][r], null, 0));
                    }
                }
            }
            if (o.malformedRows()) {
                for (MalformedKind k : MalformedKind.values()) {
                    for (int v = 0; v < k.rowsPlanted(); v++) {
                        byte[] id = ascii(Long.toString(reviewerNumber(spareReviewer--)));
                        long t = k == MalformedKind.HELPFUL_ABOVE_TOTAL ? 1 + rng.nextInt(20) : totalVotes();
                        long h = WaitingTimeBinomial.draw(rng, t, 0.75);
                        list.add(new Special(id, h, t, k, v));
                    }
                }
            }
            return list;
        }

        private long[][] splitViral(PlantedCases.PlantedReviewer p) {
            long[][] rest = split(p.reviews() - 1, p.helpful() - PlantedCases.VIRAL_TOP_HELPFUL,
                    p.total() - PlantedCases.VIRAL_TOP_TOTAL);
            long[][] out = new long[2][p.reviews()];
            out[0][0] = PlantedCases.VIRAL_TOP_HELPFUL;
            out[1][0] = PlantedCases.VIRAL_TOP_TOTAL;
            System.arraycopy(rest[0], 0, out[0], 1, p.reviews() - 1);
            System.arraycopy(rest[1], 0, out[1], 1, p.reviews() - 1);
            return out;
        }

        /** Splits H of T over n reviews: totals by exponential weights, misses at random votes. */
        private long[][] split(int n, long helpful, long total) {
            double[] w = new double[n];
            double sum = 0;
            for (int i = 0; i < n; i++) {
                w[i] = -StrictMath.log(1.0 - rng.nextDouble());
                sum += w[i];
            }
            long[] t = new long[n];
            long given = 0;
            for (int i = 0; i < n; i++) {
                t[i] = (long) (total * w[i] / sum);
                given += t[i];
            }
            while (given < total) {
                t[rng.nextInt(n)]++;
                given++;
            }
            long[] h = t.clone();
            for (long miss = total - helpful; miss > 0; ) {
                long vote = (long) (rng.nextDouble() * total);
                int i = 0;
                while (vote >= t[i]) {
                    vote -= t[i++];
                }
                if (h[i] > 0) {
                    h[i]--;
                    miss--;
                }
            }
            return new long[][] {h, t};
        }

        private void writeCrowd(ReviewerPopulation pop) throws IOException {
            int local = pop.nextReviewer();
            int c = category();
            int stars = stars();
            long t = totalVotes();
            long h = 0;
            if (t > 0) {
                double s = Math.max(1e-6, Math.min(1 - 1e-6, pop.share[local]));
                double p = MarsagliaTsangGamma.beta(rng, REVIEW_CONCENTRATION * s, REVIEW_CONCENTRATION * (1 - s));
                h = WaitingTimeBinomial.draw(rng, t, p);
            }
            boolean verified = rng.nextDouble() < VERIFIED;
            boolean incentivised = rng.nextDouble() < INCENTIVISED;
            line.clear();
            line.putDigits(reviewerNumber(pop.firstIndex + local), 8);
            rest(c, stars, h, t, verified, incentivised);
            out(c).write(line, 1);
        }

        private void writeSpecial(Special s) throws IOException {
            int c = category();
            int stars = stars();
            boolean verified = s.planted() || rng.nextDouble() < VERIFIED;
            boolean incentivised = !s.planted() && rng.nextDouble() < INCENTIVISED;
            line.clear();
            line.put(s.reviewer());
            rest(c, stars, s.helpful(), s.total(), verified, incentivised);
            int lines = 1;
            if (!s.planted()) {
                lines = plantDefect(s);
            }
            Out out = out(c);
            long first = out.lines + 2; // the header is line 1
            out.write(line, lines);
            if (!s.planted()) {
                for (int i = 0; i < lines; i++) {
                    planted.add(new GeneratedDump.PlantedLine(out.path, first + i, s.kind()));
                }
                linesByKind.merge(s.kind(), (long) lines, Long::sum);
            }
        }

        /** Everything after the reviewer id, ending with the line break. */
        private void rest(int c, int stars, long h, long t, boolean verified, boolean incentivised) {
            line.tab().put((byte) 'R').put((byte) 'V').putDigits(reviewNumber(reviewSeq++), 10);
            double u = rng.nextDouble();
            line.tab().put((byte) 'I').put((byte) 'T').putDigits(c * 100_000L + 1 + (long) (itemCount[c] * u * u * u), 7);
            line.tab().put(categoryNames[c]);
            line.tab().put((byte) ('0' + stars));
            line.tab().putLong(h);
            line.tab().putLong(t);
            line.tab().put((byte) (verified ? 'Y' : 'N'));
            line.tab().put((byte) (incentivised ? 'Y' : 'N'));
            line.tab();
            text.headline(line, rng, c, stars);
            line.tab();
            text.body(line, rng, c, stars, ReviewText.sentenceCount(rng));
            line.tab().put(dates.pick(rng));
            line.put((byte) '\n');
        }

        /** Breaks the row in {@link #line} as its kind says; returns the lines it now takes. */
        private int plantDefect(Special s) {
            int v = s.variant();
            switch (s.kind()) {
                case TOO_FEW_FIELDS -> {
                    line.truncate(line.tabIndex(v == 0 ? 9 : v == 1 ? 4 : 10));
                    line.put((byte) '\n');
                }
                case TOO_MANY_FIELDS -> {
                    if (v == 1) {
                        int at = line.tabIndex(3);
                        line.insert(at, concat("\t", categoryNames[fieldCategory()]));
                    } else {
                        line.insert(line.length() - 1, ascii(v == 0 ? "\tN" : "\t\t"));
                    }
                }
                case TAB_IN_BODY -> line.setByteAt(spaceInBody(), (byte) '\t');
                case NEWLINE_IN_BODY -> line.setByteAt(spaceInBody(), (byte) '\n');
                case VOTES_NOT_A_NUMBER -> replaceField(v == 0 ? 5 : 6, "abc");
                case VOTES_DECIMAL -> replaceField(v == 0 ? 5 : 6, "1.5");
                case VOTES_NEGATIVE -> replaceField(v == 0 ? 5 : 6, "-3");
                case VOTES_EMPTY -> replaceField(v == 0 ? 5 : 6, "");
                case HELPFUL_ABOVE_TOTAL -> replaceField(5, Long.toString(s.total() + 2));
                case DATE_INVALID -> replaceField(11, v == 0 ? "2021-02-30" : v == 1 ? "2021-13-01" : "yesterday");
                case STRAY_QUOTES -> strayQuotes(v);
                default -> throw new IllegalStateException("no defect for " + s.kind());
            }
            return s.kind().linesPerRow();
        }

        private void strayQuotes(int v) {
            switch (v) {
                case 0 -> line.insert(fieldStart(9), ascii("\"")); // unbalanced, at the start of the headline
                case 1 -> line.insert(fieldStart(10), ascii("\"")); // unbalanced, at the start of the body
                case 2 -> line.insert(fieldEnd(9), ascii(" ''really''"));
                case 3 -> {
                    line.insert(fieldEnd(10), ascii(" \"")); // a lone quote closing the body
                    line.insert(spaceInBody() + 1, ascii("\"quoted\" "));
                }
                case 4 -> line.replace(fieldStart(9), fieldEnd(9), ascii("\""));
                default -> line.insert(fieldStart(10), ascii("He said \"\"no\"\" twice. "));
            }
        }

        private int fieldCategory() {
            byte[] b = java.util.Arrays.copyOfRange(line.array(), fieldStart(3), fieldEnd(3));
            for (int c = 0; c < categoryNames.length; c++) {
                if (java.util.Arrays.equals(b, categoryNames[c])) {
                    return c;
                }
            }
            throw new IllegalStateException("category field lost");
        }

        private int fieldStart(int field) {
            return field == 0 ? 0 : line.tabIndex(field - 1) + 1;
        }

        private int fieldEnd(int field) {
            return field == COLUMNS.size() - 1 ? line.length() - 1 : line.tabIndex(field);
        }

        private void replaceField(int field, String value) {
            line.replace(fieldStart(field), fieldEnd(field), ascii(value));
        }

        /** A space near the middle of the body (bodies have at least two sentences). */
        private int spaceInBody() {
            int from = fieldStart(10);
            int to = fieldEnd(10);
            for (int i = (from + to) / 2; i < to; i++) {
                if (line.byteAt(i) == ' ') {
                    return i;
                }
            }
            for (int i = (from + to) / 2; i > from; i--) {
                if (line.byteAt(i) == ' ') {
                    return i;
                }
            }
            throw new IllegalStateException("a generated body without a space");
        }

        private Out out(int c) {
            Out[] parts = outsByCategory[c];
            if (parts.length == 1) {
                return parts[0];
            }
            return parts[(int) (largestCategoryRows++ % parts.length)];
        }

        private int category() {
            double u = rng.nextDouble();
            int c = 0;
            while (u >= categoryCumulative[c] && c < categoryCumulative.length - 1) {
                c++;
            }
            return c;
        }

        private int stars() {
            double u = rng.nextDouble();
            for (int s = 0; s < 4; s++) {
                u -= STAR_SHARES[s];
                if (u < 0) {
                    return s + 1;
                }
            }
            return 5;
        }

        /** Zero with probability {@value #ZERO_VOTES}, else a discrete Pareto tail from 1. */
        private long totalVotes() {
            if (rng.nextDouble() < ZERO_VOTES) {
                return 0;
            }
            double u = 1.0 - rng.nextDouble(); // (0, 1]
            return (long) Math.min(MAX_VOTES, StrictMath.floor(StrictMath.pow(u, -1.0 / VOTE_TAIL)));
        }

        private GeneratedDump summary() throws IOException {
            List<Path> files = new ArrayList<>();
            long disk = 0;
            long lines = 0;
            long uncompressed = 0;
            for (Out out : outs) {
                files.add(out.path);
                disk += Files.size(out.path);
                lines += out.lines;
                uncompressed += out.bytes;
            }
            Map<String, Long> byKind = new LinkedHashMap<>();
            long rejected = 0;
            if (o.malformedRows()) {
                for (MalformedKind k : MalformedKind.values()) {
                    long n = linesByKind.getOrDefault(k, 0L);
                    byKind.put(k.key(), n);
                    rejected += k.rejected() ? n : 0;
                }
            }
            return new GeneratedDump(files, rows, lines, disk, byKind, rejected, lines - rejected, uncompressed, planted);
        }

        private static long reviewerNumber(long index) {
            return 10_000_000L + mix(index, REVIEWER_BITS);
        }

        private static long reviewNumber(long index) {
            return mix(index, REVIEW_BITS);
        }

        /** A bijection on {@code bits}-bit numbers (xor-shifts and odd multipliers are invertible). */
        static long mix(long x, int bits) {
            long mask = (1L << bits) - 1;
            x ^= x >>> 13;
            x = (x * 0x9E3779B97F4A7C15L) & mask;
            x ^= x >>> 11;
            x = (x * 0xBF58476D1CE4E5B9L) & mask;
            x ^= x >>> 14;
            return x;
        }

        private static byte[] ascii(String s) {
            return s.getBytes(StandardCharsets.US_ASCII);
        }

        private static byte[] concat(String a, byte[] b) {
            byte[] x = ascii(a);
            byte[] out = java.util.Arrays.copyOf(x, x.length + b.length);
            System.arraycopy(b, 0, out, x.length, b.length);
            return out;
        }
    }
}
