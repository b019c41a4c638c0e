package dev.reweigh.core.internal.wls;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;

/** The normal-equation solver against EJML's general solve and inverse, and its rank decisions. */
class NormalEquationsTest {

    /** X'WX and X'Wz of a random design with the given columns made copies of others. */
    private static double[][] system(long seed, int n, int p, int[] copies) {
        Random r = new Random(seed);
        double[] x = new double[n * p];
        for (int i = 0; i < x.length; i++) {
            x[i] = r.nextGaussian() * (1 + (i % p));
        }
        for (int c = 0; c + 1 < copies.length; c += 2) {
            for (int i = 0; i < n; i++) {
                x[i * p + copies[c + 1]] = 2.5 * x[i * p + copies[c]];
            }
        }
        double[] w = new double[n];
        double[] z = new double[n];
        for (int i = 0; i < n; i++) {
            w[i] = 0.1 + r.nextDouble();
            z[i] = r.nextGaussian();
        }
        GramLayout layout = GramLayout.dense(p);
        GramPartial total = new GramPartial(layout);
        total.accumulate(GramRows.of(layout, n, x, new int[0][], new double[0][]), w, z, 0, n);
        double[] gram = new double[p * p];
        double[] xtwz = new double[p];
        total.writeTo(gram, xtwz, true);
        return new double[][] {gram, xtwz};
    }

    @Property(tries = 60)
    void solutionAndInverseMatchEjml(@ForAll long seed, @ForAll @IntRange(min = 1, max = 60) int p) {
        double[][] s = system(seed, 3 * p + 20, p, new int[0]);
        NormalEquations ne = new NormalEquations(p, 1e-9);
        boolean[] excluded = new boolean[p];
        assertTrue(ne.factor(s[0], excluded, true));
        for (boolean e : excluded) {
            assertFalse(e);
        }
        double[] beta = new double[p];
        ne.solve(s[1], excluded, beta);
        DMatrixRMaj a = DMatrixRMaj.wrap(p, p, s[0].clone());
        DMatrixRMaj b = DMatrixRMaj.wrap(p, 1, s[1].clone());
        DMatrixRMaj ref = new DMatrixRMaj(p, 1);
        assertTrue(CommonOps_DDRM.solve(a, b, ref));
        DMatrixRMaj inv = new DMatrixRMaj(p, p);
        assertTrue(CommonOps_DDRM.invert(DMatrixRMaj.wrap(p, p, s[0].clone()), inv));
        double[][] cov = ne.inverse(excluded);
        for (int j = 0; j < p; j++) {
            assertEquals(ref.get(j, 0), beta[j], 1e-8 * (Math.abs(ref.get(j, 0)) + 1e-3 / Math.sqrt(s[0][j * p + j])));
            for (int k = 0; k < p; k++) {
                double scaleJk = 1.0 / Math.sqrt(s[0][j * p + j] * s[0][k * p + k]);
                assertEquals(inv.get(j, k), cov[j][k], 1e-9 * scaleJk + 1e-9 * Math.abs(inv.get(j, k)));
            }
        }
    }

    @Test
    void copiedColumnsAreExcludedAndTheRestSolved() {
        int p = 12;
        double[][] s = system(5, 200, p, new int[] {2, 7, 4, 10});
        NormalEquations ne = new NormalEquations(p, 1e-7);
        boolean[] excluded = new boolean[p];
        assertTrue(ne.factor(s[0], excluded, true));
        boolean[] expected = new boolean[p];
        expected[7] = true;
        expected[10] = true;
        assertArrayEquals(expected, excluded);
        double[] beta = new double[p];
        ne.solve(s[1], excluded, beta);
        assertEquals(0.0, beta[7], 0.0);
        double[][] cov = ne.inverse(excluded);
        assertTrue(Double.isNaN(cov[7][7]) && Double.isNaN(cov[3][10]));
        // the kept columns solve the reduced system exactly
        int q = p - 2;
        int[] keep = new int[q];
        for (int j = 0, m = 0; j < p; j++) {
            if (!excluded[j]) {
                keep[m++] = j;
            }
        }
        DMatrixRMaj a = new DMatrixRMaj(q, q);
        DMatrixRMaj b = new DMatrixRMaj(q, 1);
        for (int i = 0; i < q; i++) {
            b.set(i, 0, s[1][keep[i]]);
            for (int k = 0; k < q; k++) {
                a.set(i, k, s[0][keep[i] * p + keep[k]]);
            }
        }
        DMatrixRMaj ref = new DMatrixRMaj(q, 1);
        assertTrue(CommonOps_DDRM.solve(a, b, ref));
        for (int i = 0; i < q; i++) {
            assertEquals(ref.get(i, 0), beta[keep[i]], 1e-8 * (1 + Math.abs(ref.get(i, 0))));
        }
        // not deciding: an indefinite matrix is reported as breakdown
        double[] bad = {1, 2, 2, 1};
        assertFalse(new NormalEquations(2, 1e-7).factor(bad, new boolean[2], false));
    }
}
