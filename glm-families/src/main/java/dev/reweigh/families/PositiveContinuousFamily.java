package dev.reweigh.families;

/**
 * Continuous families on the positive numbers with a power variance phi mu^p / w (gamma p = 2,
 * inverse Gaussian p = 3): deviance and Anscombe residual by {@link PowerVariance}, dispersion
 * estimated. The subclasses supply the variance itself, the density, the distribution function and
 * the default link.
 */
abstract class PositiveContinuousFamily extends AbstractFamily {
    private final double power;

    PositiveContinuousFamily(String name, double power) {
        super(name);
        this.power = power;
    }

    @Override
    public final double unitDeviance(double y, double mu) {
        return PowerVariance.unitDeviance(y, mu, power);
    }

    @Override
    public final boolean isValidResponse(double y, double priorWeight) {
        return NumberRange.POSITIVE.contains(y);
    }

    @Override
    public final String responseDomain() {
        return NumberRange.POSITIVE.description();
    }

    @Override
    public final boolean isValidMean(double mu) {
        return NumberRange.POSITIVE.contains(mu);
    }

    @Override
    public final String meanDomain() {
        return NumberRange.POSITIVE.description();
    }

    @Override
    public final double startingMean(double y, double priorWeight) {
        return y;
    }

    @Override
    public final boolean hasDensity() {
        return true;
    }

    @Override
    public final boolean isDiscrete() {
        return false;
    }

    @Override
    public final double anscombeResidual(double y, double mu) {
        return PowerVariance.anscombeResidual(y, mu, power);
    }

    @Override
    public final boolean isDispersionFixed() {
        return false;
    }
}
