package org.voteworth.spark;

import java.util.ArrayList;
import java.util.List;
import java.util.TreeMap;
import org.apache.spark.sql.Column;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.functions;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;
import org.voteworth.tally.ReviewerTally;
import org.voteworth.tally.StarCounts;

/**
 * A {@link ReviewerTally} as a Spark row and back, so that partial tallies cross the cluster as
 * rows and are merged with {@link ReviewerTally#merge} alone.
 *
 * <p>{@link #SCHEMA} carries the dates as epoch days ({@code first_day}, {@code last_day}, null
 * when no row had a date), which no time zone can shift; {@link #storeColumns()} turns them into
 * the store's {@code first_date}/{@code last_date} DATE columns and keeps the other columns in
 * the order of the reviewer table file.
 */
final class TallyRows {
    private static final StructType CATEGORY = new StructType(new StructField[] {
        DataTypes.createStructField("category", DataTypes.StringType, false),
        DataTypes.createStructField("reviews", DataTypes.LongType, false)});

    /** The counter columns after reviewer_id, in the reviewer table file's order. */
    static final List<String> COUNTERS = List.of("reviews", "helpful_votes", "total_votes", "voted_reviews",
            "majority_reviews", "max_review_votes", "sum_squared_votes", "verified", "incentivised",
            "stars_1", "stars_2", "stars_3", "stars_4", "stars_5");

    static final StructType SCHEMA = schema();

    private static final int FIRST_DAY = 1 + COUNTERS.size();
    private static final int LAST_DAY = FIRST_DAY + 1;
    private static final int CATEGORIES = LAST_DAY + 1;

    private TallyRows() {
    }

    private static StructType schema() {
        List<StructField> f = new ArrayList<>();
        f.add(DataTypes.createStructField("reviewer_id", DataTypes.StringType, false));
        for (String c : COUNTERS) {
            f.add(DataTypes.createStructField(c, DataTypes.LongType, false));
        }
        f.add(DataTypes.createStructField("first_day", DataTypes.IntegerType, true));
        f.add(DataTypes.createStructField("last_day", DataTypes.IntegerType, true));
        f.add(DataTypes.createStructField("categories", DataTypes.createArrayType(CATEGORY, false), false));
        return DataTypes.createStructType(f);
    }

    static Row row(ReviewerTally t) {
        Object[] v = new Object[SCHEMA.size()];
        v[0] = t.id();
        long[] counters = {t.reviews(), t.helpfulVotes(), t.totalVotes(), t.votedReviews(), t.majorityReviews(),
            t.maxReviewVotes(), t.sumSquaredVotes(), t.verified(), t.incentivised(), t.stars().one(), t.stars().two(),
            t.stars().three(), t.stars().four(), t.stars().five()};
        for (int i = 0; i < counters.length; i++) {
            v[1 + i] = counters[i];
        }
        v[FIRST_DAY] = t.firstDay() == ReviewerTally.NO_DATE ? null : t.firstDay();
        v[LAST_DAY] = t.lastDay() == ReviewerTally.NO_DATE ? null : t.lastDay();
        List<Row> cats = new ArrayList<>(t.reviewsByCategory().size());
        t.reviewsByCategory().forEach((c, n) -> cats.add(RowFactory.create(c, n)));
        v[CATEGORIES] = UnitScan.seq(cats);
        return RowFactory.create(v);
    }

    /** The tally of a row of {@link #SCHEMA}, or of the store's reviewer table read back (dates as epoch days). */
    static ReviewerTally tally(Row r) {
        TreeMap<String, Long> cats = new TreeMap<>();
        for (Row c : r.<Row>getList(CATEGORIES)) {
            cats.merge(c.getString(0), c.getLong(1), Long::sum);
        }
        return new ReviewerTally(r.getString(0), r.getLong(1), r.getLong(2), r.getLong(3), r.getLong(4), r.getLong(5),
                r.getLong(6), r.getLong(7), r.getLong(8), r.getLong(9),
                new StarCounts(r.getLong(10), r.getLong(11), r.getLong(12), r.getLong(13), r.getLong(14)), cats,
                r.isNullAt(FIRST_DAY) ? ReviewerTally.NO_DATE : r.getInt(FIRST_DAY),
                r.isNullAt(LAST_DAY) ? ReviewerTally.NO_DATE : r.getInt(LAST_DAY));
    }

    /** The store's reviewers.parquet columns from a frame of {@link #SCHEMA}. */
    static Column[] storeColumns() {
        return columns("date_from_unix_date(first_day)", "first_date", "date_from_unix_date(last_day)", "last_date");
    }

    /** {@link #SCHEMA}'s columns from the store's reviewers.parquet (the inverse of {@link #storeColumns()}). */
    static Column[] fromStoreColumns() {
        return columns("unix_date(first_date)", "first_day", "unix_date(last_date)", "last_day");
    }

    /** The id, the counters, the two date columns as given, and the categories. */
    private static Column[] columns(String first, String firstName, String last, String lastName) {
        List<Column> c = new ArrayList<>();
        c.add(functions.col("reviewer_id"));
        COUNTERS.forEach(n -> c.add(functions.col(n)));
        c.add(functions.expr(first).as(firstName));
        c.add(functions.expr(last).as(lastName));
        c.add(functions.col("categories"));
        return c.toArray(Column[]::new);
    }
}
