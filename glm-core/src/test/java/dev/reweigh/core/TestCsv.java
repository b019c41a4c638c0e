package dev.reweigh.core;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/** Reads the small comma-separated reference files of the tests (no quoting in them). */
final class TestCsv {
    final List<String> header;
    final List<String[]> rows;

    private TestCsv(List<String> header, List<String[]> rows) {
        this.header = header;
        this.rows = rows;
    }

    static TestCsv resource(String path) {
        try (InputStream in = TestCsv.class.getResourceAsStream(path)) {
            if (in == null) {
                throw new IllegalStateException("missing test resource " + path);
            }
            String[] lines = new String(in.readAllBytes(), StandardCharsets.UTF_8).split("\\R");
            List<String[]> rows = new ArrayList<>();
            for (int i = 1; i < lines.length; i++) {
                if (!lines[i].isBlank()) {
                    rows.add(lines[i].split(",", -1));
                }
            }
            return new TestCsv(List.of(lines[0].split(",")), rows);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    double[] numbers(String column) {
        int c = header.indexOf(column);
        return rows.stream().mapToDouble(r -> Double.parseDouble(r[c])).toArray();
    }

    String[] texts(String column) {
        int c = header.indexOf(column);
        return rows.stream().map(r -> r[c]).toArray(String[]::new);
    }
}
