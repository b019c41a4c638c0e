package dev.reweigh.families;

import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.special.Beta;

/**
 * Negative binomial counts with known theta: variance mu + mu^2 / theta; a prior weight is a
 * frequency weight. The dispersion is fixed at 1 (theta carries the extra variation).
 */
final class NegativeBinomialFamily extends CountFamily {
    private final double theta;

    NegativeBinomialFamily(double theta) {
        super("negative-binomial:" + DoubleText.format(theta));
        this.theta = theta;
    }

    double theta() {
        return theta;
    }

    @Override
    String varianceText() {
        return "mu + mu^2/" + DoubleText.format(theta);
    }

    @Override
    public double variance(double mu) {
        return mu + mu * mu / theta;
    }

    /**
     * 2 [y log(y/mu) - (y + theta) log((y + theta)/(mu + theta))], written as
     * 2 [bd0(y, mu) - bd0(y + theta, mu + theta)] (the linear terms cancel), which keeps the
     * digits near y = mu (y + theta and mu + theta are rounded, so their difference is passed as
     * the exact y - mu). The subtraction costs about log10((mu + theta) / theta) digits; the result
     * is clamped at 0 against rounding.
     */
    @Override
    public double unitDeviance(double y, double mu) {
        if (y == 0.0) {
            return 2.0 * theta * Math.log1p(mu / theta);
        }
        double d = 2.0 * (ProbabilityMath.bd0(y, mu) - ProbabilityMath.bd0(y + theta, mu + theta, y - mu));
        return Math.max(0.0, d);
    }

    /**
     * P(Y = y) = Gamma(y + theta) / (Gamma(theta) y!) p^theta (1-p)^y with p = theta / (theta + mu),
     * evaluated as theta / (y + theta) times a binomial term with theta "successes" out of
     * y + theta, so that the saddle-point form of the binomial term applies.
     */
    @Override
    double logProbability(double k, double mu) {
        double total = k + theta;
        double p = theta / (theta + mu);
        double q = mu / (theta + mu);
        return Math.log(theta / total) + ProbabilityMath.logBinomialTerm(theta, total, k, p, q);
    }

    /**
     * The regularized incomplete beta function I_p(theta, k + 1), p = theta / (theta + mu); when
     * both theta and mu exceed 1e7 the continuity-corrected saddlepoint approximation
     * ({@link Saddlepoint}).
     */
    @Override
    double probabilityUpTo(double k, double mu) {
        if (Math.min(theta, mu) > Saddlepoint.LARGE) {
            return saddlepointDistribution(k, mu);
        }
        // P(Y <= k) = I_p(theta, k + 1), p = theta / (theta + mu): valid for non-integer theta too.
        return Beta.regularizedBeta(theta / (theta + mu), theta, k + 1.0);
    }

    /** Continuity-corrected saddlepoint form at k + 1/2; theta(m) = log(m / (m + theta)). */
    double saddlepointDistribution(double k, double mu) {
        double corrected = k + 0.5;
        double w = Saddlepoint.devianceResidual(corrected, mu, unitDeviance(corrected, mu), 1.0);
        double thetaDifference = PowerVariance.logRatio(corrected, mu) - PowerVariance.logRatio(corrected + theta, mu + theta);
        double u = 2.0 * Math.sinh(0.5 * thetaDifference) * Math.sqrt(variance(corrected));
        double skewness = (theta + 2.0 * mu) / Math.sqrt(theta * mu * (theta + mu));
        return Saddlepoint.distributionFunction(w, u, skewness);
    }

    /**
     * A(t) = integral of V(s)^(-1/3) ds has no elementary form here. With s = u^3 the integrand
     * becomes 3 u (1 + u^3 / theta)^(-1/3), smooth down to u = 0, and is integrated numerically by
     * Gauss-Legendre quadrature. Close to mu the integral is taken over [mu, y] in s itself, so
     * that the rounding of the cube roots does not matter.
     */
    @Override
    public double anscombeResidual(double y, double mu) {
        if (Math.abs(y - mu) <= 0.1 * mu) {
            return NearbyIntegral.integrate(s -> Math.pow(variance(s), -1.0 / 3.0), mu, y)
                    / Math.pow(variance(mu), 1.0 / 6.0);
        }
        double lower = Math.cbrt(mu);
        double upper = Math.cbrt(y);
        if (lower == upper) {
            return 0.0;
        }
        double from = Math.min(lower, upper);
        double to = Math.max(lower, upper);
        // Pieces that double in length keep each one smooth on its own scale over wide ranges.
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(8, 1e-13, 1e-15);
        double integral = 0.0;
        double a = from;
        while (a < to) {
            double b = Math.min(to, Math.max(2.0 * a, a + 1.0));
            integral += integrator.integrate(100_000, u -> 3.0 * u * Math.pow(1.0 + u * u * u / theta, -1.0 / 3.0), a, b);
            a = b;
        }
        double signed = upper > lower ? integral : -integral;
        return signed / Math.pow(variance(mu), 1.0 / 6.0);
    }
}
