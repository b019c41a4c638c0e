package dev.reweigh.core;

import java.math.BigDecimal;
import java.math.MathContext;

/**
 * Reference least squares in (nearly) exact arithmetic: the normal equations are formed exactly in
 * BigDecimal from the double data (products and sums of doubles are exact there) and solved by
 * Gaussian elimination with 200 significant digits. Far too slow for use, but independent of the
 * library's numerics and accurate to many more digits than a double holds.
 */
final class ExactLeastSquares {
    private static final MathContext MC = new MathContext(200);

    final double[] beta;
    final double[] standardErrors;
    final double residualSd;

    private ExactLeastSquares(double[] beta, double[] standardErrors, double residualSd) {
        this.beta = beta;
        this.standardErrors = standardErrors;
        this.residualSd = residualSd;
    }

    /** Exact columns: x[row][col] must be the exact model matrix (as doubles or given by BigDecimal). */
    static ExactLeastSquares fit(BigDecimal[][] x, double[] y) {
        int n = x.length;
        int p = x[0].length;
        BigDecimal[][] a = new BigDecimal[p][2 * p + 1];
        for (int j = 0; j < p; j++) {
            for (int k = 0; k < 2 * p + 1; k++) {
                a[j][k] = BigDecimal.ZERO;
            }
            a[j][p + j] = BigDecimal.ONE;
        }
        for (int i = 0; i < n; i++) {
            BigDecimal yi = new BigDecimal(y[i]);
            for (int j = 0; j < p; j++) {
                for (int k = 0; k < p; k++) {
                    a[j][k] = a[j][k].add(x[i][j].multiply(x[i][k]));
                }
                a[j][2 * p] = a[j][2 * p].add(x[i][j].multiply(yi));
            }
        }
        // Gauss-Jordan with partial pivoting on [G | I | X'y]
        for (int c = 0; c < p; c++) {
            int best = c;
            for (int r = c + 1; r < p; r++) {
                if (a[r][c].abs().compareTo(a[best][c].abs()) > 0) {
                    best = r;
                }
            }
            BigDecimal[] tmp = a[c];
            a[c] = a[best];
            a[best] = tmp;
            BigDecimal piv = a[c][c];
            for (int k = 0; k < 2 * p + 1; k++) {
                a[c][k] = a[c][k].divide(piv, MC);
            }
            for (int r = 0; r < p; r++) {
                if (r != c && a[r][c].signum() != 0) {
                    BigDecimal f = a[r][c];
                    for (int k = 0; k < 2 * p + 1; k++) {
                        a[r][k] = a[r][k].subtract(f.multiply(a[c][k], MC), MC);
                    }
                }
            }
        }
        BigDecimal[] b = new BigDecimal[p];
        for (int j = 0; j < p; j++) {
            b[j] = a[j][2 * p];
        }
        BigDecimal rss = BigDecimal.ZERO;
        for (int i = 0; i < n; i++) {
            BigDecimal fit = BigDecimal.ZERO;
            for (int j = 0; j < p; j++) {
                fit = fit.add(x[i][j].multiply(b[j], MC), MC);
            }
            BigDecimal r = new BigDecimal(y[i]).subtract(fit, MC);
            rss = rss.add(r.multiply(r, MC), MC);
        }
        BigDecimal s2 = rss.divide(BigDecimal.valueOf(n - p), MC);
        double[] beta = new double[p];
        double[] se = new double[p];
        for (int j = 0; j < p; j++) {
            beta[j] = b[j].doubleValue();
            se[j] = s2.multiply(a[j][p + j], MC).sqrt(MC).doubleValue();
        }
        return new ExactLeastSquares(beta, se, s2.sqrt(MC).doubleValue());
    }

    /** The exact raw-polynomial model matrix of double abscissae: 1, x, ..., x^degree. */
    static BigDecimal[][] polynomial(double[] x, int degree) {
        BigDecimal[][] out = new BigDecimal[x.length][degree + 1];
        for (int i = 0; i < x.length; i++) {
            BigDecimal xi = new BigDecimal(x[i]);
            out[i][0] = BigDecimal.ONE;
            for (int k = 1; k <= degree; k++) {
                out[i][k] = out[i][k - 1].multiply(xi);
            }
        }
        return out;
    }
}
