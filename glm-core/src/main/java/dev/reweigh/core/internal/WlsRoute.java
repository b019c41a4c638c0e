package dev.reweigh.core.internal;

/**
 * One way of solving the weighted least-squares step min || sqrt(W) (z - X b) || over the
 * columns that are not excluded. A route is created per fit and is not thread-safe.
 */
interface WlsRoute {

    /**
     * Decides which of the candidate columns are aliased, from the weights of the first
     * iteration: a column is aliased when its weighted, unit-length version has a part not
     * explained by the EARLIER kept columns shorter than the rank tolerance (so of two collinear
     * columns the later one in model order is aliased). Called once; the decision is then held.
     *
     * @param w the working weights
     * @param z the working response of the same iteration (a route may keep its factorization for
     *     the {@link #solve} that follows with the same arrays)
     * @param candidates true for the columns that may enter (not fixed)
     * @return true for each column that is aliased or not a candidate
     */
    boolean[] decideExcluded(double[] w, double[] z, boolean[] candidates);

    /**
     * Solves the step over the kept columns.
     *
     * @param w working weights
     * @param z working response
     * @param beta receives the coefficients (0 for excluded columns)
     * @return false when the step could not be solved (numerical breakdown)
     */
    boolean solve(double[] w, double[] z, double[] beta);

    /**
     * Returns (X'WX)^-1 over the kept columns, p x p, with NaN rows and columns for aliased or
     * excluded columns.
     *
     * @param w the working weights at convergence
     * @param scratch an array of n entries the route may overwrite (it saves an allocation)
     * @return the unscaled covariance
     */
    double[][] covariance(double[] w, double[] scratch);

    /**
     * Returns a condition estimate of the last solved step (ratio of the extreme pivots of the
     * unit-scaled problem), for the automatic choice.
     *
     * @return an estimate of the 2-norm condition number, at least 1
     */
    double conditionEstimate();
}
