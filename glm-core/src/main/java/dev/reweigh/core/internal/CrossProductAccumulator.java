package dev.reweigh.core.internal;

/**
 * Accumulates the weighted cross products X'WX and X'Wz of a {@link DesignMatrix}: the hot path of
 * the Cholesky route. One interface so that faster (blocked, multithreaded, bit-reproducible)
 * implementations can replace the simple one; {@link CrossProducts#accumulator(int)} is the single
 * place that chooses.
 */
public interface CrossProductAccumulator {
    /**
     * Computes gram = X'WX (p x p, row-major, both triangles filled) and xtwz = X'Wz.
     *
     * @param x the design
     * @param w the working weights (length n, non-negative)
     * @param z the working response (length n)
     * @param gram receives X'WX (length at least p * p; overwritten)
     * @param xtwz receives X'Wz (length at least p; overwritten)
     */
    void accumulate(DesignMatrix x, double[] w, double[] z, double[] gram, double[] xtwz);
}
