package org.voteworth.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * RBO_EXT (Webber, Moffat &amp; Zobel 2010, eq. 32) on cases worked by hand from the published
 * formula, and its identities: identical lists 1, disjoint lists 0, a prefix extrapolates to 1.
 */
class RankBiasedOverlapTest {
    @Test
    void identicalListsGiveOne() {
        assertThat(RankBiasedOverlap.extrapolated(new int[] {1, 2, 3, 4, 5}, new int[] {1, 2, 3, 4, 5}, 0.9))
                .isCloseTo(1.0, within(1e-12));
    }

    @Test
    void disjointListsGiveZero() {
        assertThat(RankBiasedOverlap.extrapolated(new int[] {1, 2, 3}, new int[] {4, 5, 6}, 0.9)).isZero();
    }

    @Test
    void swappedPairGivesP() {
        // By hand: X_1 = 0, X_2 = 2, so (1-p)/p * (2/2) p^2 + (2/2) p^2 = p(1-p) + p^2 = p.
        assertThat(RankBiasedOverlap.extrapolated(new int[] {1, 2}, new int[] {2, 1}, 0.9)).isCloseTo(0.9, within(1e-12));
        assertThat(RankBiasedOverlap.extrapolated(new int[] {1, 2}, new int[] {2, 1}, 0.5)).isCloseTo(0.5, within(1e-12));
    }

    @Test
    void sameFirstDifferentSecond() {
        // By hand: [a,b] vs [a,c]: X_1 = 1, X_2 = 1: (1-p)/p (p + p^2/2) + p^2/2 = (1-p)(1 + p/2) + p^2/2 = 1 - p/2.
        assertThat(RankBiasedOverlap.extrapolated(new int[] {1, 2}, new int[] {1, 3}, 0.9)).isCloseTo(0.55, within(1e-12));
    }

    @Test
    void aPrefixOfTheLongerListExtrapolatesToOne() {
        // Uneven lengths: by hand from eq. 32 with s = 3, l = 4: (1-p)(1+p+p^2+p^3) + p^4 = 1.
        assertThat(RankBiasedOverlap.extrapolated(new int[] {1, 2, 3}, new int[] {1, 2, 3, 4}, 0.9))
                .isCloseTo(1.0, within(1e-12));
    }

    @Test
    void isSymmetricAndBounded() {
        int[] a = {5, 3, 9, 1, 7, 2};
        int[] b = {3, 5, 2, 8, 1};
        double ab = RankBiasedOverlap.extrapolated(a, b, 0.9);
        assertThat(ab).isCloseTo(RankBiasedOverlap.extrapolated(b, a, 0.9), within(1e-15)).isBetween(0.0, 1.0);
    }

    @Test
    void rejectsAPersistenceOutsideTheOpenUnitInterval() {
        assertThatThrownBy(() -> RankBiasedOverlap.extrapolated(new int[] {1}, new int[] {1}, 1.0))
                .hasMessageContaining("persistence");
    }

    @Test
    void jaccardCountsTheSharedShareOfTheUnion() {
        // Definition: |{2,3}| / |{1,2,3,4}| = 0.5.
        assertThat(Jaccard.of(new int[] {1, 2, 3}, new int[] {2, 3, 4})).isEqualTo(0.5);
        assertThat(Jaccard.of(new int[] {}, new int[] {})).isEqualTo(1.0);
    }
}
