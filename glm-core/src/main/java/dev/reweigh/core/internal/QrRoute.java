package dev.reweigh.core.internal;

import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.decomposition.qr.QRColPivDecompositionHouseholderColumn_DDRM;
import org.ejml.dense.row.linsol.qr.LinearSolverQrpHouseCol_DDRM;

import java.util.Arrays;

/**
 * The accurate route: column-pivoted Householder QR of A = sqrt(W) X S, where S scales each kept
 * column to about unit length by a power of two (exact, so it adds no rounding), followed by
 * iterative refinement of the least-squares solution on the augmented system
 * [I A; A' 0] [r; x] = [b; c] with residuals computed in double-double arithmetic
 * (Bjorck's method). The refinement uses the exact model matrix, low-order parts included
 * ({@link DesignMatrix#denseLow()}), so an ill-conditioned polynomial design is solved to
 * nearly full double precision as long as cond(A) times the unit roundoff is well below 1. The
 * unscaled covariance is refined the same way, one column of (A'A)^-1 at a time.
 *
 * <p>The rank is decided separately and in model order (see {@link WlsRoute#decideExcluded});
 * EJML's pivoted factorization then only sees the kept, full-rank columns. A fresh decomposition
 * instance is used for every factorization (EJML's rank and pivot array are stale on reuse).
 */
final class QrRoute implements WlsRoute {
    private static final int MAX_REFINEMENTS = 12;

    private final int n;
    private final int p;
    private final double rankTolerance;
    private final double[] xh;   // n x p row-major
    private final double[] xl;   // n x p row-major low parts, or null
    private boolean[] excluded;
    private int[] kept;
    private double condition = 1.0;

    // factorization of the current weights
    private int r;
    private double[] sw;       // sqrt(w)
    private double[] scale;    // per kept column, a power of two
    private double[] q;        // n x r row-major, compact Q of A P
    private double[] rr;       // r x r row-major upper triangular R
    private int[] piv;         // column of A at position k of A P

    QrRoute(DesignMatrix x, double rankTolerance) {
        this.n = x.rows();
        this.p = x.columns();
        this.rankTolerance = rankTolerance;
        this.xh = x.toDenseRowMajor();
        this.xl = x.toDenseLowRowMajor();
    }

    void setExcluded(boolean[] ex) {
        this.excluded = ex.clone();
        this.kept = keptColumns(excluded);
    }

    private static int[] keptColumns(boolean[] ex) {
        return java.util.stream.IntStream.range(0, ex.length).filter(j -> !ex[j]).toArray();
    }

    @Override
    public boolean[] decideExcluded(double[] w, double[] z, boolean[] candidates) {
        boolean[] ex = new boolean[p];
        // column-major copy of sqrt(W) X with unit-length columns
        double[][] a = new double[p][n];
        for (int j = 0; j < p; j++) {
            ex[j] = !candidates[j];
        }
        for (int i = 0; i < n; i++) {
            double s = Math.sqrt(w[i]);
            for (int j = 0; j < p; j++) {
                a[j][i] = s * xh[i * p + j];
            }
        }
        for (int j = 0; j < p; j++) {
            double norm = norm(a[j], 0);
            if (!(norm > 0) || !Double.isFinite(norm)) {
                ex[j] = true;
                continue;
            }
            for (int i = 0; i < n; i++) {
                a[j][i] /= norm;
            }
        }
        // Householder QR in model order: a column whose remainder is shorter than the tolerance
        // is aliased and skipped, so of collinear columns the later one goes.
        double[][] v = new double[p][];
        int k = 0;
        int[] reflectorOf = new int[p];
        for (int j = 0; j < p; j++) {
            if (ex[j]) {
                continue;
            }
            double[] col = a[j];
            for (int m = 0; m < k; m++) {
                applyReflector(v[m], m, col);
            }
            if (k >= n) {
                ex[j] = true;
                continue;
            }
            double rest = norm(col, k);
            if (!(rest > rankTolerance)) {
                ex[j] = true;
                continue;
            }
            double alpha = col[k] > 0 ? -rest : rest;
            double[] vk = new double[n];
            for (int i = k; i < n; i++) {
                vk[i] = col[i];
            }
            vk[k] -= alpha;
            double vn = norm(vk, k);
            for (int i = k; i < n; i++) {
                vk[i] /= vn;
            }
            v[k] = vk;
            reflectorOf[k] = j;
            k++;
        }
        setExcluded(ex);
        return ex.clone();
    }

    private static void applyReflector(double[] v, int from, double[] col) {
        double d = 0;
        for (int i = from; i < col.length; i++) {
            d += v[i] * col[i];
        }
        d *= 2;
        for (int i = from; i < col.length; i++) {
            col[i] -= d * v[i];
        }
    }

    private static double norm(double[] x, int from) {
        double scaleMax = 0;
        for (int i = from; i < x.length; i++) {
            scaleMax = Math.max(scaleMax, Math.abs(x[i]));
        }
        if (scaleMax == 0 || !Double.isFinite(scaleMax)) {
            return scaleMax;
        }
        double s = 0;
        for (int i = from; i < x.length; i++) {
            double t = x[i] / scaleMax;
            s += t * t;
        }
        return scaleMax * Math.sqrt(s);
    }

    /** Factors A = sqrt(W) X S over the kept columns. */
    private boolean factor(double[] w) {
        r = kept.length;
        sw = new double[n];
        for (int i = 0; i < n; i++) {
            sw[i] = Math.sqrt(w[i]);
        }
        scale = new double[r];
        DMatrixRMaj a = new DMatrixRMaj(n, r);
        for (int c = 0; c < r; c++) {
            int j = kept[c];
            double ss = 0;
            for (int i = 0; i < n; i++) {
                double v = sw[i] * xh[i * p + j];
                ss += v * v;
            }
            if (!(ss > 0) || !Double.isFinite(ss)) {
                return false;
            }
            // a power of two near 1/norm: scaling by it is exact
            scale[c] = Math.scalb(1.0, -Math.getExponent(Math.sqrt(ss)));
        }
        for (int i = 0; i < n; i++) {
            for (int c = 0; c < r; c++) {
                a.data[i * r + c] = sw[i] * xh[i * p + kept[c]] * scale[c];
            }
        }
        if (r == 0) {
            q = new double[0];
            rr = new double[0];
            piv = new int[0];
            return true;
        }
        QRColPivDecompositionHouseholderColumn_DDRM dec = new QRColPivDecompositionHouseholderColumn_DDRM(
                Double.MIN_NORMAL);
        if (!dec.decompose(a) || dec.getRank() < r) {
            return false;
        }
        DMatrixRMaj qm = dec.getQ(null, true);
        DMatrixRMaj rm = dec.getR(null, true);
        q = Arrays.copyOf(qm.data, n * r);
        rr = Arrays.copyOf(rm.data, r * r);
        piv = Arrays.copyOf(dec.getColPivots(), r);
        double dmax = 0;
        double dmin = Double.POSITIVE_INFINITY;
        for (int c = 0; c < r; c++) {
            double d = Math.abs(rr[c * r + c]);
            if (!(d > 0)) {
                return false;
            }
            dmax = Math.max(dmax, d);
            dmin = Math.min(dmin, d);
        }
        condition = dmax / dmin;
        return true;
    }

    @Override
    public boolean solve(double[] w, double[] z, double[] beta) {
        if (!factor(w)) {
            return false;
        }
        // b = sqrt(w) z kept exactly as a double-double (hi, lo)
        double[] bh = new double[n];
        double[] bl = new double[n];
        for (int i = 0; i < n; i++) {
            bh[i] = sw[i] * z[i];
            bl[i] = Math.fma(sw[i], z[i], -bh[i]);
        }
        double[] x = new double[r];
        double[] res = new double[n];
        // initial basic solution x = P R^-1 Q' b
        double[] d1 = qtMultiply(bh);
        backSolve(d1);
        for (int k = 0; k < r; k++) {
            x[piv[k]] = d1[k];
        }
        residual(bh, bl, new double[n], x, res, true);
        refine(bh, bl, null, x, res);
        Arrays.fill(beta, 0.0);
        for (int c = 0; c < r; c++) {
            beta[kept[c]] = x[c] * scale[c];
        }
        return true;
    }

    /**
     * Bjorck's refinement of [I A; A' 0][res; x] = [b; c]; c is null for 0.
     */
    private void refine(double[] bh, double[] bl, double[] c, double[] x, double[] res) {
        double[] f = new double[n];
        double[] g = new double[r];
        double prev = Double.POSITIVE_INFINITY;
        for (int it = 0; it < MAX_REFINEMENTS; it++) {
            residual(bh, bl, res, x, f, false);
            transposeResidual(c, res, g);
            // correction: h = R^-T P' g; d1 = Q' f; dx = P R^-1 (d1 - h); dres = Q (h - d1) + f
            double[] h = new double[r];
            for (int k = 0; k < r; k++) {
                h[k] = g[piv[k]];
            }
            forwardSolveTransposed(h);
            double[] d = qtMultiply(f);
            double[] e = new double[r];
            for (int k = 0; k < r; k++) {
                e[k] = d[k] - h[k];
            }
            backSolve(e);
            double dxNorm = 0;
            for (int k = 0; k < r; k++) {
                dxNorm = Math.max(dxNorm, Math.abs(e[k]));
            }
            if (dxNorm > 0.5 * prev) {
                break; // not contracting (cond(A) too close to 1/eps): keep the last good iterate
            }
            double xNorm = 0;
            for (int k = 0; k < r; k++) {
                int j = piv[k];
                x[j] += e[k];
                xNorm = Math.max(xNorm, Math.abs(x[j]));
            }
            for (int k = 0; k < r; k++) {
                h[k] -= d[k];
            }
            for (int i = 0; i < n; i++) {
                double s = f[i];
                int base = i * r;
                for (int k = 0; k < r; k++) {
                    s += q[base + k] * h[k];
                }
                res[i] += s;
            }
            if (dxNorm <= 0x1p-53 * xNorm) {
                break;
            }
            prev = dxNorm;
        }
    }

    /**
     * out = b - res - A x, in double-double (the product A x uses the exact entries
     * sqrt(w) (xh + xl) S). When initial is true, res is ignored (treated as 0).
     */
    private void residual(double[] bh, double[] bl, double[] res, double[] x, double[] out, boolean initial) {
        double[] u = new double[r];
        for (int c = 0; c < r; c++) {
            u[c] = x[c] * scale[c];
        }
        for (int i = 0; i < n; i++) {
            int base = i * p;
            double sh = 0;
            double sl = 0;
            for (int c = 0; c < r; c++) {
                int j = kept[c];
                double a = xh[base + j];
                double pr = a * u[c];
                double pe = Math.fma(a, u[c], -pr);
                if (xl != null) {
                    pe += xl[base + j] * u[c];
                }
                double t = sh + pr;
                double bb = t - sh;
                sl += (sh - (t - bb)) + (pr - bb) + pe;
                sh = t;
            }
            // times sqrt(w) in double-double
            double ph = sh * sw[i];
            double pl = Math.fma(sh, sw[i], -ph) + sl * sw[i];
            // b - res - (ph + pl)
            double th = bh[i] - ph;
            double bb = th - bh[i];
            double tl = (bh[i] - (th - bb)) + (-ph - bb) + bl[i] - pl;
            if (!initial) {
                double t2 = th - res[i];
                double b2 = t2 - th;
                tl += (th - (t2 - b2)) + (-res[i] - b2);
                th = t2;
            }
            out[i] = th + tl;
        }
    }

    /** g = c - A' res in double-double; c null means 0. */
    private void transposeResidual(double[] c, double[] res, double[] g) {
        for (int k = 0; k < r; k++) {
            int j = kept[k];
            double sh = 0;
            double sl = 0;
            for (int i = 0; i < n; i++) {
                double ri = res[i] * sw[i];
                double ri2 = Math.fma(res[i], sw[i], -ri);
                double a = xh[i * p + j];
                double prod = a * ri;
                double prodErr = Math.fma(a, ri, -prod) + a * ri2 + (xl == null ? 0 : xl[i * p + j] * ri);
                double pr = -prod;
                double pe = -prodErr;
                double t = sh + pr;
                double bb = t - sh;
                sl += (sh - (t - bb)) + (pr - bb) + pe;
                sh = t;
            }
            sh *= scale[k];
            sl *= scale[k];
            if (c != null) {
                double t = sh + c[k];
                double bb = t - sh;
                sl += (sh - (t - bb)) + (c[k] - bb);
                sh = t;
            }
            g[k] = sh + sl;
        }
    }

    private double[] qtMultiply(double[] f) {
        double[] d = new double[r];
        for (int i = 0; i < n; i++) {
            double fi = f[i];
            if (fi == 0) {
                continue;
            }
            int base = i * r;
            for (int k = 0; k < r; k++) {
                d[k] += q[base + k] * fi;
            }
        }
        return d;
    }

    /** Solves R y = v in place. */
    private void backSolve(double[] v) {
        for (int k = r - 1; k >= 0; k--) {
            double s = v[k];
            for (int m = k + 1; m < r; m++) {
                s -= rr[k * r + m] * v[m];
            }
            v[k] = s / rr[k * r + k];
        }
    }

    /** Solves R' y = v in place. */
    private void forwardSolveTransposed(double[] v) {
        for (int k = 0; k < r; k++) {
            double s = v[k];
            for (int m = 0; m < k; m++) {
                s -= rr[m * r + k] * v[m];
            }
            v[k] = s / rr[k * r + k];
        }
    }

    @Override
    public double[][] covariance(double[] w, double[] scratch) {
        double[][] cov = new double[p][p];
        for (double[] row : cov) {
            Arrays.fill(row, Double.NaN);
        }
        if (!factor(w)) {
            return cov;
        }
        double[] zero = new double[n];
        for (int c = 0; c < r; c++) {
            // column c of (A'A)^-1: r + A x = 0, A' r = -e_c
            double[] rhs = new double[r];
            rhs[c] = -1.0;
            double[] h = new double[r];
            for (int k = 0; k < r; k++) {
                h[k] = -rhs[piv[k]];
            }
            forwardSolveTransposed(h);
            backSolve(h);
            double[] x = new double[r];
            for (int k = 0; k < r; k++) {
                x[piv[k]] = h[k];
            }
            double[] res = new double[n];
            residual(zero, zero, res, x, res, true);
            refine(zero, zero, rhs, x, res);
            for (int k = 0; k < r; k++) {
                cov[kept[k]][kept[c]] = x[k] * scale[k] * scale[c];
            }
        }
        // symmetrize (the refined columns agree to rounding)
        for (int a = 0; a < r; a++) {
            for (int b = a + 1; b < r; b++) {
                double v = 0.5 * (cov[kept[a]][kept[b]] + cov[kept[b]][kept[a]]);
                cov[kept[a]][kept[b]] = v;
                cov[kept[b]][kept[a]] = v;
            }
        }
        return cov;
    }

    @Override
    public double conditionEstimate() {
        return condition;
    }
}
