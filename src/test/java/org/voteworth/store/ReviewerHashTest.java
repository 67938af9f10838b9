package org.voteworth.store;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

class ReviewerHashTest {
    private static int fnv(String s) {
        byte[] b = s.getBytes(StandardCharsets.US_ASCII);
        return ReviewerHash.hash(b, 0, b.length);
    }

    @Test
    void isThirtyTwoBitFnv1a() {
        // FNV-1a 32-bit test vectors of Fowler, Noll and Vo's reference test suite (values from memory,
        // recomputed by hand for "" and "a": offset basis 0x811c9dc5; (0x811c9dc5 ^ 0x61) * 16777619 mod 2^32).
        assertThat(fnv("")).isEqualTo(0x811c9dc5);
        assertThat(fnv("a")).isEqualTo(0xe40c292c);
        assertThat(fnv("foobar")).isEqualTo(0xbf9cf968);
    }

    @Test
    void thePartIsTheUnsignedHashModuloTheParts() {
        // 0xbf9cf968 = 3214735720 as an unsigned number (a signed int would be negative): mod 16 = 8, mod 7 = 0.
        assertThat(ReviewerHash.part("foobar", 16)).isEqualTo(8);
        assertThat(ReviewerHash.part("foobar", 7)).isZero();
        assertThat(ReviewerHash.part("foobar", 1)).isZero();
        assertThatThrownBy(() -> ReviewerHash.part("x", 0)).hasMessageContaining("at least one");
    }
}
