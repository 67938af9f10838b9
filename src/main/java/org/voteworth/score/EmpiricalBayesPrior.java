package org.voteworth.score;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.math3.analysis.MultivariateFunction;
import org.apache.commons.math3.exception.TooManyEvaluationsException;
import org.apache.commons.math3.exception.TooManyIterationsException;
import org.apache.commons.math3.optim.ConvergenceChecker;
import org.apache.commons.math3.optim.InitialGuess;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.MaxIter;
import org.apache.commons.math3.optim.PointValuePair;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.nonlinear.scalar.ObjectiveFunction;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.NelderMeadSimplex;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.SimplexOptimizer;
import org.apache.commons.math3.special.Beta;

/**
 * The empirical-Bayes Beta prior of the helpful share: the Beta(α, β) that best explains how
 * shares spread across reviewers, fitted to the beta-binomial marginal.
 *
 * <p><b>Maximum likelihood</b> ({@link #fit}): maximise, over a {@link VoteFrequencyTable} of
 * distinct (H, T) pairs with counts c,
 * <pre>
 *   L(α, β) = Σ c · [ ln B(H + α, T − H + β) − ln B(α, β) ]
 * </pre>
 * (the beta-binomial marginal without its binomial coefficients, which do not depend on α, β;
 * Gelman et al., Bayesian Data Analysis, 3rd ed., 5.3, and Skellam (1948), J. R. Statist. Soc.
 * B 10:257-261). The search runs in (logit μ, ln κ), μ = α/(α+β), κ = α+β, where the surface is
 * close to quadratic and unconstrained, starting from moment estimates.
 *
 * <p><b>Method of moments</b> ({@link #methodOfMoments}): the estimator of Gelman et al., BDA3,
 * 5.1 (rat tumours): with the N unit shares p_j = H_j / T_j (each counted c times), their mean
 * m = Σ p_j / N and sample variance s² = Σ (p_j − m)² / (N − 1), match the Beta mean and
 * variance: κ = m(1 − m)/s² − 1, α = mκ, β = (1 − m)κ. It ignores binomial noise in the shares
 * (so it understates κ when T is small); it is kept because it is the published one and the
 * fallback. {@link #methodOfMomentsBinomial} allows for that noise.
 */
public final class EmpiricalBayesPrior {
    /**
     * Strengths beyond this are treated as κ → ∞: a prior of a million pseudo-votes means the
     * shares show no over-dispersion that the data could resolve.
     */
    static final double KAPPA_LIMIT = 1e6;
    /** The smallest strength a moment estimate is floored at when shares are as spread as they can be. */
    static final double KAPPA_FLOOR = 1e-3;
    private static final int MAX_EVALUATIONS = 20_000;
    private static final int RESTARTS = 3;

    private EmpiricalBayesPrior() {
    }

    /**
     * The maximum-likelihood prior, falling back (with a warning) to {@link #methodOfMoments}
     * when the likelihood is flat (κ → ∞: no over-dispersion; or every unit has one vote, so κ
     * is not identified), when its maximum lies on an edge (every vote helpful, or every one
     * unhelpful; or κ → 0), or when the optimiser fails.
     *
     * @throws IllegalArgumentException when the table is empty: there is nothing to fit
     */
    public static PriorFit fit(VoteFrequencyTable table) {
        requireUnits(table);
        List<String> warnings = new ArrayList<>();
        long h = table.helpfulVotes();
        long t = table.totalVotes();
        if (h == 0 || h == t) {
            warnings.add("every vote in the fitted table is " + (h == 0 ? "unhelpful" : "helpful")
                    + ", so the likelihood has no maximum inside (0, 1); the prior comes from the method of moments");
            return fallback(table, warnings);
        }
        if (table.total(table.distinctPairs() - 1) == 1) {
            warnings.add("every unit has a single vote, so the likelihood cannot tell how widely shares spread (it does"
                    + " not depend on the prior strength); the prior comes from the method of moments");
            return fallback(table, warnings);
        }
        // Nelder-Mead: two parameters, a cheap objective and no gradient to code or trust near
        // the flat ridge along κ; it needs no bounds in the (logit μ, ln κ) parametrisation.
        double[] start = start(table);
        MultivariateFunction negLogL = x -> {
            double mu = 1 / (1 + Math.exp(-x[0]));
            // Plateaus beyond both ends of κ stop the simplex drifting where the likelihood is flat.
            double kappa = Math.exp(Math.max(Math.log(KAPPA_FLOOR) - 10, Math.min(x[1], Math.log(KAPPA_LIMIT) + 10)));
            double a = mu * kappa;
            double b = (1 - mu) * kappa;
            if (!(a > 0 && b > 0) || Double.isInfinite(kappa)) {
                return Double.POSITIVE_INFINITY;
            }
            double v = -logLikelihood(table, a, b);
            return Double.isNaN(v) ? Double.POSITIVE_INFINITY : v;
        };
        PointValuePair best;
        try {
            best = minimise(negLogL, start);
            for (int r = 0; r < RESTARTS; r++) {
                // A restart from the optimum rebuilds a simplex that may have collapsed (common practice with Nelder-Mead).
                PointValuePair again = minimise(negLogL, best.getPoint());
                boolean done = again.getValue() >= best.getValue() - 1e-10 * Math.max(1, Math.abs(best.getValue()));
                if (again.getValue() < best.getValue()) {
                    best = again;
                }
                if (done) {
                    break;
                }
            }
        } catch (TooManyEvaluationsException | TooManyIterationsException e) {
            warnings.add("the likelihood optimiser did not converge within " + MAX_EVALUATIONS
                    + " evaluations; the prior comes from the method of moments");
            return fallback(table, warnings);
        }
        double mu = 1 / (1 + Math.exp(-best.getPoint()[0]));
        double kappa = Math.exp(best.getPoint()[1]);
        if (!(kappa <= KAPPA_LIMIT) || !(mu > 0 && mu < 1)) {
            warnings.add(String.format(Locale.ROOT, "the likelihood is flat as the prior strength grows (kappa -> infinity,"
                    + " past %.0e): the shares vary no more than binomial noise explains, so there is no over-dispersion"
                    + " to fit; the prior comes from the method of moments", KAPPA_LIMIT));
            return fallback(table, warnings);
        }
        if (kappa < KAPPA_FLOOR) {
            warnings.add(String.format(Locale.ROOT, "the likelihood keeps rising as the prior strength falls to 0 (below"
                    + " %s): the shares split into all-or-nothing, as when most units have one or two votes, so there is"
                    + " no interior maximum; the prior comes from the method of moments", KAPPA_FLOOR));
            return fallback(table, warnings);
        }
        BetaPrior prior = BetaPrior.ofMeanAndStrength(mu, kappa);
        smallTableWarning(table, warnings);
        return new PriorFit(prior, PriorFit.Method.MAXIMUM_LIKELIHOOD, logLikelihood(table, prior.alpha(), prior.beta()),
                table.units(), table.distinctPairs(), true, warnings);
    }

    /**
     * The moment estimator of Gelman et al., BDA3, 5.1: mean and sample variance (divisor N − 1)
     * of the raw shares H/T, one per unit, matched to the Beta mean and variance. On the first
     * 70 rat-tumour experiments it gives (α, β) = (1.356, 8.615), the book's (1.4, 8.6).
     * Where no estimate exists the nearest usable prior is returned with a warning: fewer than
     * two units or no spread give κ = 1e6 (no over-dispersion seen); spread as large as a share's
     * can be gives κ = 0.001; all shares 0 (or 1) give μ = (ΣH + ½)/(ΣT + 1).
     *
     * @throws IllegalArgumentException when the table is empty
     */
    public static PriorFit methodOfMoments(VoteFrequencyTable table) {
        requireUnits(table);
        List<String> warnings = new ArrayList<>();
        BetaPrior prior = ratioMoments(table, warnings);
        smallTableWarning(table, warnings);
        return moments(table, prior, warnings, true);
    }

    /**
     * Moments that allow for binomial noise: with the shares' mean m and population variance V
     * (divisor N), and h = the mean of 1/T over units, match V to the beta-binomial
     * m(1 − m)(ρ + (1 − ρ)h) with ρ = 1/(κ + 1), so κ = (1 − ρ)/ρ. When every T is the same n
     * this is the textbook beta-binomial moment estimator (on the Saxony families, α = 34.1350,
     * β = 31.6085). Fit start for {@link #fit}. Where no estimate exists (ρ outside (0, 1), or every
     * T = 1) the {@link #methodOfMoments} estimate is returned instead, with a warning.
     *
     * @throws IllegalArgumentException when the table is empty
     */
    public static PriorFit methodOfMomentsBinomial(VoteFrequencyTable table) {
        requireUnits(table);
        List<String> warnings = new ArrayList<>();
        double[] mk = binomialMoments(table);
        BetaPrior prior;
        if (mk.length == 0) {
            warnings.add("the spread of shares is within binomial noise (or every unit has one vote), so the"
                    + " noise-corrected moments give no prior; using the moments of the raw shares");
            prior = ratioMoments(table, warnings);
        } else {
            prior = BetaPrior.ofMeanAndStrength(mk[0], mk[1]);
        }
        smallTableWarning(table, warnings);
        return moments(table, prior, warnings, true);
    }

    /**
     * L(α, β) = Σ c · [ln B(H + α, T − H + β) − ln B(α, β)] over the table, without binomial
     * coefficients (see {@link VoteFrequencyTable#logBinomialCoefficients()}).
     */
    public static double logLikelihood(VoteFrequencyTable table, BetaPrior prior) {
        return logLikelihood(table, prior.alpha(), prior.beta());
    }

    static double logLikelihood(VoteFrequencyTable table, double a, double b) {
        double sum = 0;
        int n = table.distinctPairs();
        for (int i = 0; i < n; i++) {
            long h = table.helpful(i);
            long t = table.total(i);
            sum += table.count(i) * Beta.logBeta(h + a, (t - h) + b);
        }
        return sum - table.units() * Beta.logBeta(a, b);
    }

    private static PointValuePair minimise(MultivariateFunction f, double[] start) {
        // Every vertex must settle, in value (1e-12 relative) and in place (1e-9 in logit μ and ln κ).
        ConvergenceChecker<PointValuePair> checker = (iteration, previous, current) -> {
            double fp = previous.getValue();
            double fc = current.getValue();
            if (Math.abs(fp - fc) > 1e-12 * Math.max(1, Math.max(Math.abs(fp), Math.abs(fc)))) {
                return false;
            }
            double[] p = previous.getPoint();
            double[] c = current.getPoint();
            return Math.abs(p[0] - c[0]) <= 1e-9 && Math.abs(p[1] - c[1]) <= 1e-9;
        };
        SimplexOptimizer optimiser = new SimplexOptimizer(checker);
        return optimiser.optimize(new MaxEval(MAX_EVALUATIONS), new MaxIter(MAX_EVALUATIONS), new ObjectiveFunction(f),
                GoalType.MINIMIZE, new InitialGuess(start), new NelderMeadSimplex(new double[] {0.5, 0.5}));
    }

    /** (logit μ, ln κ) to start from: noise-corrected moments, else raw-share moments, else a weak prior. */
    private static double[] start(VoteFrequencyTable table) {
        double[] mk = binomialMoments(table);
        BetaPrior p;
        if (mk.length == 2) {
            p = BetaPrior.ofMeanAndStrength(mk[0], Math.min(mk[1], KAPPA_LIMIT));
        } else {
            p = ratioMoments(table, new ArrayList<>());
        }
        double mu = p.mean();
        return new double[] {Math.log(mu / (1 - mu)), Math.log(p.strength())};
    }

    private static PriorFit fallback(VoteFrequencyTable table, List<String> warnings) {
        BetaPrior prior = ratioMoments(table, warnings);
        smallTableWarning(table, warnings);
        return moments(table, prior, warnings, false);
    }

    private static PriorFit moments(VoteFrequencyTable table, BetaPrior prior, List<String> warnings, boolean converged) {
        return new PriorFit(prior, PriorFit.Method.METHOD_OF_MOMENTS, logLikelihood(table, prior.alpha(), prior.beta()),
                table.units(), table.distinctPairs(), converged, warnings);
    }

    /** Gelman et al.'s estimator, made total: see {@link #methodOfMoments} for the edge cases. */
    private static BetaPrior ratioMoments(VoteFrequencyTable table, List<String> warnings) {
        long n = table.units();
        double m = meanShare(table);
        double ss = 0;
        for (int i = 0; i < table.distinctPairs(); i++) {
            double d = (double) table.helpful(i) / table.total(i) - m;
            ss += table.count(i) * d * d;
        }
        double mu = m;
        if (!(m > 0 && m < 1)) {
            mu = (table.helpfulVotes() + 0.5) / (table.totalVotes() + 1.0);
            warnings.add(String.format(Locale.ROOT, "every share is %s, so the prior mean is set to (helpful + 1/2) /"
                    + " (total + 1) = %.4g", m <= 0 ? "0" : "1", mu));
        }
        double kappa;
        if (n < 2 || ss <= 0) {
            kappa = KAPPA_LIMIT;
            String why = n < 2 ? "a single unit shows no spread of shares" : "every unit has the same share";
            warnings.add(String.format(Locale.ROOT, "%s; the prior strength is capped at %.0e votes (no over-dispersion"
                    + " seen)", why, KAPPA_LIMIT));
        } else {
            double s2 = ss / (n - 1);
            kappa = mu * (1 - mu) / s2 - 1;
            if (kappa > KAPPA_LIMIT) {
                warnings.add(String.format(Locale.ROOT, "the shares barely vary; the prior strength is capped at %.0e votes",
                        KAPPA_LIMIT));
                kappa = KAPPA_LIMIT;
            } else if (!(kappa >= KAPPA_FLOOR)) {
                warnings.add(String.format(Locale.ROOT, "the shares are as spread as shares can be (variance %.4g against"
                        + " at most %.4g), so the moments give no strength; the prior strength is floored at %s votes",
                        s2, mu * (1 - mu), KAPPA_FLOOR));
                kappa = KAPPA_FLOOR;
            }
        }
        return BetaPrior.ofMeanAndStrength(mu, kappa);
    }

    /** {μ, κ} from the noise-corrected moments, or an empty array when they give none. */
    private static double[] binomialMoments(VoteFrequencyTable table) {
        long n = table.units();
        double m = meanShare(table);
        double ss = 0;
        double inv = 0;
        for (int i = 0; i < table.distinctPairs(); i++) {
            double d = (double) table.helpful(i) / table.total(i) - m;
            ss += table.count(i) * d * d;
            inv += table.count(i) / (double) table.total(i);
        }
        double v = ss / n;
        double h = inv / n;
        if (!(m > 0 && m < 1) || !(h < 1)) {
            return new double[0];
        }
        double rho = (v / (m * (1 - m)) - h) / (1 - h);
        if (!(rho > 0 && rho < 1)) {
            return new double[0];
        }
        return new double[] {m, (1 - rho) / rho};
    }

    private static double meanShare(VoteFrequencyTable table) {
        double s = 0;
        for (int i = 0; i < table.distinctPairs(); i++) {
            s += table.count(i) * ((double) table.helpful(i) / table.total(i));
        }
        return s / table.units();
    }

    private static void requireUnits(VoteFrequencyTable table) {
        if (table.units() == 0) {
            throw new IllegalArgumentException("no reviewers with votes at or above the fitting floor, so there is no prior"
                    + " to fit: lower the floor or give the prior yourself (alpha and beta)");
        }
    }

    private static void smallTableWarning(VoteFrequencyTable table, List<String> warnings) {
        if (table.units() < 10) {
            warnings.add("the prior rests on only " + table.units() + " units: treat it as a rough guess");
        }
    }
}
