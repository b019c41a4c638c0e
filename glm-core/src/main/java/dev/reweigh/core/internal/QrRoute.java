package dev.reweigh.core.internal;

/** Placeholder until the pivoted-QR route lands: delegates to the Cholesky route. */
final class QrRoute implements WlsRoute {
    private final CholeskyRoute delegate;

    QrRoute(DesignMatrix x, double rankTolerance) {
        delegate = new CholeskyRoute(x, CrossProducts.accumulator(1), rankTolerance);
    }

    void setExcluded(boolean[] ex) {
        delegate.setExcluded(ex);
    }

    @Override
    public boolean[] decideExcluded(double[] w, boolean[] candidates) {
        return delegate.decideExcluded(w, candidates);
    }

    @Override
    public boolean solve(double[] w, double[] z, double[] beta) {
        return delegate.solve(w, z, beta);
    }

    @Override
    public double[][] covariance(double[] w) {
        return delegate.covariance(w);
    }

    @Override
    public double conditionEstimate() {
        return delegate.conditionEstimate();
    }
}
