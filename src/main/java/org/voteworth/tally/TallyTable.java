package org.voteworth.tally;

import java.io.IOException;
import java.util.Arrays;
import java.util.List;
import org.voteworth.source.ReviewRow;
import org.voteworth.source.ReviewSink;

/**
 * Per-reviewer tallies in primitive arrays: the reviewer table that scoring reads.
 *
 * <p>Rows go in through {@link #accept(ReviewRow)}; tables built over different files, byte
 * ranges or partitions combine through {@link #mergeFrom(TallyTable)}, which means exactly what
 * {@link ReviewerTally#merge} means for one reviewer. Slots are numbered in order of first
 * appearance; use {@link #sortedById()} for an order that does not depend on input order.
 *
 * <p>A reviewer's counters sit together (one block of ints and one of longs per slot), because
 * rows arrive in no order and a table of millions of reviewers is far larger than the CPU caches:
 * one row then touches two or three memory places instead of one per counter. The first category
 * of a slot is kept in its block; further ones in a small shared pool of linked entries.
 *
 * <p>Not thread-safe: one table per thread, merged at the end.
 */
public final class TallyTable implements ReviewSink {
    // Ints per slot, at INTS * slot + field; REVIEWS up to the last star are counters that add up in a merge.
    private static final int INTS = 16;
    private static final int REVIEWS = 0;
    private static final int VOTED = 1;
    private static final int MAJORITY = 2;
    private static final int VERIFIED = 3;
    private static final int INCENTIVISED = 4;
    private static final int STARS = 5;
    private static final int FIRST = 10;
    private static final int LAST = 11;
    private static final int CATEGORY = 12;
    private static final int CATEGORY_COUNT = 13;
    private static final int MORE = 14;
    // Longs per slot, at LONGS * slot + field.
    private static final int LONGS = 4;
    private static final int HELPFUL = 0;
    private static final int TOTAL = 1;
    private static final int MAX = 2;
    private static final int SQUARES = 3;
    // Pool entries (category, count, next entry or -1), at 3 * entry.
    private static final int ENTRY = 3;

    private final TallyUnit unit;
    private final KeyIndex index = new KeyIndex();
    private final Categories categories = new Categories();
    private int capacity = 1 << 10;
    private int[] ints = new int[INTS * capacity];
    private long[] longs = new long[LONGS * capacity];
    private int[] pool = new int[ENTRY * 64];
    private int poolUsed;
    /** Slots below this are initialised. */
    private int slots;

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
        flush();
        return index.size();
    }

    /**
     * Rows with numeric ids wait in a small batch and are tallied a batch at a time: first every
     * row's slot, then every row's counters. Within a step the rows' memory accesses do not depend
     * on each other, so the CPU overlaps their cache misses instead of waiting for each in turn.
     */
    private static final int BATCH = 32;
    private final long[] batchId = new long[BATCH];
    private final long[] batchHelpful = new long[BATCH];
    private final long[] batchTotal = new long[BATCH];
    private final int[] batchStars = new int[BATCH];
    private final int[] batchFlags = new int[BATCH];
    private final int[] batchCategory = new int[BATCH];
    private final int[] batchDay = new int[BATCH];
    private final int[] batchSlot = new int[BATCH];
    private int batched;

    @Override
    public void accept(ReviewRow r) {
        int cat = categories.idOf(r.categoryBuf, r.categoryOff, r.categoryLen);
        int off = unit == TallyUnit.REVIEWER ? r.reviewerOff : r.reviewOff;
        int len = unit == TallyUnit.REVIEWER ? r.reviewerLen : r.reviewLen;
        long n = KeyIndex.canonicalNumber(r.buf, off, len);
        if (n < 0) {
            flush();
            int s = index.slotOf(r.buf, off, len);
            ready(s);
            addReview(s, r.helpful, r.total, r.stars, r.verified == 1, r.incentivised == 1, cat, r.epochDay);
            return;
        }
        int b = batched;
        batchId[b] = n;
        batchHelpful[b] = r.helpful;
        batchTotal[b] = r.total;
        batchStars[b] = r.stars;
        batchFlags[b] = (r.verified == 1 ? 1 : 0) | (r.incentivised == 1 ? 2 : 0);
        batchCategory[b] = cat;
        batchDay[b] = r.epochDay;
        if (++batched == BATCH) {
            flush();
        }
    }

    /** Tallies the rows waiting in the batch, in their order (so slots keep their order of first appearance). */
    private void flush() {
        int n = batched;
        if (n == 0) {
            return;
        }
        batched = 0;
        for (int i = 0; i < n; i++) {
            int s = index.slotOfNumber(batchId[i]);
            ready(s);
            batchSlot[i] = s;
        }
        for (int i = 0; i < n; i++) {
            addReview(batchSlot[i], batchHelpful[i], batchTotal[i], batchStars[i], (batchFlags[i] & 1) != 0,
                    (batchFlags[i] & 2) != 0, batchCategory[i], batchDay[i]);
        }
    }

    /** Adds one review by its values (tests, generators and other engines use this). */
    public void add(String id, long helpfulVotes, long totalVotes, int starRating, boolean isVerified,
                    boolean isIncentivised, String category, int epochDay) {
        if (helpfulVotes < 0 || helpfulVotes > totalVotes) {
            throw new IllegalArgumentException("need 0 <= helpful <= total, got " + helpfulVotes + "/" + totalVotes);
        }
        flush();
        int s = index.slotOf(id);
        ready(s);
        addReview(s, helpfulVotes, totalVotes, starRating, isVerified, isIncentivised, categories.idOf(category), epochDay);
    }

    private void addReview(int s, long h, long t, int star, boolean ver, boolean inc, int cat, int day) {
        int[] a = ints;
        int b = INTS * s;
        a[b + REVIEWS]++;
        if (t > 0) {
            a[b + VOTED]++;
            if (2 * h > t) {
                a[b + MAJORITY]++;
            }
        }
        if (ver) {
            a[b + VERIFIED]++;
        }
        if (inc) {
            a[b + INCENTIVISED]++;
        }
        if (star >= 1 && star <= 5) {
            a[b + STARS + star - 1]++;
        }
        if (day != ReviewRow.NO_DATE) {
            a[b + FIRST] = ReviewerTally.minDay(a[b + FIRST], day);
            a[b + LAST] = ReviewerTally.maxDay(a[b + LAST], day);
        }
        long[] l = longs;
        int c = LONGS * s;
        l[c + HELPFUL] += h;
        l[c + TOTAL] += t;
        if (t > l[c + MAX]) {
            l[c + MAX] = t;
        }
        l[c + SQUARES] += t * t;
        addCategory(s, cat, 1);
    }

    private void addCategory(int s, int cat, int n) {
        int b = INTS * s;
        if (ints[b + CATEGORY] == cat) {
            ints[b + CATEGORY_COUNT] += n;
            return;
        }
        if (ints[b + CATEGORY] < 0) {
            ints[b + CATEGORY] = cat;
            ints[b + CATEGORY_COUNT] = n;
            return;
        }
        for (int e = ints[b + MORE]; e >= 0; e = pool[e + 2]) {
            if (pool[e] == cat) {
                pool[e + 1] += n;
                return;
            }
        }
        if (poolUsed + ENTRY > pool.length) {
            pool = Arrays.copyOf(pool, 2 * pool.length);
        }
        int e = poolUsed;
        pool[e] = cat;
        pool[e + 1] = n;
        pool[e + 2] = ints[b + MORE];
        ints[b + MORE] = e;
        poolUsed += ENTRY;
    }

    /** Adds every tally of {@code other} into this table (same meaning as {@link ReviewerTally#merge}). */
    public void mergeFrom(TallyTable other) {
        mergeSlots(other, null, other.size(), 1, 0);
    }

    /**
     * Adds the tallies of {@code other}'s {@code slots} whose id hash puts them in piece
     * {@code piece} of {@code pieces} ({@link #pieceOf}; 1 piece: all of them). {@code other} is
     * only read, so several threads may take parts of it at once.
     */
    void mergeSlots(TallyTable other, int[] slots, int pieces, int piece) {
        mergeSlots(other, slots, slots.length, pieces, piece);
    }

    /** The slots of each range partition under {@code partitioner} (as {@link #spill} chooses it), each in slot order. */
    int[][] slotsByPartition(RangePartitioner partitioner) {
        flush();
        int n = size();
        byte[] of = new byte[n];
        int[] count = new int[partitioner.parts()];
        byte[] digits = new byte[20];
        for (int s = 0; s < n; s++) {
            int p = partitioner.of(partitionKey(s, digits));
            of[s] = (byte) p;
            count[p]++;
        }
        int[][] slots = new int[count.length][];
        for (int p = 0; p < count.length; p++) {
            slots[p] = new int[count[p]];
            count[p] = 0;
        }
        for (int s = 0; s < n; s++) {
            int p = of[s] & 0xFF;
            slots[p][count[p]++] = s;
        }
        return slots;
    }

    /** The {@link RangePartitioner#key} of the id of {@code slot}; {@code digits} is scratch room. */
    private long partitionKey(int slot, byte[] digits) {
        return RangePartitioner.key(index.chunk(slot, 0, digits));
    }

    /**
     * Boundaries for {@code parts} range partitions from the ids of this table: the keys of up to
     * {@code sample} slots spread over it (in a table of millions of reviewers, tens of thousands of
     * keys place the boundaries within a fraction of a percent).
     */
    RangePartitioner rangePartitioner(int parts, int sample, TallyTable... more) {
        flush();
        long total = size();
        for (TallyTable t : more) {
            t.flush();
            total += t.size();
        }
        long[] keys = new long[(int) Math.min(total, sample)];
        int n = 0;
        byte[] digits = new byte[20];
        long step = Math.max(1, total / Math.max(1, keys.length));
        TallyTable[] all = new TallyTable[more.length + 1];
        all[0] = this;
        System.arraycopy(more, 0, all, 1, more.length);
        for (TallyTable t : all) {
            for (long s = 0; s < t.size() && n < keys.length; s += step) {
                keys[n++] = t.partitionKey((int) s, digits);
            }
        }
        return RangePartitioner.fromSample(keys, n, parts);
    }

    /** Which of {@code pieces} the id of {@code slot} falls in by its hash (the same in every table, and for a spilled record). */
    private int pieceOf(int slot, int pieces) {
        return pieces <= 1 ? 0 : index.partition(slot, pieces);
    }

    /** Merges {@code other}'s slots {@code slots[0, n)} (null: slots 0 .. n-1) that fall in the piece. */
    private void mergeSlots(TallyTable other, int[] slots, int n, int pieces, int piece) {
        flush();
        other.flush();
        if (other.unit != unit) {
            throw new IllegalArgumentException("cannot merge a " + other.unit + " tally into a " + unit + " tally");
        }
        int[] catMap = new int[other.categories.size()];
        for (int c = 0; c < catMap.length; c++) {
            catMap[c] = categories.idOf(other.categories.name(c));
        }
        // Slot by slot on the arrays: this is the in-memory merge of every worker's table.
        for (int i = 0; i < n; i++) {
            int o = slots == null ? i : slots[i];
            if (other.pieceOf(o, pieces) != piece) {
                continue;
            }
            int s = index.slotOf(other.index, o);
            ready(s);
            int b = INTS * s;
            int ob = INTS * o;
            for (int k = REVIEWS; k < STARS + 5; k++) {
                ints[b + k] += other.ints[ob + k];
            }
            ints[b + FIRST] = ReviewerTally.minDay(ints[b + FIRST], other.ints[ob + FIRST]);
            ints[b + LAST] = ReviewerTally.maxDay(ints[b + LAST], other.ints[ob + LAST]);
            int c = LONGS * s;
            int oc = LONGS * o;
            longs[c + HELPFUL] += other.longs[oc + HELPFUL];
            longs[c + TOTAL] += other.longs[oc + TOTAL];
            longs[c + MAX] = Math.max(longs[c + MAX], other.longs[oc + MAX]);
            longs[c + SQUARES] += other.longs[oc + SQUARES];
            if (other.ints[ob + CATEGORY] >= 0) {
                addCategory(s, catMap[other.ints[ob + CATEGORY]], other.ints[ob + CATEGORY_COUNT]);
            }
            for (int e = other.ints[ob + MORE]; e >= 0; e = other.pool[e + 2]) {
                addCategory(s, catMap[other.pool[e]], other.pool[e + 1]);
            }
        }
    }

    /** Adds one whole tally (as read back from a reviewer table file). */
    public void add(ReviewerTally t) {
        flush();
        TallyRecord r = new TallyRecord();
        r.set(t, categories);
        int s = r.numeric ? index.slotOfNumber(r.number) : index.slotOf(r.idBytes(), 0, r.idLength());
        ready(s);
        add(s, r);
    }

    /** Adds the tally {@code r} (category ids of this table) to slot {@code s}. */
    private void add(int s, TallyRecord r) {
        int b = INTS * s;
        ints[b + REVIEWS] += r.reviews;
        ints[b + VOTED] += r.voted;
        ints[b + MAJORITY] += r.majority;
        ints[b + VERIFIED] += r.verified;
        ints[b + INCENTIVISED] += r.incentivised;
        for (int k = 0; k < 5; k++) {
            ints[b + STARS + k] += r.stars[k];
        }
        ints[b + FIRST] = ReviewerTally.minDay(ints[b + FIRST], r.firstDay);
        ints[b + LAST] = ReviewerTally.maxDay(ints[b + LAST], r.lastDay);
        int c = LONGS * s;
        longs[c + HELPFUL] += r.helpful;
        longs[c + TOTAL] += r.total;
        longs[c + MAX] = Math.max(longs[c + MAX], r.maxVotes);
        longs[c + SQUARES] += r.sumSquares;
        for (int j = 0; j < r.categories; j++) {
            addCategory(s, r.categoryIds[j], r.categoryCounts[j]);
        }
    }

    /**
     * Fills {@code r} with the tally of {@code slot}, its category ids mapped through
     * {@code categoryMap} (null: this table's own ids).
     */
    void load(int slot, TallyRecord r, int[] categoryMap) {
        flush();
        if (index.isNumeric(slot)) {
            r.numericId(index.number(slot));
        } else {
            r.bytesId(index.idBytes(slot, r.idRoom(index.idLength(slot))));
        }
        int b = INTS * slot;
        r.reviews = ints[b + REVIEWS];
        r.voted = ints[b + VOTED];
        r.majority = ints[b + MAJORITY];
        r.verified = ints[b + VERIFIED];
        r.incentivised = ints[b + INCENTIVISED];
        System.arraycopy(ints, b + STARS, r.stars, 0, 5);
        r.firstDay = ints[b + FIRST];
        r.lastDay = ints[b + LAST];
        int c = LONGS * slot;
        r.helpful = longs[c + HELPFUL];
        r.total = longs[c + TOTAL];
        r.maxVotes = longs[c + MAX];
        r.sumSquares = longs[c + SQUARES];
        r.categories = 0;
        if (ints[b + CATEGORY] >= 0) {
            r.addCategory(mapped(ints[b + CATEGORY], categoryMap), ints[b + CATEGORY_COUNT]);
        }
        for (int e = ints[b + MORE]; e >= 0; e = pool[e + 2]) {
            r.addCategory(mapped(pool[e], categoryMap), pool[e + 1]);
        }
    }

    private static int mapped(int category, int[] map) {
        return map == null ? category : map[category];
    }

    /** The slot of {@code id}, or -1 when it was not tallied. */
    public int find(String id) {
        flush();
        return index.find(id);
    }

    public String id(int slot) {
        check(slot);
        return index.id(slot);
    }

    public long reviews(int slot) {
        check(slot);
        return ints[INTS * slot + REVIEWS];
    }

    public long helpfulVotes(int slot) {
        check(slot);
        return longs[LONGS * slot + HELPFUL];
    }

    public long totalVotes(int slot) {
        check(slot);
        return longs[LONGS * slot + TOTAL];
    }

    public long votedReviews(int slot) {
        check(slot);
        return ints[INTS * slot + VOTED];
    }

    public long majorityReviews(int slot) {
        check(slot);
        return ints[INTS * slot + MAJORITY];
    }

    public long maxReviewVotes(int slot) {
        check(slot);
        return longs[LONGS * slot + MAX];
    }

    /** The whole tally of one slot as a value. */
    public ReviewerTally get(int slot) {
        check(slot);
        TallyRecord r = new TallyRecord();
        load(slot, r, null);
        return r.toTally(categories);
    }

    /** The dictionary behind this table's category ids. */
    Categories categoryDictionary() {
        return categories;
    }

    /** Every category name seen, in order of first appearance. */
    public List<String> categories() {
        return categories.all();
    }

    /** Slots ordered by id (String order): an order independent of input order and thread count. */
    public int[] sortedById() {
        flush();
        return IdOrder.sortedSlots(index);
    }

    /** Every tally, ordered by id. */
    public List<ReviewerTally> toSortedList() {
        return Arrays.stream(sortedById()).mapToObj(this::get).toList();
    }

    /**
     * Writes every tally to {@code out} in sections, one per range partition under {@code
     * partitioner} in partition order, so that the partitions of many tables can be merged one at
     * a time. A section holds this table's category names, the partition's tallies and an end
     * mark; an empty partition gets no section.
     *
     * @return per partition, the tallies written and the bytes of the section
     */
    Sections spill(SpillFile.Out out, RangePartitioner partitioner) throws IOException {
        flush();
        int parts = partitioner.parts();
        SpillFile.Out[] sections = new SpillFile.Out[parts];
        long[] written = new long[parts];
        long[] sectionStart = new long[parts];
        long[] sectionEnd = new long[parts];
        TallyRecord r = new TallyRecord();
        byte[] digits = new byte[20];
        // One pass in slot order, the order the counters lie in memory, each tally encoded into its
        // partition's section in memory (a few dozen bytes a tally, within the growth room the budget
        // keeps), then the sections copied to the file in partition order.
        for (int s = 0; s < size(); s++) {
            int p = partitioner.of(partitionKey(s, digits));
            if (sections[p] == null) {
                sections[p] = SpillFile.inMemory();
                writeCategoryNames(sections[p]);
            }
            load(s, r, null);
            r.write(sections[p]);
            written[p]++;
        }
        for (int p = 0; p < parts; p++) {
            sectionStart[p] = out.position();
            if (sections[p] != null) {
                sections[p].write(TallyRecord.END);
                out.append(sections[p]);
                sections[p] = null;
            }
            sectionEnd[p] = out.position();
        }
        return new Sections(written, sectionStart, sectionEnd);
    }

    /**
     * Where {@link #spill} put each range partition: {@code tallies[p]} tallies in the bytes
     * {@code [start[p], end[p])} of the file (equal bounds when there are none).
     */
    record Sections(long[] tallies, long[] start, long[] end) {
    }

    /** Writes the tallies of {@code slots}, in that order, in the format of {@link #spill}. */
    void writeRun(int[] slots, SpillFile.Out out) throws IOException {
        flush();
        writeCategoryNames(out);
        TallyRecord r = new TallyRecord();
        for (int s : slots) {
            load(s, r, null);
            r.write(out);
        }
        out.write(TallyRecord.END);
    }

    private void writeCategoryNames(SpillFile.Out out) throws IOException {
        out.number(categories.size());
        for (int c = 0; c < categories.size(); c++) {
            out.text(categories.name(c));
        }
    }

    /**
     * The category names at the head of a stream written by {@link #spill} or {@link #writeRun},
     * as ids of {@code into}.
     */
    static int[] readCategoryNames(SpillFile.In in, Categories into) throws IOException {
        int[] map = new int[(int) in.number()];
        for (int c = 0; c < map.length; c++) {
            map[c] = into.idOf(in.text());
        }
        return map;
    }

    /** Adds every tally of one stream written by {@link #spill} or {@link #writeRun} (same meaning as {@link #mergeFrom}). */
    void readSpill(SpillFile.In in) throws IOException {
        readSpill(in, 1, 0);
    }

    /** As {@link #readSpill(SpillFile.In)}, only the tallies in piece {@code piece} of {@code pieces} by id hash ({@link #pieceOf}). */
    void readSpill(SpillFile.In in, int pieces, int piece) throws IOException {
        flush();
        int[] catMap = readCategoryNames(in, categories);
        TallyRecord r = new TallyRecord();
        while (r.read(in, catMap)) {
            if (pieces > 1 && r.pieceOf(pieces) != piece) {
                continue;
            }
            int s = r.numeric ? index.slotOfNumber(r.number) : index.slotOf(r.idBytes(), 0, r.idLength());
            ready(s);
            add(s, r);
        }
    }

    /** One reviewer's reviews in one category, as {@link #forEachCategoryCount} hands them out. */
    @FunctionalInterface
    interface CategoryCount {
        void accept(int slot, String category, int reviews);
    }

    /** Every (slot, category, reviews) count, in no particular order, without an object per reviewer. */
    void forEachCategoryCount(CategoryCount each) {
        flush();
        for (int s = 0; s < size(); s++) {
            int b = INTS * s;
            if (ints[b + CATEGORY] >= 0) {
                each.accept(s, categories.name(ints[b + CATEGORY]), ints[b + CATEGORY_COUNT]);
            }
            for (int e = ints[b + MORE]; e >= 0; e = pool[e + 2]) {
                each.accept(s, categories.name(pool[e]), pool[e + 1]);
            }
        }
    }

    /** Rough heap footprint, for the memory budget. */
    public long memoryBytes() {
        flush();
        return index.memoryBytes() + pool.length * 4L + (long) capacity * (INTS * 4 + LONGS * 8);
    }

    /**
     * The most the next growth of one of the table's arrays allocates while the old one is still
     * live (slot arrays by half, the id index and the category pool by doubling): a budget that
     * leaves this much room is not overrun while the table grows.
     */
    public long growthBytes() {
        long slotBytes = (long) capacity * (INTS * 4 + LONGS * 8);
        return Math.max(Math.max(2 * index.memoryBytes(), slotBytes + slotBytes / 2), 2L * pool.length * 4);
    }

    private void check(int slot) {
        if (slot < 0 || slot >= size()) {
            throw new IndexOutOfBoundsException("slot " + slot + " of " + size());
        }
    }

    /** Makes slot {@code s} (at most one past the last) usable: room, and empty counters. */
    private void ready(int s) {
        if (s < slots) {
            return;
        }
        if (s >= capacity) {
            int n = (int) Math.min(Integer.MAX_VALUE / INTS, Math.max(capacity + (capacity >> 1), s + 1L));
            ints = Arrays.copyOf(ints, INTS * n);
            longs = Arrays.copyOf(longs, LONGS * n);
            capacity = n;
        }
        int b = INTS * s;
        ints[b + FIRST] = ReviewerTally.NO_DATE;
        ints[b + LAST] = ReviewerTally.NO_DATE;
        ints[b + CATEGORY] = -1;
        ints[b + MORE] = -1;
        slots = s + 1;
    }
}
