package dev.reweigh.examples;

import dev.reweigh.examples.demo.MotorDemo;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The demo command end to end through the command line, on a small portfolio. */
class CliDemoTest {
    @TempDir
    Path dir;

    @Test
    void demoCommandWritesItsFolderAndEndsWithTheCautions() throws IOException {
        Path out = dir.resolve("demo");
        CliRun run = CliRun.of("demo", "--out", out.toString(), "--policies", "4000");
        assertEquals(0, run.status, run::toString);
        assertEquals("", run.err);
        String last = MotorDemo.CAUTIONS.get(MotorDemo.CAUTIONS.size() - 1);
        assertTrue(run.out.contains(last), run.out);
        assertTrue(run.out.indexOf("== 8. Cautions") > run.out.indexOf("== 7. Files"));
        try (Stream<Path> files = Files.list(out)) {
            List<String> names = files.map(p -> p.getFileName().toString()).sorted().toList();
            assertEquals(List.of("frequency-by-region.png", "frequency-model.json",
                    "frequency-quantile-residuals-qq.png", "pure-premium-model.json", "scored-policies.csv",
                    "severity-model.json", "severity-residuals-vs-fitted.png"), names);
        }
        // The demo's artifacts and scored file work with the other commands.
        CliRun score = CliRun.of("score", "--model", out.resolve("severity-model.json").toString(), "--data",
                out.resolve("scored-policies.csv").toString(), "--out", dir.resolve("rescored.csv").toString());
        assertEquals(0, score.status, score::toString);
        try (Stream<String> lines = Files.lines(dir.resolve("rescored.csv"))) {
            assertEquals(4_001, lines.count());
        }
    }
}
