package org.voteworth.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.voteworth.demo.DemoOptions;

/**
 * The launcher's default heap follows the --memory budget of the scanning commands, and it tells the
 * JVM whether stderr is a terminal (checked through the command it prints with VOTEWORTH_DRY_RUN).
 */
class LauncherTest {
    private static String command(String javaOpts, String... args) throws IOException, InterruptedException {
        List<String> cmd = new ArrayList<>(List.of("bash", Path.of("voteworth").toAbsolutePath().toString()));
        cmd.addAll(List.of(args));
        ProcessBuilder b = new ProcessBuilder(cmd).redirectErrorStream(true);
        b.environment().put("VOTEWORTH_DRY_RUN", "1");
        b.environment().remove("VOTEWORTH_JAVA_OPTS");
        if (javaOpts != null) {
            b.environment().put("VOTEWORTH_JAVA_OPTS", javaOpts);
        }
        Process p = b.start();
        String out = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
        assertThat(p.waitFor()).as(out).isZero();
        return out;
    }

    @Test
    void scanningCommandsGetTheBudgetPlusRoomAsMaxHeap() throws Exception {
        long defaultMib = DemoOptions.parseSize(DumpOptions.DEFAULT_MEMORY) >> 20;
        assertThat(command(null, "tally", "dump")).startsWith("java -Xmx" + (defaultMib + 128) + "m -Dvoteworth.stderr=plain -jar ").endsWith(" tally dump");
        assertThat(command(null, "overview", "dump", "--memory", "1GiB")).contains(" -Xmx1152m ");
        assertThat(command(null, "tally", "dump", "--memory=1.5GB")).contains(" -Xmx1559m ");
        assertThat(command(null, "tally", "dump", "--memory", "100KB")).contains(" -Xmx256m ");
    }

    @Test
    void anExplicitHeapAndTheRankingCommandsAreLeftAlone() throws Exception {
        assertThat(command("-Xmx2g -Dx=1", "tally", "dump")).startsWith("java -Xmx2g -Dx=1 -Dvoteworth.stderr=plain -jar ").doesNotContain("-Xmx3");
        assertThat(command(null, "rank", "dump")).doesNotContain("-Xmx");
        assertThat(command(null, "tally", "dump", "--memory", "lots")).doesNotContain("-Xmx");
    }
}
