package dev.reweigh.examples.csv;

import dev.reweigh.core.Table;
import dev.reweigh.families.ReweighException;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.io.InputStreamReader;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Reads a comma-separated file (UTF-8, first record = column names) into a {@link Table}.
 *
 * <p>Column types: a column named as a factor is categorical; a column named as numeric must hold
 * numbers in every non-empty cell; any other column is numeric when all its non-empty cells are
 * numbers, categorical otherwise. Empty cells are missing values (NaN in a numeric column, null in
 * a categorical one). "NaN" and infinities are refused in numeric columns: a missing value is an
 * empty cell.
 *
 * <pre>{@code
 * Table t = CsvTableReader.builder().factor("region").numeric("claims").build()
 *         .read(Path.of("policies.csv"));
 * }</pre>
 *
 * <p>Every failure is a {@link ReweighException}: {@link DataFileException} for the file as a
 * whole (missing, not CSV, bad header, ragged record, absent column) and {@link CellException} for
 * one cell (message naming file, column, 1-based data row and value).
 *
 * @since 0.1
 */
public final class CsvTableReader {
    private static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+(\\.\\d*)?|\\.\\d+)([eE][+-]?\\d+)?");
    private static final Set<String> NON_FINITE = Set.of("nan", "+nan", "-nan", "inf", "+inf", "-inf",
            "infinity", "+infinity", "-infinity");
    private static final String FINITE = "a finite number (leave the cell empty for a missing value)";

    private final Set<String> factors;
    private final Set<String> numerics;
    private final Set<String> required;

    private CsvTableReader(Builder b) {
        this.factors = Set.copyOf(b.factors);
        this.numerics = Set.copyOf(b.numerics);
        this.required = new LinkedHashSet<>(b.required);
    }

    /**
     * Starts a reader with no columns forced to a type.
     *
     * @return a builder
     * @since 0.1
     */
    public static Builder builder() {
        return new Builder();
    }

    /**
     * Reads a file.
     *
     * @param file a UTF-8 CSV file with a header record
     * @return the table, with the columns in file order
     * @throws DataFileException when the file is missing, unreadable, not well-formed, has a bad
     *     header or a ragged record, or lacks a column this reader was told about
     * @throws CellException when a cell cannot be used
     * @since 0.1
     */
    public Table read(Path file) {
        return readFile(file).table();
    }

    /**
     * Reads a file and keeps its text as well as the table (for commands that echo the input).
     *
     * @param file a UTF-8 CSV file with a header record
     * @return the table with the header and the cells as written
     * @throws DataFileException when the file is missing, unreadable, not well-formed, has a bad
     *     header or a ragged record, or lacks a column this reader was told about
     * @throws CellException when a cell cannot be used
     * @since 0.1
     */
    public CsvFile readFile(Path file) {
        String name = file.toString();
        if (!Files.exists(file)) {
            throw new DataFileException(name, "no such file");
        }
        if (Files.isDirectory(file)) {
            throw new DataFileException(name, "is a directory, not a file");
        }
        var decoder = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        try (Reader in = new InputStreamReader(Files.newInputStream(file), decoder)) {
            return readText(in, name);
        } catch (NoSuchFileException e) {
            throw new DataFileException(name, "no such file", e);
        } catch (AccessDeniedException e) {
            throw new DataFileException(name, "cannot be read (access denied)", e);
        } catch (IOException e) {
            throw new DataFileException(name, "cannot be read: " + e.getMessage(), e);
        }
    }

    /**
     * Reads CSV text.
     *
     * @param in the text; it is read to the end but not closed
     * @param source the name to use for the source in messages (e.g. the file name)
     * @return the table, with the columns in their order in the text
     * @throws DataFileException when the text is not well-formed CSV, has a bad header or a ragged
     *     record, or lacks a column this reader was told about
     * @throws CellException when a cell cannot be used
     * @since 0.1
     */
    public Table read(Reader in, String source) {
        return readText(in, source).table();
    }

    private CsvFile readText(Reader in, String source) {
        List<String[]> records = parse(in, source);
        if (records.isEmpty()) {
            throw new DataFileException(source, "is empty; expected a header record of column names");
        }
        String[] header = records.get(0);
        checkHeader(header, source);
        int columns = header.length;
        int rows = records.size() - 1;
        Table.Builder table = Table.builder();
        for (int c = 0; c < columns; c++) {
            String column = header[c];
            String[] cells = new String[rows];
            for (int r = 0; r < rows; r++) {
                String cell = records.get(r + 1)[c];
                cells[r] = cell.isEmpty() ? null : cell;
            }
            if (factors.contains(column)) {
                table.categorical(column, cells);
            } else if (numerics.contains(column) || allNumbers(cells)) {
                table.numeric(column, toNumbers(column, cells, source, numerics.contains(column)));
            } else {
                table.categorical(column, cells);
            }
        }
        return new CsvFile(table.build(), records);
    }

    private List<String[]> parse(Reader in, String source) {
        CSVFormat format = CSVFormat.RFC4180.builder()
                .setIgnoreEmptyLines(true)
                .setTrim(true)
                .build();
        List<String[]> records = new ArrayList<>();
        int width = -1;
        try (CSVParser parser = format.parse(in)) {
            for (CSVRecord record : parser) {
                String[] values = record.values();
                if (width < 0) {
                    width = values.length;
                } else if (values.length != width) {
                    if (values.length == 1 && values[0].isEmpty()) {
                        continue; // a line of blanks only
                    }
                    throw new DataFileException(source, String.format(Locale.ROOT,
                            "data row %d (1 = first row after the header, file line %d) has %d fields; the header has %d",
                            records.size(), parser.getCurrentLineNumber(), values.length, width));
                }
                records.add(values);
            }
        } catch (UncheckedIOException e) {
            throw notCsv(source, e.getCause(), e);
        } catch (IOException | IllegalStateException | IllegalArgumentException e) {
            throw notCsv(source, e, e);
        }
        return records;
    }

    private static DataFileException notCsv(String source, Throwable reason, Throwable cause) {
        if (reason instanceof CharacterCodingException) {
            return new DataFileException(source, "is not UTF-8 text", cause);
        }
        String detail = reason == null || reason.getMessage() == null ? cause.toString() : reason.getMessage();
        return new DataFileException(source, "is not well-formed CSV: " + detail, cause);
    }

    private void checkHeader(String[] header, String source) {
        Set<String> seen = new HashSet<>();
        for (int c = 0; c < header.length; c++) {
            String h = header[c];
            if (h.isEmpty()) {
                throw new DataFileException(source, "column " + (c + 1) + " of the header has no name");
            }
            if (!seen.add(h)) {
                throw new DataFileException(source, "the header names column '" + h + "' twice");
            }
        }
        for (String r : required) {
            if (!seen.contains(r)) {
                throw new DataFileException(source, "has no column '" + r + "'; its columns are: "
                        + String.join(", ", Arrays.asList(header)));
            }
        }
    }

    private static boolean allNumbers(String[] cells) {
        for (String cell : cells) {
            if (cell != null && !DECIMAL.matcher(cell).matches() && !isNonFinite(cell)) {
                return false;
            }
        }
        return true;
    }

    private static boolean isNonFinite(String cell) {
        return NON_FINITE.contains(cell.toLowerCase(Locale.ROOT));
    }

    private static double[] toNumbers(String column, String[] cells, String source, boolean declared) {
        double[] out = new double[cells.length];
        for (int r = 0; r < cells.length; r++) {
            String cell = cells[r];
            if (cell == null) {
                out[r] = Double.NaN;
                continue;
            }
            if (!DECIMAL.matcher(cell).matches()) {
                throw new CellException(source, column, r, cell, isNonFinite(cell) || !declared ? FINITE
                        : "a number (the column is declared numeric; leave the cell empty for a missing value)");
            }
            double v = Double.parseDouble(cell);
            if (!Double.isFinite(v)) {
                throw new CellException(source, column, r, cell, "a number within the range of double precision");
            }
            out[r] = v;
        }
        return out;
    }

    /**
     * Configures a {@link CsvTableReader}.
     *
     * @since 0.1
     */
    public static final class Builder {
        private final Set<String> factors = new LinkedHashSet<>();
        private final Set<String> numerics = new LinkedHashSet<>();
        private final Set<String> required = new LinkedHashSet<>();

        private Builder() {
        }

        /**
         * Reads a column as categorical whatever its cells look like; the file must have it.
         *
         * @param column the column name
         * @return this builder
         * @throws ReweighException when the column was declared numeric
         * @since 0.1
         */
        public Builder factor(String column) {
            if (numerics.contains(column)) {
                throw new ReweighException("column '" + column + "' cannot be both numeric and a factor");
            }
            factors.add(column);
            required.add(column);
            return this;
        }

        /**
         * Requires a column to be numeric: text in it is an error naming its row; the file must
         * have it.
         *
         * @param column the column name
         * @return this builder
         * @throws ReweighException when the column was declared a factor
         * @since 0.1
         */
        public Builder numeric(String column) {
            if (factors.contains(column)) {
                throw new ReweighException("column '" + column + "' cannot be both numeric and a factor");
            }
            numerics.add(column);
            required.add(column);
            return this;
        }

        /**
         * Requires the file to have these columns, of either type.
         *
         * @param columns column names
         * @return this builder
         * @since 0.1
         */
        public Builder require(Collection<String> columns) {
            required.addAll(columns);
            return this;
        }

        /**
         * Builds the reader.
         *
         * @return an immutable reader
         * @since 0.1
         */
        public CsvTableReader build() {
            return new CsvTableReader(this);
        }
    }
}
