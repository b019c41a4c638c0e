package dev.reweigh.core;

import dev.reweigh.families.ReweighException;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.ResultSetMetaData;
import java.sql.SQLException;
import java.sql.Types;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.function.Consumer;
import javax.sql.DataSource;

/**
 * A {@link ChunkSource} over a SQL query: each pass opens a connection, runs the query again and
 * reads its rows forward, {@code chunkRows} at a time, so a fit can go through a table far larger
 * than memory. Uses only {@code java.sql}; bring your own JDBC driver.
 *
 * <p>Columns are named by their labels in the result set (quote identifiers, or use
 * {@code AS "name"}, when the database changes their case). A column named in the declared
 * levels is categorical: its values are read as text and must be one of the declared levels
 * (SQL NULL is a missing value). Every other column must have a numeric SQL type and is read as
 * a number (SQL NULL is NaN, a missing value). The query must return the rows in the same order
 * every time: give it an ORDER BY on a key.
 * <pre>{@code
 * ChunkSource source = JdbcChunkSource.of(dataSource,
 *         "SELECT claims, exposure, driver_age, region FROM policies ORDER BY policy_id",
 *         50_000, Map.of("REGION", List.of("north", "south", "east", "west")));
 * }</pre>
 *
 * @since 0.1
 */
public final class JdbcChunkSource implements ChunkSource {
    private final ConnectionOpener opener;
    private final String query;
    private final int chunkRows;
    private final Map<String, List<String>> levels;
    private final String description;

    /** Opens a connection for one pass. */
    private interface ConnectionOpener {
        Connection open() throws SQLException;
    }

    private JdbcChunkSource(ConnectionOpener opener, String query, int chunkRows, Map<String, List<String>> levels,
            String description) {
        if (chunkRows < 1) {
            throw new IllegalArgumentException("chunkRows must be at least 1, got " + chunkRows);
        }
        this.opener = opener;
        this.query = Objects.requireNonNull(query, "query");
        this.chunkRows = chunkRows;
        Map<String, List<String>> copy = new LinkedHashMap<>();
        for (Map.Entry<String, List<String>> e : levels.entrySet()) {
            copy.put(Objects.requireNonNull(e.getKey(), "column name"), List.copyOf(e.getValue()));
        }
        this.levels = Map.copyOf(copy);
        this.description = description;
    }

    /**
     * A source that takes a connection from a {@link DataSource} for each pass (and closes it
     * after the pass).
     *
     * @param dataSource where connections come from
     * @param query the SQL query returning the rows, in a fixed order
     * @param chunkRows rows per chunk (at least 1); also the JDBC fetch size
     * @param levels the level order of each categorical column, by column label
     * @return the source
     * @throws IllegalArgumentException if {@code chunkRows} is below 1
     * @since 0.1
     */
    public static JdbcChunkSource of(DataSource dataSource, String query, int chunkRows,
            Map<String, List<String>> levels) {
        Objects.requireNonNull(dataSource, "dataSource");
        return new JdbcChunkSource(dataSource::getConnection, query, chunkRows, levels, dataSource.toString());
    }

    /**
     * A source that opens a connection with {@link DriverManager} for each pass.
     *
     * @param url the JDBC URL
     * @param user the user name, or null
     * @param password the password, or null
     * @param query the SQL query returning the rows, in a fixed order
     * @param chunkRows rows per chunk (at least 1); also the JDBC fetch size
     * @param levels the level order of each categorical column, by column label
     * @return the source
     * @throws IllegalArgumentException if {@code chunkRows} is below 1
     * @since 0.1
     */
    public static JdbcChunkSource of(String url, String user, String password, String query, int chunkRows,
            Map<String, List<String>> levels) {
        Objects.requireNonNull(url, "url");
        return new JdbcChunkSource(() -> DriverManager.getConnection(url, user, password), query, chunkRows, levels,
                url);
    }

    @Override
    public Map<String, List<String>> levels() {
        return levels;
    }

    /**
     * Runs the query and hands its rows out in chunks of {@code chunkRows}.
     *
     * @param action receives the chunks
     * @throws ReweighException when the database reports an error (its message is included)
     * @throws dev.reweigh.families.UnknownNameException when a categorical value is not a
     *         declared level
     */
    @Override
    public void forEachChunk(Consumer<Table> action) {
        try (Connection c = opener.open();
                PreparedStatement st = c.prepareStatement(query, ResultSet.TYPE_FORWARD_ONLY,
                        ResultSet.CONCUR_READ_ONLY)) {
            st.setFetchSize(chunkRows);
            try (ResultSet rs = st.executeQuery()) {
                read(rs, action);
            }
        } catch (SQLException e) {
            throw new ReweighException("reading rows from " + description + " failed: " + e.getMessage()
                    + " (query: " + query + ")", e);
        }
    }

    private void read(ResultSet rs, Consumer<Table> action) throws SQLException {
        ResultSetMetaData md = rs.getMetaData();
        int cols = md.getColumnCount();
        String[] names = new String[cols];
        boolean[] categorical = new boolean[cols];
        for (int k = 0; k < cols; k++) {
            names[k] = md.getColumnLabel(k + 1);
            categorical[k] = levels.containsKey(names[k]);
            if (!categorical[k] && !isNumeric(md.getColumnType(k + 1))) {
                throw new ModelSpecException("column '" + names[k] + "' of the query has SQL type "
                        + md.getColumnTypeName(k + 1) + ", which is not numeric, and no declared levels; declare"
                        + " its levels to read it as categorical (declared: " + levels.keySet() + ")");
            }
        }
        for (String declared : levels.keySet()) {
            if (!Arrays.asList(names).contains(declared)) {
                throw new ModelSpecException("levels are declared for column '" + declared + "', which the query does"
                        + " not return; its columns are " + Arrays.toString(names));
            }
        }
        double[][] numbers = new double[cols][];
        String[][] texts = new String[cols][];
        int filled = 0;
        while (rs.next()) {
            if (filled == 0) {
                for (int k = 0; k < cols; k++) {
                    if (categorical[k]) {
                        texts[k] = new String[chunkRows];
                    } else {
                        numbers[k] = new double[chunkRows];
                    }
                }
            }
            for (int k = 0; k < cols; k++) {
                if (categorical[k]) {
                    texts[k][filled] = rs.getString(k + 1);
                } else {
                    double v = rs.getDouble(k + 1);
                    numbers[k][filled] = rs.wasNull() ? Double.NaN : v;
                }
            }
            filled++;
            if (filled == chunkRows) {
                action.accept(chunk(names, categorical, numbers, texts, filled));
                filled = 0;
            }
        }
        if (filled > 0) {
            action.accept(chunk(names, categorical, numbers, texts, filled));
        }
    }

    private Table chunk(String[] names, boolean[] categorical, double[][] numbers, String[][] texts, int rows) {
        Table.Builder b = Table.builder();
        for (int k = 0; k < names.length; k++) {
            if (categorical[k]) {
                b.categorical(names[k], levels.get(names[k]), Arrays.copyOf(texts[k], rows));
            } else {
                b.numeric(names[k], Arrays.copyOf(numbers[k], rows));
            }
        }
        return b.build();
    }

    private static boolean isNumeric(int sqlType) {
        switch (sqlType) {
            case Types.TINYINT:
            case Types.SMALLINT:
            case Types.INTEGER:
            case Types.BIGINT:
            case Types.REAL:
            case Types.FLOAT:
            case Types.DOUBLE:
            case Types.NUMERIC:
            case Types.DECIMAL:
            case Types.BOOLEAN:
            case Types.BIT:
                return true;
            default:
                return false;
        }
    }

    /**
     * Returns a description naming the database and the chunk size (not the password).
     *
     * @return the description
     */
    @Override
    public String toString() {
        return "JdbcChunkSource[" + description + ", " + chunkRows + " rows per chunk]";
    }
}
