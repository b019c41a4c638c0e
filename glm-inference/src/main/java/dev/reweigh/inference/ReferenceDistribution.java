package dev.reweigh.inference;

/**
 * The distribution a test statistic is referred to for its p-value.
 *
 * @since 0.1
 */
public enum ReferenceDistribution {
    /** Standard normal: Wald z statistics when the dispersion is known. */
    NORMAL,
    /** Student's t with the residual degrees of freedom: Wald statistics when the dispersion is estimated. */
    T,
    /** Chi-square: joint Wald and likelihood-ratio tests when the dispersion is known. */
    CHI_SQUARED,
    /** F: joint Wald and likelihood-ratio tests when the dispersion is estimated. */
    F
}
