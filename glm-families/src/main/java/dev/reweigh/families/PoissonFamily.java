package dev.reweigh.families;

import org.apache.commons.math3.special.Gamma;

/** Counts with variance equal to the mean; a prior weight is a frequency weight. */
final class PoissonFamily extends CountFamily {
    static final PoissonFamily INSTANCE = new PoissonFamily();

    private PoissonFamily() {
        super("poisson");
    }

    @Override
    String varianceText() {
        return "mu";
    }

    @Override
    public double variance(double mu) {
        return mu;
    }

    @Override
    public double unitDeviance(double y, double mu) {
        return 2.0 * ProbabilityMath.bd0(y, mu);
    }

    @Override
    double logProbability(double k, double mu) {
        return ProbabilityMath.logPoisson(k, mu);
    }

    /**
     * The regularized incomplete gamma function Q(k + 1, mu); for means above 1e7 the
     * continuity-corrected saddlepoint approximation ({@link Saddlepoint}).
     */
    @Override
    double probabilityUpTo(double k, double mu) {
        if (mu > Saddlepoint.LARGE) {
            return saddlepointDistribution(k, mu);
        }
        return Gamma.regularizedGammaQ(k + 1.0, mu);
    }

    /** Continuity-corrected saddlepoint form at k + 1/2; theta = log m, V(m) = m. */
    static double saddlepointDistribution(double k, double mu) {
        double corrected = k + 0.5;
        double w = Saddlepoint.devianceResidual(corrected, mu, 2.0 * ProbabilityMath.bd0(corrected, mu), 1.0);
        double u = 2.0 * Math.sinh(0.5 * PowerVariance.logRatio(corrected, mu)) * Math.sqrt(corrected);
        return Saddlepoint.distributionFunction(w, u, 1.0 / Math.sqrt(mu));
    }

    @Override
    public double anscombeResidual(double y, double mu) {
        return PowerVariance.anscombeResidual(y, mu, 1.0);
    }
}
