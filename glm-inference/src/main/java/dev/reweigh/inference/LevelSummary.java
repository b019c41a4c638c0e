package dev.reweigh.inference;

/**
 * Observed and fitted mean and standard deviation of the response over the rows of one factor
 * level. See {@link GroupSummary} for the definitions.
 *
 * @since 0.1
 */
public final class LevelSummary {
    private final String level;
    private final int rows;
    private final double observedMean;
    private final double observedStandardDeviation;
    private final double fittedMean;
    private final double fittedStandardDeviation;

    LevelSummary(String level, int rows, double observedMean, double observedStandardDeviation, double fittedMean,
                 double fittedStandardDeviation) {
        this.level = level;
        this.rows = rows;
        this.observedMean = observedMean;
        this.observedStandardDeviation = observedStandardDeviation;
        this.fittedMean = fittedMean;
        this.fittedStandardDeviation = fittedStandardDeviation;
    }

    /**
     * Returns the factor level.
     *
     * @return the level
     * @since 0.1
     */
    public String level() {
        return level;
    }

    /**
     * Returns the number of fitted rows at this level.
     *
     * @return the row count
     * @since 0.1
     */
    public int rows() {
        return rows;
    }

    /**
     * Returns the mean of the responses at this level.
     *
     * @return the observed mean, NaN when the level has no fitted rows
     * @since 0.1
     */
    public double observedMean() {
        return observedMean;
    }

    /**
     * Returns the standard deviation (divisor n) of the responses at this level.
     *
     * @return the observed standard deviation, NaN when the level has no fitted rows
     * @since 0.1
     */
    public double observedStandardDeviation() {
        return observedStandardDeviation;
    }

    /**
     * Returns the mean of the fitted means at this level.
     *
     * @return the fitted mean, NaN when the level has no fitted rows
     * @since 0.1
     */
    public double fittedMean() {
        return fittedMean;
    }

    /**
     * Returns the model's standard deviation of a response drawn from a random row of this level:
     * the square root of the mean row variance phi V(mu_i) / w_i plus the spread of the mu_i.
     *
     * @return the fitted standard deviation, NaN when the level has no fitted rows
     * @since 0.1
     */
    public double fittedStandardDeviation() {
        return fittedStandardDeviation;
    }

    /**
     * Describes the level in one line.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        return level + ": " + rows + " rows, observed mean " + observedMean + " sd " + observedStandardDeviation
                + ", fitted mean " + fittedMean + " sd " + fittedStandardDeviation;
    }
}
