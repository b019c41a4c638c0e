package dev.reweigh.core.internal;

import java.util.List;

/**
 * What one IRLS fit produced. Arrays are owned by the result's receiver.
 */
public final class IrlsResult {
    /** Coefficients: NaN for aliased columns, 0 for columns that were not candidates. */
    public final double[] beta;
    /** True for columns that were candidates but found aliased. */
    public final boolean[] aliased;
    /** Linear predictor including the offset. */
    public final double[] eta;
    /** Fitted means. */
    public final double[] mu;
    /** Working weights at the final coefficients. */
    public final double[] workingWeights;
    /** (X'WX)^-1, NaN for aliased and non-candidate columns. */
    public final double[][] covariance;
    /** The deviance. */
    public final double deviance;
    /** Iterations run. */
    public final int iterations;
    /** Whether the convergence test was met. */
    public final boolean converged;
    /** Warnings in plain words. */
    public final List<String> warnings;
    /** The solver route that produced the final step ("pivoted QR" or "Cholesky"). */
    public final String route;

    IrlsResult(double[] beta, boolean[] aliased, double[] eta, double[] mu, double[] workingWeights,
            double[][] covariance, double deviance, int iterations, boolean converged, List<String> warnings,
            String route) {
        this.beta = beta;
        this.aliased = aliased;
        this.eta = eta;
        this.mu = mu;
        this.workingWeights = workingWeights;
        this.covariance = covariance;
        this.deviance = deviance;
        this.iterations = iterations;
        this.converged = converged;
        this.warnings = List.copyOf(warnings);
        this.route = route;
    }
}
