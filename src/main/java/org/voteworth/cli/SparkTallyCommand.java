package org.voteworth.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code voteworth spark-tally}: the tally as an Apache Spark job, writing the store layout.
 * Spark is not part of the voteworth jar: this class names no Spark type, and the job's classes
 * ({@code org.voteworth.spark}) are loaded only once Spark is known to be on the class path, so
 * {@code --help} and every other command work without it.
 */
@Command(name = "spark-tally", mixinStandardHelpOptions = true,
        description = {"Tallies a review dump on Apache Spark (4.0.x, Scala 2.13) for dumps too large for one machine, "
                + "with the same rows accepted and rejected as 'tally'.",
                "Writes the store to --out on any file system Spark reads: reviewers.parquet/ (part files in reviewer "
                        + "order), rejects.tsv, reconciliation.txt, vote-frequencies.csv, manifest.json, and with "
                        + "--reviewer-csv the reviewers.csv that 'rank' reads. Needs Spark on the class path: run it "
                        + "with spark-submit, or see docs/spark.md."})
final class SparkTallyCommand implements Callable<Integer> {
    /** A class every Spark SQL installation has; looked up without initialising it. */
    static final String SPARK_CLASS = "org.apache.spark.sql.SparkSession";

    @Spec
    CommandSpec spec;

    @Mixin
    DumpOptions dump;

    @Option(names = "--out", defaultValue = "voteworth-store", paramLabel = "DIR",
            description = "The store folder, e.g. out/store or hdfs://nn/voteworth/store (default: ${DEFAULT-VALUE}).")
    String out;

    @Option(names = "--master", paramLabel = "URL",
            description = "Spark master, e.g. local[*] (default: spark-submit's, or local[*] outside spark-submit).")
    String master;

    @Option(names = "--partitions", defaultValue = "0", paramLabel = "N",
            description = "Part files of the reviewer table (default: Spark's default parallelism).")
    int partitions;

    @Option(names = "--reviewer-csv", description = "Also write reviewers.csv, the reviewer table file 'rank' reads, "
            + "streamed through the driver.")
    boolean reviewerCsv;

    @Option(names = "--csv-min-votes", defaultValue = "0", paramLabel = "T",
            description = "Only reviewers with at least T total votes go into reviewers.csv: a reduced table for the "
                    + "local commands (rank with the --prior this command prints; default: ${DEFAULT-VALUE}, all).")
    long csvMinVotes;

    @Option(names = "--fit-floor", defaultValue = "1", paramLabel = "T",
            description = "Fit the prior on reviewers with at least T total votes (default: ${DEFAULT-VALUE}).")
    long fitFloor;

    @Override
    public Integer call() throws IOException {
        PrintWriter outw = spec.commandLine().getOut();
        for (String local : new String[] {"--threads", "--memory", "--tmp"}) {
            if (spec.commandLine().getParseResult().hasMatchedOption(local)) {
                throw new IllegalArgumentException("spark-tally: " + local + " sets the local engine; on Spark, parallelism"
                        + " comes from --master and --partitions and memory from spark-submit's --driver-memory and"
                        + " --executor-memory (see docs/spark.md)");
            }
        }
        if (!sparkPresent()) {
            throw new IllegalStateException("spark-tally needs Apache Spark 4.0.x (Scala 2.13) on the class path, and the"
                    + " voteworth jar does not carry it: run it with spark-submit --class org.voteworth.cli.Main"
                    + " voteworth.jar spark-tally ..., or with a Spark distribution's jars beside it: java -cp"
                    + " \"voteworth.jar:$SPARK_HOME/jars/*\" org.voteworth.cli.Main spark-tally ... (see docs/spark.md)");
        }
        if (dump.rejectsFile().isPresent()) {
            throw new IllegalArgumentException("spark-tally writes its rejects to rejects.tsv in the store (--out); drop --rejects");
        }
        org.voteworth.spark.SparkTally.Result r = org.voteworth.spark.SparkTally.run(
                new org.voteworth.spark.SparkTally.Request(dump.inputs, TallyRun.sourceOptions(dump), out, partitions,
                        reviewerCsv, csvMinVotes, fitFloor), Optional.ofNullable(master));
        outw.print(r.summary().describe());
        outw.printf(Locale.ROOT, "%,d reviewers from %,d rows in %.1f s; store: %s%n", r.reviewers(), r.summary().accepted(),
                r.seconds(), r.store());
        if (r.prior().isPresent()) {
            outw.printf(Locale.ROOT, "prior: %s%n  for the local commands: --prior %s,%s%n", RankRun.describe(r.prior().get()),
                    r.prior().get().prior().alpha(), r.prior().get().prior().beta());
        } else {
            outw.printf(Locale.ROOT, "prior: none fitted, no reviewer has %d or more total votes%n", fitFloor);
        }
        outw.flush();
        return r.summary().reconciles() ? 0 : 1;
    }

    static boolean sparkPresent() {
        try {
            Class.forName(SPARK_CLASS, false, SparkTallyCommand.class.getClassLoader());
            return true;
        } catch (ClassNotFoundException | LinkageError e) {
            return false;
        }
    }
}
