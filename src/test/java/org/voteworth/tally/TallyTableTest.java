package org.voteworth.tally;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import org.junit.jupiter.api.RepeatedTest;
import org.junit.jupiter.api.Test;

class TallyTableTest {

    /** One generated review; the property tests shuffle and partition lists of these. */
    record Review(String id, long helpful, long total, int stars, boolean verified, boolean incentivised,
                  String category, int day) {
        void addTo(TallyTable t) {
            t.add(id, helpful, total, stars, verified, incentivised, category, day);
        }

        ReviewerTally tally() {
            return ReviewerTally.ofReview(id, helpful, total, stars, verified, incentivised, category, day);
        }
    }

    static List<Review> randomReviews(Random rnd, int n) {
        String[] cats = {"garden", "books", "kitchen", "toys"};
        List<Review> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            // Mix canonical numeric ids, numeric-looking ids with leading zeros and text ids.
            int who = rnd.nextInt(40);
            String id = switch (who % 3) {
                case 0 -> Integer.toString(1000 + who);
                case 1 -> "00" + who;
                default -> "rev-" + who;
            };
            long total = rnd.nextInt(5) == 0 ? rnd.nextInt(500) : rnd.nextInt(4);
            long helpful = total == 0 ? 0 : rnd.nextLong(total + 1);
            int stars = rnd.nextInt(7) - 1; // -1 (absent), 0 (invalid, ignored), 1..5
            int day = rnd.nextInt(10) == 0 ? ReviewerTally.NO_DATE : 15000 + rnd.nextInt(3000);
            out.add(new Review(id, helpful, total, stars, rnd.nextInt(5) > 0, rnd.nextInt(100) == 0,
                    cats[rnd.nextInt(cats.length)], day));
        }
        return out;
    }

    static TallyTable tableOf(List<Review> reviews) {
        TallyTable t = new TallyTable();
        reviews.forEach(r -> r.addTo(t));
        return t;
    }

    @RepeatedTest(25)
    void mergeOfPartitionsInAnyOrderEqualsOnePass() {
        Random rnd = new Random(7_000 + counter++);
        List<Review> all = randomReviews(rnd, 400);
        List<ReviewerTally> expected = tableOf(all).toSortedList();

        // Partition at random, build one table per part, merge parts in a shuffled order.
        List<List<Review>> parts = new ArrayList<>();
        int k = 1 + rnd.nextInt(6);
        for (int i = 0; i < k; i++) {
            parts.add(new ArrayList<>());
        }
        all.forEach(r -> parts.get(rnd.nextInt(k)).add(r));
        Collections.shuffle(parts, rnd);
        TallyTable merged = new TallyTable();
        for (List<Review> p : parts) {
            merged.mergeFrom(tableOf(p));
        }
        assertThat(merged.toSortedList()).isEqualTo(expected);
    }

    private static int counter;

    @RepeatedTest(25)
    void mergeIsAssociativeAndCommutative() {
        Random rnd = new Random(9_100 + counter++);
        List<Review> all = randomReviews(rnd, 300);
        List<Review> a = all.subList(0, 100);
        List<Review> b = all.subList(100, 200);
        List<Review> c = all.subList(200, 300);

        TallyTable left = tableOf(a);           // (a + b) + c
        left.mergeFrom(tableOf(b));
        left.mergeFrom(tableOf(c));

        TallyTable bc = tableOf(b);             // a + (b + c)
        bc.mergeFrom(tableOf(c));
        TallyTable right = tableOf(a);
        right.mergeFrom(bc);

        TallyTable swapped = tableOf(c);        // c + b + a
        swapped.mergeFrom(tableOf(b));
        swapped.mergeFrom(tableOf(a));

        assertThat(left.toSortedList()).isEqualTo(right.toSortedList()).isEqualTo(swapped.toSortedList());
    }

    @RepeatedTest(10)
    void tableMergeMeansTheSameAsRecordMerge() {
        Random rnd = new Random(12_000 + counter++);
        List<Review> all = randomReviews(rnd, 300);
        Map<String, ReviewerTally> folded = new TreeMap<>();
        for (Review r : all) {
            folded.merge(r.id(), r.tally(), ReviewerTally::merge);
        }
        assertThat(tableOf(all).toSortedList()).containsExactlyElementsOf(folded.values());
    }

    @Test
    void rowsFromTheScannerGiveTheSameSlotsInOrderOfFirstAppearanceAsAddingThemOneByOne() {
        // Rows are batched internally; every reading method must see them all, in their order.
        List<Review> all = randomReviews(new Random(21), 3000);
        TallyTable added = tableOf(all);
        TallyTable accepted = new TallyTable();
        org.voteworth.source.ReviewRow row = new org.voteworth.source.ReviewRow();
        List<String> firstSeen = new ArrayList<>();
        for (Review r : all) {
            accepted.accept(TestRows.fill(row, r.id(), r.category(), r.helpful(), r.total(), r.stars(), r.verified(),
                    r.incentivised(), r.day()));
            if (!firstSeen.contains(r.id())) {
                firstSeen.add(r.id());
            }
            if (firstSeen.size() == 7) {
                // A read in the middle of the stream sees every row so far.
                assertThat(accepted.size()).isEqualTo(7);
            }
        }
        assertThat(accepted.size()).isEqualTo(firstSeen.size());
        for (int s = 0; s < accepted.size(); s++) {
            assertThat(accepted.id(s)).isEqualTo(firstSeen.get(s));
            assertThat(accepted.get(s)).isEqualTo(added.get(added.find(firstSeen.get(s))));
        }
    }

    @Test
    void addingWholeTalliesRoundTrips() {
        List<Review> all = randomReviews(new Random(5), 200);
        TallyTable original = tableOf(all);
        TallyTable copy = new TallyTable();
        original.toSortedList().forEach(copy::add);
        assertThat(copy.toSortedList()).isEqualTo(original.toSortedList());
    }

    @Test
    void keepsTheCountsOfOneReviewer() {
        TallyTable t = new TallyTable();
        t.add("42", 9, 10, 5, true, false, "garden", 18000);
        t.add("42", 0, 0, 1, false, true, "books", 17000);
        t.add("42", 1, 4, 4, true, false, "garden", 19000);
        ReviewerTally r = t.get(t.find("42"));
        assertThat(r.reviews()).isEqualTo(3);
        assertThat(r.helpfulVotes()).isEqualTo(10);
        assertThat(r.totalVotes()).isEqualTo(14);
        assertThat(r.votedReviews()).isEqualTo(2);
        assertThat(r.majorityReviews()).isEqualTo(1);   // 9/10 is a majority, 1/4 is not
        assertThat(r.maxReviewVotes()).isEqualTo(10);
        assertThat(r.sumSquaredVotes()).isEqualTo(100 + 16);
        assertThat(r.maxReviewShare()).isEqualTo(10.0 / 14);
        assertThat(r.herfindahl()).isEqualTo(116.0 / 196);
        assertThat(r.verified()).isEqualTo(2);
        assertThat(r.incentivised()).isEqualTo(1);
        assertThat(r.stars()).isEqualTo(new StarCounts(1, 0, 0, 1, 1));
        assertThat(r.reviewsByCategory()).containsExactly(Map.entry("books", 1L), Map.entry("garden", 2L));
        assertThat(r.firstDay()).isEqualTo(17000);
        assertThat(r.lastDay()).isEqualTo(19000);
    }

    @Test
    void numericLookingIdsStayDistinctFromTheirCanonicalForm() {
        TallyTable t = new TallyTable();
        t.add("7", 1, 1, 5, true, false, "x", ReviewerTally.NO_DATE);
        t.add("007", 1, 2, 5, true, false, "x", ReviewerTally.NO_DATE);
        t.add("99999999999999999999", 0, 1, 5, true, false, "x", ReviewerTally.NO_DATE);
        assertThat(t.size()).isEqualTo(3);
        assertThat(t.totalVotes(t.find("7"))).isEqualTo(1);
        assertThat(t.totalVotes(t.find("007"))).isEqualTo(2);
        assertThat(t.id(t.find("99999999999999999999"))).isEqualTo("99999999999999999999");
        assertThat(t.find("8")).isEqualTo(-1);
    }

    @Test
    void manyIdsGrowEveryStructure() {
        TallyTable t = new TallyTable();
        for (int i = 0; i < 50_000; i++) {
            t.add(i % 2 == 0 ? Integer.toString(i) : "r" + i, 1, 2, 1 + i % 5, false, false, "c" + i % 3, 18000 + i % 7);
        }
        assertThat(t.size()).isEqualTo(50_000);
        assertThat(t.get(t.find("r49999")).reviewsByCategory()).containsExactly(Map.entry("c1", 1L));
        assertThat(t.get(t.find("49998")).stars().four()).isEqualTo(1);
    }

    @Test
    void refusesHelpfulAboveTotal() {
        assertThatThrownBy(() -> new TallyTable().add("1", 3, 2, 5, true, false, "x", 0))
                .hasMessageContaining("helpful <= total");
    }
}
