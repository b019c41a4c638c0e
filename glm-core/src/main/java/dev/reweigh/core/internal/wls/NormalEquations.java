package dev.reweigh.core.internal.wls;

import java.util.Arrays;

/**
 * Solves the normal equations X'WX b = X'Wz from accumulated cross products, for fits that only
 * see the cross products (streaming fits), and as a fast factorization for large p (factor
 * designs with thousands of columns). The matrix is scaled to unit diagonal and factored as
 * U'U by Cholesky in model order; a pivot below tolerance^2 marks its column aliased when the
 * rank is decided, and means numerical breakdown afterwards (the same rule as the in-memory
 * Cholesky route). An excluded column is treated as removed from the matrix.
 *
 * <p>Speed: the factorization is right-looking on the row-major upper factor, so its O(p^3)
 * work is in axpy-shaped loops over contiguous row segments that HotSpot vectorises (a
 * left-looking dot-product form runs one dependent FMA after another). The inverse is formed
 * the same way. Workspaces are allocated once. Not thread-safe.
 */
public final class NormalEquations {
    /** Rows per panel of the blocked factorization (a panel of 32 rows of p = 1000 is 256 KB, in L2). */
    private static final int PANEL = 32;
    private final int p;
    private final double tolerance;
    private final double[] scale;
    private final double[] u;     // upper factor, row-major p x p (strictly lower part: scratch for the inverse)
    private final double[] work;

    /**
     * Creates a solver for p columns.
     *
     * @param p the number of model columns
     * @param rankTolerance relative pivot tolerance (on unit-diagonal scale); values below 1e-7
     *        are raised to 1e-7, the resolution of cross products
     */
    public NormalEquations(int p, double rankTolerance) {
        this.p = p;
        this.tolerance = Math.max(rankTolerance, 1e-7);
        this.scale = new double[p];
        this.u = new double[p * p];
        this.work = new double[p];
    }

    /**
     * Factors the gram over the columns not excluded.
     *
     * @param gram X'WX, p x p row-major; only the upper triangle (column &ge; row) is read
     * @param excluded columns left out; when {@code deciding}, aliased columns are added to it
     * @param deciding true to decide the rank (mark aliased columns), false to fail on a bad pivot
     * @return false if a pivot broke down while not deciding
     */
    public boolean factor(double[] gram, boolean[] excluded, boolean deciding) {
        for (int j = 0; j < p; j++) {
            double g = gram[j * p + j];
            scale[j] = g > 0 ? 1.0 / Math.sqrt(g) : 0.0;
            if (g <= 0 || !(g < Double.POSITIVE_INFINITY)) {
                if (deciding) {
                    excluded[j] = true;
                } else if (!excluded[j]) {
                    return false;
                }
            }
        }
        for (int i = 0; i < p; i++) {
            int ri = i * p;
            if (excluded[i]) {
                Arrays.fill(u, ri, ri + p, 0.0);
                continue;
            }
            double si = scale[i];
            for (int k = i; k < p; k++) {
                u[ri + k] = excluded[k] ? 0.0 : gram[ri + k] * si * scale[k];
            }
        }
        double tol2 = tolerance * tolerance;
        // Blocked by panels of PANEL rows: within a panel, each row is finished and applied to the
        // rest of the panel; then the panel is applied to every later row while that row sits in
        // L1. Every entry still receives its updates in increasing row order, so the result is
        // the same as the unblocked loop, bit for bit; only the memory traffic differs.
        for (int jb = 0; jb < p; jb += PANEL) {
            int je = Math.min(p, jb + PANEL);
            for (int j = jb; j < je; j++) {
                if (!finishRow(j, excluded, deciding, tol2)) {
                    return false;
                }
                int rj = j * p;
                for (int i = j + 1; i < je; i++) {
                    double f = u[rj + i];
                    if (f != 0.0 && !excluded[i]) {
                        axpy(-f, rj, i * p, i);
                    }
                }
            }
            for (int i = je; i < p; i++) {
                if (excluded[i]) {
                    continue;
                }
                int ri = i * p;
                for (int j = jb; j < je; j++) {
                    double f = u[j * p + i];
                    if (f != 0.0) {
                        axpy(-f, j * p, ri, i);
                    }
                }
            }
        }
        // columns excluded on the way still carry numbers from the rows above them: clear them
        for (int k = 0; k < p; k++) {
            if (excluded[k]) {
                for (int i = 0; i < k; i++) {
                    u[i * p + k] = 0.0;
                }
            }
        }
        return true;
    }

    /** Takes the pivot of row j (already updated by all rows above it) and scales the row. */
    private boolean finishRow(int j, boolean[] excluded, boolean deciding, double tol2) {
        if (excluded[j]) {
            return true;
        }
        int rj = j * p;
        double s = u[rj + j];
        if (!(s > tol2)) {
            if (deciding) {
                excluded[j] = true;
                Arrays.fill(u, rj, rj + p, 0.0);
                return true;
            }
            if (!(s > 0)) {
                return false;
            }
        }
        double d = Math.sqrt(s);
        u[rj + j] = d;
        double inv = 1.0 / d;
        for (int k = j + 1; k < p; k++) {
            u[rj + k] *= inv;
        }
        return true;
    }

    /** u[to + k] += a * u[from + k] for k = first..p-1. */
    private void axpy(double a, int from, int to, int first) {
        for (int k = first; k < p; k++) {
            u[to + k] = Math.fma(a, u[from + k], u[to + k]);
        }
    }

    /**
     * Solves with the last factorization; excluded coefficients are set to 0.
     *
     * @param xtwz X'Wz
     * @param excluded the excluded columns used when factoring
     * @param beta receives the solution
     */
    public void solve(double[] xtwz, boolean[] excluded, double[] beta) {
        double[] c = work;
        for (int j = 0; j < p; j++) {
            c[j] = excluded[j] ? 0.0 : xtwz[j] * scale[j];
        }
        // U' y = c, column-oriented so that row j of U is read contiguously
        for (int j = 0; j < p; j++) {
            if (excluded[j]) {
                continue;
            }
            int rj = j * p;
            double y = c[j] / u[rj + j];
            c[j] = y;
            for (int k = j + 1; k < p; k++) {
                c[k] = Math.fma(-u[rj + k], y, c[k]);
            }
        }
        // U b = y
        for (int j = p - 1; j >= 0; j--) {
            if (excluded[j]) {
                beta[j] = 0.0;
                continue;
            }
            int rj = j * p;
            double s = c[j];
            for (int k = j + 1; k < p; k++) {
                s = Math.fma(-u[rj + k], c[k], s);
            }
            c[j] = s / u[rj + j];
        }
        for (int j = 0; j < p; j++) {
            beta[j] = excluded[j] ? 0.0 : c[j] * scale[j];
        }
    }

    /**
     * The inverse of X'WX over the kept columns, from the last factorization; NaN rows and
     * columns for excluded ones.
     *
     * @param excluded the excluded columns used when factoring
     * @return p x p
     */
    public double[][] inverse(boolean[] excluded) {
        // V = U^-1 (upper), row by row from the bottom: V[j][.] = (e_j - sum_m>j U[j][m] V[m][.]) / U[j][j]
        double[] v = new double[p * p];
        for (int j = p - 1; j >= 0; j--) {
            if (excluded[j]) {
                continue;
            }
            int rj = j * p;
            double inv = 1.0 / u[rj + j];
            for (int m = j + 1; m < p; m++) {
                double f = u[rj + m];
                if (f == 0.0 || excluded[m]) {
                    continue;
                }
                int rm = m * p;
                for (int k = m; k < p; k++) {
                    v[rj + k] = Math.fma(-f, v[rm + k], v[rj + k]);
                }
            }
            for (int k = j + 1; k < p; k++) {
                v[rj + k] *= inv;
            }
            v[rj + j] = inv;
        }
        // (U'U)^-1 = V V': row a is the sum over k >= a of V[a][k] times column k of V. Column k of V
        // is stored as row k of its transpose in the strictly lower triangle of u (unused by the
        // factor), so that the inner loop is an axpy over contiguous memory without another p x p
        // array; the diagonal V[k][k] is taken from V itself.
        for (int k = 0; k < p; k++) {
            int rk = k * p;
            for (int m = 0; m < k; m++) {
                u[rk + m] = v[m * p + k];
            }
        }
        double[][] cov = new double[p][];
        for (int a = 0; a < p; a++) {
            double[] row = new double[p];
            cov[a] = row;
            if (excluded[a]) {
                continue;
            }
            int ra = a * p;
            for (int k = a; k < p; k++) {
                double f = v[ra + k];
                if (f == 0.0) {
                    continue;
                }
                int rk = k * p;
                for (int m = 0; m < k; m++) {
                    row[m] = Math.fma(f, u[rk + m], row[m]);
                }
                row[k] = Math.fma(f, v[rk + k], row[k]);
            }
        }
        // scale, mirror the upper triangle in place, and mark excluded columns
        for (int a = 0; a < p; a++) {
            for (int b = a; b < p; b++) {
                double val = excluded[a] || excluded[b] ? Double.NaN : cov[a][b] * scale[a] * scale[b];
                cov[a][b] = val;
                cov[b][a] = val;
            }
        }
        return cov;
    }
}
