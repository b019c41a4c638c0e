package dev.reweigh.families;

/** g(mu) = log(mu). */
final class LogLink extends AbstractLink {
    static final LogLink INSTANCE = new LogLink();
    /** Above this eta the mean overflows to infinity. */
    static final double MAX_ETA = Math.log(Double.MAX_VALUE);

    private LogLink() {
        super("log");
    }

    @Override
    public double apply(double mu) {
        return Math.log(mu);
    }

    @Override
    public double inverse(double eta) {
        return Math.exp(eta);
    }

    @Override
    public double derivative(double eta) {
        return Math.exp(eta);
    }

    @Override
    public boolean isValidEta(double eta) {
        return Double.isFinite(eta) && eta <= MAX_ETA;
    }

    @Override
    public String etaDomain() {
        return "a finite number at most log(Double.MAX_VALUE) = 709.78 (beyond it the mean overflows)";
    }
}
