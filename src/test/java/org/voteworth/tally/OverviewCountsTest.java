package org.voteworth.tally;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.LocalDate;
import java.time.YearMonth;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.voteworth.source.ReviewRow;

class OverviewCountsTest {
    /** One invented review, for equality tests only. */
    record Review(String reviewer, String category, long helpful, long total, int stars, int verified, int incentivised,
                  int day) {
        void addTo(OverviewCounts c) {
            c.add(category, helpful, total, stars, verified, incentivised, day);
        }

        void addTo(TallyTable t) {
            t.add(reviewer, helpful, total, stars, verified == 1, incentivised == 1, category, day);
        }
    }

    static List<Review> reviews(long seed, int n) {
        Random rnd = new Random(seed);
        String[] cats = {"garden", "kitchen", "toys", ""};
        List<Review> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            long total = rnd.nextDouble() < 0.5 ? 0 : rnd.nextDouble() < 0.99 ? rnd.nextInt(30) : 4000 + rnd.nextInt(9000);
            long helpful = total == 0 ? 0 : rnd.nextLong(total + 1);
            int flag = rnd.nextInt(3) - 1;
            int day = rnd.nextInt(10) == 0 ? ReviewRow.NO_DATE : 10_000 + rnd.nextInt(8000);
            out.add(new Review("r" + rnd.nextInt(n / 3 + 1), cats[rnd.nextInt(cats.length)], helpful, total,
                    rnd.nextInt(6) == 0 ? ReviewRow.ABSENT : 1 + rnd.nextInt(5), flag, rnd.nextInt(3) - 1, day));
        }
        return out;
    }

    static OverviewCounts counted(List<Review> rs) {
        OverviewCounts c = new OverviewCounts();
        rs.forEach(r -> r.addTo(c));
        return c;
    }

    @Test
    void mergeOfPartsInAnyOrderEqualsOnePass() {
        List<Review> all = reviews(1, 6000);
        OverviewCounts whole = counted(all);
        OverviewCounts a = counted(all.subList(0, 1000));
        OverviewCounts b = counted(all.subList(1000, 4500));
        OverviewCounts c = counted(all.subList(4500, 6000));

        OverviewCounts left = counted(List.of());
        left.mergeFrom(a);
        left.mergeFrom(b);
        left.mergeFrom(c);
        OverviewCounts bc = counted(List.of());
        bc.mergeFrom(b);
        bc.mergeFrom(c);
        OverviewCounts right = counted(List.of());
        right.mergeFrom(a);
        right.mergeFrom(bc);
        OverviewCounts reversed = counted(List.of());
        reversed.mergeFrom(c);
        reversed.mergeFrom(b);
        reversed.mergeFrom(a);

        assertThat(left).isEqualTo(whole);
        assertThat(right).isEqualTo(whole);
        assertThat(reversed).isEqualTo(whole);
        List<Review> shuffled = new ArrayList<>(all);
        Collections.shuffle(shuffled, new Random(9));
        assertThat(counted(shuffled)).isEqualTo(whole);
        assertThat(reversed.overall()).isEqualTo(whole.overall());
    }

    @Test
    void countsEachFieldAsTheRowsSayPerCategoryAndOverall() {
        List<Review> all = reviews(2, 3000);
        OverviewCounts c = counted(all);
        assertThat(c.categories()).containsExactly("", "garden", "kitchen", "toys");
        for (String cat : c.categories()) {
            List<Review> in = all.stream().filter(r -> r.category().equals(cat)).toList();
            CategoryCounts k = c.category(cat).orElseThrow();
            assertThat(k.rows()).isEqualTo(in.size());
            assertThat(k.stars().of(4)).isEqualTo(in.stream().filter(r -> r.stars() == 4).count());
            assertThat(k.unrated()).isEqualTo(in.stream().filter(r -> r.stars() == ReviewRow.ABSENT).count());
            assertThat(k.zeroVoteReviews()).isEqualTo(in.stream().filter(r -> r.total() == 0).count());
            assertThat(k.verified()).isEqualTo(in.stream().filter(r -> r.verified() == 1).count());
            assertThat(k.notVerified()).isEqualTo(in.stream().filter(r -> r.verified() == 0).count());
            assertThat(k.incentivised()).isEqualTo(in.stream().filter(r -> r.incentivised() == 1).count());
            assertThat(k.undated()).isEqualTo(in.stream().filter(r -> r.day() == ReviewRow.NO_DATE).count());
            assertThat(k.helpfulVotes().sum()).isEqualTo(in.stream().mapToLong(Review::helpful).sum());
            long monthTotal = k.reviewsPerMonth().values().stream().mapToLong(Long::longValue).sum();
            assertThat(monthTotal + k.undated()).isEqualTo(k.rows());
        }
        CategoryCounts overall = c.overall();
        assertThat(overall.rows()).isEqualTo(all.size()).isEqualTo(c.rows());
        assertThat(overall.totalVotes().sum()).isEqualTo(all.stream().mapToLong(Review::total).sum());
        // Months checked against java.time on the same days.
        YearMonth some = YearMonth.from(LocalDate.ofEpochDay(all.stream().filter(r -> r.day() != ReviewRow.NO_DATE)
                .findFirst().orElseThrow().day()));
        assertThat(overall.reviewsPerMonth().get(some)).isEqualTo(all.stream()
                .filter(r -> r.day() != ReviewRow.NO_DATE && YearMonth.from(LocalDate.ofEpochDay(r.day())).equals(some)).count());
    }

    @Test
    void reviewsPerReviewerComeFromTheFinalTable() {
        List<Review> all = reviews(3, 4000);
        TallyTable t = new TallyTable();
        all.forEach(r -> r.addTo(t));
        OverviewCounts c = counted(all);
        c.addReviewers(t);
        CategoryCounts overall = c.overall();
        assertThat(overall.reviewers()).isEqualTo(t.size());
        assertThat(overall.reviewsPerReviewer().sum()).isEqualTo(all.size());
        for (String cat : c.categories()) {
            long distinct = all.stream().filter(r -> r.category().equals(cat)).map(Review::reviewer).distinct().count();
            assertThat(c.category(cat).orElseThrow().reviewers()).as(cat).isEqualTo(distinct);
            assertThat(c.category(cat).orElseThrow().reviewsPerReviewer().sum()).isEqualTo(c.category(cat).orElseThrow().rows());
        }
        assertThatThrownBy(() -> c.addReviewers(new TallyTable(TallyUnit.REVIEW))).hasMessageContaining("reviewer table");
    }

    @Test
    void epochMonthAgreesWithJavaTime() {
        // Reference: java.time.LocalDate (proleptic ISO calendar) over four centuries either side of 1970.
        for (long day = -150_000; day <= 150_000; day += 7) {
            LocalDate d = LocalDate.ofEpochDay(day);
            long expected = (d.getYear() - 1970L) * 12 + d.getMonthValue() - 1;
            assertThat(CategoryCounts.epochMonth(day)).as("day %d = %s", day, d).isEqualTo(expected);
        }
        for (String iso : new String[] {"2000-02-29", "2000-03-01", "1969-12-31", "1970-01-01", "2024-12-31", "1900-02-28"}) {
            LocalDate d = LocalDate.parse(iso);
            assertThat(CategoryCounts.epochMonth(d.toEpochDay())).as(iso).isEqualTo((d.getYear() - 1970L) * 12 + d.getMonthValue() - 1);
        }
    }

    @Test
    void refusesHelpfulAboveTotal() {
        assertThatThrownBy(() -> new OverviewCounts().add("garden", 3, 2, 5, 1, 0, 0)).hasMessageContaining("helpful <= total");
    }
}
