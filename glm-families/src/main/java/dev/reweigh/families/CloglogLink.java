package dev.reweigh.families;

/**
 * Complementary log-log: g(mu) = log(-log(1 - mu)), inverse 1 - exp(-exp(eta)) evaluated as
 * -expm1(-exp(eta)) so that it equals exp(eta) to full precision in the lower tail.
 */
final class CloglogLink extends AbstractLink {
    static final CloglogLink INSTANCE = new CloglogLink();

    private CloglogLink() {
        super("cloglog");
    }

    @Override
    public double apply(double mu) {
        return Math.log(-Math.log1p(-mu));
    }

    @Override
    public double inverse(double eta) {
        return -Math.expm1(-Math.exp(eta));
    }

    @Override
    public double derivative(double eta) {
        // exp(eta) exp(-exp(eta)) = exp(eta - exp(eta)): one exponential, no overflow for large eta.
        return Math.exp(eta - Math.exp(eta));
    }
}
