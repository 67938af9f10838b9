package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Optional;
import org.voteworth.store.Store;
import org.voteworth.tally.TallyTable;
import org.voteworth.tally.TallyUnit;
import org.voteworth.tally.VoteCap;

/**
 * Reads the input of a ranking command: {@link TallyRun#run} as it is, or, with
 * {@code --cap-votes}, the same scan with every row passed through {@link VoteCap} first (the cap
 * needs each review's votes, so it cannot be applied to a reviewer table read back from CSV). A
 * store folder written by {@code tally --store} is read instead of any dump.
 */
final class AnalysisInput {
    private AnalysisInput() {
    }

    /** The parameters every analysis report starts with. */
    static java.util.Map<String, String> parameters(org.voteworth.score.PriorFit fit, ScoringOptions s, DumpOptions d,
                                                    TallyTable table) {
        java.util.Map<String, String> p = new java.util.LinkedHashMap<>();
        p.put("input", String.join(" ", d.inputs) + " (" + table.size() + (table.unit() == TallyUnit.REVIEW ? " reviews)" : " reviewers)"));
        p.put("confidence", Double.toString(s.confidence));
        p.put("prior", RankRun.describe(fit));
        p.put("vote cap", s.capVotes == 0 ? "none" : "at most " + s.capVotes + " votes per review, helpful scaled in proportion");
        p.put("tie order", "higher score, then more total votes, then reviewer id");
        return p;
    }

    /** The store folder when the input is one (a single folder written by {@code tally --store}). */
    static Optional<Path> store(DumpOptions o) {
        return o.inputs.size() == 1 && Store.isStore(Path.of(o.inputs.get(0))) ? Optional.of(Path.of(o.inputs.get(0))) : Optional.empty();
    }

    static TallyRun.Result read(DumpOptions o, ScoringOptions s, TallyUnit unit, Path rejectsFile, boolean quiet,
                                PrintWriter err) throws IOException {
        Optional<Path> store = store(o);
        if (store.isPresent()) {
            return fromStore(store.get(), unit, s.capVotes);
        }
        return TallyRun.run(o, unit, rejectsFile, quiet, err, s.capVotes);
    }

    /**
     * As {@link #read}, with the data set overview filled for a store too (a dump's scan counts it on
     * the way; a store's reviews are read once more for it, so only the commands that show it ask).
     * A store of the reviewer table only has no reviews to count: its overview stays empty, as for a
     * reviewer table file.
     */
    static TallyRun.Result readWithOverview(DumpOptions o, ScoringOptions s, TallyUnit unit, Path rejectsFile, boolean quiet,
                                            PrintWriter err) throws IOException {
        TallyRun.Result t = read(o, s, unit, rejectsFile, quiet, err);
        Optional<Path> store = store(o);
        if (store.isPresent() && Store.open(store.get()).hasReviews()) {
            TallyRun.Written w = StoreTally.overview(store.get());
            return new TallyRun.Result(t.table(), t.summary(), t.rejectsFile(), t.seconds() + w.seconds(), t.bytes(), w.overview());
        }
        return t;
    }

    /**
     * Reads a store written by {@code tally --store} and never the dump: its reviewer table, or, for
     * a vote cap or the review unit, its reviews tallied again. The reconciliation is the store's.
     */
    static TallyRun.Result fromStore(Path dir, TallyUnit unit, long capVotes) throws IOException {
        if (capVotes < 0) {
            throw new IllegalArgumentException("--cap-votes must be at least 1 vote per review (or 0 for no cap), not " + capVotes);
        }
        long start = System.nanoTime();
        Store store = Store.open(dir);
        TallyTable table;
        if (capVotes == 0 && unit == TallyUnit.REVIEWER) {
            table = store.reviewerTable();
        } else {
            table = new TallyTable(unit);
            store.scan(capVotes == 0 ? table : new VoteCap(capVotes, table));
        }
        // Ranking needs no data set overview (as for a reviewer table read back); 'overview' counts a store itself.
        return new TallyRun.Result(table, store.summary(), store.rejectsFile(), (System.nanoTime() - start) / 1e9,
                StoreTally.sizeOf(dir), new org.voteworth.tally.OverviewCounts());
    }
}
