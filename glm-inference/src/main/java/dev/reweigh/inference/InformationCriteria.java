package dev.reweigh.inference;

import dev.reweigh.inference.internal.TextTable;

/**
 * The exact log-likelihood of a fitted model at its maximum-likelihood dispersion, and the
 * information criteria built on it. The parameter count is the rank plus one when the family's
 * dispersion is free (it is then estimated).
 *
 * <ul>
 * <li>AIC = -2 l + 2 k</li>
 * <li>AICc = AIC + 2 k (k + 1) / (n - k - 1), positive infinity when n &lt;= k + 1</li>
 * <li>BIC = -2 l + k log n</li>
 * </ul>
 * where n counts the rows with a positive prior weight.
 *
 * @since 0.1
 */
public final class InformationCriteria {
    private final double logLikelihood;
    private final int parameters;
    private final int observations;
    private final double dispersion;

    private InformationCriteria(double logLikelihood, int parameters, int observations, double dispersion) {
        this.logLikelihood = logLikelihood;
        this.parameters = parameters;
        this.observations = observations;
        this.dispersion = dispersion;
    }

    static InformationCriteria of(double logLikelihood, int parameters, int observations, double dispersion) {
        return new InformationCriteria(logLikelihood, parameters, observations, dispersion);
    }

    /**
     * Returns the log-likelihood, the sum of the family's log-densities with prior weights.
     *
     * @return l
     * @since 0.1
     */
    public double logLikelihood() {
        return logLikelihood;
    }

    /**
     * Returns the number of parameters counted: the rank, plus one for an estimated dispersion
     * (plus one for an estimated negative binomial theta or Tweedie power where that applies).
     *
     * @return k
     * @since 0.1
     */
    public int parameters() {
        return parameters;
    }

    /**
     * Returns the number of observations: rows with a positive prior weight.
     *
     * @return n
     * @since 0.1
     */
    public int observations() {
        return observations;
    }

    /**
     * Returns the dispersion the log-likelihood was evaluated at (1 for fixed-dispersion families).
     *
     * @return phi
     * @since 0.1
     */
    public double dispersion() {
        return dispersion;
    }

    /**
     * Returns Akaike's information criterion.
     *
     * @return -2 l + 2 k
     * @since 0.1
     */
    public double aic() {
        return -2 * logLikelihood + 2.0 * parameters;
    }

    /**
     * Returns AIC with the small-sample correction.
     *
     * @return AIC + 2k(k+1)/(n-k-1), or positive infinity when n &lt;= k + 1
     * @since 0.1
     */
    public double aicc() {
        double denominator = observations - parameters - 1.0;
        if (denominator <= 0) {
            return Double.POSITIVE_INFINITY;
        }
        return aic() + 2.0 * parameters * (parameters + 1.0) / denominator;
    }

    /**
     * Returns the Bayesian (Schwarz) information criterion.
     *
     * @return -2 l + k log n
     * @since 0.1
     */
    public double bic() {
        return -2 * logLikelihood + parameters * Math.log(observations);
    }

    /**
     * Returns the value of the given criterion.
     *
     * @param criterion which one
     * @return its value
     * @since 0.1
     */
    public double value(Criterion criterion) {
        switch (criterion) {
            case AIC:
                return aic();
            case AICC:
                return aicc();
            default:
                return bic();
        }
    }

    /**
     * Describes the criteria in one line.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        return "log-likelihood " + TextTable.number(logLikelihood) + " with " + parameters + " parameters on "
                + observations + " rows: AIC " + TextTable.number(aic()) + ", AICc " + TextTable.number(aicc())
                + ", BIC " + TextTable.number(bic());
    }
}
