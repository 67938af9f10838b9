package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import org.voteworth.tally.TallyTable;
import org.voteworth.tally.TallyUnit;
import org.voteworth.tally.VoteCap;

/**
 * Reads the input of a ranking command: {@link TallyRun#run} as it is, or, with
 * {@code --cap-votes}, the same scan with every row passed through {@link VoteCap} first (the cap
 * needs each review's votes, so it cannot be applied to a reviewer table read back from CSV).
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

    static TallyRun.Result read(DumpOptions o, ScoringOptions s, TallyUnit unit, Path rejectsFile, boolean quiet,
                                PrintWriter err) throws IOException {
        return TallyRun.run(o, unit, rejectsFile, quiet, err, s.capVotes);
    }
}
