package dev.reweigh.core;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.function.Consumer;

/**
 * Rows that can be read again and again, a chunk at a time: the input of a streaming fit
 * ({@link StreamingGlm}), which makes one pass over the source per iteration and keeps in memory
 * only one chunk and sums whose size does not depend on the number of rows.
 *
 * <p>Every pass must hand out the same rows in the same order. Categorical columns must use the
 * level order declared by {@link #levels()} in every chunk (build them with
 * {@link Table.Builder#categorical(String, List, String...)}), so that level codes mean the same
 * thing in every chunk. A chunk may have any number of rows, including none.
 *
 * <p>Implement it over a file, a message log or a database cursor; {@link JdbcChunkSource}
 * reads a SQL query, and {@link #of(Table, int)} splits a table in memory. For example:
 * <pre>{@code
 * ChunkSource source = ChunkSource.of(portfolio, 100_000);
 * StreamingFit fit = StreamingGlm.fit(spec, source, FitOptions.defaults());
 * }</pre>
 *
 * @since 0.1
 */
public interface ChunkSource {

    /**
     * Returns the declared level order of every categorical column the chunks carry, by column
     * name. Columns not named here are numeric.
     *
     * @return column name to level order; not modified by the caller
     * @since 0.1
     */
    Map<String, List<String>> levels();

    /**
     * Makes one pass over all rows, handing each chunk to {@code action} in row order. Called
     * once per iteration of a streaming fit; each call starts again from the first row.
     *
     * @param action receives the chunks
     * @throws dev.reweigh.families.ReweighException (or a subclass) when the rows cannot be read
     * @since 0.1
     */
    void forEachChunk(Consumer<Table> action);

    /**
     * A source over a table in memory, handing out consecutive runs of {@code chunkRows} rows.
     * Useful to bound the memory of a fit's per-row work, and to check a streaming fit against
     * an in-memory one.
     *
     * @param table the rows
     * @param chunkRows rows per chunk (at least 1)
     * @return the source
     * @throws IllegalArgumentException if {@code chunkRows} is below 1
     * @since 0.1
     */
    static ChunkSource of(Table table, int chunkRows) {
        Objects.requireNonNull(table, "table");
        if (chunkRows < 1) {
            throw new IllegalArgumentException("chunkRows must be at least 1, got " + chunkRows);
        }
        Map<String, List<String>> levels = new LinkedHashMap<>();
        for (String c : table.columnNames()) {
            if (table.isCategorical(c)) {
                levels.put(c, table.levels(c));
            }
        }
        Map<String, List<String>> declared = Map.copyOf(levels);
        return new ChunkSource() {
            @Override
            public Map<String, List<String>> levels() {
                return declared;
            }

            @Override
            public void forEachChunk(Consumer<Table> action) {
                int n = table.rowCount();
                for (int start = 0; start < n; start += chunkRows) {
                    int end = Math.min(n, start + chunkRows);
                    int[] rows = new int[end - start];
                    for (int i = 0; i < rows.length; i++) {
                        rows[i] = start + i;
                    }
                    action.accept(table.select(rows));
                }
            }

            @Override
            public String toString() {
                return "ChunkSource[" + table.rowCount() + " rows in chunks of " + chunkRows + "]";
            }
        };
    }
}
