package dev.reweigh.examples;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import javax.tools.JavaCompiler;
import javax.tools.ToolProvider;
import java.io.ByteArrayOutputStream;
import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The README's "Quick start in Java" compiles against the real API and runs. */
class ReadmeExampleTest {
    @TempDir
    Path dir;

    private static String javaBlock() throws IOException {
        String readme = Files.readString(Path.of("..", "README.md"), StandardCharsets.UTF_8);
        int section = readme.indexOf("## Quick start in Java");
        assertTrue(section >= 0, "README has the section");
        int start = readme.indexOf("```java\n", section);
        int end = readme.indexOf("```", start + 7);
        assertTrue(start > 0 && end > start, "the section has a java block");
        return readme.substring(start + "```java\n".length(), end);
    }

    @Test
    void quickStartCompilesAndRuns() throws Exception {
        Path source = dir.resolve("QuickStart.java");
        Files.writeString(source, javaBlock(), StandardCharsets.UTF_8);
        String classPath = System.getProperty("java.class.path");
        JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
        ByteArrayOutputStream diagnostics = new ByteArrayOutputStream();
        int status = javac.run(null, diagnostics, diagnostics, "-classpath", classPath, "-d", dir.toString(),
                source.toString());
        assertEquals(0, status, () -> diagnostics.toString(StandardCharsets.UTF_8));

        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        Process p = new ProcessBuilder(List.of(java.toString(), "-cp", dir + File.pathSeparator + classPath,
                "QuickStart")).directory(dir.toFile()).redirectErrorStream(true).start();
        assertTrue(p.waitFor(120, TimeUnit.SECONDS), "the example finishes");
        String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertEquals(0, p.exitValue(), output);
        assertTrue(output.contains("region=south") && output.contains("south: relativity"), output);
        assertTrue(Files.size(dir.resolve("frequency.json")) > 0, "the artifact was written");
    }
}
