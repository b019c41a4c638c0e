package dev.reweigh.families;

/**
 * Lugannani-Rice saddlepoint approximation to a distribution function (R. Lugannani and S. Rice,
 * 1980, "Saddle point approximation for the distribution of the sum of independent random
 * variables", Advances in Applied Probability 12, 475-490), in the form it takes for an exponential
 * dispersion model: F(y) = Phi(w) + phi(w) (1/w - 1/u), where w = sign(y - mu) sqrt(d(y, mu) / phi)
 * is the deviance residual and u = (theta(y) - theta(mu)) sqrt(V(y) / phi) the Wald-type residual
 * on the canonical scale. For a count the callers use the second continuity-corrected form of
 * H. E. Daniels (1987), "Tail probability approximations", International Statistical Review 55,
 * 37-48: w and the saddlepoint s = theta(y) - theta(mu) are taken half a step above the count, and
 * u = 2 sinh(s/2) sqrt(K''(s)). Measured against Commons Math at means of 1e4 to 1e6 (where its
 * incomplete gamma and beta functions are still accurate), the relative error in the smaller tail
 * was 2e-7 at 1e4 and below 1e-8 at 1e6 for the counts, and 3e-8 at shape 1e4 for the Gamma
 * distribution, decreasing like a power of the size.
 *
 * <p>The families use it only where their exact distribution functions would need incomplete gamma
 * or beta functions with parameters beyond 1e7: Commons Math computes those through
 * exp(a log x - x - log Gamma(a)), whose rounding error grows like 1e-16 a log a (2e-8 at a = 1e7,
 * 3e-3 at 1e12), while the saddlepoint error shrinks like 1/a.
 */
final class Saddlepoint {
    /** Parameters above this size switch the distribution functions to the saddlepoint form. */
    static final double LARGE = 1e7;

    private Saddlepoint() {
    }

    /**
     * Evaluates Phi(w) + phi(w) (1/w - 1/u). Near w = 0, where 1/w - 1/u cancels, its limit
     * skewness/6 is used; in the lower tail the sum is formed through the Mills ratio so that small
     * probabilities keep their relative accuracy.
     *
     * @param w the signed deviance residual
     * @param u the canonical-scale residual, of the same sign as w
     * @param skewness the standardized third cumulant at the mean
     */
    static double distributionFunction(double w, double u, double skewness) {
        double density = ProbabilityMath.normalDensity(w);
        if (Math.abs(w) < 1e-3) {
            return ProbabilityMath.normalCdf(w) + density * skewness / 6.0;
        }
        double correction = 1.0 / w - 1.0 / u;
        double value;
        if (w < 0) {
            value = density * (ProbabilityMath.millsRatio(-w) + correction);
        } else {
            value = 1.0 - density * (ProbabilityMath.millsRatio(w) - correction);
        }
        return Math.min(1.0, Math.max(0.0, value));
    }

    /** Signed square root of a deviance divided by the dispersion. */
    static double devianceResidual(double y, double mu, double deviance, double dispersion) {
        return Math.signum(y - mu) * Math.sqrt(deviance / dispersion);
    }
}
