package dev.reweigh.core.internal;

import java.util.Arrays;
import java.util.List;

/**
 * Chooses the {@link CrossProductAccumulator} for a fit, and holds the simple single-threaded
 * one: each row is gathered as a sparse list (dense entries plus one entry per factor block) and
 * its weighted outer product is added to the upper triangle, in row order.
 */
public final class CrossProducts {
    private CrossProducts() {
    }

    /**
     * Returns the accumulator for the given thread count. Results must not depend on it.
     *
     * @param threads the number of threads the caller allows
     * @return an accumulator
     */
    public static CrossProductAccumulator accumulator(int threads) {
        // blocked, level-coded, bit-identical for any thread count (package internal.wls)
        return new dev.reweigh.core.internal.wls.DesignGramAccumulator(threads, null);
    }

    static void accumulateSimple(DesignMatrix x, double[] w, double[] z, double[] gram, double[] xtwz) {
        int p = x.columns();
        int n = x.rows();
        int d = x.denseWidth();
        double[] dense = x.dense();
        int[] dcol = x.denseColumns();
        List<DesignMatrix.FactorBlock> factors = x.factors();
        Arrays.fill(gram, 0, p * p, 0.0);
        Arrays.fill(xtwz, 0, p, 0.0);
        int[] idx = new int[d + factors.size()];
        double[] val = new double[idx.length];
        for (int i = 0; i < n; i++) {
            double wi = w[i];
            if (wi == 0.0) {
                continue;
            }
            int m = 0;
            for (int k = 0; k < d; k++) {
                idx[m] = dcol[k];
                val[m++] = dense[i * d + k];
            }
            for (DesignMatrix.FactorBlock f : factors) {
                int c = f.codes()[i];
                if (c >= 0) {
                    idx[m] = f.firstColumn() + c;
                    val[m++] = f.multipliers() == null ? 1.0 : f.multipliers()[i];
                }
            }
            double wz = wi * z[i];
            for (int a = 0; a < m; a++) {
                double wa = wi * val[a];
                int ia = idx[a];
                xtwz[ia] += val[a] * wz;
                for (int b = 0; b < m; b++) {
                    int ib = idx[b];
                    if (ib >= ia) {
                        gram[ia * p + ib] += wa * val[b];
                    }
                }
            }
        }
        for (int a = 0; a < p; a++) {
            for (int b = a + 1; b < p; b++) {
                gram[b * p + a] = gram[a * p + b];
            }
        }
    }
}
