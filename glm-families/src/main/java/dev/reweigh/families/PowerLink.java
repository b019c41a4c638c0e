package dev.reweigh.families;

/**
 * Power link g(mu) = mu^lambda for lambda other than 0 and 1 (which are the log and identity
 * links). The exponents -1, -2 and 1/2 carry their own names (inverse, inverse-squared, sqrt) and
 * exact formulas. The mean must be positive, so eta must be positive (for sqrt: non-negative).
 */
final class PowerLink extends AbstractLink {
    static final PowerLink INVERSE = new PowerLink(-1.0, "inverse");
    static final PowerLink INVERSE_SQUARED = new PowerLink(-2.0, "inverse-squared");
    static final PowerLink SQRT = new PowerLink(0.5, "sqrt");

    private final double lambda;
    private final double reciprocal;

    private PowerLink(double lambda, String name) {
        super(name);
        this.lambda = lambda;
        this.reciprocal = 1.0 / lambda;
    }

    /** A power link whose exponent has no special name. */
    static PowerLink general(double lambda) {
        return new PowerLink(lambda, "power:" + DoubleText.format(lambda));
    }

    double lambda() {
        return lambda;
    }

    @Override
    public double apply(double mu) {
        if (lambda == -1.0) {
            return 1.0 / mu;
        }
        if (lambda == -2.0) {
            return 1.0 / (mu * mu);
        }
        if (lambda == 0.5) {
            return Math.sqrt(mu);
        }
        return Math.pow(mu, lambda);
    }

    @Override
    public double inverse(double eta) {
        if (lambda == -1.0) {
            return 1.0 / eta;
        }
        if (lambda == -2.0) {
            return 1.0 / Math.sqrt(eta);
        }
        if (lambda == 0.5) {
            return eta * eta;
        }
        return Math.pow(eta, reciprocal);
    }

    @Override
    public double derivative(double eta) {
        if (lambda == -1.0) {
            return -1.0 / (eta * eta);
        }
        if (lambda == -2.0) {
            return -0.5 / (eta * Math.sqrt(eta));
        }
        if (lambda == 0.5) {
            return 2.0 * eta;
        }
        return reciprocal * Math.pow(eta, reciprocal - 1.0);
    }

    @Override
    public boolean isValidEta(double eta) {
        if (!Double.isFinite(eta)) {
            return false;
        }
        boolean inDomain = lambda == 0.5 ? eta >= 0 : eta > 0;
        return inDomain && Double.isFinite(inverse(eta));
    }

    @Override
    public String etaDomain() {
        return lambda == 0.5
                ? "a non-negative finite number"
                : "a positive finite number (whose mean eta^(1/lambda) does not overflow)";
    }
}
