package dev.reweigh.core.internal.wls;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;

/**
 * The accumulated X'WX and X'Wz against independent computations: a naive row-by-row sum over the
 * expanded model matrix, and EJML's multTransA on sqrt(W) X.
 */
class GramAccumulationTest {

    private static void assertClose(RandomDesign.Naive ref, double[] gram, double[] xtwz, int p, String what) {
        // error bound of a recursive sum of m terms is ~ m * eps * sum|terms|; ours sums in blocks
        // of at most a few hundred rows, far inside 1e-12 relative to sum|terms|
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                double tol = 1e-12 * ref.gramAbs[a * p + b] + 1e-300;
                assertEquals(ref.gram[a * p + b], gram[a * p + b], tol, what + " X'WX(" + a + "," + b + ")");
            }
            assertEquals(ref.xtwz[a], xtwz[a], 1e-12 * ref.xtwzAbs[a] + 1e-300, what + " X'Wz(" + a + ")");
        }
    }

    @Property(tries = 200)
    void denseAndFactorSumsMatchNaiveSum(@ForAll long seed, @ForAll @IntRange(min = 0, max = 700) int n,
            @ForAll @IntRange(min = 0, max = 13) int d, @ForAll @IntRange(min = 0, max = 3) int factors,
            @ForAll @IntRange(min = 1, max = 6) int maxLevels, @ForAll boolean multipliers,
            @ForAll @IntRange(min = 1, max = 300) int blockRows, @ForAll @IntRange(min = 1, max = 4) int threads) {
        int[] levels = new int[factors];
        for (int f = 0; f < factors; f++) {
            levels[f] = 1 + (int) Math.floorMod(seed >>> (8 * f), (long) maxLevels);
        }
        if (d + factors == 0) {
            d = 1;
        }
        RandomDesign design = RandomDesign.generate(seed, n, d, levels, multipliers);
        int p = design.layout.columns();
        GramPartial total = new GramPartial(design.layout);
        new BlockedGramAccumulator(design.layout, blockRows, threads, null)
                .accumulate(design.rows(), design.w, design.z, total);
        double[] gram = new double[p * p];
        double[] xtwz = new double[p];
        total.writeTo(gram, xtwz, true);
        assertClose(design.naive(), gram, xtwz, p, design.layout.toString());
    }

    @Property(tries = 100)
    void denseSumMatchesEjmlOnScaledRows(@ForAll long seed, @ForAll @IntRange(min = 1, max = 2000) int n,
            @ForAll @IntRange(min = 1, max = 40) int d) {
        RandomDesign design = RandomDesign.generate(seed, n, d, new int[0], false);
        // sqrt(W) X and sqrt(W) z, then (sqrt(W)X)'(sqrt(W)X) and (sqrt(W)X)'(sqrt(W)z) by EJML
        DMatrixRMaj sx = new DMatrixRMaj(n, d);
        DMatrixRMaj sz = new DMatrixRMaj(n, 1);
        double[] abs = new double[d * d];
        for (int i = 0; i < n; i++) {
            double s = Math.sqrt(design.w[i]);
            for (int k = 0; k < d; k++) {
                sx.data[i * d + k] = s * design.dense[i * d + k];
            }
            sz.data[i] = s * design.z[i];
            for (int a = 0; a < d; a++) {
                for (int b = 0; b < d; b++) {
                    abs[a * d + b] += Math.abs(design.w[i] * design.dense[i * d + a] * design.dense[i * d + b]);
                }
            }
        }
        DMatrixRMaj ejmlGram = new DMatrixRMaj(d, d);
        DMatrixRMaj ejmlXtz = new DMatrixRMaj(d, 1);
        CommonOps_DDRM.multTransA(sx, sx, ejmlGram);
        CommonOps_DDRM.multTransA(sx, sz, ejmlXtz);

        GramPartial total = new GramPartial(design.layout);
        BlockedGramAccumulator.of(design.layout, 1, null).accumulate(design.rows(), design.w, design.z, total);
        double[] gram = new double[d * d];
        double[] xtwz = new double[d];
        total.writeTo(gram, xtwz, true);
        for (int a = 0; a < d; a++) {
            for (int b = 0; b < d; b++) {
                // dense column a is model column denseColumn(a) (the generator shuffles them)
                int ma = design.layout.denseColumn(a);
                int mb = design.layout.denseColumn(b);
                assertEquals(ejmlGram.get(a, b), gram[ma * d + mb], 1e-12 * abs[a * d + b] + 1e-300);
            }
        }
        double scale = 0;
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < d; k++) {
                scale = Math.max(scale, Math.abs(design.w[i] * design.dense[i * d + k] * design.z[i]));
            }
        }
        for (int a = 0; a < d; a++) {
            assertEquals(ejmlXtz.get(a, 0), xtwz[design.layout.denseColumn(a)], 1e-12 * n * scale + 1e-300);
        }
    }

    @Test
    void upperTriangleOnlyLeavesLowerTriangleZero() {
        RandomDesign design = RandomDesign.generate(7, 300, 6, new int[] {4, 3}, true);
        int p = design.layout.columns();
        GramPartial total = new GramPartial(design.layout);
        total.accumulate(design.rows(), design.w, design.z, 0, design.n);
        double[] upper = new double[p * p];
        double[] full = new double[p * p];
        total.writeTo(upper, new double[p], false);
        total.writeTo(full, new double[p], true);
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                if (b >= a) {
                    assertEquals(full[a * p + b], upper[a * p + b], 0.0);
                    assertEquals(full[a * p + b], full[b * p + a], 0.0);
                } else {
                    assertEquals(0.0, upper[a * p + b], 0.0);
                }
            }
        }
    }

    @Test
    void layoutRejectsOverlapsAndGaps() {
        assertThrows(IllegalArgumentException.class, () -> GramLayout.of(3, new int[] {0, 1}, new int[] {2}, new int[] {1}));
        assertThrows(IllegalArgumentException.class, () -> GramLayout.of(4, new int[] {0}, new int[] {2}, new int[] {1}));
        assertThrows(IllegalArgumentException.class, () -> GramLayout.of(2, new int[] {0, 2}, new int[0], new int[0]));
        GramLayout ok = GramLayout.of(4, new int[] {3}, new int[] {3}, new int[] {0});
        assertEquals(4, ok.columns());
        assertTrue(ok.defaultBlockRows() % 1024 == 0);
    }

    @Test
    void mergingPartialsOfDifferentLayoutsIsRejected() {
        GramPartial a = new GramPartial(GramLayout.dense(2));
        GramPartial b = new GramPartial(GramLayout.dense(2));
        assertThrows(IllegalArgumentException.class, () -> a.add(b));
    }
}
