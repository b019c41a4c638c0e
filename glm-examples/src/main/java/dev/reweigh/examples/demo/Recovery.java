package dev.reweigh.examples.demo;

/**
 * One estimated coefficient beside its true simulated value.
 *
 * @since 0.1
 */
public final class Recovery {
    private final String model;
    private final String column;
    private final double estimate;
    private final double standardError;
    private final double truth;

    Recovery(String model, String column, double estimate, double standardError, double truth) {
        this.model = model;
        this.column = column;
        this.estimate = estimate;
        this.standardError = standardError;
        this.truth = truth;
    }

    /**
     * Returns which model the coefficient belongs to ("frequency" or "severity").
     *
     * @return the model name
     * @since 0.1
     */
    public String model() {
        return model;
    }

    /**
     * Returns the model column.
     *
     * @return the column name
     * @since 0.1
     */
    public String column() {
        return column;
    }

    /**
     * Returns the estimate.
     *
     * @return the estimated coefficient
     * @since 0.1
     */
    public double estimate() {
        return estimate;
    }

    /**
     * Returns the standard error of the estimate.
     *
     * @return the standard error
     * @since 0.1
     */
    public double standardError() {
        return standardError;
    }

    /**
     * Returns the true coefficient of the simulation.
     *
     * @return the true value
     * @since 0.1
     */
    public double truth() {
        return truth;
    }

    /**
     * Returns (estimate - truth) / standard error.
     *
     * @return the error in standard errors
     * @since 0.1
     */
    public double standardizedError() {
        return (estimate - truth) / standardError;
    }

    /**
     * Describes the row.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        return model + " " + column + ": estimate " + estimate + " (s.e. " + standardError + "), true " + truth;
    }
}
