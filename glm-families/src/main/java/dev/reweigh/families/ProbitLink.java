package dev.reweigh.families;

/**
 * g(mu) = Phi^-1(mu), the standard normal quantile. The inverse uses the complementary error
 * function in both tails; the link itself is accurate for mu down to the smallest doubles.
 */
final class ProbitLink extends AbstractLink {
    static final ProbitLink INSTANCE = new ProbitLink();

    private ProbitLink() {
        super("probit");
    }

    @Override
    public double apply(double mu) {
        return ProbabilityMath.normalQuantile(mu);
    }

    @Override
    public double inverse(double eta) {
        return ProbabilityMath.normalCdf(eta);
    }

    @Override
    public double derivative(double eta) {
        return ProbabilityMath.normalDensity(eta);
    }
}
