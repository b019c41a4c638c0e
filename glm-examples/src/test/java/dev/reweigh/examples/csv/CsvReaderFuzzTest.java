package dev.reweigh.examples.csv;

import dev.reweigh.core.Table;
import dev.reweigh.families.ReweighException;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.Size;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

/**
 * Fuzzing the CSV reader: random bytes and mutations of a valid file either read into a table or
 * fail with one of the library's own exceptions (never a NullPointerException, an
 * IndexOutOfBoundsException, an OutOfMemoryError or a hang).
 */
class CsvReaderFuzzTest {
    private static final String VALID = "claims,exposure,driver_age,region,mileage\n"
            + "0,1.0,18-24,coast,12.5\n"
            + "1,0.5,25-49,\"metro, north\",8\n"
            + "2,0.75,50+,rural,\n"
            + "0,1,25-49,coast,20.25\n";

    private static void readsOrFailsCleanly(byte[] bytes, boolean declareColumns) {
        Path file;
        try {
            file = Files.createTempFile("fuzz", ".csv");
            Files.write(file, bytes);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        try {
            assertTimeoutPreemptively(Duration.ofSeconds(10), () -> {
                CsvTableReader.Builder b = CsvTableReader.builder();
                if (declareColumns) {
                    b.numeric("claims").factor("region");
                }
                try {
                    Table t = b.build().read(file);
                    assertTrue(t.rowCount() >= 0 && !t.columnNames().isEmpty());
                } catch (ReweighException expected) {
                    String message = expected.getMessage();
                    assertTrue(message != null && !message.isBlank(), "a message");
                    assertTrue(!message.contains("\n"), "one line: " + message);
                } catch (RuntimeException | Error unexpected) {
                    fail("undocumented failure " + unexpected + " for input " + new String(bytes,
                            StandardCharsets.ISO_8859_1), unexpected);
                }
            });
        } finally {
            try {
                Files.deleteIfExists(file);
            } catch (IOException ignored) {
                // a leftover temporary file does no harm
            }
        }
    }

    @Property(tries = 300)
    void randomBytes(@ForAll @Size(max = 400) byte[] bytes) {
        readsOrFailsCleanly(bytes, false);
    }

    @Property(tries = 300)
    void mutatedValidFile(@ForAll("mutations") byte[] bytes, @ForAll boolean declareColumns) {
        readsOrFailsCleanly(bytes, declareColumns);
    }

    private static final byte[] REPLACEMENTS = {',', '"', '\n', '\r', 0, 'x', '-', '.', 'e', (byte) 0xC3,
        (byte) 0xFF, ' ', 'N'};

    @Provide
    Arbitrary<byte[]> mutations() {
        Arbitrary<int[]> oneEdit = Combinators.combine(Arbitraries.integers().between(0, 999),
                Arbitraries.integers().between(0, REPLACEMENTS.length - 1), Arbitraries.integers().between(0, 2))
                .as((permille, b, kind) -> new int[] {permille, b, kind});
        Arbitrary<List<int[]>> edits = oneEdit.list().ofMinSize(1).ofMaxSize(6);
        return Combinators.combine(edits, Arbitraries.integers().between(0, 3)).as((list, extra) -> {
            byte[] current = VALID.getBytes(StandardCharsets.UTF_8);
            for (int[] e : list) {
                if (current.length == 0) {
                    break;
                }
                current = edit(current, e[0] * current.length / 1000, REPLACEMENTS[e[1]], e[2]);
            }
            return applyMore(current, extra);
        });
    }

    private static byte[] edit(byte[] base, int pos, byte b, int kind) {
        switch (kind) {
            case 0: { // replace
                byte[] out = base.clone();
                out[pos] = b;
                return out;
            }
            case 1: { // insert
                byte[] out = new byte[base.length + 1];
                System.arraycopy(base, 0, out, 0, pos);
                out[pos] = b;
                System.arraycopy(base, pos, out, pos + 1, base.length - pos);
                return out;
            }
            default: { // delete
                byte[] out = new byte[base.length - 1];
                System.arraycopy(base, 0, out, 0, pos);
                System.arraycopy(base, pos + 1, out, pos, base.length - pos - 1);
                return out;
            }
        }
    }

    private static byte[] applyMore(byte[] bytes, int extra) {
        byte[] current = bytes;
        List<byte[]> tokens = List.of("NaN".getBytes(StandardCharsets.UTF_8), "1e999".getBytes(StandardCharsets.UTF_8),
                "\"".getBytes(StandardCharsets.UTF_8), ",,".getBytes(StandardCharsets.UTF_8));
        for (int k = 0; k < extra && current.length > 0; k++) {
            byte[] token = tokens.get(k % tokens.size());
            int pos = (current.length * (k + 1)) / (extra + 1);
            byte[] out = new byte[current.length + token.length];
            System.arraycopy(current, 0, out, 0, pos);
            System.arraycopy(token, 0, out, pos, token.length);
            System.arraycopy(current, pos, out, pos + token.length, current.length - pos);
            current = out;
        }
        return current;
    }
}
