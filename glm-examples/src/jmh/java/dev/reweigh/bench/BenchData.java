package dev.reweigh.bench;

import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import java.util.SplittableRandom;

/** Synthetic motor-portfolio data for the benchmarks (fixed seeds). */
final class BenchData {
    private BenchData() {
    }

    /** Claim counts from a Poisson log-linear model with p - 1 numeric rating variables plus an intercept. */
    static final class Dense {
        final Table table;
        final ModelSpec spec;
        /** The same model matrix, row-major n x p with the intercept column first. */
        final double[] rowMajor;
        final double[] claims;

        Dense(Table table, ModelSpec spec, double[] rowMajor, double[] claims) {
            this.table = table;
            this.spec = spec;
            this.rowMajor = rowMajor;
            this.claims = claims;
        }
    }

    static Dense dense(int n, int p, long seed, boolean withRowMajor) {
        SplittableRandom r = new SplittableRandom(seed);
        int q = p - 1;
        double[][] cols = new double[q][n];
        double[] claims = new double[n];
        double[] beta = new double[q];
        for (int j = 0; j < q; j++) {
            beta[j] = 0.3 * (r.nextDouble() - 0.5) / Math.sqrt(q);
        }
        for (int i = 0; i < n; i++) {
            double eta = -1.0;
            for (int j = 0; j < q; j++) {
                double v = r.nextDouble() * 2 - 1;
                cols[j][i] = v;
                eta += beta[j] * v;
            }
            claims[i] = poisson(r, Math.exp(eta));
        }
        Table.Builder t = Table.builder().numeric("claims", claims);
        ModelSpec.Builder s = ModelSpec.builder("claims").family(Families.poisson());
        for (int j = 0; j < q; j++) {
            t.numeric("rating" + j, cols[j]);
            s.numeric("rating" + j);
        }
        double[] rm = null;
        if (withRowMajor) {
            rm = new double[n * p];
            for (int i = 0; i < n; i++) {
                rm[i * p] = 1.0;
                for (int j = 0; j < q; j++) {
                    rm[i * p + 1 + j] = cols[j][i];
                }
            }
        }
        return new Dense(t.build(), s.build(), rm, claims);
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

    /** Level labels "prefix0".."prefix(k-1)". */
    static String[] labels(String prefix, int k) {
        String[] out = new String[k];
        for (int i = 0; i < k; i++) {
            out[i] = prefix + i;
        }
        return out;
    }
}
