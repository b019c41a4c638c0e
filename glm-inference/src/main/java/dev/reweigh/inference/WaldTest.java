package dev.reweigh.inference;

import dev.reweigh.inference.internal.TextTable;

/**
 * A joint Wald test of the linear hypothesis L beta = c. With a known or fixed dispersion the
 * statistic W = (L b - c)' (L V L')^-1 (L b - c) is referred to chi-square with q = rows of L
 * degrees of freedom; with an estimated dispersion W / q is referred to F(q, residual df).
 *
 * @since 0.1
 */
public final class WaldTest {
    private final String hypothesis;
    private final double statistic;
    private final int numeratorDf;
    private final int denominatorDf;
    private final ReferenceDistribution reference;
    private final double pValue;

    WaldTest(String hypothesis, double statistic, int numeratorDf, int denominatorDf,
             ReferenceDistribution reference, double pValue) {
        this.hypothesis = hypothesis;
        this.statistic = statistic;
        this.numeratorDf = numeratorDf;
        this.denominatorDf = denominatorDf;
        this.reference = reference;
        this.pValue = pValue;
    }

    /**
     * Returns a short description of the hypothesis.
     *
     * @return e.g. "region=North = 0, region=South = 0"
     * @since 0.1
     */
    public String hypothesis() {
        return hypothesis;
    }

    /**
     * Returns the statistic: W for a chi-square reference, W / q for an F reference.
     *
     * @return the statistic
     * @since 0.1
     */
    public double statistic() {
        return statistic;
    }

    /**
     * Returns q, the number of constraints.
     *
     * @return the numerator degrees of freedom
     * @since 0.1
     */
    public int numeratorDf() {
        return numeratorDf;
    }

    /**
     * Returns the residual degrees of freedom of an F reference.
     *
     * @return the denominator degrees of freedom, 0 for a chi-square reference
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
        return "Wald test of " + hypothesis + ": statistic " + TextTable.number(statistic) + " against "
                + reference.withDf(numeratorDf, denominatorDf) + ", p-value " + TextTable.probability(pValue);
    }
}
