package org.voteworth.notebooks;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;

/**
 * Executes every notebook in {@code notebooks-java/} cell by cell (so {@code mvn test} and CI run
 * them) and fails on any cell that does not compile or throws. With
 * {@code -Dnotebooks.write=true} it writes each notebook back with the outputs of this run.
 */
class NotebooksTest {
    static final Path FOLDER = Path.of(System.getProperty("voteworth.projectDir", "."), "notebooks-java");

    @TestFactory
    Stream<DynamicTest> everyNotebookRunsCellByCell() throws IOException {
        List<Path> notebooks;
        try (Stream<Path> s = Files.list(FOLDER)) {
            notebooks = s.filter(p -> p.toString().endsWith(".ipynb")).sorted().toList();
        }
        assertThat(notebooks).as("notebooks in " + FOLDER).hasSizeGreaterThanOrEqualTo(3);
        NotebookRunner runner = new NotebookRunner(System.getProperty("java.class.path"));
        boolean write = Boolean.getBoolean("notebooks.write");
        return notebooks.stream().map(p -> DynamicTest.dynamicTest(p.getFileName().toString(), () -> {
            JsonNode committed = new ObjectMapper().readTree(p.toFile());
            assertThat(committed.at("/metadata/kernelspec/language").asText()).isEqualTo("java");
            assertThat(committed.path("nbformat").asInt()).isEqualTo(4);
            ObjectNode ran = runner.run(p);
            if (write) {
                NotebookRunner.write(ran, p);
            } else {
                // The committed notebook shows a whole run: every code cell numbered in order.
                int count = 0;
                for (JsonNode cell : committed.get("cells")) {
                    // nbformat 4.5 gives every cell an id.
                    assertThat(cell.path("id").asText()).as(p.getFileName() + ": a cell without an id").isNotEmpty();
                    if ("code".equals(cell.path("cell_type").asText())) {
                        count++;
                        assertThat(cell.path("execution_count").asInt())
                                .as(p.getFileName() + ": code cell " + count + " was not executed before it was committed "
                                        + "(rerun with -Dnotebooks.write=true)")
                                .isEqualTo(count);
                    }
                }
            }
        }));
    }
}
