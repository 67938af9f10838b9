package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class RawShareTest {

    @Test
    void scoreIsTheShareAndTheIntervalIsWilsonAtNinetyFive() {
        RawShare rule = new RawShare();
        assertThat(rule.score(Evidence.of(81, 263))).isEqualTo(81.0 / 263);
        // Newcombe (1998), 81/263 (confirmed): Wilson 0.2553, 0.3662.
        Interval i = rule.interval(Evidence.of(81, 263)).orElseThrow();
        assertThat(i.lower()).isCloseTo(0.2553, within(5e-5));
        assertThat(i.upper()).isCloseTo(0.3662, within(5e-5));
        assertThat(i.confidence()).isEqualTo(0.95);
    }

    @Test
    void smallSamplesWithFullSharesComeFirst() {
        // The artefact the project exists to show: 1 of 1 beats 990 of 1000 under the raw share.
        RawShare rule = new RawShare();
        assertThat(rule.score(Evidence.of(1, 1))).isGreaterThan(rule.score(Evidence.of(990, 1000)));
    }

    @Test
    void namesAndEdges() {
        RawShare rule = new RawShare();
        assertThat(rule.name()).isEqualTo("raw-share");
        assertThat(rule.label()).isEqualTo("Raw share (H / T)");
        assertThat(rule.describe()).endsWith(".");
        assertThat(rule.score(Evidence.of(0, 0))).isZero();
        assertThat(rule.eligible(Evidence.of(0, 0))).isFalse();
    }
}
