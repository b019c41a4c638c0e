package dev.reweigh.core.internal.wls;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.core.FitOptions;
import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Solver;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Whole fits on the Cholesky route: coefficients bit-identical for 1, 2, 4 and 8 threads, and
 * factors as level codes giving the same fit as the same model with dense dummy columns.
 */
class FitLevelTest {
    private static final String[] REGIONS = {"north", "south", "east", "west", "centre", "coast", "hills"};
    private static final String[] BANDS = {"17-24", "25-34", "35-49", "50-64", "65+"};

    /** A synthetic motor portfolio: claim counts with exposure, driver age, vehicle value, region, age band. */
    private static Table portfolio(int n, long seed, boolean dummies) {
        SplittableRandom r = new SplittableRandom(seed);
        double[] claims = new double[n];
        double[] exposure = new double[n];
        double[] age = new double[n];
        double[] value = new double[n];
        String[] region = new String[n];
        String[] band = new String[n];
        double[][] regionDummy = new double[REGIONS.length][n];
        double[][] bandDummy = new double[BANDS.length][n];
        for (int i = 0; i < n; i++) {
            exposure[i] = 0.1 + 0.9 * r.nextDouble();
            age[i] = 18 + 60 * r.nextDouble();
            value[i] = Math.exp(9 + r.nextGaussian() * 0.5) / 10_000;
            int g = r.nextInt(REGIONS.length);
            int b = r.nextInt(BANDS.length);
            region[i] = REGIONS[g];
            band[i] = BANDS[b];
            regionDummy[g][i] = 1;
            bandDummy[b][i] = 1;
            double eta = -2.0 + 0.01 * (age[i] - 40) + 0.05 * value[i] + 0.1 * g - 0.08 * b;
            double mean = exposure[i] * Math.exp(eta);
            claims[i] = poisson(r, mean);
        }
        Table.Builder t = Table.builder().numeric("claims", claims).numeric("exposure", exposure)
                .numeric("age", age).numeric("value", value);
        if (dummies) {
            for (int g = 1; g < REGIONS.length; g++) {
                t.numeric("region_" + REGIONS[g], regionDummy[g]);
            }
            for (int b = 1; b < BANDS.length; b++) {
                t.numeric("band_" + b, bandDummy[b]);
            }
        } else {
            t.categorical("region", java.util.List.of(REGIONS), region);
            t.categorical("band", java.util.List.of(BANDS), band);
        }
        return t.build();
    }

    private static double poisson(SplittableRandom r, double mean) {
        double l = Math.exp(-mean);
        double p = r.nextDouble();
        int k = 0;
        while (p > l) {
            p *= r.nextDouble();
            k++;
        }
        return k;
    }

    private static ModelSpec factorSpec() {
        return ModelSpec.builder("claims").family(Families.poisson()).numeric("age").numeric("value")
                .factor("region", REGIONS[0]).factor("band", BANDS[0]).logOffset("exposure").build();
    }

    private static ModelSpec dummySpec() {
        ModelSpec.Builder b = ModelSpec.builder("claims").family(Families.poisson()).numeric("age").numeric("value");
        for (int g = 1; g < REGIONS.length; g++) {
            b.numeric("region_" + REGIONS[g]);
        }
        for (int k = 1; k < BANDS.length; k++) {
            b.numeric("band_" + k);
        }
        return b.logOffset("exposure").build();
    }

    private static FitOptions cholesky(int threads) {
        return FitOptions.builder().solver(Solver.CHOLESKY).threads(threads).build();
    }

    private static long[] bits(double[] a) {
        long[] out = new long[a.length];
        for (int i = 0; i < a.length; i++) {
            out[i] = Double.doubleToRawLongBits(a[i]);
        }
        return out;
    }

    // enough rows for several fixed row blocks (the block size does not depend on threads)
    private static final int ROWS = 60_000;

    @Test
    void denseDesignCoefficientsAreBitIdenticalFor1248Threads() {
        Table data = portfolio(ROWS, 101, true);
        FittedModel one = Glm.fit(dummySpec(), data, cholesky(1));
        assertTrue(one.converged());
        for (int t : new int[] {2, 4, 8}) {
            FittedModel many = Glm.fit(dummySpec(), data, cholesky(t));
            assertArrayEquals(bits(one.coefficients()), bits(many.coefficients()), t + " threads");
            assertEquals(Double.doubleToRawLongBits(one.deviance()), Double.doubleToRawLongBits(many.deviance()));
            assertEquals(one.iterations(), many.iterations());
        }
    }

    @Test
    void factorDesignCoefficientsAreBitIdenticalFor1248Threads() {
        Table data = portfolio(ROWS, 102, false);
        FittedModel one = Glm.fit(factorSpec(), data, cholesky(1));
        assertTrue(one.converged());
        for (int t : new int[] {2, 4, 8}) {
            FittedModel many = Glm.fit(factorSpec(), data, cholesky(t));
            assertArrayEquals(bits(one.coefficients()), bits(many.coefficients()), t + " threads");
            assertArrayEquals(bits(one.fittedValues()), bits(many.fittedValues()), t + " threads");
        }
    }

    @Test
    void factorsAsLevelCodesGiveTheSameFitAsDenseDummyColumns() {
        FittedModel coded = Glm.fit(factorSpec(), portfolio(ROWS, 103, false), cholesky(2));
        FittedModel dense = Glm.fit(dummySpec(), portfolio(ROWS, 103, true), cholesky(2));
        double[] a = coded.coefficients();
        double[] b = dense.coefficients();
        assertEquals(b.length, a.length);
        for (int j = 0; j < a.length; j++) {
            assertEquals(b[j], a[j], 1e-10 * Math.max(1, Math.abs(b[j])), coded.columnNames().get(j));
        }
        assertEquals(dense.deviance(), coded.deviance(), 1e-10 * dense.deviance());
        assertEquals(coded.columnNames().get(3), "region=" + REGIONS[1]);
    }
}
