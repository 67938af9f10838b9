package org.voteworth.tally;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;

/** The reference for every order here is Java's own {@link String#compareTo} on the same ids. */
class IdOrderTest {
    private static List<String> ids(Random rnd, int n, boolean ascii) {
        Set<String> out = new LinkedHashSet<>();
        String[] odd = {"\u00e9", "\uffe9", "\ue000", "\ud83d\ude00", "\u0000", "~", " "};
        while (out.size() < n) {
            String id = switch (rnd.nextInt(ascii ? 6 : 8)) {
                case 0 -> Long.toString(rnd.nextInt(100_000));
                case 1 -> Long.toString(Math.abs(rnd.nextLong()) % 1_000_000_000_000_000_000L);
                case 2 -> "0" + rnd.nextInt(1000);
                // Long shared prefixes: ties on the first 8 and 16 bytes, and ids that are prefixes of others.
                case 3 -> "reviewer-000000-" + rnd.nextInt(300);
                case 4 -> "reviewer" + (rnd.nextBoolean() ? "" : Integer.toString(rnd.nextInt(50)));
                case 5 -> "ab" + (rnd.nextBoolean() ? "\u0000" : "") + rnd.nextInt(20);
                default -> "r" + odd[rnd.nextInt(odd.length)] + rnd.nextInt(30);
            };
            out.add(id);
        }
        return new ArrayList<>(out);
    }

    private static void assertSortedLikeStrings(List<String> ids) {
        KeyIndex index = new KeyIndex();
        ids.forEach(index::slotOf);
        List<String> got = new ArrayList<>();
        for (int s : IdOrder.sortedSlots(index)) {
            got.add(index.id(s));
        }
        List<String> expected = new ArrayList<>(ids);
        expected.sort(String::compareTo);
        assertThat(got).isEqualTo(expected);
    }

    @Test
    void slotsOfAsciiIdsSortAsStringsDo() {
        for (int seed = 0; seed < 20; seed++) {
            assertSortedLikeStrings(ids(new Random(seed), 50 + 400 * seed, true));
        }
    }

    @Test
    void slotsOfIdsBeyondAsciiSortAsStringsDo() {
        for (int seed = 0; seed < 5; seed++) {
            assertSortedLikeStrings(ids(new Random(100 + seed), 2000, false));
        }
    }

    @Test
    void numericIdsOnlySortAsStringsDo() {
        Random rnd = new Random(9);
        Set<String> ids = new LinkedHashSet<>();
        while (ids.size() < 50_000) {
            ids.add(Long.toString(rnd.nextInt(10) == 0 ? rnd.nextInt(1000) : 10_000_000 + rnd.nextInt(90_000_000)));
        }
        assertSortedLikeStrings(new ArrayList<>(ids));
    }

    @Test
    void digitsOfNumbersAgreeWithLongToString() {
        byte[] b = new byte[24];
        Random rnd = new Random(2);
        List<Long> values = new ArrayList<>(List.of(0L, 9L, 10L, 99L, 100L, 101L, Long.MAX_VALUE));
        for (long p = 1; p > 0 && p <= Long.MAX_VALUE / 10; p *= 10) {
            values.addAll(List.of(p - 1, p, p + 1, 10 * p - 1));
        }
        for (int i = 0; i < 10_000; i++) {
            values.add(rnd.nextLong() >>> (1 + rnd.nextInt(63)));
        }
        for (long v : values) {
            int n = KeyIndex.digits(v, b, 3);
            assertThat(new String(b, 3, n, StandardCharsets.US_ASCII)).isEqualTo(Long.toString(v));
            assertThat(KeyIndex.decimalLength(v)).isEqualTo(n);
        }
    }

    @Test
    void pairwiseComparisonAgreesWithStrings() {
        List<String> ids = ids(new Random(4), 600, false);
        List<String> disagree = new ArrayList<>();
        for (String a : ids) {
            for (String b : ids.subList(0, 60)) {
                byte[] x = a.getBytes(StandardCharsets.UTF_8);
                byte[] y = b.getBytes(StandardCharsets.UTF_8);
                if (Integer.signum(IdOrder.compare(x, x.length, y, y.length)) != Integer.signum(a.compareTo(b))) {
                    disagree.add(a + " vs " + b);
                }
            }
        }
        assertThat(disagree).isEmpty();
    }
}
