package org.voteworth.score;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class PriorFitTest {

    @Test
    void aGivenPriorCarriesNoFit() {
        PriorFit f = PriorFit.given(new BetaPrior(2, 8));
        assertThat(f.method()).isEqualTo(PriorFit.Method.GIVEN);
        assertThat(f.logLikelihood()).isNaN();
        assertThat(f.unitsUsed()).isZero();
        assertThat(f.converged()).isTrue();
        assertThat(f.warnings()).isEmpty();
        assertThat(f.mu()).isEqualTo(0.2);
        assertThat(f.kappa()).isEqualTo(10.0);
    }

    @Test
    void warningsAreCopied() {
        List<String> w = new ArrayList<>(List.of("a"));
        PriorFit f = new PriorFit(new BetaPrior(1, 1), PriorFit.Method.METHOD_OF_MOMENTS, -1, 3, 2, true, w);
        w.add("b");
        assertThat(f.warnings()).containsExactly("a");
    }
}
