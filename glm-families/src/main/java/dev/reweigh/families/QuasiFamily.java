package dev.reweigh.families;

/**
 * Quasi-likelihood family: a variance function and its deviance, no density. The variance is
 * either a power mu^p (p = 0, 1, 2, 3 named constant, mu, mu^2, mu^3) or mu(1-mu). The dispersion
 * is always estimated.
 */
final class QuasiFamily extends AbstractFamily {
    /** The power p of V(mu) = mu^p, or NaN for V(mu) = mu(1-mu). */
    private final double power;
    private final Link defaultLink;

    private QuasiFamily(String varianceName, double power, Link defaultLink) {
        super("quasi:" + varianceName);
        this.power = power;
        this.defaultLink = defaultLink;
    }

    static QuasiFamily ofPower(double p) {
        return new QuasiFamily(powerText(p), p, Links.power(1.0 - p));
    }

    static QuasiFamily proportion() {
        return new QuasiFamily("mu(1-mu)", Double.NaN, Links.logit());
    }

    static String powerText(double p) {
        if (p == 0.0) {
            return "constant";
        }
        if (p == 1.0) {
            return "mu";
        }
        if (p == 2.0) {
            return "mu^2";
        }
        if (p == 3.0) {
            return "mu^3";
        }
        return "mu^" + DoubleText.format(p);
    }

    private boolean isProportion() {
        return Double.isNaN(power);
    }

    /** The variance power, NaN for mu(1-mu). */
    double power() {
        return power;
    }

    @Override
    String varianceText() {
        return isProportion() ? "mu(1-mu)" : power == 0.0 ? "1" : powerText(power);
    }

    @Override
    public double variance(double mu) {
        if (isProportion()) {
            return mu * (1.0 - mu);
        }
        return power == 0.0 ? 1.0 : Math.pow(mu, power);
    }

    @Override
    public double unitDeviance(double y, double mu) {
        if (isProportion()) {
            return BinomialFamily.deviance(y, mu);
        }
        return PowerVariance.unitDeviance(y, mu, power);
    }

    @Override
    public boolean isValidResponse(double y, double priorWeight) {
        if (isProportion()) {
            return y >= 0.0 && y <= 1.0;
        }
        return powerResponseRange().contains(y);
    }

    @Override
    public String responseDomain() {
        if (isProportion()) {
            return "a proportion in [0, 1]";
        }
        return powerResponseRange().description();
    }

    /** The response range of a power variance: any number for a constant, zero allowed below p = 2. */
    private NumberRange powerResponseRange() {
        if (power == 0.0) {
            return NumberRange.FINITE;
        }
        return power >= 2.0 ? NumberRange.POSITIVE : NumberRange.NON_NEGATIVE;
    }

    @Override
    public boolean isValidMean(double mu) {
        if (isProportion()) {
            return mu > 0.0 && mu < 1.0;
        }
        return powerMeanRange().contains(mu);
    }

    @Override
    public String meanDomain() {
        if (isProportion()) {
            return "a number strictly between 0 and 1";
        }
        return powerMeanRange().description();
    }

    private NumberRange powerMeanRange() {
        return power == 0.0 ? NumberRange.FINITE : NumberRange.POSITIVE;
    }

    @Override
    public double startingMean(double y, double priorWeight) {
        if (isProportion()) {
            return (priorWeight * y + 0.5) / (priorWeight + 1.0);
        }
        if (power == 0.0 || power >= 2.0) {
            return y;
        }
        return y + 0.1;
    }

    @Override
    public boolean hasDensity() {
        return false;
    }

    @Override
    public double logDensity(double y, double mu, double dispersion, double priorWeight) {
        throw new NoLikelihoodException(name(), "log-density");
    }

    @Override
    public double cumulativeProbability(double y, double mu, double dispersion, double priorWeight) {
        throw new NoLikelihoodException(name(), "distribution function");
    }

    @Override
    public boolean isDiscrete() {
        return false;
    }

    @Override
    public double anscombeResidual(double y, double mu) {
        if (isProportion()) {
            return BinomialFamily.anscombe(y, mu);
        }
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
