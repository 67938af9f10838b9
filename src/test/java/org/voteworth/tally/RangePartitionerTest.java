package org.voteworth.tally;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The partitions must be ranges of the output order (String order, the order {@link IdOrder}
 * implements): written one after another they give a sorted table. The reference order is
 * {@link String#compareTo} itself.
 */
class RangePartitionerTest {
    private static long key(String id) {
        byte[] b = id.getBytes(StandardCharsets.UTF_8);
        return RangePartitioner.keyOf(b, 0, b.length);
    }

    /** Ids of every kind the tally meets: numbers of several lengths, codes, prefixes of each other, accents, symbols outside the BMP. */
    private static List<String> mixedIds(Random rnd, int n) {
        String[] pieces = {"", "a", "A", "z", "0", "9", "-", "é", "ü", "\uFFFD", "\uE000", "😀", "用户", "\u007F"};
        List<String> ids = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            switch (i % 4) {
                case 0 -> ids.add(Long.toString(rnd.nextInt(1 << 30)));
                case 1 -> ids.add("rev-" + rnd.nextInt(100_000));
                case 2 -> ids.add(Long.toString(rnd.nextInt(1000)));
                default -> {
                    StringBuilder b = new StringBuilder();
                    for (int k = rnd.nextInt(12); k >= 0; k--) {
                        b.append(pieces[rnd.nextInt(pieces.length)]);
                    }
                    ids.add(b.toString());
                }
            }
        }
        return ids;
    }

    @Test
    void partitionsNeverContradictStringOrder() {
        Random rnd = new Random(11);
        List<String> ids = mixedIds(rnd, 20_000);
        long[] sample = new long[2000];
        for (int i = 0; i < sample.length; i++) {
            sample[i] = key(ids.get(rnd.nextInt(ids.size())));
        }
        RangePartitioner p = RangePartitioner.fromSample(sample, sample.length, 64);
        assertThat(p.parts()).isBetween(8, 64);
        List<String> sorted = new ArrayList<>(ids);
        sorted.sort(String::compareTo);
        int last = 0;
        for (String id : sorted) {
            int part = p.of(key(id));
            assertThat(part).as("partition of '%s' after one in partition %d", id, last).isGreaterThanOrEqualTo(last);
            last = part;
        }
        assertThat(last).isEqualTo(p.parts() - 1);
    }

    @Test
    void idsAheadOfNonAsciiOnesStayAheadWhateverTheirBytes() {
        // U+E000 is one UTF-16 unit above the surrogates of U+1F600, but its UTF-8 bytes sort below them:
        // String order puts "a😀" first. The key must not put them the other way round.
        assertThat("a😀".compareTo("a\uE000")).isNegative();
        assertThat(key("a😀")).isEqualTo(key("a\uE000"));
        assertThat(Long.compareUnsigned(key("a\u007F"), key("aé"))).isNegative();
        assertThat(Long.compareUnsigned(key("a"), key("a0"))).isNegative();
        assertThat(key("12345678")).isEqualTo(key("123456789"));
    }

    @Test
    void uniformIdsFillEqualPartitions() {
        Random rnd = new Random(5);
        long[] sample = new long[1 << 16];
        for (int i = 0; i < sample.length; i++) {
            sample[i] = key(Integer.toString(10_000_000 + rnd.nextInt(90_000_000)));
        }
        RangePartitioner p = RangePartitioner.fromSample(sample, sample.length, 64);
        assertThat(p.parts()).isEqualTo(64);
        int[] counts = new int[64];
        for (int i = 0; i < 200_000; i++) {
            counts[p.of(key(Integer.toString(10_000_000 + rnd.nextInt(90_000_000))))]++;
        }
        for (int c : counts) {
            assertThat(c).isBetween(200_000 / 64 * 8 / 10, 200_000 / 64 * 12 / 10);
        }
    }

    @Test
    void aSampleWithoutSpreadGivesFewerPartitions() {
        assertThat(RangePartitioner.fromSample(new long[0], 0, 64).parts()).isEqualTo(1);
        long[] same = new long[500];
        java.util.Arrays.fill(same, key("reviewer-000"));
        assertThat(RangePartitioner.fromSample(same, same.length, 64).parts()).isEqualTo(1);
    }
}
