package dev.reweigh.inference;

/**
 * The kinds of residual a {@link Residuals} object gives.
 *
 * @since 0.1
 */
public enum ResidualKind {
    /** y - mu. */
    RESPONSE,
    /** (y - mu) deta/dmu, the residual of the final weighted least-squares step. */
    WORKING,
    /** sqrt(w) (y - mu) / sqrt(V(mu)). */
    PEARSON,
    /** sign(y - mu) sqrt(w d(y, mu)). */
    DEVIANCE,
    /** sqrt(w) times the family's Anscombe residual. */
    ANSCOMBE,
    /** Pearson residual / sqrt(phi (1 - h)). */
    STANDARDIZED_PEARSON,
    /** Deviance residual / sqrt(phi (1 - h)). */
    STANDARDIZED_DEVIANCE,
    /** Randomized quantile residual: Phi^-1 of the (randomized, for discrete responses) distribution function at y. */
    RANDOMIZED_QUANTILE
}
