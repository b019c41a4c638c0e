package dev.reweigh.families;

/**
 * Inverse Gaussian response with variance phi mu^3 / w; density and distribution function from
 * R. S. Chhikara and J. L. Folks (1989), The Inverse Gaussian Distribution, with shape
 * lambda = w / phi.
 */
final class InverseGaussianFamily extends PositiveContinuousFamily {
    static final InverseGaussianFamily INSTANCE = new InverseGaussianFamily();

    private InverseGaussianFamily() {
        super("inverse-gaussian", 3.0);
    }

    @Override
    String varianceText() {
        return "mu^3";
    }

    @Override
    public double variance(double mu) {
        return mu * mu * mu;
    }

    @Override
    public double logDensity(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, dispersion, priorWeight);
        if (!(y > 0.0) || y == Double.POSITIVE_INFINITY) {
            return Double.NEGATIVE_INFINITY;
        }
        double rowDispersion = dispersion / priorWeight;
        return -0.5 * (ProbabilityMath.LOG_2PI + Math.log(rowDispersion) + 3.0 * Math.log(y))
                - unitDeviance(y, mu) / (2.0 * rowDispersion);
    }

    /**
     * F(y) = Phi(z1) + exp(2 lambda / mu) Phi(-z2) with z1 = (y - mu) / (mu sqrt(phi y)) and
     * z2 = (y + mu) / (mu sqrt(phi y)). The second term is evaluated as phi(z1) R(z2), R the
     * normal Mills ratio, which is the same number but cannot overflow (exp(2 lambda / mu) alone
     * overflows once lambda / mu exceeds 355).
     */
    @Override
    public double cumulativeProbability(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, dispersion, priorWeight);
        if (!(y > 0.0)) {
            return 0.0;
        }
        if (y == Double.POSITIVE_INFINITY) {
            return 1.0;
        }
        double scale = mu * Math.sqrt(dispersion / priorWeight * y);
        double z1 = (y - mu) / scale;
        double z2 = (y + mu) / scale;
        double p = ProbabilityMath.normalCdf(z1) + ProbabilityMath.normalDensity(z1) * ProbabilityMath.millsRatio(z2);
        // Rounding can lift the sum a few ulps above 1 far in the upper tail.
        return Math.min(1.0, p);
    }

    @Override
    public Link defaultLink() {
        return Links.inverseSquared();
    }
}
