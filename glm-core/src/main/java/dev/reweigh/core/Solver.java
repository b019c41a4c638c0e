package dev.reweigh.core;

/**
 * How each weighted least-squares step is solved.
 *
 * @since 0.1
 */
public enum Solver {
    /**
     * Chooses per fit: the pivoted QR route when the expanded model matrix has at most 250,000
     * entries (rows times columns); otherwise the Cholesky route, moving to pivoted QR when its
     * condition estimate exceeds 1e4 and the matrix has at most 2 million entries. Small and
     * ill-conditioned problems (such as the NIST reference problems) therefore get the accurate
     * route, large ones the fast route.
     *
     * @since 0.1
     */
    AUTO,
    /**
     * Householder QR of sqrt(W) X with column pivoting, unit-scaled columns and iterative
     * refinement in extended precision: accurate on ill-conditioned designs, needs the
     * expanded n x p model matrix.
     *
     * @since 0.1
     */
    PIVOTED_QR,
    /**
     * Cross-product matrix X'WX accumulated from the compact design, then Cholesky with a
     * relative pivot tolerance: fast and memory-light, loses accuracy on ill-conditioned designs.
     *
     * @since 0.1
     */
    CHOLESKY
}
