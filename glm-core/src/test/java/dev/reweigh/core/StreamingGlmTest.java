package dev.reweigh.core;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.families.Families;
import dev.reweigh.families.InvalidDataException;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.function.Consumer;
import org.junit.jupiter.api.Test;

/** A streaming fit gives the in-memory fit on the same rows. */
class StreamingGlmTest {
    static final List<String> REGIONS = List.of("north", "south", "east", "west", "centre", "coast");
    static final List<String> COVERS = List.of("third-party", "fire-theft", "comprehensive");

    /** A synthetic motor portfolio: claim counts, exposure, driver age, vehicle value, region, cover. */
    static Table portfolio(int n, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        double[] claims = new double[n];
        double[] exposure = new double[n];
        double[] age = new double[n];
        double[] value = new double[n];
        String[] region = new String[n];
        String[] cover = new String[n];
        for (int i = 0; i < n; i++) {
            exposure[i] = 0.05 + 0.95 * r.nextDouble();
            age[i] = 18 + 62 * r.nextDouble();
            value[i] = 5 + 45 * r.nextDouble();
            int g = r.nextInt(REGIONS.size());
            int c = (int) (COVERS.size() * Math.sqrt(r.nextDouble()));
            region[i] = REGIONS.get(g);
            cover[i] = COVERS.get(c);
            double eta = -2.2 - 0.012 * (age[i] - 45) + 0.01 * value[i] + 0.07 * g + 0.15 * c;
            claims[i] = poisson(r, exposure[i] * Math.exp(eta));
        }
        return Table.builder().numeric("claims", claims).numeric("exposure", exposure).numeric("age", age)
                .numeric("value", value).categorical("region", REGIONS, region).categorical("cover", COVERS, cover)
                .build();
    }

    static double poisson(SplittableRandom r, double mean) {
        double l = Math.exp(-mean);
        double prod = r.nextDouble();
        int k = 0;
        while (prod > l) {
            prod *= r.nextDouble();
            k++;
        }
        return k;
    }

    static ModelSpec frequencySpec() {
        return ModelSpec.builder("claims").family(Families.poisson()).numeric("age").numeric("value")
                .factor("region").factor("cover").interaction("cover", "age").logOffset("exposure").build();
    }

    static void assertSameFit(FittedModel memory, StreamingFit streamed, double rel) {
        assertEquals(memory.columnNames(), streamed.columnNames());
        double[] a = memory.coefficients();
        double[] b = streamed.coefficients();
        for (int j = 0; j < a.length; j++) {
            assertEquals(a[j], b[j], rel * Math.max(1e-3, Math.abs(a[j])), memory.columnNames().get(j));
        }
        assertEquals(memory.deviance(), streamed.deviance(), rel * memory.deviance());
        double[][] ca = memory.unscaledCovariance();
        double[][] cb = streamed.unscaledCovariance();
        for (int j = 0; j < a.length; j++) {
            assertEquals(ca[j][j], cb[j][j], 1e-8 * Math.abs(ca[j][j]), "variance " + j);
        }
        assertEquals(memory.residualDf(), streamed.residualDf());
        assertEquals(memory.rowCount(), streamed.rowCount());
    }

    @Test
    void streamingFitOfAMillionRowsEqualsInMemoryFit() {
        Table data = portfolio(1_000_000, 2026);
        FitOptions options = FitOptions.builder().solver(Solver.CHOLESKY).threads(2).build();
        FittedModel memory = Glm.fit(frequencySpec(), data, options);
        StreamingFit streamed = StreamingGlm.fit(frequencySpec(), ChunkSource.of(data, 65_536), options);
        assertTrue(memory.converged());
        assertTrue(streamed.converged());
        assertSameFit(memory, streamed, 1e-10);
        // the same iteration; rounding in the cross products can move the stopping test by one step
        assertTrue(Math.abs(memory.iterations() - streamed.iterations()) <= 1);
        // one survey pass, one pass at the starting means, then one pass per iteration (no halvings here)
        assertEquals(streamed.iterations() + 2, streamed.passes());
        // default reference levels (largest total prior weight) are chosen alike
        assertEquals(memory.columnNames(), streamed.columnNames());
    }

    @Test
    void chunkSizeAndThreadsDoNotChangeTheFitBeyondRounding() {
        Table data = portfolio(30_000, 7);
        StreamingFit a = StreamingGlm.fit(frequencySpec(), ChunkSource.of(data, 1_000),
                FitOptions.builder().threads(1).build());
        StreamingFit b = StreamingGlm.fit(frequencySpec(), ChunkSource.of(data, 7_777),
                FitOptions.builder().threads(4).build());
        assertArrayEquals(a.coefficients(), b.coefficients(), 1e-9);
        // same chunks, different threads: bit-identical
        StreamingFit c = StreamingGlm.fit(frequencySpec(), ChunkSource.of(data, 1_000),
                FitOptions.builder().threads(3).build());
        assertArrayEquals(a.coefficients(), c.coefficients(), 0.0);
    }

    @Test
    void gaussianIdentityWithWeightsAndNullDevianceMatch() {
        SplittableRandom r = new SplittableRandom(3);
        int n = 5_000;
        double[] y = new double[n];
        double[] x = new double[n];
        double[] wt = new double[n];
        String[] band = new String[n];
        List<String> bands = List.of("a", "b", "c", "d");
        for (int i = 0; i < n; i++) {
            x[i] = r.nextGaussian();
            wt[i] = i % 50 == 0 ? 0.0 : 0.5 + r.nextDouble();
            int k = r.nextInt(4);
            band[i] = bands.get(k);
            y[i] = 1 + 2 * x[i] + 0.3 * k + r.nextGaussian();
        }
        Table t = Table.builder().numeric("severity", y).numeric("x", x).numeric("w", wt)
                .categorical("band", bands, band).build();
        ModelSpec spec = ModelSpec.builder("severity").numeric("x").factor("band").weights("w").build();
        FittedModel memory = Glm.fit(spec, t, FitOptions.builder().solver(Solver.CHOLESKY).build());
        StreamingFit streamed = StreamingGlm.fit(spec, ChunkSource.of(t, 333));
        assertSameFit(memory, streamed, 1e-10);
        assertEquals(memory.nullDeviance(), streamed.nullDeviance(), 1e-10 * memory.nullDeviance());
    }

    @Test
    void aliasedColumnsAreReportedAsInMemory() {
        Table base = portfolio(4_000, 11);
        double[] age = base.numeric("age");
        double[] months = new double[age.length];
        for (int i = 0; i < age.length; i++) {
            months[i] = 12 * age[i];
        }
        Table t = Table.builder().numeric("claims", base.numeric("claims")).numeric("exposure", base.numeric("exposure"))
                .numeric("age", age).numeric("ageMonths", months).build();
        ModelSpec spec = ModelSpec.builder("claims").family(Families.poisson()).numeric("age").numeric("ageMonths")
                .logOffset("exposure").build();
        FittedModel memory = Glm.fit(spec, t, FitOptions.builder().solver(Solver.CHOLESKY).build());
        StreamingFit streamed = StreamingGlm.fit(spec, ChunkSource.of(t, 512));
        assertEquals(memory.aliasedColumns(), streamed.aliasedColumns());
        assertEquals(List.of("ageMonths"), streamed.aliasedColumns());
        assertTrue(Double.isNaN(streamed.coefficient("ageMonths")));
        assertEquals(memory.coefficient("age"), streamed.coefficient("age"), 1e-10 * Math.abs(memory.coefficient("age")));
    }

    @Test
    void badValuesAreReportedWithTheirRowInTheWholeSource() {
        Table data = portfolio(3_000, 5);
        double[] exposure = data.numeric("exposure");
        exposure[2_345] = -1.0;
        Table bad = Table.builder().numeric("claims", data.numeric("claims")).numeric("exposure", exposure)
                .numeric("age", data.numeric("age")).numeric("value", data.numeric("value"))
                .categorical("region", REGIONS, column(data, "region")).categorical("cover", COVERS, column(data, "cover"))
                .build();
        InvalidDataException e = assertThrows(InvalidDataException.class,
                () -> StreamingGlm.fit(frequencySpec(), ChunkSource.of(bad, 1_000)));
        assertEquals("exposure", e.column());
        assertEquals(2_345, e.row());
    }

    private static String[] column(Table t, String c) {
        String[] out = new String[t.rowCount()];
        for (int i = 0; i < out.length; i++) {
            out[i] = t.value(c, i);
        }
        return out;
    }

    @Test
    void chunksWithOtherLevelOrdersAndUnsupportedOptionsAreRefused() {
        Table data = portfolio(2_000, 9);
        ChunkSource lying = new ChunkSource() {
            @Override
            public Map<String, List<String>> levels() {
                return Map.of("region", List.of("north", "south"), "cover", COVERS);
            }

            @Override
            public void forEachChunk(Consumer<Table> action) {
                action.accept(data);
            }
        };
        assertThrows(ModelSpecException.class, () -> StreamingGlm.fit(frequencySpec(), lying));
        ChunkSource ok = ChunkSource.of(data, 500);
        assertThrows(IllegalArgumentException.class, () -> StreamingGlm.fit(frequencySpec(), ok,
                FitOptions.builder().solver(Solver.PIVOTED_QR).build()));
        ModelSpec orthogonal = ModelSpec.builder("claims").family(Families.poisson()).polynomial("age", 2, true)
                .logOffset("exposure").build();
        assertThrows(ModelSpecException.class, () -> StreamingGlm.fit(orthogonal, ok));
    }
}
