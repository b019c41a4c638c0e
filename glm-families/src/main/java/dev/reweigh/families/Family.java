package dev.reweigh.families;

/**
 * An exponential-dispersion family (or a quasi-likelihood family) for the response of a
 * generalized linear model.
 *
 * <p>Prior weights: for the binomial family the prior weight is the number of trials and the
 * response a proportion; for the discrete count families (Poisson, negative binomial) a prior
 * weight is a frequency weight, multiplying the log-density; for the continuous families a prior
 * weight divides the dispersion (the row's dispersion is phi / w).
 *
 * <pre>{@code
 * Family poisson = Families.poisson();
 * double d  = poisson.unitDeviance(3, 2.5);                 // 2 [y log(y/mu) - (y - mu)]
 * double lf = poisson.logDensity(3, 2.5, 1.0, 1.0);          // log P(Y = 3) when mu = 2.5
 * }</pre>
 *
 * @since 0.1
 */
public interface Family {

    /**
     * Returns the name this family is looked up by in {@link Families#byName(String)}, e.g.
     * "gamma", "tweedie:1.5" or "negative-binomial:2.0". Names are canonical: numbers are written
     * in the shortest decimal form that reads back to the same double, and two families are equal
     * exactly when their names are.
     *
     * @return the canonical name
     * @since 0.1
     */
    String name();

    /**
     * Returns the variance function V(mu); the response's variance is phi V(mu) / w.
     *
     * @param mu a valid mean
     * @return V(mu), positive on the mean domain
     * @since 0.1
     */
    double variance(double mu);

    /**
     * Returns the unit deviance d(y, mu): non-negative, zero exactly when y equals mu. It keeps
     * its relative accuracy when y is close to mu and at the boundary y = 0. It does not check
     * its arguments (it sits on the fitting loop's hot path): the caller passes a valid response
     * and a valid mean.
     *
     * @param y a valid response
     * @param mu a valid mean
     * @return the unit deviance
     * @since 0.1
     */
    double unitDeviance(double y, double mu);

    /**
     * Tells whether y is a valid response for a row with the given prior weight (for the
     * binomial family the weight is the number of trials and y times the weight must be a whole
     * number of successes).
     *
     * @param y the response
     * @param priorWeight the row's prior weight
     * @return true when the response is in the family's domain
     * @since 0.1
     */
    boolean isValidResponse(double y, double priorWeight);

    /**
     * Describes the valid responses in words, for messages.
     *
     * @return e.g. "a non-negative whole number" or "a positive finite number"
     * @since 0.1
     */
    String responseDomain();

    /**
     * Tells whether mu is a valid mean (strictly inside the family's mean domain).
     *
     * @param mu a mean
     * @return true when V(mu) and the unit deviance are defined and finite
     * @since 0.1
     */
    boolean isValidMean(double mu);

    /**
     * Describes the valid means in words, for messages.
     *
     * @return e.g. "a positive number"
     * @since 0.1
     */
    String meanDomain();

    /**
     * Returns a starting mean for the iterative fit, from one row's response and prior weight. It
     * is always a valid mean, even for a response on the domain's boundary (a zero count, a
     * proportion of 0 or 1).
     *
     * @param y the row's response
     * @param priorWeight the row's prior weight
     * @return a valid starting mean
     * @since 0.1
     */
    double startingMean(double y, double priorWeight);

    /**
     * Tells whether the family has a density, so that log-likelihoods, AIC and BIC exist. The
     * quasi-likelihood families have none.
     *
     * @return true when {@link #logDensity(double, double, double, double)} is defined
     * @since 0.1
     */
    boolean hasDensity();

    /**
     * Returns the log of the density (or probability mass) of y given the mean, the dispersion and
     * the row's prior weight; see the class comment for how each family uses the weight.
     *
     * @param y the response
     * @param mu the mean
     * @param dispersion phi, positive (ignored by families whose dispersion is fixed at 1)
     * @param priorWeight the row's prior weight, positive
     * @return the log-density, possibly negative infinity where the density is 0 (a response
     *     outside the family's support)
     * @throws NoLikelihoodException when the family has no density
     * @throws ReweighException when the mean is not valid or the dispersion or prior weight is not
     *     positive and finite
     * @since 0.1
     */
    double logDensity(double y, double mu, double dispersion, double priorWeight);

    /**
     * Returns the distribution function P(Y &lt;= y), used for randomized quantile residuals. For
     * the discrete families P(Y &lt; y) is the value one step below: at y - 1 for counts, at
     * y - 1/w for a binomial proportion out of w trials. For the count families a prior weight is
     * a frequency weight and does not change the distribution of one observation.
     *
     * @param y the response
     * @param mu the mean
     * @param dispersion phi, positive
     * @param priorWeight the row's prior weight, positive
     * @return the probability P(Y &lt;= y)
     * @throws NoLikelihoodException when the family has no density
     * @throws ReweighException when the mean is not valid or the dispersion or prior weight is not
     *     positive and finite
     * @since 0.1
     */
    double cumulativeProbability(double y, double mu, double dispersion, double priorWeight);

    /**
     * Tells whether the response is discrete (binomial, Poisson, negative binomial), so that a
     * randomized quantile residual must draw uniformly between P(Y &lt; y) and P(Y &lt;= y).
     * The Tweedie family with 1 &lt; p &lt; 2 is continuous with an atom at zero; it reports false
     * and {@link #cumulativeProbability(double, double, double, double)} includes the atom.
     *
     * @return true for families whose response is a count or a count proportion
     * @since 0.1
     */
    boolean isDiscrete();

    /**
     * Returns the Anscombe residual of one observation at unit weight and unit dispersion:
     * (A(y) - A(mu)) / (A'(mu) sqrt(V(mu))) with A' = V^(-1/3).
     *
     * @param y the response
     * @param mu the mean
     * @return the Anscombe residual
     * @since 0.1
     */
    double anscombeResidual(double y, double mu);

    /**
     * Returns the family's default link: the canonical link, except for the negative binomial
     * family, whose canonical link depends on theta and whose default is log.
     *
     * @return the default link
     * @since 0.1
     */
    Link defaultLink();

    /**
     * Tells whether the dispersion is fixed at 1 (binomial, Poisson, negative binomial) rather
     * than estimated.
     *
     * @return true when phi = 1 by definition
     * @since 0.1
     */
    boolean isDispersionFixed();
}
