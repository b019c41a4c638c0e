package dev.reweigh.core;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.families.Families;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * A streaming fit becomes a model artifact that scores as the artifact of the in-memory fit on
 * the same rows does (to the fits' own agreement), and reads back bit for bit.
 */
class StreamingArtifactTest {

    private static void assertRelative(double expected, double actual, double rel, String what) {
        assertEquals(expected, actual, rel * Math.max(Math.abs(expected), 1e-300), what);
    }

    @Test
    void aStreamingPoissonFitDeploysLikeTheInMemoryOne() {
        Table data = StreamingGlmTest.portfolio(40_000, 71);
        ModelSpec spec = StreamingGlmTest.frequencySpec();
        ModelArtifact memory = ModelArtifact.of(Glm.fit(spec, data));
        StreamingFit streamed = StreamingGlm.fit(spec, ChunkSource.of(data, 3_001));
        ModelArtifact artifact = ModelArtifact.of(streamed);

        assertEquals(memory.columnNames(), artifact.columnNames());
        assertEquals(memory.rowCount(), artifact.rowCount());
        assertEquals(memory.residualDf(), artifact.residualDf());
        assertEquals(memory.nullDf(), artifact.nullDf());
        assertEquals(1.0, artifact.dispersion());
        assertEquals(memory.dispersionMethod(), artifact.dispersionMethod());
        assertRelative(memory.deviance(), artifact.deviance(), 1e-10, "deviance");
        // with an exposure offset the streaming fit leaves the intercept-only deviance out, and says so
        assertTrue(Double.isNaN(artifact.nullDeviance()));
        assertTrue(artifact.warnings().stream().anyMatch(w -> w.contains("intercept-only deviance")),
                artifact.warnings().toString());
        // the Poisson log-likelihood is gathered during the streaming fit's passes
        assertTrue(artifact.logLikelihood().isPresent());
        assertRelative(memory.logLikelihood().getAsDouble(), artifact.logLikelihood().getAsDouble(), 1e-10,
                "log-likelihood");

        Table fresh = StreamingGlmTest.portfolio(5_000, 72);
        double[] a = memory.scorer().score(fresh).mean();
        double[] b = artifact.scorer().score(fresh).mean();
        for (int i = 0; i < a.length; i++) {
            assertRelative(a[i], b[i], 1e-10, "mean of row " + i);
        }
        // written and read back, the artifact scores bit for bit as before
        ModelArtifact read = ModelArtifact.fromJson(artifact.toJson());
        assertEquals(artifact, read);
        double[] c = read.scorer().score(fresh).mean();
        for (int i = 0; i < b.length; i++) {
            assertEquals(Double.doubleToRawLongBits(b[i]), Double.doubleToRawLongBits(c[i]), "row " + i);
        }
    }

    @Test
    void aStreamingGammaFitRecordsThePearsonDispersion() {
        SplittableRandom r = new SplittableRandom(5);
        int n = 20_000;
        double[] amount = new double[n];
        double[] age = new double[n];
        String[] cover = new String[n];
        double shape = 2.5;
        for (int i = 0; i < n; i++) {
            age[i] = 18 + 62 * r.nextDouble();
            int c = r.nextInt(3);
            cover[i] = StreamingGlmTest.COVERS.get(c);
            double mean = Math.exp(7 + 0.004 * (age[i] - 45) + 0.2 * c);
            double g = 0;
            for (int k = 0; k < 5; k++) { // shape 2.5 as half a chi-square with 5 degrees of freedom
                double z = gaussian(r);
                g += z * z;
            }
            amount[i] = mean * (g / 2) / shape;
        }
        Table data = Table.builder().numeric("amount", amount).numeric("age", age)
                .categorical("cover", StreamingGlmTest.COVERS, cover).build();
        ModelSpec spec = ModelSpec.builder("amount").family(Families.gamma()).numeric("age").factor("cover").build();
        ModelArtifact memory = ModelArtifact.of(Glm.fit(spec, data));
        StreamingFit streamed = StreamingGlm.fit(spec, ChunkSource.of(data, 777));
        ModelArtifact artifact = ModelArtifact.of(streamed);

        assertEquals(ModelArtifact.PEARSON, artifact.dispersionMethod());
        assertRelative(memory.dispersion(), artifact.dispersion(), 1e-9, "dispersion");
        assertRelative(streamed.pearsonChiSquare() / streamed.residualDf(), artifact.dispersion(), 0, "Pearson / df");
        // the Gamma log-likelihood needs the dispersion first, i.e. another pass: not recorded
        assertFalse(artifact.logLikelihood().isPresent());
        // simulated with shape 2.5: the dispersion estimate is near 1 / 2.5 (common practice, no source)
        assertEquals(0.4, artifact.dispersion(), 0.02);

        ModelArtifact chosen = ModelArtifact.of(streamed, 0.41, "maximum likelihood");
        assertEquals(0.41, chosen.dispersion());
        assertEquals("maximum likelihood", chosen.dispersionMethod());
        assertThrows(IllegalArgumentException.class, () -> ModelArtifact.of(streamed, -1.0, "x"));
        assertThrows(IllegalArgumentException.class, () -> ModelArtifact.of(streamed, 1.0, " "));
    }

    private static double gaussian(SplittableRandom r) {
        double u = r.nextDouble();
        double v = r.nextDouble();
        return Math.sqrt(-2 * Math.log(1 - u)) * Math.cos(2 * Math.PI * v);
    }
}
