package dev.reweigh.core.internal.wls;

import java.util.Random;

/** A random design in compact form plus helpers to expand it, for the tests of this package. */
final class RandomDesign {
    final GramLayout layout;
    final int n;
    final double[] dense;
    final int[][] codes;
    final double[][] multipliers;
    final double[] w;
    final double[] z;

    private RandomDesign(GramLayout layout, int n, double[] dense, int[][] codes, double[][] multipliers,
            double[] w, double[] z) {
        this.layout = layout;
        this.n = n;
        this.dense = dense;
        this.codes = codes;
        this.multipliers = multipliers;
        this.w = w;
        this.z = z;
    }

    /**
     * A design whose model columns interleave the dense block and the factor blocks (dense columns
     * are scattered among the factor blocks, in shuffled order), so the mapping back to model
     * order is exercised.
     */
    static RandomDesign generate(long seed, int n, int d, int[] levels, boolean withMultipliers) {
        Random r = new Random(seed);
        int nf = levels.length;
        int p = d;
        for (int l : levels) {
            p += l;
        }
        // order of parts: each dense column and each factor block is a "part"; shuffle them
        int parts = d + nf;
        int[] order = new int[parts];
        for (int i = 0; i < parts; i++) {
            order[i] = i;
        }
        for (int i = parts - 1; i > 0; i--) {
            int j = r.nextInt(i + 1);
            int t = order[i];
            order[i] = order[j];
            order[j] = t;
        }
        int[] denseColumns = new int[d];
        int[] first = new int[nf];
        int col = 0;
        for (int part : order) {
            if (part < d) {
                denseColumns[part] = col++;
            } else {
                first[part - d] = col;
                col += levels[part - d];
            }
        }
        GramLayout layout = GramLayout.of(p, denseColumns, levels, first);
        double[] dense = new double[n * d];
        for (int i = 0; i < dense.length; i++) {
            dense[i] = r.nextInt(10) == 0 ? 1.0 : r.nextGaussian() * Math.exp(r.nextGaussian());
        }
        int[][] codes = new int[nf][n];
        double[][] mult = new double[nf][];
        for (int f = 0; f < nf; f++) {
            for (int i = 0; i < n; i++) {
                codes[f][i] = r.nextInt(levels[f] + 1) - 1;
            }
            if (withMultipliers && r.nextBoolean()) {
                mult[f] = new double[n];
                for (int i = 0; i < n; i++) {
                    mult[f][i] = r.nextGaussian();
                }
            }
        }
        double[] w = new double[n];
        double[] z = new double[n];
        for (int i = 0; i < n; i++) {
            w[i] = r.nextInt(20) == 0 ? 0.0 : r.nextDouble() * 3;
            z[i] = r.nextGaussian() * 2;
        }
        return new RandomDesign(layout, n, dense, codes, mult, w, z);
    }

    GramRows rows() {
        return GramRows.of(layout, n, dense, codes, multipliers);
    }

    /** X expanded to n x p, row-major, in model-column order. */
    double[] expanded() {
        int p = layout.columns();
        int d = layout.denseWidth();
        double[] x = new double[n * p];
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < d; k++) {
                x[i * p + layout.denseColumn(k)] = dense[i * d + k];
            }
            for (int f = 0; f < layout.factorCount(); f++) {
                int c = codes[f][i];
                if (c >= 0) {
                    x[i * p + layout.factorFirstColumn(f) + c] = multipliers[f] == null ? 1.0 : multipliers[f][i];
                }
            }
        }
        return x;
    }

    /** The same model with every column dense (dummy expansion), same model-column order. */
    RandomDesign denseExpansion() {
        int p = layout.columns();
        return new RandomDesign(GramLayout.dense(p), n, expanded(), new int[0][], new double[0][], w, z);
    }

    /** Result of a naive row-by-row sum: full X'WX, X'Wz and the sums of absolute terms. */
    static final class Naive {
        final double[] gram;
        final double[] xtwz;
        final double[] gramAbs;
        final double[] xtwzAbs;

        Naive(double[] gram, double[] xtwz, double[] gramAbs, double[] xtwzAbs) {
            this.gram = gram;
            this.xtwz = xtwz;
            this.gramAbs = gramAbs;
            this.xtwzAbs = xtwzAbs;
        }
    }

    Naive naive() {
        int p = layout.columns();
        double[] x = expanded();
        double[] g = new double[p * p];
        double[] ga = new double[p * p];
        double[] v = new double[p];
        double[] va = new double[p];
        for (int i = 0; i < n; i++) {
            for (int a = 0; a < p; a++) {
                double xa = x[i * p + a];
                v[a] += w[i] * xa * z[i];
                va[a] += Math.abs(w[i] * xa * z[i]);
                for (int b = 0; b < p; b++) {
                    double t = w[i] * xa * x[i * p + b];
                    g[a * p + b] += t;
                    ga[a * p + b] += Math.abs(t);
                }
            }
        }
        return new Naive(g, v, ga, va);
    }
}
