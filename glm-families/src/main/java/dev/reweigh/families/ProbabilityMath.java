package dev.reweigh.families;

import org.apache.commons.math3.special.Erf;

/**
 * Numerically careful building blocks shared by the families and links.
 *
 * <p>The count densities follow the saddle-point method of C. Loader (2000), "Fast and accurate
 * computation of binomial probabilities": log-probabilities are written as a Stirling remainder
 * plus a deviance-like term {@link #bd0(double, double)} that is computed without cancellation,
 * so that they stay accurate for large counts and for means close to the count.
 */
final class ProbabilityMath {
    static final double LOG_2PI = Math.log(2 * Math.PI);
    static final double LOG_SQRT_2PI = 0.5 * LOG_2PI;
    private static final double SQRT_2 = Math.sqrt(2.0);
    private static final double INV_SQRT_2PI = 1.0 / Math.sqrt(2 * Math.PI);

    private ProbabilityMath() {
    }

    /**
     * Returns x log(x/m) + m - x (non-negative, zero at x = m) for x &gt;= 0 and m &gt; 0. Near
     * x = m it sums the series in v = (x - m)/(x + m), which avoids the cancellation of the
     * direct form.
     */
    static double bd0(double x, double m) {
        return bd0(x, m, x - m);
    }

    /**
     * As {@link #bd0(double, double)} with the difference x - m supplied by the caller. When x and
     * m are themselves rounded (1 - y and 1 - mu, or y + theta and mu + theta), their computed
     * difference can be wrong in every digit while the caller knows it exactly (mu - y); every
     * term here uses x and m only as factors, so their rounding costs no more than a few ulps.
     */
    static double bd0(double x, double m, double diff) {
        if (x == 0.0) {
            return m;
        }
        if (m == 0.0 || Double.isInfinite(m)) {
            return Double.POSITIVE_INFINITY;
        }
        if (Math.abs(diff) < 0.1 * (x + m)) {
            double v = diff / (x + m);
            double sum = diff * v;
            double term = 2 * x * v;
            double v2 = v * v;
            for (int j = 1; j < 1000; j++) {
                term *= v2;
                double next = sum + term / (2 * j + 1);
                if (next == sum) {
                    return sum;
                }
                sum = next;
            }
            return sum;
        }
        double relative = diff / m;
        double logRatio = Double.isFinite(relative) ? Math.log1p(relative) : Math.log(x) - Math.log(m);
        return x * logRatio - diff;
    }

    /**
     * Returns the Stirling remainder log Gamma(z + 1) - [(z + 1/2) log z - z + log sqrt(2 pi)] for
     * z &gt; 0. Above 15 it sums the Stirling series; below, it shifts z up by n to z + n &gt; 15
     * through Gamma(z + 1) = Gamma(z + n + 1) / ((z + 1) ... (z + n)), with the product taken
     * before its single logarithm. The terms then cancel to an absolute error of about 1e-14, which
     * is what the densities need, at a fraction of the cost of a log-gamma evaluation.
     */
    static double stirlingRemainder(double z) {
        if (z > 15.0) {
            return stirlingSeries(z);
        }
        int n = (int) Math.ceil(15.0 - z) + 1;
        double shifted = z + n;
        double product = 1.0;
        for (int i = 1; i <= n; i++) {
            product *= z + i;
        }
        return stirlingSeries(shifted) - Math.log(product) + (shifted + 0.5) * Math.log(shifted)
                - (z + 0.5) * Math.log(z) - n;
    }

    private static double stirlingSeries(double z) {
        double z2 = z * z;
        // Bernoulli-number terms of the Stirling series: 1/12, 1/360, 1/1260, 1/1680, 1/1188.
        return (1.0 / 12 - (1.0 / 360 - (1.0 / 1260 - (1.0 / 1680 - (1.0 / 1188) / z2) / z2) / z2) / z2) / z;
    }

    /**
     * Returns log[ Gamma(n+1) / (Gamma(x+1) Gamma(n-x+1)) p^x q^(n-x) ] for real 0 &lt;= x &lt;= n,
     * where q = 1 - p is passed separately so that it keeps its own precision.
     */
    static double logBinomialTerm(double x, double n, double p, double q) {
        return logBinomialTerm(x, n, n - x, p, q);
    }

    /**
     * As {@link #logBinomialTerm(double, double, double, double)} with n - x supplied by the caller,
     * who may know it exactly when n - x is small and n large (the negative binomial count y out of
     * y + theta trials, theta = 1e12).
     */
    static double logBinomialTerm(double x, double n, double nMinusX, double p, double q) {
        if (p == 0.0) {
            return x == 0.0 ? 0.0 : Double.NEGATIVE_INFINITY;
        }
        if (q == 0.0) {
            return nMinusX == 0.0 ? 0.0 : Double.NEGATIVE_INFINITY;
        }
        if (x < 0 || nMinusX < 0) {
            return Double.NEGATIVE_INFINITY;
        }
        if (x == 0.0) {
            if (n == 0.0) {
                return 0.0;
            }
            return p < 0.1 ? -bd0(n, n * q) - n * p : n * Math.log(q);
        }
        if (nMinusX == 0.0) {
            return q < 0.1 ? -bd0(n, n * p) - n * q : n * Math.log(p);
        }
        double lc = stirlingRemainder(n) - stirlingRemainder(x) - stirlingRemainder(nMinusX)
                - bd0(x, n * p) - bd0(nMinusX, n * q);
        double lf = LOG_2PI + Math.log(x) + Math.log(nMinusX) - Math.log(n);
        return lc - 0.5 * lf;
    }

    /** Returns log P(X = x) for X Poisson with mean lambda &gt; 0, for real x &gt;= 0. */
    static double logPoisson(double x, double lambda) {
        if (x < 0) {
            return Double.NEGATIVE_INFINITY;
        }
        if (x == 0.0) {
            return -lambda;
        }
        return -stirlingRemainder(x) - bd0(x, lambda) - 0.5 * (LOG_2PI + Math.log(x));
    }

    /** Standard normal density. */
    static double normalDensity(double x) {
        return INV_SQRT_2PI * Math.exp(-0.5 * x * x);
    }

    /** Standard normal distribution function through the complementary error function (both tails). */
    static double normalCdf(double x) {
        return 0.5 * Erf.erfc(-x / SQRT_2);
    }

    /**
     * Mills ratio P(Z &gt; z) / phi(z) of the standard normal. For z &gt;= 10 it uses the continued
     * fraction 1/(z + 1/(z + 2/(z + 3/(z + ...)))), which stays finite where both the tail
     * probability and the density underflow.
     */
    static double millsRatio(double z) {
        if (z >= 10.0) {
            double tail = z;
            for (int k = 60; k >= 1; k--) {
                tail = z + k / tail;
            }
            return 1.0 / tail;
        }
        return normalCdf(-z) / normalDensity(z);
    }

    /** Log of the standard normal distribution function, accurate far into the lower tail. */
    static double logNormalCdf(double x) {
        if (x > -5.0) {
            return Math.log(normalCdf(x));
        }
        return -0.5 * x * x - LOG_SQRT_2PI + Math.log(millsRatio(-x));
    }

    /**
     * Standard normal quantile. A starting value from the rational approximation in Abramowitz
     * and Stegun (1964), Handbook of Mathematical Functions, formula 26.2.23 (error below 4.5e-4),
     * is refined by Newton steps on log Phi(x) = log p, whose slope is 1 / Mills ratio. Working on
     * the log scale keeps full relative accuracy down to p = Double.MIN_VALUE. The upper half is
     * solved by symmetry from 1 - p, which is exact in floating point for p &gt;= 1/2.
     */
    static double normalQuantile(double p) {
        if (Double.isNaN(p) || p < 0 || p > 1) {
            return Double.NaN;
        }
        if (p == 0.0) {
            return Double.NEGATIVE_INFINITY;
        }
        if (p == 1.0) {
            return Double.POSITIVE_INFINITY;
        }
        if (p > 0.5) {
            return -lowerQuantile(1.0 - p);
        }
        return lowerQuantile(p);
    }

    private static double lowerQuantile(double p) {
        double t = Math.sqrt(-2.0 * Math.log(p));
        double x = -(t - (2.515517 + t * (0.802853 + t * 0.010328))
                / (1.0 + t * (1.432788 + t * (0.189269 + t * 0.001308))));
        double logP = Math.log(p);
        for (int i = 0; i < 50; i++) {
            double step = (logNormalCdf(x) - logP) * millsRatio(-x);
            x -= step;
            // Newton converges quadratically: after a step this small the remaining error is far below one ulp.
            if (Math.abs(step) <= 1e-10 * Math.max(1.0, Math.abs(x))) {
                break;
            }
        }
        return x;
    }
}
