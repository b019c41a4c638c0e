package dev.reweigh.inference;

/**
 * One line of a {@link DevianceTable}: the effect of adding one term to the terms before it.
 * The first line describes the starting (null) model and has no test.
 *
 * @since 0.1
 */
public final class DevianceStep {
    private final String term;
    private final int df;
    private final double devianceReduction;
    private final int residualDf;
    private final double residualDeviance;
    private final double statistic;
    private final double pValue;

    DevianceStep(String term, int df, double devianceReduction, int residualDf, double residualDeviance,
                 double statistic, double pValue) {
        this.term = term;
        this.df = df;
        this.devianceReduction = devianceReduction;
        this.residualDf = residualDf;
        this.residualDeviance = residualDeviance;
        this.statistic = statistic;
        this.pValue = pValue;
    }

    /**
     * Returns the term added at this step, or "null model" for the first line.
     *
     * @return the term label
     * @since 0.1
     */
    public String term() {
        return term;
    }

    /**
     * Returns the degrees of freedom the term uses (0 on the first line, or when every column of
     * the term is aliased).
     *
     * @return the df
     * @since 0.1
     */
    public int df() {
        return df;
    }

    /**
     * Returns the fall in deviance from adding the term (0 on the first line).
     *
     * @return the deviance reduction
     * @since 0.1
     */
    public double devianceReduction() {
        return devianceReduction;
    }

    /**
     * Returns the residual degrees of freedom after this step.
     *
     * @return the residual df
     * @since 0.1
     */
    public int residualDf() {
        return residualDf;
    }

    /**
     * Returns the deviance of the model with the terms up to this one.
     *
     * @return the deviance
     * @since 0.1
     */
    public double residualDeviance() {
        return residualDeviance;
    }

    /**
     * Returns the test statistic: reduction / phi (chi-square) or reduction / (df phi) (F).
     *
     * @return the statistic, NaN on the first line and when df is 0
     * @since 0.1
     */
    public double statistic() {
        return statistic;
    }

    /**
     * Returns the p-value of the statistic.
     *
     * @return the p-value, NaN on the first line and when df is 0
     * @since 0.1
     */
    public double pValue() {
        return pValue;
    }

    /**
     * Tells whether this line carries a test.
     *
     * @return false on the first line and when df is 0
     * @since 0.1
     */
    public boolean hasTest() {
        return df > 0;
    }

    /**
     * Describes the step in one line.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        return term + ": df " + df + ", deviance reduction " + devianceReduction + ", residual df " + residualDf
                + ", residual deviance " + residualDeviance + ", statistic " + statistic + ", p-value " + pValue;
    }
}
