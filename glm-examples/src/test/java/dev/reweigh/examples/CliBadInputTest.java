package dev.reweigh.examples;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The command-line half of the bad-input catalogue: each case exits with status 2 and one line on
 * standard error that names the file, column, row (1-based data row) and value where they apply,
 * and never shows a stack trace.
 */
class CliBadInputTest {
    @TempDir
    static Path dir;

    private static final String HEADER = "claims,exposure,driver_age,region,mileage,amount,weight,successes,trials\n";

    /** Ten good rows; row k (1-based) can be replaced to plant one bad cell. */
    private static String rows(int badRow, String badLine) {
        StringBuilder sb = new StringBuilder(HEADER);
        String[] regions = {"coast", "metro", "rural"};
        String[] ages = {"18-24", "25-49", "50+"};
        for (int r = 1; r <= 10; r++) {
            if (r == badRow) {
                sb.append(badLine).append('\n');
                continue;
            }
            sb.append(r % 3).append(',').append(0.5 + r / 20.0).append(',').append(ages[r % 3]).append(',')
                    .append(regions[(r / 2) % 3]).append(',').append(8 + r).append(',').append(900 + 37 * r)
                    .append(',').append(1 + r % 2).append(',').append(r % 4).append(',').append(4).append('\n');
        }
        return sb.toString();
    }

    @BeforeAll
    static void writeFiles() throws IOException {
        write("good.csv", rows(0, ""));
        write("text-numeric.csv", rows(3, "1,0.7,18-24,coast,lots,950,1,1,4"));
        write("text-response.csv", rows(4, "two,0.7,18-24,coast,12,950,1,1,4"));
        write("nan.csv", rows(2, "1,NaN,18-24,coast,12,950,1,1,4"));
        write("empty-response.csv", rows(5, ",0.7,18-24,coast,12,950,1,1,4"));
        write("negative-count.csv", rows(6, "-1,0.7,18-24,coast,12,950,1,1,4"));
        write("fractional-count.csv", rows(2, "1.5,0.7,18-24,coast,12,950,1,1,4"));
        write("zero-exposure.csv", rows(7, "1,0,18-24,coast,12,950,1,1,4"));
        write("gamma-zero.csv", rows(3, "1,0.7,18-24,coast,12,0,1,1,4"));
        write("too-many-successes.csv", rows(2, "1,0.7,18-24,coast,12,950,1,5,3"));
        write("negative-weight.csv", rows(4, "1,0.7,18-24,coast,12,950,-2,1,4"));
        write("infinity.csv", rows(2, "1,0.7,18-24,coast,Infinity,950,1,1,4"));
        write("huge.csv", rows(3, "1,0.7,18-24,coast,1e999,950,1,1,4"));
        write("ragged.csv", rows(2, "1,0.7,18-24,coast,12,950,1,1"));
        write("quote.csv", rows(9, "1,0.7,\"18-24,coast,12,950,1,1,4"));
        write("dup-header.csv", "claims,exposure,claims\n1,0.5,2\n");
        write("no-name.csv", "claims,,region\n1,0.5,coast\n");
        write("empty.csv", "");
        write("plain-file", "not a folder");
        Files.write(dir.resolve("latin1.csv"), "claims,r\u00e9gion\n1,c\u00f4te\n".getBytes(StandardCharsets.ISO_8859_1));
        Files.createDirectories(dir.resolve("folder.csv"));

        StringBuilder big = new StringBuilder(HEADER);
        PortfolioCsv p = new PortfolioCsv(400, 3L);
        for (int i = 0; i < 400; i++) {
            big.append((long) p.claims[i]).append(',').append(p.exposure[i]).append(',').append(p.age[i]).append(',')
                    .append(p.region[i]).append(',').append(p.mileage[i]).append(',').append(p.amount[i])
                    .append(",1,1,4\n");
        }
        write("train.csv", big.toString());
        CliRun fit = CliRun.of("fit", "--data", dir.resolve("train.csv").toString(), "--response", "claims",
                "--family", "poisson", "--factor", "region", "--numeric", "mileage", "--log-offset", "exposure",
                "--save-model", dir.resolve("model.json").toString());
        assertEquals(0, fit.status, fit::toString);
        String model = Files.readString(dir.resolve("model.json"));
        write("garbage.json", "this is not a model\n");
        write("tampered.json", model.replaceFirst("\"intercept\" : true", "\"intercept\" : false"));
        write("truncated.json", model.substring(0, model.length() / 2));
        write("other-format.json", "{\"format\": \"something-else\", \"formatVersion\": \"1.0\"}");
        write("unseen.csv", "exposure,region,mileage\n1,coast,10\n1,mars,12\n");
        write("score-text.csv", "exposure,region,mileage\n1,coast,x\n");
        write("score-missing-column.csv", "exposure,mileage\n1,10\n");
        write("score-bad-exposure.csv", "exposure,region,mileage\n1,coast,10\n1,metro,11\n-1,rural,9\n");
    }

    private static void write(String name, String text) throws IOException {
        Files.writeString(dir.resolve(name), text, StandardCharsets.UTF_8);
    }

    private static Arguments fit(String label, String file, List<String> options, String... fragments) {
        List<String> args = new ArrayList<>(List.of("fit", "--data", "@" + file));
        args.addAll(options);
        return Arguments.of(label, args, List.of(fragments));
    }

    private static Arguments poisson(String label, String file, String... fragments) {
        return fit(label, file, List.of("--response", "claims", "--family", "poisson", "--factor", "region",
                "--numeric", "mileage", "--log-offset", "exposure"), fragments);
    }

    private static Arguments score(String label, String model, String data, String... fragments) {
        return Arguments.of(label, List.of("score", "--model", "@" + model, "--data", "@" + data), List.of(fragments));
    }

    private static Arguments raw(String label, List<String> args, String... fragments) {
        return Arguments.of(label, args, List.of(fragments));
    }

    static Stream<Arguments> cases() {
        return Stream.of(
                poisson("data file missing", "missing.csv", "missing.csv", "no such file"),
                poisson("data path is a folder", "folder.csv", "folder.csv", "directory"),
                fit("unknown response column", "good.csv", List.of("--response", "claimz", "--family", "poisson"),
                        "good.csv", "claimz"),
                fit("unknown factor column", "good.csv", List.of("--response", "claims", "--family", "poisson",
                        "--factor", "regio"), "good.csv", "regio"),
                fit("unknown log-offset column", "good.csv", List.of("--response", "claims", "--family", "poisson",
                        "--log-offset", "exposur"), "good.csv", "exposur"),
                poisson("text in a numeric column", "text-numeric.csv", "text-numeric.csv", "mileage", "data row 3",
                        "lots"),
                poisson("text in the response", "text-response.csv", "text-response.csv", "claims", "data row 4",
                        "two"),
                poisson("NaN in the exposure", "nan.csv", "nan.csv", "exposure", "data row 2", "NaN"),
                poisson("Infinity in a numeric column", "infinity.csv", "infinity.csv", "mileage", "data row 2",
                        "Infinity"),
                poisson("number beyond double range", "huge.csv", "huge.csv", "mileage", "data row 3", "1e999"),
                poisson("missing response", "empty-response.csv", "empty-response.csv", "claims", "data row 5"),
                poisson("negative claim count", "negative-count.csv", "negative-count.csv", "claims", "data row 6",
                        "-1"),
                poisson("fractional claim count", "fractional-count.csv", "fractional-count.csv", "claims",
                        "data row 2", "1.5"),
                poisson("zero exposure under a log-offset", "zero-exposure.csv", "zero-exposure.csv", "exposure",
                        "data row 7", "0"),
                fit("zero amount for the Gamma family", "gamma-zero.csv", List.of("--response", "amount", "--family",
                        "gamma", "--factor", "region"), "gamma-zero.csv", "amount", "data row 3", "0"),
                fit("more successes than trials", "too-many-successes.csv", List.of("--response", "successes",
                        "--trials", "trials", "--family", "binomial", "--factor", "region"), "too-many-successes.csv",
                        "data row 2", "5"),
                fit("negative prior weight", "negative-weight.csv", List.of("--response", "amount", "--family",
                        "gamma", "--weights", "weight"), "negative-weight.csv", "weight", "data row 4", "-2"),
                fit("unknown family", "good.csv", List.of("--response", "claims", "--family", "poison"), "poison",
                        "poisson"),
                fit("unknown link", "good.csv", List.of("--response", "claims", "--family", "poisson", "--link",
                        "lgo"), "lgo", "log"),
                fit("unknown reference level", "good.csv", List.of("--response", "claims", "--family", "poisson",
                        "--factor", "region:mars"), "mars", "region"),
                fit("column both numeric and factor", "good.csv", List.of("--response", "claims", "--family",
                        "poisson", "--numeric", "region", "--factor", "region"), "region"),
                poisson("ragged record", "ragged.csv", "ragged.csv", "data row 2", "fields"),
                poisson("unterminated quote", "quote.csv", "quote.csv", "CSV"),
                poisson("header repeats a name", "dup-header.csv", "dup-header.csv", "claims", "twice"),
                poisson("header with an empty name", "no-name.csv", "no-name.csv", "column 2"),
                poisson("empty file", "empty.csv", "empty.csv", "empty"),
                poisson("not UTF-8", "latin1.csv", "latin1.csv", "UTF-8"),
                score("unseen level when scoring", "model.json", "unseen.csv", "unseen.csv", "region", "data row 2",
                        "mars"),
                score("text in a numeric column when scoring", "model.json", "score-text.csv", "score-text.csv",
                        "mileage", "data row 1", "x"),
                score("column missing when scoring", "model.json", "score-missing-column.csv",
                        "score-missing-column.csv", "region"),
                score("negative exposure when scoring", "model.json", "score-bad-exposure.csv",
                        "score-bad-exposure.csv", "exposure", "data row 3", "-1"),
                score("model file missing", "nothing.json", "unseen.csv", "nothing.json", "no such file"),
                score("model file not JSON", "garbage.json", "unseen.csv", "garbage.json"),
                score("model file edited (checksum)", "tampered.json", "unseen.csv", "tampered.json", "checksum"),
                score("model file cut short", "truncated.json", "unseen.csv", "truncated.json"),
                score("JSON that is not a model", "other-format.json", "unseen.csv", "other-format.json"),
                raw("required option missing", List.of("fit", "--data", "x.csv", "--response", "claims"), "--family"),
                raw("unknown option", List.of("fit", "--data", "x.csv", "--response", "claims", "--family",
                        "poisson", "--famly", "gamma"), "--famly"),
                raw("unknown command", List.of("fitt"), "fitt"),
                raw("interaction of one column", List.of("fit", "--data", "@good.csv", "--response", "claims",
                        "--family", "poisson", "--interaction", "region"), "--interaction", "region"),
                raw("portfolio size not a number", List.of("demo", "--policies", "many"), "many"),
                raw("portfolio too small", List.of("demo", "--policies", "10", "--out", "@demo-small"), "2000", "10"),
                raw("demo output folder under a file", List.of("demo", "--out", "@plain-file/out"), "plain-file",
                        "output folder"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void badInputExitsWithTwoAndOneLine(String label, List<String> args, List<String> fragments) {
        String[] resolved = args.stream().map(a -> a.startsWith("@") ? dir.resolve(a.substring(1)).toString() : a)
                .toArray(String[]::new);
        CliRun run = CliRun.of(resolved);
        assertEquals(2, run.status, run::toString);
        assertEquals("", run.out, "nothing on standard output");
        assertTrue(run.err.endsWith("\n"), run::toString);
        String line = run.err.substring(0, run.err.length() - 1);
        assertFalse(line.isBlank(), "a message");
        assertFalse(line.contains("\n") || line.contains("\r"), () -> "one line only:\n" + run.err);
        assertFalse(line.contains("\tat ") || line.matches(".*\\b[a-z]+(\\.[a-z]+)+\\.[A-Z]\\w*Exception\\b.*"),
                () -> "no stack trace or exception class: " + line);
        for (String fragment : fragments) {
            assertTrue(line.contains(fragment), () -> "message names '" + fragment + "': " + line);
        }
    }
}
