package org.voteworth.demo;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.text.NumberFormat;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The bundled sample in demo-data/ is what the documented command writes, and its README says so. */
class SampleDumpTest {
    private static final Path SAMPLE = Path.of(System.getProperty("voteworth.projectDir", ".")).resolve("demo-data");

    @TempDir
    Path dir;

    @Test
    void bundledSampleIsReproducedByTheDocumentedCommand() throws Exception {
        SampleDump.main(new String[] {dir.toString(), "40000", "20261202"});
        List<Path> fresh = dumpFiles(dir);
        List<Path> bundled = dumpFiles(SAMPLE);
        assertThat(bundled.stream().map(Path::getFileName).map(Path::toString))
                .containsExactlyElementsOf(fresh.stream().map(Path::getFileName).map(Path::toString).toList());
        assertThat(DemoDumpGeneratorTest.uncompressedDigests(bundled))
                .as("demo-data/ is stale: regenerate it with the command in demo-data/README.md")
                .isEqualTo(DemoDumpGeneratorTest.uncompressedDigests(fresh));
        long total = 0;
        for (Path p : bundled) {
            total += Files.size(p);
        }
        assertThat(total).as("the sample stays small").isLessThan(4_000_000);
    }

    @Test
    void readmeStatesTheCountsAndPositions() throws IOException {
        GeneratedDump d = new DemoDumpGenerator().generate(dir, DemoOptions.rows(40_000));
        String readme = Files.readString(SAMPLE.resolve("README.md"));
        NumberFormat n = NumberFormat.getIntegerInstance(Locale.UK);
        assertThat(readme).contains(n.format(d.physicalLines()) + " data lines = " + n.format(d.expectedAcceptedRows())
                + " accepted rows + " + d.expectedRejectedLines() + " rejected lines");
        for (GeneratedDump.PlantedLine p : d.plantedLines()) {
            assertThat(readme).contains("| `" + p.file().getFileName() + "` | " + p.line() + " | `" + p.kind().key() + "` |");
        }
        PlainDump plain = PlainDump.read(d.files());
        for (Path f : d.files()) {
            List<PlainDump.Line> lines = plain.lines.stream().filter(l -> l.file().equals(f)).toList();
            String category = lines.stream().filter(PlainDump.Line::valid).findFirst().orElseThrow().fields()[3];
            assertThat(readme).contains("| `" + f.getFileName() + "` | " + category + " | " + n.format(lines.size()) + " |");
        }
        assertThat(readme).contains("java -cp target/classes org.voteworth.demo.SampleDump demo-data 40000 20261202")
                .contains("./voteworth generate --rows 40000 --seed 20261202 --out demo-data");
    }

    private static List<Path> dumpFiles(Path folder) throws IOException {
        try (Stream<Path> s = Files.list(folder)) {
            return s.filter(p -> DemoDumpGenerator.isDumpFileName(p.getFileName().toString())).sorted().toList();
        }
    }
}
