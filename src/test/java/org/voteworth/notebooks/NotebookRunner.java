package org.voteworth.notebooks;

import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.ByteArrayOutputStream;
import java.io.File;
import java.io.IOException;
import java.io.PrintStream;
import java.lang.reflect.Method;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;
import jdk.jshell.Diag;
import jdk.jshell.EvalException;
import jdk.jshell.JShell;
import jdk.jshell.JShellException;
import jdk.jshell.Snippet;
import jdk.jshell.SnippetEvent;
import jdk.jshell.SourceCodeAnalysis;
import jdk.jshell.UnresolvedReferenceException;
import jdk.jshell.execution.DirectExecutionControl;
import jdk.jshell.spi.ExecutionControl;
import jdk.jshell.spi.ExecutionControlProvider;
import jdk.jshell.spi.ExecutionEnv;
import org.voteworth.api.Display;

/**
 * Executes every code cell of a Jupyter notebook in Java, in order, in one {@link JShell} with
 * the project's class path, and returns the notebook with each cell's real outputs: what it
 * printed (stdout and stderr streams) and the value of its last expression (text/plain, plus the
 * rich form of a {@link Display}). A compile error, an unresolved reference or an exception in
 * any cell stops the run with a {@link CellFailure} naming the notebook, the cell and the snippet.
 *
 * <p>Snippets run in this JVM (jshell's direct execution), so the cells share the runner's
 * classes and the runner can see the value objects a cell produced; plain {@code jshell} on a
 * script would exit 0 even when a cell throws.
 */
final class NotebookRunner {
    private static final ObjectMapper JSON = new ObjectMapper();
    private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

    /** A cell that did not compile or threw; the message names notebook, cell and snippet. */
    static final class CellFailure extends AssertionError {
        private static final long serialVersionUID = 1L;

        CellFailure(String message) {
            super(message);
        }
    }

    private final String classPath;

    /** @param classPath the class path the cells compile and run against (path-separator separated) */
    NotebookRunner(String classPath) {
        this.classPath = classPath;
    }

    /** Reads a notebook, runs it, and returns it with fresh outputs and execution counts. */
    ObjectNode run(Path notebook) throws IOException {
        ObjectNode nb = (ObjectNode) JSON.readTree(notebook.toFile());
        JsonNode cells = nb.get("cells");
        if (cells == null || !cells.isArray()) {
            throw new CellFailure(notebook + ": not a Jupyter notebook (no \"cells\" array)");
        }
        PrintStream out = System.out;
        PrintStream err = System.err;
        ClassLoader context = Thread.currentThread().getContextClassLoader();
        Capturing engine = new Capturing();
        try (JShell shell = JShell.builder().executionEngine(engine, Map.of()).build()) {
            for (String entry : classPath.split(File.pathSeparator)) {
                if (!entry.isBlank()) {
                    shell.addToClasspath(entry);
                }
            }
            int count = 0;
            for (int i = 0; i < cells.size(); i++) {
                ObjectNode cell = (ObjectNode) cells.get(i);
                if (!"code".equals(cell.path("cell_type").asText())) {
                    continue;
                }
                count++;
                ByteArrayOutputStream stdout = new ByteArrayOutputStream();
                ByteArrayOutputStream stderr = new ByteArrayOutputStream();
                System.setOut(new PrintStream(stdout, true, StandardCharsets.UTF_8));
                System.setErr(new PrintStream(stderr, true, StandardCharsets.UTF_8));
                Object value;
                boolean shown;
                String where = notebook.getFileName() + ", cell " + (i + 1) + " (code cell " + count + ")";
                try {
                    Shown s = runCell(shell, engine, source(cell), where);
                    value = s.value();
                    shown = s.shown();
                } finally {
                    System.out.flush();
                    System.err.flush();
                    System.setOut(out);
                    System.setErr(err);
                }
                ArrayNode outputs = NODES.arrayNode();
                stream(outputs, "stdout", stdout);
                stream(outputs, "stderr", stderr);
                if (shown) {
                    outputs.add(result(value, count));
                }
                cell.set("outputs", outputs);
                cell.put("execution_count", count);
            }
        } finally {
            Thread.currentThread().setContextClassLoader(context);
        }
        return nb;
    }

    /** Writes a notebook as Jupyter does: one-space indent, a newline at the end. */
    static void write(ObjectNode nb, Path file) throws IOException {
        DefaultPrettyPrinter pretty = new DefaultPrettyPrinter()
                .withObjectIndenter(new DefaultIndenter(" ", "\n"))
                .withArrayIndenter(new DefaultIndenter(" ", "\n"));
        String text = JSON.writer(pretty).writeValueAsString(nb).replace("\" : ", "\": ");
        Files.writeString(file, text + "\n", StandardCharsets.UTF_8);
    }

    /** What a cell ended with: the value of its last snippet, and whether that snippet is an expression to show. */
    private record Shown(Object value, boolean shown) {
    }

    private static Shown runCell(JShell shell, Capturing engine, String source, String where) {
        SourceCodeAnalysis analysis = shell.sourceCodeAnalysis();
        String remaining = source;
        Object value = null;
        boolean shown = false;
        while (!remaining.isBlank()) {
            SourceCodeAnalysis.CompletionInfo info = analysis.analyzeCompletion(remaining);
            if (info.completeness() == SourceCodeAnalysis.Completeness.EMPTY) {
                break;
            }
            if (!info.completeness().isComplete()) {
                throw new CellFailure(where + ": the cell ends inside an unfinished snippet: " + first(remaining));
            }
            String snippet = info.source();
            remaining = info.remaining();
            engine.last = null;
            for (SnippetEvent e : shell.eval(snippet)) {
                if (e.causeSnippet() != null) {
                    continue;
                }
                check(shell, e, where, snippet);
                shown = isExpression(e.snippet());
                value = engine.last;
            }
        }
        return new Shown(value, shown);
    }

    private static void check(JShell shell, SnippetEvent e, String where, String snippet) {
        if (e.status() == Snippet.Status.REJECTED) {
            String diags = shell.diagnostics(e.snippet()).map(d -> describe(d, snippet)).collect(Collectors.joining("; "));
            throw new CellFailure(where + ": does not compile: " + diags + "\n  in: " + first(snippet));
        }
        JShellException x = e.exception();
        if (x instanceof UnresolvedReferenceException u) {
            throw new CellFailure(where + ": " + u.getSnippet().source().strip() + " uses what is not defined: "
                    + shell.unresolvedDependencies(u.getSnippet()).collect(Collectors.joining(", ")));
        }
        if (x != null) {
            String type = x instanceof EvalException ev ? ev.getExceptionClassName() : x.getClass().getName();
            throw new CellFailure(where + ": threw " + type + ": " + x.getMessage() + "\n  in: " + first(snippet));
        }
        if (e.status() == Snippet.Status.RECOVERABLE_DEFINED || e.status() == Snippet.Status.RECOVERABLE_NOT_DEFINED) {
            throw new CellFailure(where + ": uses what is not defined: "
                    + shell.unresolvedDependencies((jdk.jshell.DeclarationSnippet) e.snippet()).collect(Collectors.joining(", "))
                    + "\n  in: " + first(snippet));
        }
    }

    /** A bare expression or variable name: what Jupyter shows as the cell's result when it comes last. */
    private static boolean isExpression(Snippet s) {
        return s.subKind() == Snippet.SubKind.TEMP_VAR_EXPRESSION_SUBKIND || s.subKind() == Snippet.SubKind.VAR_VALUE_SUBKIND;
    }

    private static String describe(Diag d, String snippet) {
        long line = snippet.substring(0, (int) Math.max(0, Math.min(snippet.length(), d.getStartPosition()))).lines().count();
        return "line " + Math.max(1, line) + " of the snippet: " + d.getMessage(Locale.ROOT);
    }

    private static String first(String snippet) {
        String s = snippet.strip();
        int nl = s.indexOf('\n');
        return nl < 0 ? s : s.substring(0, nl) + " ...";
    }

    private static String source(ObjectNode cell) {
        JsonNode src = cell.path("source");
        if (src.isTextual()) {
            return src.asText();
        }
        StringBuilder b = new StringBuilder();
        src.forEach(line -> b.append(line.asText()));
        return b.toString();
    }

    private static void stream(ArrayNode outputs, String name, ByteArrayOutputStream bytes) {
        String text = bytes.toString(StandardCharsets.UTF_8);
        if (text.isEmpty()) {
            return;
        }
        ObjectNode o = outputs.addObject();
        o.put("name", name);
        o.put("output_type", "stream");
        o.set("text", lines(text));
    }

    private static ObjectNode result(Object value, int count) {
        ObjectNode o = NODES.objectNode();
        ObjectNode data = o.putObject("data");
        if (value instanceof Display d && !"text/plain".equals(d.mimeType())) {
            data.set(d.mimeType(), lines(d.content()));
            data.set("text/plain", lines(d.text()));
        } else {
            data.set("text/plain", lines(String.valueOf(value)));
        }
        o.put("execution_count", count);
        o.putObject("metadata");
        o.put("output_type", "execute_result");
        return o;
    }

    /** Text as nbformat stores it: a list of lines, each but the last ending in a newline. */
    private static ArrayNode lines(String text) {
        ArrayNode a = NODES.arrayNode();
        int start = 0;
        for (int i = 0; i < text.length(); i++) {
            if (text.charAt(i) == '\n') {
                a.add(text.substring(start, i + 1));
                start = i + 1;
            }
        }
        if (start < text.length()) {
            a.add(text.substring(start));
        }
        return a;
    }

    /**
     * jshell's direct execution, keeping the value each snippet produced so the runner can show
     * a {@link Display} richly. The override repeats what {@link DirectExecutionControl} does
     * (invoke the snippet's generated method) and only remembers the result.
     */
    private static final class Capturing implements ExecutionControlProvider {
        volatile Object last;

        @Override
        public String name() {
            return "voteworth-notebook";
        }

        @Override
        public ExecutionControl generate(ExecutionEnv env, Map<String, String> parameters) {
            return new DirectExecutionControl() {
                @Override
                protected String invoke(Method doit) throws Exception {
                    Object value = doit.invoke(null);
                    last = value;
                    return valueString(value);
                }
            };
        }
    }
}
