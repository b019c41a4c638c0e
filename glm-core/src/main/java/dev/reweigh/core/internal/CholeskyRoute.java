package dev.reweigh.core.internal;

import java.util.Arrays;

/**
 * The fast route: X'WX and X'Wz from the {@link CrossProductAccumulator}, scaled to unit diagonal,
 * then a Cholesky factorization in model order with a relative pivot tolerance (a pivot below
 * rankTolerance^2 marks the column aliased when the rank is decided; later it means breakdown).
 * Above {@link #LARGE_P} columns the factorization, solve and inverse are delegated to the
 * vectorised {@link dev.reweigh.core.internal.wls.NormalEquations} (same rule, no condition
 * estimate).
 */
final class CholeskyRoute implements WlsRoute {
    /** Cross products resolve remainders down to about sqrt(1e-14) = 1e-7 of a column's length. */
    static final double MIN_TOLERANCE = 1e-7;

    private final DesignMatrix x;
    private final CrossProductAccumulator accumulator;
    private final double rankTolerance;
    private final int p;
    private final double[] gram;
    private final double[] xtwz;
    /** The factor of the small-p route; null above {@link #LARGE_P}, where {@link #large} holds its own. */
    private final double[] chol;
    private final double[] scale;
    private boolean[] excluded;
    private double condition = 1.0;
    private double[] decidedW;
    private double[] decidedZ;
    /** Large p: the vectorised panel factorization of the wls package (no condition estimate). */
    private final dev.reweigh.core.internal.wls.NormalEquations large;
    /** Above this many columns the O(p^3) work goes to {@link #large}. */
    static final int LARGE_P = 64;

    CholeskyRoute(DesignMatrix x, CrossProductAccumulator accumulator, double rankTolerance) {
        this.x = x;
        this.accumulator = accumulator;
        this.rankTolerance = Math.max(rankTolerance, MIN_TOLERANCE);
        this.p = x.columns();
        this.gram = new double[p * p];
        this.xtwz = new double[p];
        this.scale = new double[p];
        this.large = p > LARGE_P ? new dev.reweigh.core.internal.wls.NormalEquations(p, this.rankTolerance) : null;
        this.chol = large == null ? new double[p * p] : null;
    }

    @Override
    public boolean[] decideExcluded(double[] w, double[] z, boolean[] candidates) {
        accumulator.accumulate(x, w, z, gram, xtwz);
        boolean[] out = new boolean[p];
        for (int j = 0; j < p; j++) {
            out[j] = !candidates[j];
        }
        factor(out, true);
        excluded = out;
        // the deciding factorization skips the aliased columns, so it is the one the first solve needs
        decidedW = w;
        decidedZ = z;
        return out.clone();
    }

    void setExcluded(boolean[] ex) {
        this.excluded = ex.clone();
    }

    /** Scales and factors the gram over the non-excluded columns; marks aliased ones if deciding. */
    private boolean factor(boolean[] ex, boolean deciding) {
        if (large != null) {
            condition = 1.0;
            return large.factor(gram, ex, deciding);
        }
        for (int j = 0; j < p; j++) {
            double g = gram[j * p + j];
            scale[j] = g > 0 ? 1.0 / Math.sqrt(g) : 0.0;
            if (g <= 0 || !(g < Double.POSITIVE_INFINITY)) {
                if (deciding) {
                    ex[j] = true;
                } else if (!ex[j]) {
                    return false;
                }
            }
        }
        double tol2 = rankTolerance * rankTolerance;
        Arrays.fill(chol, 0.0);
        double maxPivot = 0;
        double minPivot = Double.POSITIVE_INFINITY;
        for (int j = 0; j < p; j++) {
            if (ex[j]) {
                continue;
            }
            double s = gram[j * p + j] * scale[j] * scale[j];
            for (int k = 0; k < j; k++) {
                if (!ex[k]) {
                    s -= chol[j * p + k] * chol[j * p + k];
                }
            }
            if (!(s > tol2)) {
                if (deciding) {
                    ex[j] = true;
                    continue;
                }
                if (!(s > 0)) {
                    return false;
                }
            }
            double d = Math.sqrt(s);
            chol[j * p + j] = d;
            maxPivot = Math.max(maxPivot, d);
            minPivot = Math.min(minPivot, d);
            for (int i = j + 1; i < p; i++) {
                if (ex[i]) {
                    continue;
                }
                double t = gram[i * p + j] * scale[i] * scale[j];
                for (int k = 0; k < j; k++) {
                    if (!ex[k]) {
                        t -= chol[i * p + k] * chol[j * p + k];
                    }
                }
                chol[i * p + j] = t / d;
            }
        }
        double r = maxPivot / minPivot;
        condition = minPivot == Double.POSITIVE_INFINITY ? 1.0 : r * r;
        return true;
    }

    @Override
    public boolean solve(double[] w, double[] z, double[] beta) {
        boolean fresh = w == decidedW && z == decidedZ;
        decidedW = null;
        decidedZ = null;
        if (!fresh) {
            accumulator.accumulate(x, w, z, gram, xtwz);
            if (!factor(excluded, false)) {
                return false;
            }
        }
        if (large != null) {
            large.solve(xtwz, excluded, beta);
            return true;
        }
        double[] u = new double[p];
        for (int j = 0; j < p; j++) {
            if (excluded[j]) {
                continue;
            }
            double s = xtwz[j] * scale[j];
            for (int k = 0; k < j; k++) {
                if (!excluded[k]) {
                    s -= chol[j * p + k] * u[k];
                }
            }
            u[j] = s / chol[j * p + j];
        }
        for (int j = p - 1; j >= 0; j--) {
            if (excluded[j]) {
                continue;
            }
            double s = u[j];
            for (int k = j + 1; k < p; k++) {
                if (!excluded[k]) {
                    s -= chol[k * p + j] * u[k];
                }
            }
            u[j] = s / chol[j * p + j];
        }
        for (int j = 0; j < p; j++) {
            beta[j] = excluded[j] ? 0.0 : u[j] * scale[j];
        }
        return true;
    }

    @Override
    public double[][] covariance(double[] w, double[] scratch) {
        decidedW = null;
        decidedZ = null;
        // X'WX alone is needed: a zero working response (X'Wz is not used)
        Arrays.fill(scratch, 0.0);
        accumulator.accumulate(x, w, scratch, gram, xtwz);
        scratch = null; // not held while the inverse is formed
        if (!factor(excluded, false)) {
            double[][] unavailable = new double[p][p];
            for (double[] row : unavailable) {
                Arrays.fill(row, Double.NaN);
            }
            return unavailable;
        }
        if (large != null) {
            return large.inverse(excluded);
        }
        double[][] cov = new double[p][p];
        for (double[] row : cov) {
            Arrays.fill(row, Double.NaN);
        }
        // inverse of L (lower), then S^-1 = L^-T L^-1
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
                    if (!excluded[k]) {
                        s -= chol[i * p + k] * linv[k * p + j];
                    }
                }
                linv[i * p + j] = s / chol[i * p + i];
            }
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
                    if (!excluded[k]) {
                        s += linv[k * p + a] * linv[k * p + b];
                    }
                }
                double v = s * scale[a] * scale[b];
                cov[a][b] = v;
                cov[b][a] = v;
            }
        }
        return cov;
    }

    @Override
    public double conditionEstimate() {
        return Math.sqrt(condition);
    }
}
