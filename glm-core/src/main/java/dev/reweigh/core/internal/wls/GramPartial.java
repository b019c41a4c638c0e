package dev.reweigh.core.internal.wls;

import java.util.Arrays;

/**
 * A mergeable partial sum of X'WX (upper triangle) and X'Wz in compact form, for one
 * {@link GramLayout}:
 * <ul>
 * <li>dense by dense: d x (d + 1), X'WX in columns 0..d-1 (upper triangle), X'Wz in column d;</li>
 * <li>per factor block f: the diagonal (weighted sums of squared multipliers, i.e. weighted
 * counts for a plain factor) and a levels x (d + 1) block of weighted sums against each dense
 * column, with X'Wz in its last column;</li>
 * <li>per pair of factor blocks f &lt; g: the levels_f x levels_g weighted cross-tabulation.</li>
 * </ul>
 * A factor block's own off-diagonal entries are zero (a row has one entry per block), so they are
 * not stored. Memory is independent of the number of rows.
 *
 * <p>One instance is a workspace: {@link #accumulate} adds rows in a single pass (the dense
 * kernel and the factor gathering run on the same sub-block of rows while it is in cache),
 * {@link #add} merges another partial, {@link #reset} clears it for reuse. Not thread-safe.
 */
public final class GramPartial {
    private final GramLayout layout;
    private final int d;
    private final int nf;
    private final double[] dense;
    private final double[][] factorDiagonal;
    private final double[][] factorByDense;
    private final double[][] factorByFactor;
    private final double[] packA;
    private final double[] packB;
    private final int[] rowCodes;
    private final double[] rowValues;

    /**
     * Creates a zero partial (allocates all its storage, once).
     *
     * @param layout the column structure
     */
    public GramPartial(GramLayout layout) {
        this.layout = layout;
        this.d = layout.denseWidth();
        this.nf = layout.factorCount();
        this.dense = new double[d * (d + 1)];
        this.factorDiagonal = new double[nf][];
        this.factorByDense = new double[nf][];
        this.factorByFactor = new double[nf * nf][];
        for (int f = 0; f < nf; f++) {
            int lf = layout.factorLevels(f);
            factorDiagonal[f] = new double[lf];
            factorByDense[f] = new double[lf * (d + 1)];
            for (int g = f + 1; g < nf; g++) {
                factorByFactor[f * nf + g] = new double[lf * layout.factorLevels(g)];
            }
        }
        int pack = DenseGramKernel.packLength(d);
        this.packA = new double[pack];
        this.packB = new double[pack];
        this.rowCodes = new int[nf];
        this.rowValues = new double[nf];
    }

    /** @return the column structure */
    public GramLayout layout() {
        return layout;
    }

    /** Sets every sum to zero. */
    public void reset() {
        Arrays.fill(dense, 0.0);
        for (int f = 0; f < nf; f++) {
            Arrays.fill(factorDiagonal[f], 0.0);
            Arrays.fill(factorByDense[f], 0.0);
            for (int g = f + 1; g < nf; g++) {
                Arrays.fill(factorByFactor[f * nf + g], 0.0);
            }
        }
    }

    /**
     * Adds another partial of the same layout into this one, entry by entry.
     *
     * @param other the partial to add (unchanged)
     * @throws IllegalArgumentException if its layout differs
     */
    public void add(GramPartial other) {
        if (other.layout != layout) {
            throw new IllegalArgumentException("cannot merge partials of different layouts: " + other.layout + " into " + layout);
        }
        addInto(dense, other.dense);
        for (int f = 0; f < nf; f++) {
            addInto(factorDiagonal[f], other.factorDiagonal[f]);
            addInto(factorByDense[f], other.factorByDense[f]);
            for (int g = f + 1; g < nf; g++) {
                addInto(factorByFactor[f * nf + g], other.factorByFactor[f * nf + g]);
            }
        }
    }

    private static void addInto(double[] to, double[] from) {
        for (int i = 0; i < to.length; i++) {
            to[i] += from[i];
        }
    }

    /**
     * Adds rows {@code from..to-1} of {@code rows}: their contributions to X'WX and X'Wz with
     * weights w and working response z (indexed like the rows).
     *
     * @param rows the rows (same layout)
     * @param w the weights
     * @param z the working response
     * @param from the first row
     * @param to one past the last row
     */
    public void accumulate(GramRows rows, double[] w, double[] z, int from, int to) {
        if (rows.layout() != layout) {
            throw new IllegalArgumentException("rows have layout " + rows.layout() + ", partial has " + layout);
        }
        if (from < 0 || to > rows.rows() || from > to || w.length < to || z.length < to) {
            throw new IllegalArgumentException("row range " + from + ".." + to + " outside " + rows.rows()
                    + " rows (weights " + w.length + ", response " + z.length + ")");
        }
        for (int s = from; s < to; s += DenseGramKernel.SUB_ROWS) {
            int e = Math.min(to, s + DenseGramKernel.SUB_ROWS);
            DenseGramKernel.accumulate(rows.dense(), d, s, e, w, z, dense, packA, packB);
            if (nf > 0) {
                accumulateFactors(rows, w, z, s, e);
            }
        }
    }

    private void accumulateFactors(GramRows rows, double[] w, double[] z, int from, int to) {
        double[] x = rows.dense();
        int width = d + 1;
        for (int i = from; i < to; i++) {
            int active = 0;
            for (int f = 0; f < nf; f++) {
                int c = rows.codes(f)[i];
                double[] m = rows.multipliers(f);
                rowCodes[f] = c;
                rowValues[f] = m == null ? 1.0 : m[i];
                if (c >= 0) {
                    active++;
                }
            }
            if (active == 0) {
                continue;
            }
            double wi = w[i];
            double zi = z[i];
            int xo = i * d;
            for (int f = 0; f < nf; f++) {
                int c = rowCodes[f];
                if (c < 0) {
                    continue;
                }
                double m = rowValues[f];
                double v = wi * m;
                factorDiagonal[f][c] = Math.fma(v, m, factorDiagonal[f][c]);
                double[] fd = factorByDense[f];
                int o = c * width;
                for (int k = 0; k < d; k++) {
                    fd[o + k] = Math.fma(v, x[xo + k], fd[o + k]);
                }
                fd[o + d] = Math.fma(v, zi, fd[o + d]);
                for (int g = f + 1; g < nf; g++) {
                    int c2 = rowCodes[g];
                    if (c2 >= 0) {
                        double[] ff = factorByFactor[f * nf + g];
                        int q = c * layout.factorLevels(g) + c2;
                        ff[q] = Math.fma(v, rowValues[g], ff[q]);
                    }
                }
            }
        }
    }

    /**
     * Writes the full X'WX (p x p row-major) and X'Wz in model-column order. Entries not covered
     * by the sums (within a factor block, off the diagonal) are zero.
     *
     * @param gram receives X'WX (length at least p * p; overwritten)
     * @param xtwz receives X'Wz (length at least p; overwritten)
     * @param bothTriangles true to fill both triangles, false to fill only entries (r, c) with r &le; c
     *        (the rest are zero)
     */
    public void writeTo(double[] gram, double[] xtwz, boolean bothTriangles) {
        int p = layout.columns();
        Arrays.fill(gram, 0, p * p, 0.0);
        Arrays.fill(xtwz, 0, p, 0.0);
        int width = d + 1;
        for (int a = 0; a < d; a++) {
            int ca = layout.denseColumn(a);
            for (int b = a; b < d; b++) {
                put(gram, p, ca, layout.denseColumn(b), dense[a * width + b]);
            }
            xtwz[ca] = dense[a * width + d];
        }
        for (int f = 0; f < nf; f++) {
            int first = layout.factorFirstColumn(f);
            int lf = layout.factorLevels(f);
            double[] fd = factorByDense[f];
            for (int l = 0; l < lf; l++) {
                int cl = first + l;
                gram[cl * p + cl] = factorDiagonal[f][l];
                for (int k = 0; k < d; k++) {
                    put(gram, p, cl, layout.denseColumn(k), fd[l * width + k]);
                }
                xtwz[cl] = fd[l * width + d];
            }
            for (int g = f + 1; g < nf; g++) {
                int firstG = layout.factorFirstColumn(g);
                int lg = layout.factorLevels(g);
                double[] ff = factorByFactor[f * nf + g];
                for (int l = 0; l < lf; l++) {
                    for (int m = 0; m < lg; m++) {
                        put(gram, p, first + l, firstG + m, ff[l * lg + m]);
                    }
                }
            }
        }
        if (bothTriangles) {
            for (int r = 0; r < p; r++) {
                for (int c = r + 1; c < p; c++) {
                    gram[c * p + r] = gram[r * p + c];
                }
            }
        }
    }

    private static void put(double[] gram, int p, int r, int c, double v) {
        if (r <= c) {
            gram[r * p + c] = v;
        } else {
            gram[c * p + r] = v;
        }
    }
}
