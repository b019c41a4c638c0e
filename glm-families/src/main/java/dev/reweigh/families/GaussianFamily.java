package dev.reweigh.families;

/** Normal response with constant variance; a prior weight w divides the dispersion. */
final class GaussianFamily extends AbstractFamily {
    static final GaussianFamily INSTANCE = new GaussianFamily();

    private GaussianFamily() {
        super("gaussian");
    }

    @Override
    String varianceText() {
        return "1";
    }

    @Override
    public double variance(double mu) {
        return 1.0;
    }

    @Override
    public double unitDeviance(double y, double mu) {
        double r = y - mu;
        return r * r;
    }

    @Override
    public boolean isValidResponse(double y, double priorWeight) {
        return NumberRange.FINITE.contains(y);
    }

    @Override
    public String responseDomain() {
        return NumberRange.FINITE.description();
    }

    @Override
    public boolean isValidMean(double mu) {
        return NumberRange.FINITE.contains(mu);
    }

    @Override
    public String meanDomain() {
        return NumberRange.FINITE.description();
    }

    @Override
    public double startingMean(double y, double priorWeight) {
        return y;
    }

    @Override
    public boolean hasDensity() {
        return true;
    }

    @Override
    public double logDensity(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, dispersion, priorWeight);
        double rowDispersion = dispersion / priorWeight;
        double r = y - mu;
        return -0.5 * (ProbabilityMath.LOG_2PI + Math.log(rowDispersion)) - r * r / (2.0 * rowDispersion);
    }

    @Override
    public double cumulativeProbability(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, dispersion, priorWeight);
        return ProbabilityMath.normalCdf((y - mu) / Math.sqrt(dispersion / priorWeight));
    }

    @Override
    public boolean isDiscrete() {
        return false;
    }

    @Override
    public double anscombeResidual(double y, double mu) {
        return y - mu;
    }

    @Override
    public Link defaultLink() {
        return Links.identity();
    }

    @Override
    public boolean isDispersionFixed() {
        return false;
    }
}
