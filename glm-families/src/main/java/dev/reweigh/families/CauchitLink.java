package dev.reweigh.families;

/**
 * Cauchit: g(mu) = tan(pi (mu - 1/2)), the standard Cauchy quantile. Both directions switch to
 * cotangent and arctangent forms away from the centre so that tail means keep their relative
 * precision (a direct 1/2 + atan(eta)/pi loses every digit for eta = -1e10).
 */
final class CauchitLink extends AbstractLink {
    static final CauchitLink INSTANCE = new CauchitLink();

    private CauchitLink() {
        super("cauchit");
    }

    @Override
    public double apply(double mu) {
        if (mu < 0.25) {
            return -1.0 / Math.tan(Math.PI * mu);
        }
        if (mu > 0.75) {
            return 1.0 / Math.tan(Math.PI * (1.0 - mu));
        }
        return Math.tan(Math.PI * (mu - 0.5));
    }

    @Override
    public double inverse(double eta) {
        if (eta < -1.0) {
            return -Math.atan(1.0 / eta) / Math.PI;
        }
        if (eta > 1.0) {
            return 1.0 - Math.atan(1.0 / eta) / Math.PI;
        }
        return 0.5 + Math.atan(eta) / Math.PI;
    }

    @Override
    public double derivative(double eta) {
        if (Math.abs(eta) > 1e150) {
            // 1 + eta^2 would overflow; the true value is far below the smallest normal double here.
            return 1.0 / (Math.PI * eta) / eta;
        }
        return 1.0 / (Math.PI * (1.0 + eta * eta));
    }
}
