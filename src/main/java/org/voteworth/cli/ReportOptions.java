package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.voteworth.report.OutputFormat;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;

/**
 * Where and how a ranking or analysis command writes its result, and how it ends: the options
 * {@code --format}, {@code --out} and {@code --quiet}, the default rejects file, and the
 * reconciliation every run closes with.
 */
final class ReportOptions {
    @Option(names = "--format", defaultValue = "table", paramLabel = "table|md|csv|json",
            description = "Output format (default: ${DEFAULT-VALUE}).")
    String format;

    @Option(names = "--out", paramLabel = "DIR", description = "Write the result file (named after the command) into this folder instead of stdout.")
    Path out;

    @Option(names = "--quiet", description = "No progress or reconciliation on stderr.")
    boolean quiet;

    OutputFormat format() {
        return OutputFormat.parse(format);
    }

    /** Creates the output folder if one is given, and returns where rejected rows go. */
    Path prepare(DumpOptions dump) throws IOException {
        if (out != null) {
            Files.createDirectories(out);
        }
        return dump.rejectsFile().orElse(out != null ? out.resolve("rejects.tsv") : Path.of("voteworth-rejects.tsv"));
    }

    /** Prints {@code text} to stdout, or writes it to {@code NAME.EXT} in {@code --out} and says so. */
    void emit(CommandSpec spec, String name, OutputFormat f, String text) throws IOException {
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

    /** Ends the run with the reconciliation on stderr (unless quiet); exit code 1 when it does not hold. */
    int finish(TallyRun.Result t, PrintWriter err) {
        return finish(t.summary(), err);
    }

    /** As {@link #finish(TallyRun.Result, PrintWriter)} for a scan's reconciliation. */
    int finish(org.voteworth.source.ScanSummary s, PrintWriter err) {
        if (!quiet && !s.files().isEmpty()) {
            err.print(s.describe());
            err.flush();
        }
        return s.reconciles() ? 0 : 1;
    }
}
