package org.voteworth.analysis;

import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.voteworth.score.BetaPrior;

/**
 * P(X &gt; Y) for independent X ~ Beta(a₁, b₁), Y ~ Beta(a₂, b₂), by numerical integration of
 * ∫ f_X(x) F_Y(x) dx (Commons Math Legendre-Gauss quadrature over X's effective support, split
 * into pieces so that the narrow posteriors of well-evidenced reviewers are resolved).
 *
 * <p>When that support reaches 0 or 1, the density behaves like x^(a₁-1) or (1-x)^(b₁-1) there:
 * for a parameter below 2 (a reviewer with every vote helpful has b₁ = the prior's β, often
 * below 2) its derivative is unbounded and the quadrature does not converge. The piece at such an
 * end is integrated in s with x = s⁴ (or 1 - x = s⁴), which turns the factor into a smooth
 * s^(4a-1) (or s^(4b-1)).
 */
public final class BetaComparison {
    private static final int PIECES = 16;
    private static final int MAX_EVALUATIONS = 100_000;

    private BetaComparison() {
    }

    public static double probabilityGreater(BetaPrior x, BetaPrior y) {
        BetaDistribution fx = new BetaDistribution(null, x.alpha(), x.beta(), 1e-12);
        BetaDistribution fy = new BetaDistribution(null, y.alpha(), y.beta(), 1e-12);
        // X's mass lies within its mean ± 14 sd (Chebyshev leaves ≤ 0.5 %; Beta tails are far thinner).
        double lo = Math.max(0, x.mean() - 14 * x.sd());
        double hi = Math.min(1, x.mean() + 14 * x.sd());
        IterativeLegendreGaussIntegrator g = new IterativeLegendreGaussIntegrator(16, 1e-10, 1e-13);
        double sum = 0;
        double w = (hi - lo) / PIECES;
        UnivariateFunction f = t -> density(fx, t) * fy.cumulativeProbability(t);
        for (int i = 0; i < PIECES; i++) {
            double from = lo + i * w;
            double to = i == PIECES - 1 ? hi : from + w;
            if (from == 0 && x.alpha() < 2) {
                // x = s^4, dx = 4 s^3 ds
                sum += g.integrate(MAX_EVALUATIONS, s -> 4 * s * s * s * f.value(s * s * s * s), 0, Math.pow(to, 0.25));
            } else if (to == 1 && x.beta() < 2) {
                // 1 - x = s^4, dx = -4 s^3 ds
                sum += g.integrate(MAX_EVALUATIONS, s -> 4 * s * s * s * f.value(1 - s * s * s * s), 0, Math.pow(1 - from, 0.25));
            } else {
                sum += g.integrate(MAX_EVALUATIONS, f, from, to);
            }
        }
        return Math.max(0, Math.min(1, sum));
    }

    private static double density(BetaDistribution d, double t) {
        double v = d.density(t);
        return Double.isFinite(v) ? v : 0;
    }
}
