package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.util.CombinatoricsUtils;
import org.junit.jupiter.api.RepeatedTest;
import org.junit.jupiter.api.Test;
import org.voteworth.tally.TallyTable;

class VoteFrequencyTableTest {
    private static int seed = 1;

    @Test
    void collapsesEqualPairsAndDropsUnitsWithoutVotes() {
        VoteFrequencyTable t = VoteFrequencyTable.of(new long[] {1, 0, 1, 3, 0, 1}, new long[] {2, 0, 2, 4, 5, 2});
        assertThat(t.distinctPairs()).isEqualTo(3);
        assertThat(t.units()).isEqualTo(5);
        List<String> seen = new ArrayList<>();
        t.forEach((h, tot, c) -> seen.add(h + "/" + tot + "x" + c));
        // Sorted by (T, H).
        assertThat(seen).containsExactly("1/2x3", "3/4x1", "0/5x1");
        assertThat(t.helpfulVotes()).isEqualTo(6);
        assertThat(t.totalVotes()).isEqualTo(15);
    }

    @Test
    void fromATallyTableWithAFloor() {
        TallyTable table = new TallyTable();
        table.add("a", 3, 4, 5, true, false, "toys", 19000);
        table.add("a", 1, 1, 5, true, false, "toys", 19001);
        table.add("b", 4, 5, 5, true, false, "toys", 19000);
        table.add("c", 0, 1, 2, true, false, "toys", 19000);
        table.add("d", 0, 0, 2, true, false, "toys", 19000);
        VoteFrequencyTable all = VoteFrequencyTable.of(table, 1);
        assertThat(all.units()).isEqualTo(3);
        assertThat(all.distinctPairs()).isEqualTo(2);
        assertThat(all).isEqualTo(VoteFrequencyTable.ofCounts(new long[] {0, 4}, new long[] {1, 5}, new long[] {1, 2}));
        assertThat(VoteFrequencyTable.of(table, 2).units()).isEqualTo(2);
        assertThatThrownBy(() -> VoteFrequencyTable.of(table, 0)).hasMessageContaining("at least 1").hasMessageContaining("0");
    }

    @RepeatedTest(10)
    void mergeIsAssociativeAndOrderIndependent() {
        Random rnd = new Random(4_100 + seed++);
        long[] allH = new long[0];
        long[] allT = new long[0];
        VoteFrequencyTable[] tables = new VoteFrequencyTable[3];
        for (int p = 0; p < 3; p++) {
            int n = rnd.nextInt(300);
            long[] h = new long[n];
            long[] t = new long[n];
            for (int i = 0; i < n; i++) {
                t[i] = rnd.nextInt(4) == 0 ? rnd.nextInt(2000) : rnd.nextInt(6);
                h[i] = t[i] == 0 ? 0 : rnd.nextLong(t[i] + 1);
            }
            tables[p] = VoteFrequencyTable.of(h, t);
            allH = concat(allH, h);
            allT = concat(allT, t);
        }
        VoteFrequencyTable whole = VoteFrequencyTable.of(allH, allT);
        VoteFrequencyTable a = tables[0].merge(tables[1]).merge(tables[2]);
        VoteFrequencyTable b = tables[0].merge(tables[1].merge(tables[2]));
        VoteFrequencyTable c = tables[2].merge(tables[0]).merge(tables[1]);
        assertThat(a).isEqualTo(whole).isEqualTo(b).isEqualTo(c);
        assertThat(whole.merge(VoteFrequencyTable.empty())).isEqualTo(whole);
    }

    @Test
    void binomialCoefficientsAgainstCommonsMath() {
        // Reference: Commons Math CombinatoricsUtils.binomialCoefficientLog.
        VoteFrequencyTable t = VoteFrequencyTable.ofCounts(new long[] {0, 4, 7, 30}, new long[] {20, 14, 12, 61},
                new long[] {7, 1, 3, 2});
        double expected = 7 * CombinatoricsUtils.binomialCoefficientLog(20, 0) + CombinatoricsUtils.binomialCoefficientLog(14, 4)
                + 3 * CombinatoricsUtils.binomialCoefficientLog(12, 7) + 2 * CombinatoricsUtils.binomialCoefficientLog(61, 30);
        assertThat(t.logBinomialCoefficients()).isCloseTo(expected, within(1e-9));
    }

    @Test
    void rejectsImpossibleCounts() {
        assertThatThrownBy(() -> VoteFrequencyTable.of(new long[] {3}, new long[] {2})).hasMessageContaining("entry 0")
                .hasMessageContaining("3 of 2");
        assertThatThrownBy(() -> VoteFrequencyTable.of(new long[] {1, 2}, new long[] {2})).hasMessageContaining("2 and 1");
        assertThatThrownBy(() -> VoteFrequencyTable.ofCounts(new long[] {1}, new long[] {2}, new long[] {-1}))
                .hasMessageContaining("-1");
    }

    private static long[] concat(long[] a, long[] b) {
        long[] r = new long[a.length + b.length];
        System.arraycopy(a, 0, r, 0, a.length);
        System.arraycopy(b, 0, r, a.length, b.length);
        return r;
    }
}
