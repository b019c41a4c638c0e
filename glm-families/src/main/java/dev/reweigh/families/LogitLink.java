package dev.reweigh.families;

/**
 * g(mu) = log(mu / (1 - mu)). The inverse is evaluated as exp(eta) / (1 + exp(eta)) for negative
 * eta and 1 / (1 + exp(-eta)) otherwise, so nothing overflows; no clamping is applied (below about
 * eta = -745 the mean underflows to 0, above about eta = 37 it rounds to 1).
 */
final class LogitLink extends AbstractLink {
    static final LogitLink INSTANCE = new LogitLink();

    private LogitLink() {
        super("logit");
    }

    @Override
    public double apply(double mu) {
        if (mu < 0.5) {
            return Math.log(mu) - Math.log1p(-mu);
        }
        return Math.log(mu / (1.0 - mu));
    }

    @Override
    public double inverse(double eta) {
        if (eta < 0) {
            double e = Math.exp(eta);
            return e / (1.0 + e);
        }
        return 1.0 / (1.0 + Math.exp(-eta));
    }

    @Override
    public double derivative(double eta) {
        // mu (1 - mu) = e / (1 + e)^2 with e = exp(-|eta|): symmetric and overflow-free.
        double e = Math.exp(-Math.abs(eta));
        double onePlus = 1.0 + e;
        return e / (onePlus * onePlus);
    }
}
