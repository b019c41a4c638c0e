package dev.reweigh.inference;

import dev.reweigh.inference.internal.TextTable;

/**
 * A likelihood-ratio test of a smaller model nested in a larger one, fitted to the same rows with
 * the same family and link. With a fixed or known dispersion the statistic is the deviance
 * difference over phi, referred to chi-square with the difference in residual degrees of freedom;
 * with an estimated dispersion (from the larger model) it is that difference over (phi times the
 * df difference), referred to F with the larger model's residual degrees of freedom.
 *
 * @since 0.1
 */
public final class LikelihoodRatioTest {
    private final double smallerDeviance;
    private final double largerDeviance;
    private final int dfDifference;
    private final double dispersion;
    private final double statistic;
    private final int denominatorDf;
    private final ReferenceDistribution reference;
    private final double pValue;

    LikelihoodRatioTest(double smallerDeviance, double largerDeviance, int dfDifference, double dispersion,
                        double statistic, int denominatorDf, ReferenceDistribution reference, double pValue) {
        this.smallerDeviance = smallerDeviance;
        this.largerDeviance = largerDeviance;
        this.dfDifference = dfDifference;
        this.dispersion = dispersion;
        this.statistic = statistic;
        this.denominatorDf = denominatorDf;
        this.reference = reference;
        this.pValue = pValue;
    }

    /**
     * Returns the deviance of the smaller model.
     *
     * @return the deviance
     * @since 0.1
     */
    public double smallerDeviance() {
        return smallerDeviance;
    }

    /**
     * Returns the deviance of the larger model.
     *
     * @return the deviance
     * @since 0.1
     */
    public double largerDeviance() {
        return largerDeviance;
    }

    /**
     * Returns the smaller model's deviance minus the larger model's.
     *
     * @return the deviance difference
     * @since 0.1
     */
    public double devianceDifference() {
        return smallerDeviance - largerDeviance;
    }

    /**
     * Returns the difference in residual degrees of freedom.
     *
     * @return the degrees of freedom of the test
     * @since 0.1
     */
    public int dfDifference() {
        return dfDifference;
    }

    /**
     * Returns the dispersion the deviance difference was divided by.
     *
     * @return phi
     * @since 0.1
     */
    public double dispersion() {
        return dispersion;
    }

    /**
     * Returns the statistic: chi-square or F, see the class comment.
     *
     * @return the statistic
     * @since 0.1
     */
    public double statistic() {
        return statistic;
    }

    /**
     * Returns the denominator degrees of freedom of an F reference.
     *
     * @return the larger model's residual df, or 0 for a chi-square reference
     * @since 0.1
     */
    public int denominatorDf() {
        return denominatorDf;
    }

    /**
     * Returns the reference distribution.
     *
     * @return CHI_SQUARED or F
     * @since 0.1
     */
    public ReferenceDistribution reference() {
        return reference;
    }

    /**
     * Returns the upper-tail p-value.
     *
     * @return the p-value
     * @since 0.1
     */
    public double pValue() {
        return pValue;
    }

    /**
     * Describes the test in one line.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        return "likelihood-ratio test: deviance falls from " + TextTable.number(smallerDeviance) + " to "
                + TextTable.number(largerDeviance) + " for " + dfDifference + " df; statistic "
                + TextTable.number(statistic) + " against " + reference.withDf(dfDifference, denominatorDf)
                + ", p-value " + TextTable.probability(pValue);
    }
}
