package dev.reweigh.families;

/** g(mu) = mu. */
final class IdentityLink extends AbstractLink {
    static final IdentityLink INSTANCE = new IdentityLink();

    private IdentityLink() {
        super("identity");
    }

    @Override
    public double apply(double mu) {
        return mu;
    }

    @Override
    public double inverse(double eta) {
        return eta;
    }

    @Override
    public double derivative(double eta) {
        return 1.0;
    }
}
