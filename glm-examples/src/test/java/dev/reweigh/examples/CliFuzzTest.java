package dev.reweigh.examples;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The fit command on damaged data files and assorted families: it either succeeds (status 0) or
 * reports bad input (status 2, one line), never an internal error or a stack trace.
 */
class CliFuzzTest {
    private static final String VALID = "claims,exposure,driver_age,region,mileage,amount\n"
            + "0,1.0,18-24,coast,12.5,1200\n1,0.5,25-49,metro,8,950\n2,0.75,50+,rural,15,3100\n"
            + "0,1,25-49,coast,20.25,870\n1,0.9,18-24,metro,9.5,2250\n0,0.4,50+,rural,11,1430\n"
            + "3,1,18-24,coast,17,2900\n0,0.6,25-49,rural,6.5,640\n1,1,50+,metro,13,1800\n"
            + "0,0.8,25-49,coast,10,1010\n";
    private static final char[] NOISE = {',', '"', '\n', '-', '.', 'x', '0', ' ', 'e', '9'};

    @Provide
    Arbitrary<String> damaged() {
        Arbitrary<int[]> edit = Combinators.combine(Arbitraries.integers().between(0, 999),
                Arbitraries.integers().between(0, NOISE.length - 1), Arbitraries.integers().between(0, 2))
                .as((at, c, kind) -> new int[] {at, c, kind});
        return edit.list().ofMaxSize(4).map(edits -> {
            StringBuilder s = new StringBuilder(VALID);
            for (int[] e : edits) {
                if (s.length() == 0) {
                    break;
                }
                int at = e[0] * s.length() / 1000;
                if (e[2] == 0) {
                    s.setCharAt(at, NOISE[e[1]]);
                } else if (e[2] == 1) {
                    s.insert(at, NOISE[e[1]]);
                } else {
                    s.deleteCharAt(at);
                }
            }
            return s.toString();
        });
    }

    @Provide
    Arbitrary<List<String>> models() {
        return Arbitraries.of(
                List.of("--response", "claims", "--family", "poisson", "--factor", "region", "--log-offset", "exposure"),
                List.of("--response", "claims", "--family", "negative-binomial:2", "--numeric", "mileage"),
                List.of("--response", "amount", "--family", "gamma", "--link", "log", "--factor", "driver_age"),
                List.of("--response", "amount", "--family", "inverse-gaussian", "--numeric", "mileage"),
                List.of("--response", "amount", "--family", "gaussian", "--interaction", "region,mileage"),
                List.of("--response", "claims", "--family", "tweedie:1.5", "--factor", "region", "--weights",
                        "exposure"),
                List.of("--response", "claims", "--family", "quasi:mu", "--factor", "driver_age", "--no-intercept"));
    }

    @Property(tries = 120)
    void fitExitsWithZeroOrTwo(@ForAll("damaged") String csv, @ForAll("models") List<String> model,
                               @ForAll boolean json) throws IOException {
        Path file = Files.createTempFile("cli-fuzz", ".csv");
        try {
            Files.writeString(file, csv, StandardCharsets.UTF_8);
            List<String> args = new java.util.ArrayList<>(List.of("fit", "--data", file.toString()));
            args.addAll(model);
            if (json) {
                args.add("--json");
            }
            CliRun run = CliRun.of(args.toArray(new String[0]));
            assertTrue(run.status == 0 || run.status == 2, run::toString);
            if (run.status == 2) {
                assertTrue(run.err.endsWith("\n") && run.err.indexOf('\n') == run.err.length() - 1,
                        () -> "one line: " + run);
            } else {
                assertTrue(!run.out.isEmpty(), "a report");
            }
        } finally {
            Files.deleteIfExists(file);
        }
    }
}
