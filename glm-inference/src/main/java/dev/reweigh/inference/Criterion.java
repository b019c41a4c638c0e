package dev.reweigh.inference;

/**
 * An information criterion to rank models by; smaller is better for each.
 *
 * @since 0.1
 */
public enum Criterion {
    /** Akaike's information criterion. */
    AIC,
    /** AIC with the small-sample correction. */
    AICC,
    /** The Bayesian (Schwarz) information criterion. */
    BIC
}
