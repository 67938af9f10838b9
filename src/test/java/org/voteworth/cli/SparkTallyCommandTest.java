package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/**
 * The command line without Spark: a separate JVM on the test class path minus the Spark and
 * Scala jars (what a plain {@code ./voteworth} run has) lists and documents {@code spark-tally},
 * and running it gives a clear error naming what to add, instead of a class-loading failure.
 */
class SparkTallyCommandTest {
    record Exit(int code, String out) {
    }

    static Exit runWithoutSpark(String... args) throws IOException, InterruptedException {
        String classPath = Arrays.stream(System.getProperty("java.class.path").split(File.pathSeparator))
                .filter(e -> !e.contains("/org/apache/spark/") && !e.contains("/org/scala-lang/"))
                .collect(Collectors.joining(File.pathSeparator));
        List<String> command = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-cp", classPath, Main.class.getName()));
        command.addAll(List.of(args));
        Process p = new ProcessBuilder(command).redirectErrorStream(true).start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(p.waitFor(60, TimeUnit.SECONDS)).isTrue();
        return new Exit(p.exitValue(), out);
    }

    @Test
    void helpAndTheCommandListWorkWithoutSpark() throws Exception {
        Exit help = runWithoutSpark("--help");
        assertThat(help.code()).as(help.out()).isZero();
        assertThat(help.out()).contains("spark-tally").contains("tally");
        Exit sparkHelp = runWithoutSpark("spark-tally", "--help");
        assertThat(sparkHelp.code()).as(sparkHelp.out()).isZero();
        assertThat(sparkHelp.out()).contains("--master").contains("--reviewer-csv");
    }

    @Test
    void runningItWithoutSparkSaysWhatToAdd() throws Exception {
        Exit r = runWithoutSpark("spark-tally", "demo-data", "--out", "unused-store");
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.out()).contains("needs Apache Spark 4.0.x").contains("spark-submit").doesNotContain("NoClassDefFoundError");
    }

    @Test
    void localEngineOptionsAreRefusedRatherThanIgnored() {
        for (String[] option : new String[][] {{"--threads", "2"}, {"--memory", "64MB"}, {"--tmp", "tmp"}}) {
            CliTest.Run r = CliTest.run("spark-tally", "demo-data", "--out", "unused-store", option[0], option[1]);
            assertThat(r.code()).isNotZero();
            assertThat(r.err()).contains(option[0] + " sets the local engine").contains("--partitions");
        }
    }
}
