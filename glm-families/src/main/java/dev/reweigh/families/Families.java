package dev.reweigh.families;

import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * Static factories and name lookup for families.
 *
 * <p>Every family has one canonical name, and {@link #byName(String)} of that name returns an
 * equal family; families compare equal exactly when their names are equal. Numeric parameters are
 * written in the shortest decimal form that reads back to the same double, so
 * {@code Families.tweedie(1.5).name()} is "tweedie:1.5" and {@code Families.negativeBinomial(2)}
 * is "negative-binomial:2.0".
 *
 * <pre>{@code
 * Family frequency = Families.byName("negative-binomial:1.8");
 * Family purePremium = Families.tweedie(1.6);
 * double theta = Families.negativeBinomialTheta(frequency).getAsDouble();   // 1.8
 * double p = Families.variancePower(purePremium).getAsDouble();             // 1.6
 * }</pre>
 *
 * <p>Parameters are read back with {@link #variancePower(Family)} (for every family whose variance
 * function is a power of the mean) and {@link #negativeBinomialTheta(Family)}, rather than through
 * family-specific types, so that the {@link Family} interface stays the one public family type.
 *
 * @since 0.1
 */
public final class Families {
    private static final List<String> NAMES = List.of("gaussian", "binomial", "poisson", "gamma",
            "inverse-gaussian", "tweedie:P", "negative-binomial:THETA", "quasi:constant", "quasi:mu",
            "quasi:mu^2", "quasi:mu^3", "quasi:mu(1-mu)", "quasi:mu^P");
    private static final List<String> QUASI_VARIANCES = List.of("constant", "mu", "mu^2", "mu^3", "mu(1-mu)", "mu^P");

    private Families() {
    }

    /**
     * Returns the Gaussian (normal) family, named "gaussian": V(mu) = 1, default link identity;
     * a prior weight w divides the dispersion.
     *
     * @return the Gaussian family
     * @since 0.1
     */
    public static Family gaussian() {
        return GaussianFamily.INSTANCE;
    }

    /**
     * Returns the binomial family, named "binomial": the response is a proportion of successes,
     * the prior weight the number of trials; V(mu) = mu(1-mu), default link logit, dispersion
     * fixed at 1. When the prior weight is a whole number, the response times the weight must be
     * a whole number within a relative 1e-7; with a fractional weight any proportion in [0, 1] is
     * accepted and the density uses the continuous extension of the binomial coefficient.
     *
     * @return the binomial family
     * @since 0.1
     */
    public static Family binomial() {
        return BinomialFamily.INSTANCE;
    }

    /**
     * Returns the Poisson family, named "poisson": V(mu) = mu, default link log, dispersion fixed
     * at 1; a prior weight is a frequency weight. Counts must be whole within a relative 1e-7.
     *
     * @return the Poisson family
     * @since 0.1
     */
    public static Family poisson() {
        return PoissonFamily.INSTANCE;
    }

    /**
     * Returns the Gamma family, named "gamma": V(mu) = mu^2, default link inverse; a prior weight
     * w divides the dispersion.
     *
     * @return the Gamma family
     * @since 0.1
     */
    public static Family gamma() {
        return GammaFamily.INSTANCE;
    }

    /**
     * Returns the inverse Gaussian family, named "inverse-gaussian": V(mu) = mu^3, default link
     * inverse-squared; a prior weight w divides the dispersion.
     *
     * @return the inverse Gaussian family
     * @since 0.1
     */
    public static Family inverseGaussian() {
        return InverseGaussianFamily.INSTANCE;
    }

    /**
     * Returns the Tweedie family with variance power p: V(mu) = mu^p, default link power(1 - p).
     * For 1 &lt; p &lt; 2 it is the compound Poisson-Gamma distribution (non-negative, with an atom
     * at zero), named "tweedie:P"; p = 0, 1, 2 and 3 return the Gaussian, Poisson, Gamma and
     * inverse Gaussian families (named as such).
     *
     * @param p the variance power: 0, 1, 2, 3, or strictly between 1 and 2
     * @return the family
     * @throws ReweighException for any other power
     * @since 0.1
     */
    public static Family tweedie(double p) {
        if (p == 0.0) {
            return gaussian();
        }
        if (p == 1.0) {
            return poisson();
        }
        if (p == 2.0) {
            return gamma();
        }
        if (p == 3.0) {
            return inverseGaussian();
        }
        if (p > 1.0 && p < 2.0) {
            return new TweedieFamily(p);
        }
        throw new ReweighException("Tweedie power " + p + " is not valid; expected a number strictly between 1 and 2"
                + " (compound Poisson-Gamma), or 0, 1, 2, 3 (gaussian, poisson, gamma, inverse-gaussian);"
                + " for other powers use a quasi family quasi:mu^P");
    }

    /**
     * Returns the negative binomial family with shape theta, named "negative-binomial:THETA":
     * V(mu) = mu + mu^2 / theta, default link log (not the canonical link, which depends on
     * theta), dispersion fixed at 1; a prior weight is a frequency weight.
     *
     * @param theta the shape, positive and finite (large theta approaches the Poisson family)
     * @return the family
     * @throws ReweighException when theta is not positive and finite
     * @since 0.1
     */
    public static Family negativeBinomial(double theta) {
        if (!(theta > 0.0) || theta == Double.POSITIVE_INFINITY) {
            throw new ReweighException("negative binomial theta " + theta
                    + " is not valid; expected a positive finite number");
        }
        return new NegativeBinomialFamily(theta);
    }

    /**
     * Returns a quasi-likelihood family with the given variance function, named
     * "quasi:VARIANCE". VARIANCE is one of "constant", "mu", "mu^2", "mu^3", "mu(1-mu)" or
     * "mu^P" with P a decimal number. The default link is identity, log, inverse,
     * inverse-squared, logit and power(1 - P) respectively. Quasi families have no density
     * ({@link Family#hasDensity()} is false) and their dispersion is estimated.
     *
     * @param variance the variance function's name
     * @return the quasi family
     * @throws UnknownNameException when the variance function is not one of those listed
     * @throws ReweighException when P in "mu^P" is not a finite decimal number
     * @since 0.1
     */
    public static Family quasi(String variance) {
        Objects.requireNonNull(variance, "variance");
        String key = variance.replace(" ", "").toLowerCase(Locale.ROOT);
        switch (key) {
            case "constant":
                return QuasiFamily.ofPower(0.0);
            case "mu":
                return QuasiFamily.ofPower(1.0);
            case "mu^2":
                return QuasiFamily.ofPower(2.0);
            case "mu^3":
                return QuasiFamily.ofPower(3.0);
            case "mu(1-mu)":
                return QuasiFamily.proportion();
            default:
                break;
        }
        if (key.startsWith("mu^")) {
            String text = key.substring("mu^".length());
            double p = DoubleText.parse(text);
            if (!Double.isFinite(p)) {
                throw new ReweighException("quasi variance '" + variance + "': power '" + text
                        + "' is not valid; expected mu^P with P a finite decimal number, e.g. mu^1.5");
            }
            return quasiPower(p);
        }
        throw new UnknownNameException("quasi variance", variance, QUASI_VARIANCES);
    }

    /**
     * Returns the quasi-likelihood family with V(mu) = mu^p, named "quasi:mu^P" (or
     * "quasi:constant", "quasi:mu", "quasi:mu^2", "quasi:mu^3" for p = 0, 1, 2, 3), default link
     * power(1 - p). Responses must be non-negative for p &lt; 2 and positive for p &gt;= 2 (any
     * finite number for p = 0).
     *
     * @param p the variance power, finite
     * @return the quasi family
     * @throws ReweighException when p is NaN or infinite
     * @since 0.1
     */
    public static Family quasiPower(double p) {
        if (!Double.isFinite(p)) {
            throw new ReweighException("quasi variance power " + p + " is not valid; expected a finite number");
        }
        return QuasiFamily.ofPower(p);
    }

    /**
     * Looks a family up by name: "gaussian", "binomial", "poisson", "gamma", "inverse-gaussian",
     * "tweedie:P", "negative-binomial:THETA" or "quasi:VARIANCE" (see {@link #quasi(String)}).
     * Surrounding blanks and letter case are ignored; the returned family's name is canonical
     * (so "tweedie:1.50" gives "tweedie:1.5" and "tweedie:2" gives "gamma").
     *
     * @param name the family's name
     * @return the family
     * @throws UnknownNameException when no family has this name (the message lists the valid names)
     * @throws ReweighException when a parameter is not a number or out of its range
     * @since 0.1
     */
    public static Family byName(String name) {
        Objects.requireNonNull(name, "name");
        String key = name.trim().toLowerCase(Locale.ROOT);
        switch (key) {
            case "gaussian":
                return gaussian();
            case "binomial":
                return binomial();
            case "poisson":
                return poisson();
            case "gamma":
                return gamma();
            case "inverse-gaussian":
                return inverseGaussian();
            default:
                break;
        }
        if (key.startsWith("tweedie:")) {
            return tweedie(parameter(name, key.substring("tweedie:".length()),
                    "tweedie:P with P strictly between 1 and 2 (or 0, 1, 2, 3), e.g. tweedie:1.5"));
        }
        if (key.startsWith("negative-binomial:")) {
            return negativeBinomial(parameter(name, key.substring("negative-binomial:".length()),
                    "negative-binomial:THETA with THETA a positive number, e.g. negative-binomial:2.0"));
        }
        if (key.startsWith("quasi:")) {
            try {
                return quasi(key.substring("quasi:".length()));
            } catch (UnknownNameException e) {
                throw new UnknownNameException("family", name, NAMES);
            }
        }
        throw new UnknownNameException("family", name, NAMES);
    }

    private static double parameter(String name, String text, String expected) {
        double value = DoubleText.parse(text);
        if (!Double.isFinite(value)) {
            throw new ReweighException("family '" + name + "': parameter '" + text + "' is not a finite decimal number;"
                    + " expected " + expected);
        }
        return value;
    }

    /**
     * Returns the family name patterns that {@link #byName(String)} accepts, P and THETA standing
     * for decimal numbers.
     *
     * @return an immutable list of name patterns
     * @since 0.1
     */
    public static List<String> names() {
        return NAMES;
    }

    /**
     * Returns the power p when the family's variance function is V(mu) = mu^p: gaussian 0,
     * poisson 1, gamma 2, inverse-gaussian 3, tweedie:P its P, and the quasi families with a
     * power variance (quasi:constant 0, quasi:mu 1, ..., quasi:mu^P its P). The binomial, negative
     * binomial and quasi:mu(1-mu) families give an empty result.
     *
     * @param family a family
     * @return the variance power, or empty when the variance is not a power of the mean
     * @since 0.1
     */
    public static OptionalDouble variancePower(Family family) {
        Objects.requireNonNull(family, "family");
        if (family instanceof GaussianFamily) {
            return OptionalDouble.of(0.0);
        }
        if (family instanceof PoissonFamily) {
            return OptionalDouble.of(1.0);
        }
        if (family instanceof GammaFamily) {
            return OptionalDouble.of(2.0);
        }
        if (family instanceof InverseGaussianFamily) {
            return OptionalDouble.of(3.0);
        }
        if (family instanceof TweedieFamily) {
            return OptionalDouble.of(((TweedieFamily) family).power());
        }
        if (family instanceof QuasiFamily && !Double.isNaN(((QuasiFamily) family).power())) {
            return OptionalDouble.of(((QuasiFamily) family).power());
        }
        return OptionalDouble.empty();
    }

    /**
     * Returns theta of a negative binomial family, empty for every other family.
     *
     * @param family a family
     * @return theta, or empty when the family is not negative binomial
     * @since 0.1
     */
    public static OptionalDouble negativeBinomialTheta(Family family) {
        Objects.requireNonNull(family, "family");
        if (family instanceof NegativeBinomialFamily) {
            return OptionalDouble.of(((NegativeBinomialFamily) family).theta());
        }
        return OptionalDouble.empty();
    }
}
