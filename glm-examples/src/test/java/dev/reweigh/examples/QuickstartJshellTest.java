package dev.reweigh.examples;

import jdk.jshell.JShell;
import jdk.jshell.Snippet;
import jdk.jshell.SnippetEvent;
import jdk.jshell.SourceCodeAnalysis;
import org.junit.jupiter.api.Test;

import java.io.ByteArrayOutputStream;
import java.io.File;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Runs jshell/quickstart.jsh through the JShell API, line by line as the jshell tool reads a
 * script, on this module's runtime class path, and checks that every snippet is valid, nothing
 * throws, and the printed report and relativity agree with the fitted model in the session.
 */
class QuickstartJshellTest {
    private static final Path SCRIPT = Path.of("jshell", "quickstart.jsh");

    @Test
    void quickstartRunsAndPrintsTheFit() throws IOException {
        List<String> lines = Files.readAllLines(SCRIPT, StandardCharsets.UTF_8);
        ByteArrayOutputStream captured = new ByteArrayOutputStream();
        PrintStream out = new PrintStream(captured, true, StandardCharsets.UTF_8);
        try (JShell shell = JShell.builder().out(out).err(out).build()) {
            for (String entry : System.getProperty("java.class.path").split(File.pathSeparator)) {
                if (!entry.isBlank()) {
                    shell.addToClasspath(entry);
                }
            }
            SourceCodeAnalysis analysis = shell.sourceCodeAnalysis();
            StringBuilder pending = new StringBuilder();
            int snippets = 0;
            for (String line : lines) {
                if (pending.length() == 0 && line.strip().startsWith("/")) {
                    continue; // a jshell command such as /exit
                }
                pending.append(line).append('\n');
                SourceCodeAnalysis.CompletionInfo info = analysis.analyzeCompletion(pending.toString());
                if (info.completeness() == SourceCodeAnalysis.Completeness.EMPTY) {
                    pending.setLength(0);
                    continue;
                }
                if (!info.completeness().isComplete()) {
                    continue;
                }
                evaluate(shell, info.source());
                snippets++;
                pending.setLength(0);
            }
            assertEquals("", pending.toString().strip(), "the script ends with complete statements");
            assertTrue(snippets >= 8, "imports, table, specification, fit, report, relativity: " + snippets);

            String output = captured.toString(StandardCharsets.UTF_8);
            assertTrue(output.contains("driver_age=18-24") && output.contains("region=rural"), output);
            assertEquals("true", value(shell, "fit.converged()"));
            assertEquals("24", value(shell, "fit.rowCount()"));
            double coefficient = Double.parseDouble(value(shell, "fit.coefficient(\"driver_age=18-24\")"));
            Matcher m = Pattern.compile("drivers aged 18-24 claim ([0-9.]+) times as often").matcher(output);
            assertTrue(m.find(), output);
            assertEquals(String.format(Locale.ROOT, "%.2f", Math.exp(coefficient)), m.group(1));
            // The young drivers of the inline table have 10 claims in 6.3 years against 3 in 7.6 years.
            assertTrue(Math.exp(coefficient) > 2, "young drivers claim more often");
        }
    }

    private static void evaluate(JShell shell, String source) {
        List<SnippetEvent> events = shell.eval(source);
        for (SnippetEvent e : events) {
            if (e.status() == Snippet.Status.REJECTED) {
                List<String> problems = new ArrayList<>();
                shell.diagnostics(e.snippet()).forEach(d -> problems.add(d.getMessage(Locale.ROOT)));
                fail("snippet rejected: " + source + " " + problems);
            }
            assertNull(e.exception(), () -> "snippet threw: " + source + " " + e.exception());
        }
    }

    private static String value(JShell shell, String expression) {
        List<SnippetEvent> events = shell.eval(expression);
        SnippetEvent last = events.get(events.size() - 1);
        assertNull(last.exception(), expression);
        return last.value();
    }
}
