package org.voteworth.cli;

import java.io.PrintWriter;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/**
 * The {@code voteworth} command line: one subcommand per job. Exit codes: 0 success, 1 failure
 * (bad input, I/O, a failed check), 2 usage error.
 */
@Command(name = "voteworth",
        mixinStandardHelpOptions = true,
        versionProvider = Main.Version.class,
        description = "Scores how credible reviewers are from the helpfulness votes their reviews received, "
                + "ranks them with sound statistics, and explains every rank.",
        subcommands = {DemoCommand.class, GenerateCommand.class, TallyCommand.class, OverviewCommand.class, SparkTallyCommand.class,
                RankCommand.class, SweepCommand.class, CompareCommand.class, AuditCommand.class, ReportCommand.class, ProfileCommand.class,
                CommandLine.HelpCommand.class})
public final class Main implements Runnable {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    public static void main(String[] args) {
        System.exit(run(args));
    }

    /** Runs the command line and returns its exit code (tests call this instead of {@link #main}). */
    public static int run(String... args) {
        return commandLine().execute(args);
    }

    /** Runs the command line with its output and errors sent to the given writers. */
    public static int run(PrintWriter out, PrintWriter err, String... args) {
        CommandLine cl = commandLine();
        cl.setOut(out);
        cl.setErr(err);
        return cl.execute(args);
    }

    static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        cl.setExecutionExceptionHandler((ex, cmd, parsed) -> {
            PrintWriter err = cmd.getErr();
            err.println("voteworth " + cmd.getCommandName() + ": " + message(ex));
            if (System.getenv("VOTEWORTH_DEBUG") != null) {
                ex.printStackTrace(err);
            }
            err.flush();
            return 1;
        });
        return cl;
    }

    private static String message(Throwable ex) {
        Throwable t = ex;
        while (t.getMessage() == null && t.getCause() != null) {
            t = t.getCause();
        }
        return t.getMessage() == null ? t.toString() : t.getMessage();
    }

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "name a command (see --help)");
    }

    /** The version from the jar manifest, or "development" when run from classes. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            String v = Main.class.getPackage().getImplementationVersion();
            return new String[] {"voteworth " + (v == null ? "development build" : v),
                    "Java " + System.getProperty("java.version")};
        }
    }
}
