package dev.reweigh.core.internal.wls;

/**
 * The dense kernel: adds the upper triangle of X'WX and the vector X'Wz of a row range of a
 * row-major block to {@code out}, where {@code out} is d x (d + 1) row-major with X'WX in columns
 * 0..d-1 (entries with column &ge; row) and X'Wz in column d.
 *
 * <p>How it is fast on HotSpot: the obvious axpy form (for each row, add w x_j x to row j of the
 * output) runs inner loops of length d - j, far too short for C2's vectorised main loop at
 * typical GLM widths, and dot products are not vectorised at all. So the kernel works like a
 * small GEMM instead. Rows are taken {@value #SUB_ROWS} at a time and packed into panels of four
 * columns (weighted on one side, with z appended as an extra column on the other), and each 4 x 4
 * output tile is summed over the packed rows in sixteen scalar registers with explicit FMAs:
 * eight loads feed sixteen FMAs, which keeps both FMA pipes busy from L1. The packed panels of
 * {@value #SUB_ROWS} rows stay in L1/L2 while every tile visits them.
 *
 * <p>Determinism: every output entry is a fixed sequence of FMAs in row order within each
 * sub-block of {@value #SUB_ROWS} rows (counted from {@code from}), then one addition per
 * sub-block; nothing depends on timing or threads.
 */
final class DenseGramKernel {
    /** Rows packed and swept together. */
    static final int SUB_ROWS = 256;

    private DenseGramKernel() {
    }

    /**
     * Size of each of the two packing buffers needed for width d.
     *
     * @param d the dense width
     * @return the buffer length
     */
    static int packLength(int d) {
        return SUB_ROWS * 4 * ((d + 4) / 4);
    }

    /**
     * Adds the contribution of rows {@code from..to-1}.
     *
     * @param x the dense block, row-major n x d
     * @param d the width
     * @param from the first row
     * @param to one past the last row
     * @param w the weights
     * @param z the working response
     * @param out d x (d + 1) row-major accumulator (see the class comment)
     * @param packA scratch of {@link #packLength(int)}
     * @param packB scratch of {@link #packLength(int)}
     */
    static void accumulate(double[] x, int d, int from, int to, double[] w, double[] z, double[] out,
            double[] packA, double[] packB) {
        if (d == 0) {
            return;
        }
        for (int s = from; s < to; s += SUB_ROWS) {
            int rows = Math.min(SUB_ROWS, to - s);
            pack(x, d, s, rows, w, z, packA, packB);
            sweep(d, rows, out, packA, packB);
        }
    }

    private static void pack(double[] x, int d, int s, int rows, double[] w, double[] z, double[] packA,
            double[] packB) {
        int stride = rows * 4;
        int na = (d + 3) >> 2;
        int nb = (d + 4) >> 2;
        for (int r = 0; r < rows; r++) {
            int i = s + r;
            double wi = w[i];
            int o = i * d;
            int q = r * 4;
            int c = 0;
            for (; c + 4 <= d; c += 4, q += stride) {
                double v0 = x[o + c];
                double v1 = x[o + c + 1];
                double v2 = x[o + c + 2];
                double v3 = x[o + c + 3];
                packB[q] = v0;
                packB[q + 1] = v1;
                packB[q + 2] = v2;
                packB[q + 3] = v3;
                packA[q] = wi * v0;
                packA[q + 1] = wi * v1;
                packA[q + 2] = wi * v2;
                packA[q + 3] = wi * v3;
            }
            // the last, partly filled panel(s): remaining x columns, then z, then zeros
            for (int t = 0; c + t < nb * 4; t++) {
                int col = c + t;
                int qq = q + (t >> 2) * stride + (t & 3);
                double v = col < d ? x[o + col] : col == d ? z[i] : 0.0;
                packB[qq] = v;
                if (col < na * 4) {
                    packA[qq] = col < d ? wi * v : 0.0;
                }
            }
        }
    }

    private static void sweep(int d, int rows, double[] out, double[] packA, double[] packB) {
        int stride = rows * 4;
        int na = (d + 3) >> 2;
        int nb = (d + 4) >> 2;
        int width = d + 1;
        for (int jp = 0; jp < na; jp++) {
            int ja = jp * stride;
            for (int kp = jp; kp < nb; kp++) {
                int kb = kp * stride;
                double c00 = 0, c01 = 0, c02 = 0, c03 = 0;
                double c10 = 0, c11 = 0, c12 = 0, c13 = 0;
                double c20 = 0, c21 = 0, c22 = 0, c23 = 0;
                double c30 = 0, c31 = 0, c32 = 0, c33 = 0;
                for (int r = 0; r < stride; r += 4) {
                    int qa = ja + r;
                    int qb = kb + r;
                    double a0 = packA[qa];
                    double a1 = packA[qa + 1];
                    double a2 = packA[qa + 2];
                    double a3 = packA[qa + 3];
                    double b0 = packB[qb];
                    double b1 = packB[qb + 1];
                    double b2 = packB[qb + 2];
                    double b3 = packB[qb + 3];
                    c00 = Math.fma(a0, b0, c00);
                    c01 = Math.fma(a0, b1, c01);
                    c02 = Math.fma(a0, b2, c02);
                    c03 = Math.fma(a0, b3, c03);
                    c10 = Math.fma(a1, b0, c10);
                    c11 = Math.fma(a1, b1, c11);
                    c12 = Math.fma(a1, b2, c12);
                    c13 = Math.fma(a1, b3, c13);
                    c20 = Math.fma(a2, b0, c20);
                    c21 = Math.fma(a2, b1, c21);
                    c22 = Math.fma(a2, b2, c22);
                    c23 = Math.fma(a2, b3, c23);
                    c30 = Math.fma(a3, b0, c30);
                    c31 = Math.fma(a3, b1, c31);
                    c32 = Math.fma(a3, b2, c32);
                    c33 = Math.fma(a3, b3, c33);
                }
                int j0 = jp * 4;
                int k0 = kp * 4;
                if (kp > jp && j0 + 4 <= d && k0 + 4 <= width) {
                    int o = j0 * width + k0;
                    out[o] += c00;
                    out[o + 1] += c01;
                    out[o + 2] += c02;
                    out[o + 3] += c03;
                    o += width;
                    out[o] += c10;
                    out[o + 1] += c11;
                    out[o + 2] += c12;
                    out[o + 3] += c13;
                    o += width;
                    out[o] += c20;
                    out[o + 1] += c21;
                    out[o + 2] += c22;
                    out[o + 3] += c23;
                    o += width;
                    out[o] += c30;
                    out[o + 1] += c31;
                    out[o + 2] += c32;
                    out[o + 3] += c33;
                } else {
                    store(out, d, j0, k0, c00, c01, c02, c03);
                    store(out, d, j0 + 1, k0, c10, c11, c12, c13);
                    store(out, d, j0 + 2, k0, c20, c21, c22, c23);
                    store(out, d, j0 + 3, k0, c30, c31, c32, c33);
                }
            }
        }
    }

    /** Adds one tile row, keeping only entries inside the upper triangle of the d x (d + 1) output. */
    private static void store(double[] out, int d, int j, int k0, double v0, double v1, double v2, double v3) {
        if (j >= d) {
            return;
        }
        int width = d + 1;
        int o = j * width;
        if (k0 >= j && k0 <= d) {
            out[o + k0] += v0;
        }
        if (k0 + 1 >= j && k0 + 1 <= d) {
            out[o + k0 + 1] += v1;
        }
        if (k0 + 2 >= j && k0 + 2 <= d) {
            out[o + k0 + 2] += v2;
        }
        if (k0 + 3 >= j && k0 + 3 <= d) {
            out[o + k0 + 3] += v3;
        }
    }
}
