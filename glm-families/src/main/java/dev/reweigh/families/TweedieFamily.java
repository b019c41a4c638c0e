package dev.reweigh.families;

/**
 * Tweedie family with 1 &lt; p &lt; 2: a compound Poisson-Gamma response, non-negative with an
 * atom at zero, variance phi mu^p / w. Density and distribution function in {@link TweedieSeries}.
 */
final class TweedieFamily extends AbstractFamily {
    private final double power;
    private final Link defaultLink;

    TweedieFamily(double power) {
        super("tweedie:" + DoubleText.format(power));
        this.power = power;
        this.defaultLink = Links.power(1.0 - power);
    }

    double power() {
        return power;
    }

    @Override
    String varianceText() {
        return "mu^" + DoubleText.format(power);
    }

    @Override
    public double variance(double mu) {
        return Math.pow(mu, power);
    }

    @Override
    public double unitDeviance(double y, double mu) {
        return PowerVariance.unitDeviance(y, mu, power);
    }

    @Override
    public boolean isValidResponse(double y, double priorWeight) {
        return NumberRange.NON_NEGATIVE.contains(y);
    }

    @Override
    public String responseDomain() {
        return NumberRange.NON_NEGATIVE.description();
    }

    @Override
    public boolean isValidMean(double mu) {
        return NumberRange.POSITIVE.contains(mu);
    }

    @Override
    public String meanDomain() {
        return NumberRange.POSITIVE.description();
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
        checkDensityArguments(mu, dispersion, priorWeight);
        double rowDispersion = dispersion / priorWeight;
        if (y == 0.0) {
            return -TweedieSeries.poissonRate(mu, rowDispersion, power);
        }
        if (!(y > 0.0) || y == Double.POSITIVE_INFINITY) {
            return Double.NEGATIVE_INFINITY;
        }
        return TweedieSeries.logDensityPositive(y, mu, rowDispersion, power);
    }

    @Override
    public double cumulativeProbability(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, dispersion, priorWeight);
        return TweedieSeries.cumulativeProbability(y, mu, dispersion / priorWeight, power);
    }

    @Override
    public boolean isDiscrete() {
        return false;
    }

    @Override
    public double anscombeResidual(double y, double mu) {
        return PowerVariance.anscombeResidual(y, mu, power);
    }

    @Override
    public Link defaultLink() {
        return defaultLink;
    }

    @Override
    public boolean isDispersionFixed() {
        return false;
    }
}
