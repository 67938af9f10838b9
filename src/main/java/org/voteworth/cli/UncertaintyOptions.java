package org.voteworth.cli;

import picocli.CommandLine.Option;
import org.voteworth.analysis.RankUncertainty;

/** The Monte Carlo options of the commands that say how sure a rank is. */
final class UncertaintyOptions {
    static final long DEFAULT_SEED = 20240611L;

    @Option(names = "--draws", defaultValue = "2000", paramLabel = "N",
            description = "Monte Carlo draws for P(in top k) and rank intervals (default: ${DEFAULT-VALUE}).")
    int draws;

    @Option(names = "--seed", defaultValue = "" + DEFAULT_SEED, paramLabel = "SEED",
            description = "Random seed: the same seed gives the same numbers whatever the thread count (default: ${DEFAULT-VALUE}).")
    long seed;

    /** The draws' settings; {@code threads} is the command's one {@code --threads} (see DumpOptions). */
    RankUncertainty.Settings settings(int k, int threads) {
        return new RankUncertainty.Settings(k, draws, seed, threads, 0.05, 0.95);
    }
}
