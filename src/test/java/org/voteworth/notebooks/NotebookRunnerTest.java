package org.voteworth.notebooks;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The runner on small notebooks written here: outputs captured, and every kind of failing cell fails the run. */
class NotebookRunnerTest {
    private static final ObjectMapper JSON = new ObjectMapper();
    private final NotebookRunner runner = new NotebookRunner(System.getProperty("java.class.path"));

    @TempDir
    Path dir;

    @Test
    void capturesPrintedTextTheLastExpressionAndRichDisplays() throws IOException {
        Path nb = notebook("ok", "# A title", "int x = 20;\nSystem.out.println(\"x is \" + x);\nx + 1",
                "import org.voteworth.api.Display;\nDisplay.markdown(\"**bold**\", \"bold\")", "int y = x * 2;");
        ObjectNode ran = runner.run(nb);
        JsonNode first = ran.at("/cells/1");
        assertThat(first.path("execution_count").asInt()).isEqualTo(1);
        assertThat(first.at("/outputs/0/output_type").asText()).isEqualTo("stream");
        assertThat(first.at("/outputs/0/text/0").asText()).isEqualTo("x is 20\n");
        assertThat(first.at("/outputs/1/data/text~1plain/0").asText()).isEqualTo("21");
        JsonNode rich = ran.at("/cells/2/outputs/0/data");
        assertThat(rich.at("/text~1markdown/0").asText()).isEqualTo("**bold**");
        assertThat(rich.at("/text~1plain/0").asText()).isEqualTo("bold");
        // A declaration shows nothing, as in Jupyter.
        assertThat(ran.at("/cells/3/outputs").size()).isZero();
        assertThat(ran.at("/cells/3/execution_count").asInt()).isEqualTo(3);

        NotebookRunner.write(ran, nb);
        assertThat(JSON.readTree(nb.toFile())).isEqualTo(ran);
    }

    @Test
    void aCompileErrorFailsTheRunNamingTheCell() throws IOException {
        Path nb = notebook("compile", "int x = 1;", "String s = x.length();");
        assertThatThrownBy(() -> runner.run(nb)).isInstanceOf(NotebookRunner.CellFailure.class)
                .hasMessageContaining("compile.ipynb, cell 2 (code cell 2)").hasMessageContaining("does not compile")
                .hasMessageContaining("int cannot be dereferenced");
    }

    @Test
    void anExceptionFailsTheRunNamingTheCellAndTheException() throws IOException {
        Path nb = notebook("throws", "int x = 1;", "import java.util.List;\nList.of(1).get(x)");
        assertThatThrownBy(() -> runner.run(nb)).isInstanceOf(NotebookRunner.CellFailure.class)
                .hasMessageContaining("cell 2").hasMessageContaining("threw java.lang.IndexOutOfBoundsException");
    }

    @Test
    void anExceptionInsideALibraryCallFailsTheRun() throws IOException {
        Path nb = notebook("library", "import org.voteworth.api.*;\nRule.named(\"no-such-rule\")");
        assertThatThrownBy(() -> runner.run(nb)).isInstanceOf(NotebookRunner.CellFailure.class)
                .hasMessageContaining("cell 1").hasMessageContaining("IllegalArgumentException")
                .hasMessageContaining("unknown ranking rule 'no-such-rule'");
    }

    @Test
    void aMethodUsingSomethingUndefinedFailsTheRun() throws IOException {
        Path nb = notebook("unresolved", "int twice() { return 2 * missing; }");
        assertThatThrownBy(() -> runner.run(nb)).isInstanceOf(NotebookRunner.CellFailure.class)
                .hasMessageContaining("cell 1").hasMessageContaining("missing");
    }

    @Test
    void anUnfinishedCellFailsTheRun() throws IOException {
        Path nb = notebook("unfinished", "int x = 1;", "if (x > 0) {");
        assertThatThrownBy(() -> runner.run(nb)).isInstanceOf(NotebookRunner.CellFailure.class)
                .hasMessageContaining("cell 2").hasMessageContaining("unfinished");
    }

    /** A notebook whose cells are the given sources; a source starting with '#' is a Markdown cell. */
    private Path notebook(String name, String... sources) throws IOException {
        ObjectNode nb = JSON.createObjectNode();
        ArrayNode cells = nb.putArray("cells");
        for (String s : sources) {
            ObjectNode c = cells.addObject();
            boolean md = s.startsWith("#");
            c.put("cell_type", md ? "markdown" : "code");
            c.putObject("metadata");
            c.putArray("source").add(s);
            if (!md) {
                c.putNull("execution_count");
                c.putArray("outputs");
            }
        }
        nb.putObject("metadata").putObject("kernelspec").put("name", "java").put("display_name", "Java").put("language", "java");
        nb.put("nbformat", 4);
        nb.put("nbformat_minor", 5);
        Path p = dir.resolve(name + ".ipynb");
        Files.writeString(p, JSON.writeValueAsString(nb));
        return p;
    }
}
