package org.voteworth.tally;

import java.util.Arrays;
import java.util.List;
import java.util.TreeMap;
import org.voteworth.source.ReviewRow;
import org.voteworth.source.ReviewSink;

/**
 * Per-reviewer tallies in parallel primitive arrays: the reviewer table that scoring reads.
 *
 * <p>Rows go in through {@link #accept(ReviewRow)}; tables built over different files, byte
 * ranges or partitions combine through {@link #mergeFrom(TallyTable)}, which means exactly what
 * {@link ReviewerTally#merge} means for one reviewer. Slots are numbered in order of first
 * appearance; use {@link #sortedById()} for an order that does not depend on input order.
 *
 * <p>Not thread-safe: one table per thread, merged at the end.
 */
public final class TallyTable implements ReviewSink {
    private final TallyUnit unit;
    private final KeyIndex index = new KeyIndex();
    private final Categories categories = new Categories();
    /** Reviews per (slot, category): key = slot << 20 | category id. */
    private final LongIntMap byCategory = new LongIntMap(1 << 12);

    private int capacity = 1 << 10;
    private int[] reviews = new int[capacity];
    private long[] helpful = new long[capacity];
    private long[] total = new long[capacity];
    private int[] voted = new int[capacity];
    private int[] majority = new int[capacity];
    private long[] maxVotes = new long[capacity];
    private long[] sumSquares = new long[capacity];
    private int[] verified = new int[capacity];
    private int[] incentivised = new int[capacity];
    /** Five counters per slot: stars[5 * slot + (stars - 1)]. */
    private int[] stars = new int[5 * capacity];
    private int[] firstDay = filledDays(capacity);
    private int[] lastDay = filledDays(capacity);

    public TallyTable() {
        this(TallyUnit.REVIEWER);
    }

    public TallyTable(TallyUnit unit) {
        this.unit = unit;
    }

    public TallyUnit unit() {
        return unit;
    }

    /** Number of reviewers (or reviews) tallied. */
    public int size() {
        return index.size();
    }

    @Override
    public void accept(ReviewRow r) {
        int s = unit == TallyUnit.REVIEWER
                ? index.slotOf(r.buf, r.reviewerOff, r.reviewerLen)
                : index.slotOf(r.buf, r.reviewOff, r.reviewLen);
        ensure(s);
        int cat = categories.idOf(r.categoryBuf, r.categoryOff, r.categoryLen);
        addReview(s, r.helpful, r.total, r.stars, r.verified == 1, r.incentivised == 1, cat, r.epochDay);
    }

    /** Adds one review by its values (tests, generators and other engines use this). */
    public void add(String id, long helpfulVotes, long totalVotes, int starRating, boolean isVerified,
                    boolean isIncentivised, String category, int epochDay) {
        if (helpfulVotes < 0 || helpfulVotes > totalVotes) {
            throw new IllegalArgumentException("need 0 <= helpful <= total, got " + helpfulVotes + "/" + totalVotes);
        }
        int s = index.slotOf(id);
        ensure(s);
        addReview(s, helpfulVotes, totalVotes, starRating, isVerified, isIncentivised, categories.idOf(category), epochDay);
    }

    private void addReview(int s, long h, long t, int star, boolean ver, boolean inc, int cat, int day) {
        reviews[s]++;
        helpful[s] += h;
        total[s] += t;
        if (t > 0) {
            voted[s]++;
            if (2 * h > t) {
                majority[s]++;
            }
        }
        if (t > maxVotes[s]) {
            maxVotes[s] = t;
        }
        sumSquares[s] += t * t;
        if (ver) {
            verified[s]++;
        }
        if (inc) {
            incentivised[s]++;
        }
        if (star >= 1 && star <= 5) {
            stars[5 * s + star - 1]++;
        }
        if (day != ReviewRow.NO_DATE) {
            if (firstDay[s] == ReviewerTally.NO_DATE || day < firstDay[s]) {
                firstDay[s] = day;
            }
            if (lastDay[s] == ReviewerTally.NO_DATE || day > lastDay[s]) {
                lastDay[s] = day;
            }
        }
        byCategory.add((long) s << 20 | cat, 1);
    }

    /** Adds every tally of {@code other} into this table (same meaning as {@link ReviewerTally#merge}). */
    public void mergeFrom(TallyTable other) {
        if (other.unit != unit) {
            throw new IllegalArgumentException("cannot merge a " + other.unit + " tally into a " + unit + " tally");
        }
        int[] slotMap = new int[other.size()];
        for (int o = 0; o < other.size(); o++) {
            int s = index.slotOf(other.index.id(o));
            ensure(s);
            slotMap[o] = s;
            reviews[s] += other.reviews[o];
            helpful[s] += other.helpful[o];
            total[s] += other.total[o];
            voted[s] += other.voted[o];
            majority[s] += other.majority[o];
            maxVotes[s] = Math.max(maxVotes[s], other.maxVotes[o]);
            sumSquares[s] += other.sumSquares[o];
            verified[s] += other.verified[o];
            incentivised[s] += other.incentivised[o];
            for (int k = 0; k < 5; k++) {
                stars[5 * s + k] += other.stars[5 * o + k];
            }
            firstDay[s] = ReviewerTally.minDay(firstDay[s], other.firstDay[o]);
            lastDay[s] = ReviewerTally.maxDay(lastDay[s], other.lastDay[o]);
        }
        int[] catMap = new int[other.categories.size()];
        for (int c = 0; c < catMap.length; c++) {
            catMap[c] = categories.idOf(other.categories.name(c));
        }
        other.byCategory.forEach((key, count) -> {
            int o = (int) (key >>> 20);
            int c = (int) (key & 0xFFFFF);
            byCategory.add((long) slotMap[o] << 20 | catMap[c], count);
        });
    }

    /** Adds one whole tally (as read back from a reviewer table file). */
    public void add(ReviewerTally t) {
        TallyTable one = new TallyTable(unit);
        int s = one.index.slotOf(t.id());
        one.ensure(s);
        one.reviews[s] = Math.toIntExact(t.reviews());
        one.helpful[s] = t.helpfulVotes();
        one.total[s] = t.totalVotes();
        one.voted[s] = Math.toIntExact(t.votedReviews());
        one.majority[s] = Math.toIntExact(t.majorityReviews());
        one.maxVotes[s] = t.maxReviewVotes();
        one.sumSquares[s] = t.sumSquaredVotes();
        one.verified[s] = Math.toIntExact(t.verified());
        one.incentivised[s] = Math.toIntExact(t.incentivised());
        for (int k = 1; k <= 5; k++) {
            one.stars[5 * s + k - 1] = Math.toIntExact(t.stars().of(k));
        }
        one.firstDay[s] = t.firstDay();
        one.lastDay[s] = t.lastDay();
        t.reviewsByCategory().forEach((c, n) -> one.byCategory.add((long) s << 20 | one.categories.idOf(c), Math.toIntExact(n)));
        mergeFrom(one);
    }

    /** The slot of {@code id}, or -1 when it was not tallied. */
    public int find(String id) {
        return index.find(id);
    }

    public String id(int slot) {
        check(slot);
        return index.id(slot);
    }

    public long reviews(int slot) {
        check(slot);
        return reviews[slot];
    }

    public long helpfulVotes(int slot) {
        check(slot);
        return helpful[slot];
    }

    public long totalVotes(int slot) {
        check(slot);
        return total[slot];
    }

    public long votedReviews(int slot) {
        check(slot);
        return voted[slot];
    }

    public long majorityReviews(int slot) {
        check(slot);
        return majority[slot];
    }

    public long maxReviewVotes(int slot) {
        check(slot);
        return maxVotes[slot];
    }

    /** The whole tally of one slot as a value. */
    public ReviewerTally get(int slot) {
        check(slot);
        TreeMap<String, Long> cats = new TreeMap<>();
        // Categories are few; scanning them per reviewer keeps the counters in one primitive map.
        for (int c = 0; c < categories.size(); c++) {
            int n = byCategory.get((long) slot << 20 | c);
            if (n > 0) {
                cats.put(categories.name(c), (long) n);
            }
        }
        int b = 5 * slot;
        return new ReviewerTally(index.id(slot), reviews[slot], helpful[slot], total[slot], voted[slot],
                majority[slot], maxVotes[slot], sumSquares[slot], verified[slot], incentivised[slot],
                new StarCounts(stars[b], stars[b + 1], stars[b + 2], stars[b + 3], stars[b + 4]), cats,
                firstDay[slot], lastDay[slot]);
    }

    /** Every category name seen, in order of first appearance. */
    public List<String> categories() {
        return categories.all();
    }

    /** Slots ordered by id (String order): an order independent of input order and thread count. */
    public int[] sortedById() {
        String[] ids = new String[size()];
        Integer[] order = new Integer[size()];
        for (int i = 0; i < ids.length; i++) {
            ids[i] = index.id(i);
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> ids[a].compareTo(ids[b]));
        return Arrays.stream(order).mapToInt(Integer::intValue).toArray();
    }

    /** Every tally, ordered by id. */
    public List<ReviewerTally> toSortedList() {
        return Arrays.stream(sortedById()).mapToObj(this::get).toList();
    }

    /**
     * Writes every tally to one of {@code parts.length} partition streams, chosen by a hash of the
     * id that is the same in every table, so that the partitions of many tables can be merged one
     * at a time. Each stream gets this table's category names first and an end mark last.
     */
    void spill(java.io.DataOutputStream[] parts) throws java.io.IOException {
        for (java.io.DataOutputStream out : parts) {
            out.writeInt(categories.size());
            for (int c = 0; c < categories.size(); c++) {
                out.writeUTF(categories.name(c));
            }
        }
        for (int s = 0; s < size(); s++) {
            writeSlot(s, parts[index.partition(s, parts.length)]);
        }
        for (java.io.DataOutputStream out : parts) {
            out.writeByte(END);
        }
    }

    /** Writes the tallies of {@code slots}, in that order, in the format of {@link #spill}. */
    void writeRun(int[] slots, java.io.DataOutputStream out) throws java.io.IOException {
        out.writeInt(categories.size());
        for (int c = 0; c < categories.size(); c++) {
            out.writeUTF(categories.name(c));
        }
        for (int s : slots) {
            writeSlot(s, out);
        }
        out.writeByte(END);
    }

    private static final int END = 2;

    private void writeSlot(int s, java.io.DataOutputStream out) throws java.io.IOException {
        index.writeId(s, out);
        out.writeInt(reviews[s]);
        out.writeLong(helpful[s]);
        out.writeLong(total[s]);
        out.writeInt(voted[s]);
        out.writeInt(majority[s]);
        out.writeLong(maxVotes[s]);
        out.writeLong(sumSquares[s]);
        out.writeInt(verified[s]);
        out.writeInt(incentivised[s]);
        for (int k = 0; k < 5; k++) {
            out.writeInt(stars[5 * s + k]);
        }
        out.writeInt(firstDay[s]);
        out.writeInt(lastDay[s]);
        int n = 0;
        for (int c = 0; c < categories.size(); c++) {
            if (byCategory.get((long) s << 20 | c) > 0) {
                n++;
            }
        }
        out.writeInt(n);
        for (int c = 0; c < categories.size(); c++) {
            int v = byCategory.get((long) s << 20 | c);
            if (v > 0) {
                out.writeInt(c);
                out.writeInt(v);
            }
        }
    }

    /** Adds every tally of one stream written by {@link #spill} or {@link #writeRun} (same meaning as {@link #mergeFrom}). */
    void readSpill(java.io.DataInputStream in) throws java.io.IOException {
        int nc = in.readInt();
        int[] catMap = new int[nc];
        for (int c = 0; c < nc; c++) {
            catMap[c] = categories.idOf(in.readUTF());
        }
        byte[][] scratch = {new byte[64]};
        int kind;
        while ((kind = in.readByte()) != END) {
            int s = index.readId(kind, in, scratch);
            ensure(s);
            reviews[s] += in.readInt();
            helpful[s] += in.readLong();
            total[s] += in.readLong();
            voted[s] += in.readInt();
            majority[s] += in.readInt();
            maxVotes[s] = Math.max(maxVotes[s], in.readLong());
            sumSquares[s] += in.readLong();
            verified[s] += in.readInt();
            incentivised[s] += in.readInt();
            for (int k = 0; k < 5; k++) {
                stars[5 * s + k] += in.readInt();
            }
            firstDay[s] = ReviewerTally.minDay(firstDay[s], in.readInt());
            lastDay[s] = ReviewerTally.maxDay(lastDay[s], in.readInt());
            int n = in.readInt();
            for (int j = 0; j < n; j++) {
                int c = in.readInt();
                byCategory.add((long) s << 20 | catMap[c], in.readInt());
            }
        }
    }

    /**
     * Reads one stream written by {@link #writeRun} tally by tally, for merging sorted runs without
     * holding them: {@link #next()} gives the tallies in the order they were written.
     */
    static final class RunReader implements AutoCloseable {
        private final java.io.DataInputStream in;
        private final String[] cats;

        RunReader(java.io.DataInputStream in) throws java.io.IOException {
            this.in = in;
            cats = new String[in.readInt()];
            for (int c = 0; c < cats.length; c++) {
                cats[c] = in.readUTF();
            }
        }

        /** The next tally, or empty at the end mark. */
        java.util.Optional<ReviewerTally> next() throws java.io.IOException {
            int kind = in.readByte();
            if (kind == END) {
                return java.util.Optional.empty();
            }
            String id;
            if (kind == 0) {
                id = Long.toString(in.readLong());
            } else {
                byte[] b = new byte[in.readInt()];
                in.readFully(b);
                id = new String(b, java.nio.charset.StandardCharsets.UTF_8);
            }
            long reviews = in.readInt();
            long h = in.readLong();
            long t = in.readLong();
            long voted = in.readInt();
            long majority = in.readInt();
            long max = in.readLong();
            long sq = in.readLong();
            long ver = in.readInt();
            long inc = in.readInt();
            StarCounts st = new StarCounts(in.readInt(), in.readInt(), in.readInt(), in.readInt(), in.readInt());
            int first = in.readInt();
            int last = in.readInt();
            int n = in.readInt();
            TreeMap<String, Long> byCat = new TreeMap<>();
            for (int j = 0; j < n; j++) {
                String c = cats[in.readInt()];
                byCat.merge(c, (long) in.readInt(), Long::sum);
            }
            return java.util.Optional.of(new ReviewerTally(id, reviews, h, t, voted, majority, max, sq, ver, inc, st, byCat,
                    first, last));
        }

        @Override
        public void close() throws java.io.IOException {
            in.close();
        }
    }

    /** One reviewer's reviews in one category, as {@link #forEachCategoryCount} hands them out. */
    @FunctionalInterface
    interface CategoryCount {
        void accept(int slot, String category, int reviews);
    }

    /** Every (slot, category, reviews) count, in no particular order, without an object per reviewer. */
    void forEachCategoryCount(CategoryCount each) {
        byCategory.forEach((key, count) -> each.accept((int) (key >>> 20), categories.name((int) (key & 0xFFFFF)), count));
    }

    /** Rough heap footprint, for the memory budget. */
    public long memoryBytes() {
        return index.memoryBytes() + byCategory.memoryBytes() + (long) capacity * (4 * 6 + 8 * 4 + 4 * 5 + 4 * 2);
    }

    private void check(int slot) {
        if (slot < 0 || slot >= size()) {
            throw new IndexOutOfBoundsException("slot " + slot + " of " + size());
        }
    }

    private void ensure(int slot) {
        if (slot < capacity) {
            return;
        }
        int n = Math.max(capacity * 2, slot + 1);
        reviews = Arrays.copyOf(reviews, n);
        helpful = Arrays.copyOf(helpful, n);
        total = Arrays.copyOf(total, n);
        voted = Arrays.copyOf(voted, n);
        majority = Arrays.copyOf(majority, n);
        maxVotes = Arrays.copyOf(maxVotes, n);
        sumSquares = Arrays.copyOf(sumSquares, n);
        verified = Arrays.copyOf(verified, n);
        incentivised = Arrays.copyOf(incentivised, n);
        stars = Arrays.copyOf(stars, 5 * n);
        firstDay = Arrays.copyOf(firstDay, n);
        lastDay = Arrays.copyOf(lastDay, n);
        Arrays.fill(firstDay, capacity, n, ReviewerTally.NO_DATE);
        Arrays.fill(lastDay, capacity, n, ReviewerTally.NO_DATE);
        capacity = n;
    }

    private static int[] filledDays(int n) {
        int[] a = new int[n];
        Arrays.fill(a, ReviewerTally.NO_DATE);
        return a;
    }
}
