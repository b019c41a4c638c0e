package dev.reweigh.core;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.families.ReweighException;
import dev.reweigh.families.UnknownNameException;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** The JDBC chunk source against a real embedded database (H2, in memory). */
class JdbcChunkSourceTest {
    private static final String URL = "jdbc:h2:mem:reweigh_policies;DB_CLOSE_DELAY=-1";
    private static final int ROWS = 20_000;
    private static Connection keepAlive;
    private static Table portfolio;

    @BeforeAll
    static void createDatabase() throws SQLException {
        portfolio = StreamingGlmTest.portfolio(ROWS, 42);
        keepAlive = DriverManager.getConnection(URL, "sa", "");
        try (Statement st = keepAlive.createStatement()) {
            st.execute("CREATE TABLE policies (policy_id INT PRIMARY KEY, claims INT, exposure DOUBLE, age DOUBLE,"
                    + " vehicle_value DECIMAL(12, 6), region VARCHAR(20), cover VARCHAR(20))");
        }
        try (PreparedStatement ins = keepAlive.prepareStatement("INSERT INTO policies VALUES (?, ?, ?, ?, ?, ?, ?)")) {
            double[] claims = portfolio.numeric("claims");
            double[] exposure = portfolio.numeric("exposure");
            double[] age = portfolio.numeric("age");
            double[] value = portfolio.numeric("value");
            // rows are inserted in reverse so that only the query's ORDER BY gives the table's order
            for (int i = ROWS - 1; i >= 0; i--) {
                ins.setInt(1, i);
                ins.setInt(2, (int) claims[i]);
                ins.setDouble(3, exposure[i]);
                ins.setDouble(4, age[i]);
                ins.setBigDecimal(5, new java.math.BigDecimal(value[i]).setScale(6, java.math.RoundingMode.HALF_EVEN));
                ins.setString(6, portfolio.value("region", i));
                ins.setString(7, portfolio.value("cover", i));
                ins.addBatch();
            }
            ins.executeBatch();
        }
    }

    @AfterAll
    static void dropDatabase() throws SQLException {
        try (Statement st = keepAlive.createStatement()) {
            st.execute("DROP ALL OBJECTS");
        }
        keepAlive.close();
    }

    private static final String QUERY = "SELECT claims AS \"claims\", exposure AS \"exposure\", age AS \"age\","
            + " vehicle_value AS \"value\", region AS \"region\", cover AS \"cover\" FROM policies ORDER BY policy_id";

    private static Map<String, List<String>> levels() {
        return Map.of("region", StreamingGlmTest.REGIONS, "cover", StreamingGlmTest.COVERS);
    }

    /** A minimal DataSource over DriverManager (H2's own needs java.naming, absent from the test module). */
    private static javax.sql.DataSource dataSource() {
        return new javax.sql.DataSource() {
            @Override
            public Connection getConnection() throws SQLException {
                return DriverManager.getConnection(URL, "sa", "");
            }

            @Override
            public Connection getConnection(String user, String password) throws SQLException {
                return DriverManager.getConnection(URL, user, password);
            }

            @Override
            public java.io.PrintWriter getLogWriter() {
                return null;
            }

            @Override
            public void setLogWriter(java.io.PrintWriter out) {
            }

            @Override
            public void setLoginTimeout(int seconds) {
            }

            @Override
            public int getLoginTimeout() {
                return 0;
            }

            @Override
            public java.util.logging.Logger getParentLogger() {
                return java.util.logging.Logger.getGlobal();
            }

            @Override
            public <T> T unwrap(Class<T> iface) throws SQLException {
                throw new SQLException("not a wrapper");
            }

            @Override
            public boolean isWrapperFor(Class<?> iface) {
                return false;
            }

            @Override
            public String toString() {
                return "test database " + URL;
            }
        };
    }

    /** The table as the database holds it (vehicle value rounded to 6 decimals). */
    private static Table asStored() {
        double[] value = portfolio.numeric("value");
        for (int i = 0; i < value.length; i++) {
            value[i] = new java.math.BigDecimal(value[i]).setScale(6, java.math.RoundingMode.HALF_EVEN).doubleValue();
        }
        String[] region = new String[ROWS];
        String[] cover = new String[ROWS];
        for (int i = 0; i < ROWS; i++) {
            region[i] = portfolio.value("region", i);
            cover[i] = portfolio.value("cover", i);
        }
        return Table.builder().numeric("claims", portfolio.numeric("claims"))
                .numeric("exposure", portfolio.numeric("exposure")).numeric("age", portfolio.numeric("age"))
                .numeric("value", value).categorical("region", StreamingGlmTest.REGIONS, region)
                .categorical("cover", StreamingGlmTest.COVERS, cover).build();
    }

    @Test
    void streamingFitFromTheDatabaseEqualsInMemoryFit() {
        ChunkSource source = JdbcChunkSource.of(dataSource(), QUERY, 3_000, levels());
        StreamingFit streamed = StreamingGlm.fit(StreamingGlmTest.frequencySpec(), source,
                FitOptions.builder().threads(2).build());
        FittedModel memory = Glm.fit(StreamingGlmTest.frequencySpec(), asStored(),
                FitOptions.builder().solver(Solver.CHOLESKY).build());
        assertTrue(streamed.converged());
        StreamingGlmTest.assertSameFit(memory, streamed, 1e-10);
    }

    @Test
    void eachPassRerunsTheQueryAndHandsOutTheSameChunks() {
        ChunkSource source = JdbcChunkSource.of(URL, "sa", "", QUERY, 6_000, levels());
        List<Integer> sizes = new ArrayList<>();
        AtomicInteger passes = new AtomicInteger();
        for (int pass = 0; pass < 2; pass++) {
            passes.incrementAndGet();
            source.forEachChunk(chunk -> sizes.add(chunk.rowCount()));
        }
        assertEquals(List.of(6_000, 6_000, 6_000, 2_000, 6_000, 6_000, 6_000, 2_000), sizes);
        double[] firstClaims = new double[1];
        source.forEachChunk(chunk -> {
            if (firstClaims[0] == 0 && chunk.rowCount() > 0) {
                firstClaims[0] = 1 + chunk.numeric("claims")[0];
                assertEquals(portfolio.numeric("age")[0], chunk.numeric("age")[0], 0.0);
                assertEquals(portfolio.value("region", 0), chunk.value("region", 0));
            }
        });
        assertEquals(2, passes.get());
    }

    @Test
    void undeclaredTextColumnsUnknownLevelsAndSqlErrorsAreReported() {
        Map<String, List<String>> noCover = Map.of("region", StreamingGlmTest.REGIONS);
        ModelSpecException text = assertThrows(ModelSpecException.class,
                () -> JdbcChunkSource.of(dataSource(), QUERY, 1_000, noCover).forEachChunk(c -> { }));
        assertTrue(text.getMessage().contains("cover"), text.getMessage());

        Map<String, List<String>> fewRegions = Map.of("region", List.of("north", "south"), "cover",
                StreamingGlmTest.COVERS);
        assertThrows(UnknownNameException.class,
                () -> JdbcChunkSource.of(dataSource(), QUERY, 1_000, fewRegions).forEachChunk(c -> { }));

        ReweighException sql = assertThrows(ReweighException.class,
                () -> JdbcChunkSource.of(dataSource(), "SELECT nothing FROM nowhere", 10, Map.of())
                        .forEachChunk(c -> { }));
        assertTrue(sql.getMessage().contains("nowhere"), sql.getMessage());
    }
}
