package dev.reweigh.core.internal.wls;

import java.util.Arrays;

/**
 * Solves the normal equations X'WX b = X'Wz from accumulated cross products, for fits that only
 * see the cross products (streaming fits). The matrix is scaled to unit diagonal and factored by
 * Cholesky in model order; a pivot below tolerance^2 marks its column aliased when the rank is
 * decided, and means numerical breakdown afterwards. The same rule as the in-memory Cholesky
 * route, so both decide rank alike. Workspaces are allocated once. Not thread-safe.
 */
public final class NormalEquations {
    private final int p;
    private final double tolerance;
    private final double[] scale;
    private final double[] chol;
    private final double[] u;

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
        this.chol = new double[p * p];
        this.u = new double[p];
    }

    /**
     * Factors the gram over the columns not excluded.
     *
     * @param gram X'WX, p x p row-major, both triangles
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
        double tol2 = tolerance * tolerance;
        Arrays.fill(chol, 0.0);
        for (int j = 0; j < p; j++) {
            if (excluded[j]) {
                continue;
            }
            int rj = j * p;
            double s = gram[rj + j] * scale[j] * scale[j];
            for (int k = 0; k < j; k++) {
                s -= chol[rj + k] * chol[rj + k];
            }
            if (!(s > tol2)) {
                if (deciding) {
                    excluded[j] = true;
                    continue;
                }
                if (!(s > 0)) {
                    return false;
                }
            }
            double d = Math.sqrt(s);
            chol[rj + j] = d;
            for (int i = j + 1; i < p; i++) {
                if (excluded[i]) {
                    continue;
                }
                int ri = i * p;
                double t = gram[ri + j] * scale[i] * scale[j];
                for (int k = 0; k < j; k++) {
                    t -= chol[ri + k] * chol[rj + k];
                }
                chol[ri + j] = t / d;
            }
        }
        return true;
    }

    /**
     * Solves with the last factorization; excluded coefficients are set to 0.
     *
     * @param xtwz X'Wz
     * @param excluded the excluded columns used when factoring
     * @param beta receives the solution
     */
    public void solve(double[] xtwz, boolean[] excluded, double[] beta) {
        for (int j = 0; j < p; j++) {
            if (excluded[j]) {
                u[j] = 0;
                continue;
            }
            double s = xtwz[j] * scale[j];
            for (int k = 0; k < j; k++) {
                s -= chol[j * p + k] * u[k];
            }
            u[j] = s / chol[j * p + j];
        }
        for (int j = p - 1; j >= 0; j--) {
            if (excluded[j]) {
                continue;
            }
            double s = u[j];
            for (int k = j + 1; k < p; k++) {
                s -= chol[k * p + j] * u[k];
            }
            u[j] = s / chol[j * p + j];
        }
        for (int j = 0; j < p; j++) {
            beta[j] = excluded[j] ? 0.0 : u[j] * scale[j];
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
        double[] linv = new double[p * p];
        for (int j = 0; j < p; j++) {
            if (excluded[j]) {
                continue;
            }
            linv[j * p + j] = 1.0 / chol[j * p + j];
            for (int i = j + 1; i < p; i++) {
                if (excluded[i]) {
                    continue;
                }
                double s = 0;
                for (int k = j; k < i; k++) {
                    s -= chol[i * p + k] * linv[k * p + j];
                }
                linv[i * p + j] = s / chol[i * p + i];
            }
        }
        double[][] cov = new double[p][p];
        for (int a = 0; a < p; a++) {
            Arrays.fill(cov[a], Double.NaN);
        }
        for (int a = 0; a < p; a++) {
            if (excluded[a]) {
                continue;
            }
            for (int b = a; b < p; b++) {
                if (excluded[b]) {
                    continue;
                }
                double s = 0;
                for (int k = b; k < p; k++) {
                    s += linv[k * p + a] * linv[k * p + b];
                }
                double v = s * scale[a] * scale[b];
                cov[a][b] = v;
                cov[b][a] = v;
            }
        }
        return cov;
    }
}
