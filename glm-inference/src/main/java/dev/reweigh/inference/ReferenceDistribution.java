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
    F;

    /**
     * Names the reference of a joint test with its degrees of freedom, as the one-line
     * descriptions show it: "F(2, 30)" for F, "chi-square(2)" otherwise.
     */
    String withDf(int df, int denominatorDf) {
        return this == F ? "F(" + df + ", " + denominatorDf + ")" : "chi-square(" + df + ")";
    }
}
