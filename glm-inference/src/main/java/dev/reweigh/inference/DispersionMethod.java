package dev.reweigh.inference;

/**
 * How the dispersion phi used by the inference is obtained.
 *
 * <p>Binomial, Poisson and negative binomial families fix phi at 1; asking them for
 * {@link #PEARSON} or {@link #DEVIANCE} gives a quasi-likelihood estimate instead. Families with
 * a free dispersion default to {@link #PEARSON}.
 *
 * @since 0.1
 */
public enum DispersionMethod {
    /** phi = 1, as the binomial, Poisson and negative binomial families define it. */
    FAMILY_FIXED,
    /** A value supplied by the caller, treated as known (see Inference.withKnownDispersion). */
    KNOWN,
    /** Pearson chi-square over the residual degrees of freedom, X^2 / (n - p). */
    PEARSON,
    /** Deviance over the residual degrees of freedom, D / (n - p). */
    DEVIANCE,
    /** The value maximising the likelihood at the fitted means (needs a family with a density). */
    MAXIMUM_LIKELIHOOD
}
