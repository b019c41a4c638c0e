package dev.reweigh.families;

/**
 * Count families (Poisson, negative binomial): non-negative whole responses, a positive mean, log
 * default link, dispersion fixed at 1, and a prior weight that is a frequency weight. The subclasses
 * supply the probability of one count and of the counts up to it.
 */
abstract class CountFamily extends AbstractFamily {
    CountFamily(String name) {
        super(name);
    }

    /** The log probability of the whole count k &ge; 0 at mean mu (mu already checked). */
    abstract double logProbability(double k, double mu);

    /** P(Y &le; k) for the whole count k &ge; 0 at mean mu (mu already checked). */
    abstract double probabilityUpTo(double k, double mu);

    @Override
    public final boolean isValidResponse(double y, double priorWeight) {
        return y >= 0.0 && isWhole(y);
    }

    @Override
    public final String responseDomain() {
        return "a non-negative whole number";
    }

    @Override
    public final boolean isValidMean(double mu) {
        return NumberRange.POSITIVE.contains(mu);
    }

    @Override
    public final String meanDomain() {
        return NumberRange.POSITIVE.description();
    }

    /** Shifted off zero so that the log link can start from a zero count. */
    @Override
    public final double startingMean(double y, double priorWeight) {
        return y + 0.1;
    }

    @Override
    public final boolean hasDensity() {
        return true;
    }

    /** A frequency weight w raises the probability to the power w; the dispersion is ignored (fixed at 1). */
    @Override
    public final double logDensity(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, 1.0, priorWeight);
        double k = nearestWhole(y);
        if (!(k >= 0.0)) {
            return Double.NEGATIVE_INFINITY;
        }
        return priorWeight * logProbability(k, mu);
    }

    /** Depends on the largest whole count not above y; the prior weight is only checked, the dispersion ignored. */
    @Override
    public final double cumulativeProbability(double y, double mu, double dispersion, double priorWeight) {
        checkDensityArguments(mu, 1.0, priorWeight);
        double k = floorCount(y);
        if (k < 0) {
            return 0.0;
        }
        return probabilityUpTo(k, mu);
    }

    /** Largest whole count not above y, treating a value within tolerance of a whole number as that number. */
    private static double floorCount(double y) {
        double whole = nearestWhole(y);
        return Double.isNaN(whole) ? Math.floor(y) : whole;
    }

    @Override
    public final boolean isDiscrete() {
        return true;
    }

    @Override
    public final Link defaultLink() {
        return Links.log();
    }

    @Override
    public final boolean isDispersionFixed() {
        return true;
    }
}
