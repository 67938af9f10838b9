package org.voteworth.source;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;
import org.junit.jupiter.api.Test;

class ByteScanTest {
    /** The word-at-a-time search must agree with a plain byte loop at every offset and length. */
    @Test
    void agreesWithAByteLoop() {
        Random rnd = new Random(13);
        for (int round = 0; round < 3000; round++) {
            byte[] a = new byte[rnd.nextInt(70)];
            for (int i = 0; i < a.length; i++) {
                // Few distinct values so matches, near-matches (0x89 vs 0x09) and high bytes all occur.
                a[i] = (byte) new int[] {'\t', '\n', ',', 0x89, 0x8A, 0x00, 0xFF, 'a', 0x08, 0x0A + 0x80}[rnd.nextInt(10)];
            }
            int from = a.length == 0 ? 0 : rnd.nextInt(a.length + 1);
            int to = from + rnd.nextInt(a.length - from + 1);
            for (byte b : new byte[] {'\t', '\n', ',', (byte) 0xFF, 0}) {
                int expectedIndex = -1;
                int expectedCount = 0;
                for (int i = from; i < to; i++) {
                    if (a[i] == b) {
                        expectedCount++;
                        if (expectedIndex < 0) {
                            expectedIndex = i;
                        }
                    }
                }
                assertThat(ByteScan.indexOf(a, from, to, b, ByteScan.pattern(b))).isEqualTo(expectedIndex);
                assertThat(ByteScan.count(a, from, to, b, ByteScan.pattern(b))).isEqualTo(expectedCount);
            }
        }
    }

    /** The test for bytes up to 0x0A must flag exactly those bytes, for every byte value in every position. */
    @Test
    void flagsExactlyTheBytesUpToLineFeed() {
        Random rnd = new Random(17);
        for (int round = 0; round < 20_000; round++) {
            byte[] a = new byte[8];
            for (int i = 0; i < 8; i++) {
                a[i] = (byte) (round < 256 ? (round + 37 * i) : rnd.nextInt(256));
            }
            long m = ByteScan.atMostLineFeed(ByteScan.word(a, 0));
            for (int i = 0; i < 8; i++) {
                boolean flagged = ((m >>> (8 * i)) & 0xFF) == 0x80;
                assertThat(flagged).as("byte 0x%02x at %d", a[i] & 0xFF, i).isEqualTo((a[i] & 0xFF) <= 0x0A);
                assertThat((m >>> (8 * i)) & 0x7F).isZero();
            }
        }
    }
}
