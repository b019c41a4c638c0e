package dev.reweigh.families;

import org.apache.commons.math3.special.Gamma;

/** Counts with variance equal to the mean; a prior weight is a frequency weight. */
final class PoissonFamily extends AbstractFamily {
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
    public boolean isValidResponse(double y, double priorWeight) {
        return y >= 0.0 && isWhole(y);
    }

    @Override
    public String responseDomain() {
        return "a non-negative whole number";
    }

    @Override
    public boolean isValidMean(double mu) {
        return mu > 0.0 && mu < Double.POSITIVE_INFINITY;
    }

    @Override
    public String meanDomain() {
        return "a positive finite number";
    }

    @Override
    public double startingMean(double y, double priorWeight) {
        return y + 0.1;
    }

    @Override
    public boolean hasDensity() {
        return true;
    }

    @Override
    public double logDensity(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, 1.0, priorWeight);
        double k = nearestWhole(y);
        if (!(k >= 0.0)) {
            return Double.NEGATIVE_INFINITY;
        }
        return priorWeight * ProbabilityMath.logPoisson(k, mu);
    }

    /**
     * The regularized incomplete gamma function Q(k + 1, mu); for means above 1e7 the
     * continuity-corrected saddlepoint approximation ({@link Saddlepoint}).
     */
    @Override
    public double cumulativeProbability(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, 1.0, priorWeight);
        double k = floorCount(y);
        if (k < 0) {
            return 0.0;
        }
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

    /** Largest whole count not above y, treating a value within tolerance of a whole number as that number. */
    static double floorCount(double y) {
        double whole = nearestWhole(y);
        return Double.isNaN(whole) ? Math.floor(y) : whole;
    }

    @Override
    public boolean isDiscrete() {
        return true;
    }

    @Override
    public double anscombeResidual(double y, double mu) {
        return PowerVariance.anscombeResidual(y, mu, 1.0);
    }

    @Override
    public Link defaultLink() {
        return Links.log();
    }

    @Override
    public boolean isDispersionFixed() {
        return true;
    }
}
