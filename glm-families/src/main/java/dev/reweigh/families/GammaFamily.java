package dev.reweigh.families;

import org.apache.commons.math3.special.Gamma;

/** Positive response with variance phi mu^2 / w (constant coefficient of variation). */
final class GammaFamily extends PositiveContinuousFamily {
    static final GammaFamily INSTANCE = new GammaFamily();

    private GammaFamily() {
        super("gamma", 2.0);
    }

    @Override
    String varianceText() {
        return "mu^2";
    }

    @Override
    public double variance(double mu) {
        return mu * mu;
    }

    /**
     * With shape k = w / phi and scale mu / k, log f = -log y - s(k) + log(k / (2 pi)) / 2 - k d / 2,
     * where s is the Stirling remainder and d the unit deviance: the form avoids subtracting the
     * large terms k log k and log Gamma(k) when the dispersion is small.
     */
    @Override
    public double logDensity(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, dispersion, priorWeight);
        if (!(y > 0.0) || y == Double.POSITIVE_INFINITY) {
            return Double.NEGATIVE_INFINITY;
        }
        double shape = priorWeight / dispersion;
        return -Math.log(y) - ProbabilityMath.stirlingRemainder(shape)
                + 0.5 * (Math.log(shape) - ProbabilityMath.LOG_2PI) - 0.5 * shape * unitDeviance(y, mu);
    }

    /**
     * The regularized incomplete gamma function P(k, k y / mu), k = w / phi; for shapes above 1e7,
     * where its Commons Math evaluation loses digits, the saddlepoint approximation
     * ({@link Saddlepoint}).
     */
    @Override
    public double cumulativeProbability(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, dispersion, priorWeight);
        if (!(y > 0.0)) {
            return 0.0;
        }
        double shape = priorWeight / dispersion;
        if (shape > Saddlepoint.LARGE) {
            return saddlepointDistribution(y, mu, shape);
        }
        return Gamma.regularizedGammaP(shape, shape * y / mu);
    }

    /** Saddlepoint form: u = (theta(y) - theta(mu)) sqrt(V(y) k) with theta = -1/m is (y - mu) sqrt(k) / mu. */
    static double saddlepointDistribution(double y, double mu, double shape) {
        double w = Saddlepoint.devianceResidual(y, mu, PowerVariance.unitDeviance(y, mu, 2.0), 1.0 / shape);
        return Saddlepoint.distributionFunction(w, (y - mu) * Math.sqrt(shape) / mu, 2.0 / Math.sqrt(shape));
    }

    @Override
    public Link defaultLink() {
        return Links.inverse();
    }
}
