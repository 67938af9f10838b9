package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.voteworth.source.DumpFile;
import org.voteworth.source.DumpFinder;
import org.voteworth.source.DumpReader;
import org.voteworth.source.ProgressListener;
import org.voteworth.source.RejectLog;
import org.voteworth.source.ScanSummary;
import org.voteworth.source.SourceOptions;
import org.voteworth.tally.ReviewerTableFile;
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

    /** Prints {@code text} to stdout, or writes it to DIR/NAME.EXT and says so. */
    static void emit(picocli.CommandLine.Model.CommandSpec spec, Path out, String name,
                     org.voteworth.report.OutputFormat f, String text) throws IOException {
        PrintWriter stdout = spec.commandLine().getOut();
        if (out == null) {
            stdout.print(text);
        } else {
            Path file = out.resolve(name + "." + f.extension());
            Files.writeString(file, text);
            stdout.println("wrote " + file);
        }
        stdout.flush();
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
        if (s.capVotes == 0) {
            return TallyRun.run(o, unit, rejectsFile, quiet, err);
        }
        if (s.capVotes < 0) {
            throw new IllegalArgumentException("--cap-votes must be at least 1 vote per review (or 0 for no cap), not "
                    + s.capVotes);
        }
        if (o.inputs.size() == 1 && Files.isRegularFile(Path.of(o.inputs.get(0)))
                && ReviewerTableFile.looksLikeReviewerTable(Path.of(o.inputs.get(0)))) {
            throw new IllegalArgumentException("--cap-votes needs each review's votes, but " + o.inputs.get(0)
                    + " is a reviewer table (votes already summed per reviewer): give the dump instead");
        }
        long start = System.nanoTime();
        SourceOptions options = TallyRun.sourceOptions(o);
        List<DumpFile> files = DumpFinder.find(o.inputs, options.categories());
        TallyTable table = new TallyTable(unit);
        if (rejectsFile.getParent() != null) {
            Files.createDirectories(rejectsFile.getParent());
        }
        ScanSummary summary;
        try (RejectLog rejects = new RejectLog(rejectsFile)) {
            summary = new DumpReader(options).read(files, new VoteCap(s.capVotes, table), rejects,
                    quiet ? ProgressListener.NONE : new TallyRun.Progress(err, start));
        }
        long bytes = files.stream().mapToLong(DumpFile::sizeBytes).sum();
        double seconds = (System.nanoTime() - start) / 1e9;
        if (!quiet) {
            err.printf(Locale.ROOT, "tally: done, %,d rows from %d files in %.1f s, votes capped at %d per review%n",
                    summary.rowsRead(), files.size(), seconds, s.capVotes);
            err.flush();
        }
        return new TallyRun.Result(table, summary, rejectsFile, seconds, bytes);
    }
}
