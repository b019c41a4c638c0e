package dev.reweigh.families;

import org.apache.commons.math3.special.Beta;

/**
 * Proportion of successes out of w trials, w being the prior weight. When w is a whole number the
 * count w y must be one too (within a relative 1e-7); fractional weights only require y in [0, 1].
 */
final class BinomialFamily extends AbstractFamily {
    static final BinomialFamily INSTANCE = new BinomialFamily();

    private BinomialFamily() {
        super("binomial");
    }

    @Override
    String varianceText() {
        return "mu(1-mu)";
    }

    @Override
    public double variance(double mu) {
        return mu * (1.0 - mu);
    }

    @Override
    public double unitDeviance(double y, double mu) {
        return deviance(y, mu);
    }

    static double deviance(double y, double mu) {
        if (y == 0.0) {
            return -2.0 * Math.log1p(-mu);
        }
        if (y == 1.0) {
            return -2.0 * Math.log(mu);
        }
        // 1 - y and 1 - mu are rounded, but their difference mu - y is exact: pass it explicitly.
        return 2.0 * (ProbabilityMath.bd0(y, mu) + ProbabilityMath.bd0(1.0 - y, 1.0 - mu, mu - y));
    }

    @Override
    public boolean isValidResponse(double y, double priorWeight) {
        if (!(y >= 0.0 && y <= 1.0)) {
            return false;
        }
        return !isWhole(priorWeight) || isWhole(y * priorWeight);
    }

    @Override
    public String responseDomain() {
        return "a proportion in [0, 1] whose product with the prior weight (the number of trials) is a whole number";
    }

    @Override
    public boolean isValidMean(double mu) {
        return mu > 0.0 && mu < 1.0;
    }

    @Override
    public String meanDomain() {
        return "a probability strictly between 0 and 1";
    }

    @Override
    public double startingMean(double y, double priorWeight) {
        return (priorWeight * y + 0.5) / (priorWeight + 1.0);
    }

    @Override
    public boolean hasDensity() {
        return true;
    }

    /** Number of successes out of n trials, rounded when it is whole within tolerance. */
    private static double successes(double y, double trials) {
        double x = y * trials;
        double whole = nearestWhole(x);
        return Double.isNaN(whole) ? x : whole;
    }

    @Override
    public double logDensity(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, 1.0, priorWeight);
        if (!(y >= 0.0 && y <= 1.0)) {
            return Double.NEGATIVE_INFINITY;
        }
        double trials = priorWeight;
        double x = successes(y, trials);
        if (isWhole(trials) && !isWhole(x)) {
            // A whole number of trials cannot give a fractional number of successes.
            return Double.NEGATIVE_INFINITY;
        }
        return ProbabilityMath.logBinomialTerm(x, trials, mu, 1.0 - mu);
    }

    /**
     * The regularized incomplete beta function I_(1-mu)(n - k, k + 1); when the variance
     * n mu (1 - mu) exceeds 1e7 the continuity-corrected saddlepoint approximation
     * ({@link Saddlepoint}).
     */
    @Override
    public double cumulativeProbability(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, 1.0, priorWeight);
        double trials = priorWeight;
        double k = Math.floor(successes(y, trials));
        if (k < 0) {
            return 0.0;
        }
        if (k >= trials) {
            return 1.0;
        }
        if (trials * mu * (1.0 - mu) > Saddlepoint.LARGE) {
            return saddlepointDistribution(k, trials, mu);
        }
        // P(K <= k) = I_{1-mu}(n - k, k + 1), the regularized incomplete beta function.
        return Beta.regularizedBeta(1.0 - mu, trials - k, k + 1.0);
    }

    /**
     * Continuity-corrected saddlepoint form at K = k + 1/2 successes, worked on the count scale:
     * with a billion trials (k + 1/2) / n would lose the half step to rounding, and n mu is only
     * needed through the exactly rounded difference K - n mu (a fused multiply-add).
     */
    static double saddlepointDistribution(double k, double trials, double mu) {
        double successes = k + 0.5;
        double failures = (trials - k) - 0.5;
        double expected = trials * mu;
        double expectedFailures = trials * (1.0 - mu);
        double diff = -Math.fma(trials, mu, -successes);
        double deviance = 2.0 * (ProbabilityMath.bd0(successes, expected, diff)
                + ProbabilityMath.bd0(failures, expectedFailures, -diff));
        double w = Saddlepoint.devianceResidual(diff, 0.0, deviance, 1.0);
        // s = logit((k + 1/2)/n) - logit(mu) = log(K / (n mu)) - log((n - K) / (n (1 - mu))).
        double s = Math.log1p(diff / expected) - Math.log1p(-diff / expectedFailures);
        double u = 2.0 * Math.sinh(0.5 * s) * Math.sqrt(successes * failures / trials);
        double skewness = (1.0 - 2.0 * mu) / Math.sqrt(trials * mu * (1.0 - mu));
        return Saddlepoint.distributionFunction(w, u, skewness);
    }

    @Override
    public boolean isDiscrete() {
        return true;
    }

    @Override
    public double anscombeResidual(double y, double mu) {
        return anscombe(y, mu);
    }

    private static final double TWO_THIRDS = 2.0 / 3.0;
    private static final double BETA_TWO_THIRDS = Math.exp(Beta.logBeta(TWO_THIRDS, TWO_THIRDS));

    /**
     * A(t) = integral of (s(1-s))^(-1/3) from 0 to t = B(2/3, 2/3) I_t(2/3, 2/3). Close to mu the
     * difference A(y) - A(mu) is integrated directly over [mu, y] instead of subtracting.
     */
    static double anscombe(double y, double mu) {
        double scale = Math.pow(mu * (1.0 - mu), 1.0 / 6.0);
        if (Math.abs(y - mu) <= 0.1 * Math.min(mu, 1.0 - mu)) {
            return NearbyIntegral.integrate(t -> Math.pow(t * (1.0 - t), -1.0 / 3.0), mu, y) / scale;
        }
        double ay = y <= 0 ? 0.0 : y >= 1 ? BETA_TWO_THIRDS : BETA_TWO_THIRDS * Beta.regularizedBeta(y, TWO_THIRDS, TWO_THIRDS);
        double amu = BETA_TWO_THIRDS * Beta.regularizedBeta(mu, TWO_THIRDS, TWO_THIRDS);
        return (ay - amu) / scale;
    }

    @Override
    public Link defaultLink() {
        return Links.logit();
    }

    @Override
    public boolean isDispersionFixed() {
        return true;
    }
}
