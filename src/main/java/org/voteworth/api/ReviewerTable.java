package org.voteworth.api;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.UnaryOperator;
import org.voteworth.analysis.ReviewerProfile;
import org.voteworth.report.Cautions;
import org.voteworth.report.Grid;
import org.voteworth.report.IdMask;
import org.voteworth.report.OutputFormat;
import org.voteworth.report.ProfileWriter;
import org.voteworth.score.EmpiricalBayesPrior;
import org.voteworth.score.PriorFit;
import org.voteworth.score.Ranker;
import org.voteworth.score.VoteFrequencyTable;
import org.voteworth.source.ScanSummary;
import org.voteworth.store.Store;
import org.voteworth.tally.ReviewerTableFile;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.TallyTable;
import tech.tablesaw.api.DateColumn;
import tech.tablesaw.api.DoubleColumn;
import tech.tablesaw.api.LongColumn;
import tech.tablesaw.api.StringColumn;
import tech.tablesaw.api.Table;
import tech.tablesaw.columns.numbers.NumberColumnFormatter;

/**
 * One row per reviewer across every file and category of a dump: the tallies every rule ranks
 * from, with the reconciliation of the rows they came from. Get one from {@link Dump#tally()},
 * {@link #open(Path)} (a store) or {@link #read(Path)}; rank it with {@link #rank(Rule)}, slice it as a Tablesaw table with
 * {@link #toTablesaw()}.
 */
public final class ReviewerTable {
    private final TallyTable table;
    private final String source;
    private final ScanSummary summary;
    private final Optional<Path> rejectsFile;
    private final long capVotes;
    private final UnaryOperator<String> ids;
    private final Optional<Store> store;
    private PriorFit prior;

    ReviewerTable(TallyTable table, String source, ScanSummary summary, Optional<Path> rejectsFile, long capVotes,
                  UnaryOperator<String> ids) {
        this(table, source, summary, rejectsFile, capVotes, ids, Optional.empty());
    }

    private ReviewerTable(TallyTable table, String source, ScanSummary summary, Optional<Path> rejectsFile, long capVotes,
                          UnaryOperator<String> ids, Optional<Store> store) {
        this.store = store;
        this.table = table;
        this.source = source;
        this.summary = summary;
        this.rejectsFile = rejectsFile;
        this.capVotes = capVotes;
        this.ids = ids;
    }

    /** Reads a reviewer table written by {@code voteworth tally} (reviewers.csv) or {@link #write(Path)}. */
    public static ReviewerTable read(Path reviewersCsv) throws IOException {
        return new ReviewerTable(ReviewerTableFile.read(reviewersCsv), reviewersCsv.toString(), new ScanSummary(List.of()),
                Optional.empty(), 0, UnaryOperator.identity());
    }

    /**
     * Opens the reviewer table of a store written by {@code voteworth tally DUMP --store DIR}, with
     * the reconciliation per file its manifest records; a store with every review can also
     * {@link #profile(String...)} reviewers.
     *
     * @throws IOException when the folder is not a store, or a store file is missing, damaged or disagrees with the manifest
     */
    public static ReviewerTable open(Path storeDir) throws IOException {
        Store s = Store.open(storeDir);
        Optional<Path> rejects = Optional.of(s.rejectsFile()).filter(Files::isRegularFile);
        return new ReviewerTable(s.reviewerTable(), storeDir.toString(), s.summary(), rejects, 0, UnaryOperator.identity(),
                Optional.of(s));
    }

    /** The same table whose outputs show a keyed pseudonym (HMAC-SHA-256) instead of each reviewer id. */
    public ReviewerTable pseudonymized(String key) {
        return new ReviewerTable(table, source, summary, rejectsFile, capVotes, IdMask.withKey(key), store);
    }

    /**
     * Profiles reviewers across all categories from the store's reviews: reviews by category, stars
     * against each category's, helpful share per review, activity per month, busiest days. An id
     * not in the store gives a profile that is not {@link ReviewerProfile#found() found}.
     *
     * @throws IllegalStateException when the table was not opened from a store that holds every review
     * @throws IOException when a store file cannot be read
     */
    public Report<List<ReviewerProfile>> profile(String... reviewerIds) throws IOException {
        Store s = store.filter(Store::hasReviews).orElseThrow(() -> new IllegalStateException("profiles need every review of "
                + "a store, and the table of " + source + (store.isPresent() ? " is a store of the reviewer table only" : " is not "
                + "from a store") + ": build one with 'voteworth tally DUMP... --store DIR' and open it with ReviewerTable.open(DIR)"));
        List<ReviewerProfile> profiles = new ArrayList<>(reviewerIds.length);
        for (String id : reviewerIds) {
            profiles.add(ReviewerProfile.of(s, id));
        }
        Map<String, String> parameters = ProfileWriter.storeParameters(source, s.manifest());
        return Report.markdown(List.copyOf(profiles), ProfileWriter.write(profiles, OutputFormat.MD, ids, parameters),
                ProfileWriter.write(profiles, OutputFormat.TABLE, ids, parameters));
    }

    /** Reviewers in the table. */
    public int size() {
        return table.size();
    }

    /** Rows read, accepted and rejected per file; empty when the table was read back from a file. */
    public ScanSummary summary() {
        return summary;
    }

    /** Whether read = accepted + rejected holds for every file (true for a table read back from a file). */
    public boolean reconciles() {
        return summary.reconciles();
    }

    /** The reconciliation in words, one line per file and a total. */
    public String reconciliation() {
        return summary.files().isEmpty() ? "read back from " + source + ": no rows to reconcile\n" : summary.describe();
    }

    /** Where the rejected rows went, with file, line, field and reason; empty for a table read back from a file. */
    public Optional<Path> rejectsFile() {
        return rejectsFile;
    }

    /** The categories seen, sorted. */
    public List<String> categories() {
        return table.categories();
    }

    /** One reviewer's tally, looked up by the id in the dump. */
    public Optional<ReviewerTally> reviewer(String id) {
        int slot = table.find(id);
        return slot < 0 ? Optional.empty() : Optional.of(table.get(slot));
    }

    /** The ids of every reviewer, in id order, as the dump spells them. */
    public List<String> reviewerIds() {
        List<String> out = new ArrayList<>(table.size());
        for (int slot : table.sortedById()) {
            out.add(table.id(slot));
        }
        return out;
    }

    /**
     * The empirical-Bayes Beta prior of the Bayesian rules, fitted by maximum likelihood over the
     * reviewers with at least one vote (as the command line does by default); fitted once.
     */
    public synchronized PriorFit prior() {
        if (prior == null) {
            prior = EmpiricalBayesPrior.fit(VoteFrequencyTable.of(table, 1));
        }
        return prior;
    }

    /** Ranks the reviewers under {@code rule}. */
    public Ranking rank(Rule rule) {
        PriorFit fit = rule.prior().map(PriorFit::given).orElseGet(this::prior);
        return new Ranking(this, rule, fit, Ranker.rank(table, rule.build(fit.prior()), rule.entryBar()));
    }

    /** Writes the table as the reviewer table CSV that {@code voteworth rank} and {@link #read(Path)} read. */
    public void write(Path reviewersCsv) throws IOException {
        ReviewerTableFile.write(table, reviewersCsv);
    }

    /**
     * The table as a Tablesaw data frame, one row per reviewer in id order, with the columns of
     * the reviewer table CSV ({@link ReviewerTableFile#HEADER}); ids pseudonymised if asked,
     * dates missing where no row had one, categories as {@code name:count;...}.
     */
    public Table toTablesaw() {
        int[] order = table.sortedById();
        int n = order.length;
        String[] id = new String[n];
        String[] cats = new String[n];
        long[][] counts = new long[15][n];
        double[][] shares = new double[3][n];
        DateColumn first = DateColumn.create("first_date");
        DateColumn last = DateColumn.create("last_date");
        for (int i = 0; i < n; i++) {
            ReviewerTally t = table.get(order[i]);
            id[i] = ids.apply(t.id());
            long[] c = {t.reviews(), t.helpfulVotes(), t.totalVotes(), t.votedReviews(), t.majorityReviews(),
                t.maxReviewVotes(), t.sumSquaredVotes(), t.verified(), t.incentivised(), t.stars().one(), t.stars().two(),
                t.stars().three(), t.stars().four(), t.stars().five()};
            for (int k = 0; k < c.length; k++) {
                counts[k][i] = c[k];
            }
            shares[0][i] = t.helpfulShare();
            shares[1][i] = t.maxReviewShare();
            shares[2][i] = t.herfindahl();
            appendDay(first, t.firstDay());
            appendDay(last, t.lastDay());
            StringBuilder b = new StringBuilder();
            t.reviewsByCategory().forEach((k, v) -> b.append(b.length() == 0 ? "" : ";").append(k).append(':').append(v));
            cats[i] = b.toString();
        }
        List<String> h = ReviewerTableFile.HEADER;
        Table out = Table.create("reviewers",
                StringColumn.create(h.get(0), id),
                LongColumn.create(h.get(1), counts[0]), LongColumn.create(h.get(2), counts[1]),
                LongColumn.create(h.get(3), counts[2]), DoubleColumn.create(h.get(4), shares[0]),
                LongColumn.create(h.get(5), counts[3]), LongColumn.create(h.get(6), counts[4]),
                LongColumn.create(h.get(7), counts[5]), DoubleColumn.create(h.get(8), shares[1]),
                LongColumn.create(h.get(9), counts[6]), DoubleColumn.create(h.get(10), shares[2]),
                LongColumn.create(h.get(11), counts[7]), LongColumn.create(h.get(12), counts[8]),
                LongColumn.create(h.get(13), counts[9]), LongColumn.create(h.get(14), counts[10]),
                LongColumn.create(h.get(15), counts[11]), LongColumn.create(h.get(16), counts[12]),
                LongColumn.create(h.get(17), counts[13]), first, last, StringColumn.create(h.get(20), cats));
        // Shares print with four decimals, as every report prints them; the values keep full precision.
        for (int c : new int[] {4, 8, 10}) {
            out.numberColumn(c).setPrintFormatter(NumberColumnFormatter.fixedWithGrouping(4));
        }
        return out;
    }

    /** Reviews per reviewer and category in long form: reviewer_id, category, reviews (one row per pair). */
    public Table categoriesToTablesaw() {
        StringColumn id = StringColumn.create("reviewer_id");
        StringColumn category = StringColumn.create("category");
        LongColumn reviews = LongColumn.create("reviews");
        for (int slot : table.sortedById()) {
            ReviewerTally t = table.get(slot);
            for (Map.Entry<String, Long> e : t.reviewsByCategory().entrySet()) {
                id.append(ids.apply(t.id()));
                category.append(e.getKey());
                reviews.append(e.getValue());
            }
        }
        return Table.create("reviews by category", id, category, reviews);
    }

    /**
     * One reviewer's history as the reviewer table holds it: reviews per category, stars, dates,
     * votes and how concentrated they are. The per-review history (each review's votes and date)
     * needs the per-review store.
     *
     * @throws IllegalArgumentException when the id is not in the table
     */
    public Report<ReviewerTally> history(String id) {
        ReviewerTally t = reviewer(id).orElseThrow(() -> new IllegalArgumentException("reviewer '" + id
                + "' is not in the table of " + source + " (" + table.size() + " reviewers)"));
        Grid g = new Grid(List.of("category", "reviews>", "share of reviews>"));
        t.reviewsByCategory().forEach((c, n) -> g.add(List.of(c.isEmpty() ? "(none)" : c, Long.toString(n),
                String.format(Locale.ROOT, "%.1f %%", 100.0 * n / t.reviews()))));
        String facts = String.format(Locale.ROOT, "%d reviews in %d categories, %s to %s; %d of %d votes helpful (%s); "
                        + "%d reviews with votes, the largest holds %.1f %% of them; stars 1-5: %d, %d, %d, %d, %d; "
                        + "%d verified, %d incentivised.",
                t.reviews(), t.reviewsByCategory().size(), day(t.firstDay()), day(t.lastDay()), t.helpfulVotes(),
                t.totalVotes(), t.totalVotes() == 0 ? "no votes" : String.format(Locale.ROOT, "%.1f %%", 100 * t.helpfulShare()),
                t.votedReviews(), 100 * t.maxReviewShare(), t.stars().one(), t.stars().two(), t.stars().three(),
                t.stars().four(), t.stars().five(), t.verified(), t.incentivised());
        String shown = ids.apply(id);
        StringBuilder md = new StringBuilder("### Reviewer " + shown.replace("|", "\\|") + "\n\n" + facts + "\n\n" + g.toMarkdown());
        md.append("\nEach review's own votes and date are in the per-review store, not in the reviewer table.\n\n");
        Cautions.TEXT.forEach(c -> md.append("- ").append(c).append('\n'));
        return Report.markdown(t, md.toString(), "reviewer " + shown + ": " + facts + "\n" + g.toText());
    }

    TallyTable tallyTable() {
        return table;
    }

    UnaryOperator<String> ids() {
        return ids;
    }

    String source() {
        return source;
    }

    long capVotes() {
        return capVotes;
    }

    private static void appendDay(DateColumn c, int epochDay) {
        if (epochDay == ReviewerTally.NO_DATE) {
            c.appendMissing();
        } else {
            c.append(LocalDate.ofEpochDay(epochDay));
        }
    }

    private static String day(int epochDay) {
        return epochDay == ReviewerTally.NO_DATE ? "no date" : LocalDate.ofEpochDay(epochDay).toString();
    }

    @Override
    public String toString() {
        String rows = summary.files().isEmpty() ? "read back from " + source
                : String.format(Locale.ROOT, "%,d rows read, %,d accepted, %,d rejected (read = accepted + rejected %s)",
                        summary.rowsRead(), summary.accepted(), summary.rejected(), summary.reconciles() ? "holds" : "DOES NOT HOLD");
        return String.format(Locale.ROOT, "ReviewerTable of %s: %,d reviewers in %d categories; %s", source, table.size(),
                table.categories().size(), rows);
    }
}
