package dev.reweigh.families;

/** Log-log: g(mu) = -log(-log(mu)), inverse exp(-exp(-eta)). */
final class LoglogLink extends AbstractLink {
    static final LoglogLink INSTANCE = new LoglogLink();

    private LoglogLink() {
        super("loglog");
    }

    @Override
    public double apply(double mu) {
        // For mu near 1, log(mu) = log1p(mu - 1) with mu - 1 exact.
        double logMu = mu > 0.5 ? Math.log1p(mu - 1.0) : Math.log(mu);
        return -Math.log(-logMu);
    }

    @Override
    public double inverse(double eta) {
        return Math.exp(-Math.exp(-eta));
    }

    @Override
    public double derivative(double eta) {
        return Math.exp(-eta - Math.exp(-eta));
    }
}
