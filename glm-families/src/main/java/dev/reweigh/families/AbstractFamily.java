package dev.reweigh.families;

/** Shared identity and argument checks of the families: equal when their names are equal. */
abstract class AbstractFamily implements Family {
    /** Relative tolerance for a count (or a proportion times trials) to count as a whole number. */
    static final double WHOLE_TOLERANCE = 1e-7;

    private final String name;

    AbstractFamily(String name) {
        this.name = name;
    }

    @Override
    public final String name() {
        return name;
    }

    /** Describes the variance function in words, for toString. */
    abstract String varianceText();

    @Override
    public final boolean equals(Object other) {
        return other instanceof Family && ((Family) other).name().equals(name);
    }

    @Override
    public final int hashCode() {
        return name.hashCode();
    }

    @Override
    public final String toString() {
        return "Family[" + name + ", variance " + varianceText() + ", default link " + defaultLink().name()
                + (isDispersionFixed() ? ", dispersion fixed at 1" : ", dispersion estimated")
                + (hasDensity() ? "" : ", no density") + "]";
    }

    /**
     * Returns the nearest whole number when x is one within {@link #WHOLE_TOLERANCE} relative
     * (absolute below 1), else NaN.
     */
    static double nearestWhole(double x) {
        double r = Math.rint(x);
        return Math.abs(x - r) <= WHOLE_TOLERANCE * Math.max(1.0, Math.abs(x)) ? r : Double.NaN;
    }

    static boolean isWhole(double x) {
        return Double.isFinite(x) && !Double.isNaN(nearestWhole(x));
    }

    /** Checks the arguments of a density or distribution function that are not the response. */
    final void checkDensityArguments(double mu, double dispersion, double priorWeight) {
        if (!isValidMean(mu)) {
            throw new ReweighException("family '" + name + "': mean " + mu + " is not valid; expected " + meanDomain());
        }
        if (!(dispersion > 0) || !Double.isFinite(dispersion)) {
            throw new ReweighException("family '" + name + "': dispersion " + dispersion
                    + " is not valid; expected a positive finite number");
        }
        if (!(priorWeight > 0) || !Double.isFinite(priorWeight)) {
            throw new ReweighException("family '" + name + "': prior weight " + priorWeight
                    + " is not valid; expected a positive finite number");
        }
    }
}
