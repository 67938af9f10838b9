package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

class RuleSettingsTest {

    @Test
    void defaultsAreNinetyFivePercentAndTheFivePercentQuantile() {
        RuleSettings s = RuleSettings.defaults(new BetaPrior(1, 1));
        assertThat(s.confidence()).isEqualTo(0.95);
        assertThat(s.quantile()).isEqualTo(0.05);
        assertThat(s.prior()).isEqualTo(new BetaPrior(1, 1));
    }

    @Test
    void rejectsOutOfRangeSettings() {
        BetaPrior p = new BetaPrior(1, 1);
        assertThatThrownBy(() -> new RuleSettings(95, 0.05, p)).hasMessageContaining("95");
        assertThatThrownBy(() -> new RuleSettings(0.95, 0.6, p)).hasMessageContaining("0.6");
        assertThatThrownBy(() -> new RuleSettings(0.95, 0.05, null)).isInstanceOf(NullPointerException.class);
    }
}
