package dev.reweigh.families;

import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * Static factories and name lookup for links.
 *
 * <p>Every link has one canonical name, and {@link #byName(String)} of that name returns an equal
 * link. Links compare equal exactly when their names are equal. Power links with the exponents
 * 0, 1, 1/2, -1 and -2 are the log, identity, sqrt, inverse and inverse-squared links, so
 * {@code Links.power(-1.0)} equals {@code Links.inverse()} and is named "inverse".
 *
 * <pre>{@code
 * Link probit = Links.byName("probit");
 * Link cubeRoot = Links.power(1.0 / 3);         // name "power:0.3333333333333333"
 * double mu = probit.inverse(-37.0);            // about 5.7e-300, accurate to the last digits
 * }</pre>
 *
 * <p>No link clamps its results: means that are not representable in double precision round to
 * 0 or 1 (for the bounded links) or overflow (for the log link above eta = 709.78).
 *
 * @since 0.1
 */
public final class Links {
    private static final List<String> NAMES = List.of("identity", "log", "logit", "probit", "cloglog",
            "loglog", "cauchit", "inverse", "inverse-squared", "sqrt", "power:LAMBDA");

    private Links() {
    }

    /**
     * Returns the identity link g(mu) = mu, named "identity".
     *
     * @return the identity link
     * @since 0.1
     */
    public static Link identity() {
        return IdentityLink.INSTANCE;
    }

    /**
     * Returns the log link g(mu) = log(mu), named "log".
     *
     * @return the log link
     * @since 0.1
     */
    public static Link log() {
        return LogLink.INSTANCE;
    }

    /**
     * Returns the logit link g(mu) = log(mu / (1 - mu)), named "logit". Its inverse neither
     * overflows nor returns NaN for any finite eta.
     *
     * @return the logit link
     * @since 0.1
     */
    public static Link logit() {
        return LogitLink.INSTANCE;
    }

    /**
     * Returns the probit link, the standard normal quantile, named "probit". The inverse is
     * computed with the complementary error function in both tails and the link stays accurate
     * for means down to 1e-300.
     *
     * @return the probit link
     * @since 0.1
     */
    public static Link probit() {
        return ProbitLink.INSTANCE;
    }

    /**
     * Returns the complementary log-log link g(mu) = log(-log(1 - mu)), named "cloglog".
     *
     * @return the complementary log-log link
     * @since 0.1
     */
    public static Link cloglog() {
        return CloglogLink.INSTANCE;
    }

    /**
     * Returns the log-log link g(mu) = -log(-log(mu)), named "loglog".
     *
     * @return the log-log link
     * @since 0.1
     */
    public static Link loglog() {
        return LoglogLink.INSTANCE;
    }

    /**
     * Returns the cauchit link g(mu) = tan(pi (mu - 1/2)), the standard Cauchy quantile, named
     * "cauchit".
     *
     * @return the cauchit link
     * @since 0.1
     */
    public static Link cauchit() {
        return CauchitLink.INSTANCE;
    }

    /**
     * Returns the inverse link g(mu) = 1 / mu, named "inverse"; eta must be positive.
     *
     * @return the inverse link
     * @since 0.1
     */
    public static Link inverse() {
        return PowerLink.INVERSE;
    }

    /**
     * Returns the inverse-squared link g(mu) = 1 / mu^2, named "inverse-squared"; eta must be
     * positive.
     *
     * @return the inverse-squared link
     * @since 0.1
     */
    public static Link inverseSquared() {
        return PowerLink.INVERSE_SQUARED;
    }

    /**
     * Returns the square-root link g(mu) = sqrt(mu), named "sqrt"; eta must be non-negative.
     *
     * @return the square-root link
     * @since 0.1
     */
    public static Link sqrt() {
        return PowerLink.SQRT;
    }

    /**
     * Returns the power link g(mu) = mu^lambda, or the log link for lambda = 0. The exponents 0,
     * 1, 0.5, -1 and -2 return the log, identity, sqrt, inverse and inverse-squared links; any
     * other exponent gives a link named "power:LAMBDA" with LAMBDA in the shortest decimal form
     * that reads back to the same double (e.g. "power:0.25").
     *
     * @param lambda the exponent, finite
     * @return the power link
     * @throws ReweighException when lambda is NaN or infinite
     * @since 0.1
     */
    public static Link power(double lambda) {
        if (!Double.isFinite(lambda)) {
            throw new ReweighException("power link exponent " + lambda + " is not valid; expected a finite number"
                    + " (0 is the log link)");
        }
        if (lambda == 0.0) {
            return log();
        }
        if (lambda == 1.0) {
            return identity();
        }
        if (lambda == 0.5) {
            return sqrt();
        }
        if (lambda == -1.0) {
            return inverse();
        }
        if (lambda == -2.0) {
            return inverseSquared();
        }
        return PowerLink.general(lambda);
    }

    /**
     * Looks a link up by name: "identity", "log", "logit", "probit", "cloglog", "loglog",
     * "cauchit", "inverse", "inverse-squared", "sqrt" or "power:LAMBDA" with LAMBDA a decimal
     * number. Surrounding blanks and letter case are ignored.
     *
     * @param name the link's name
     * @return the link; its {@link Link#name()} is the canonical form of the name
     * @throws UnknownNameException when no link has this name (the message lists the valid names)
     * @throws ReweighException when the exponent of "power:LAMBDA" is not a finite decimal number
     * @since 0.1
     */
    public static Link byName(String name) {
        Objects.requireNonNull(name, "name");
        String key = name.trim().toLowerCase(Locale.ROOT);
        switch (key) {
            case "identity":
                return identity();
            case "log":
                return log();
            case "logit":
                return logit();
            case "probit":
                return probit();
            case "cloglog":
                return cloglog();
            case "loglog":
                return loglog();
            case "cauchit":
                return cauchit();
            case "inverse":
                return inverse();
            case "inverse-squared":
                return inverseSquared();
            case "sqrt":
                return sqrt();
            default:
                break;
        }
        if (key.startsWith("power:")) {
            String text = key.substring("power:".length());
            double lambda = DoubleText.parse(text);
            if (!Double.isFinite(lambda)) {
                throw new ReweighException("link '" + name + "': exponent '" + text
                        + "' is not valid; expected power:LAMBDA with LAMBDA a finite decimal number, e.g. power:0.25");
            }
            return power(lambda);
        }
        throw new UnknownNameException("link", name, NAMES);
    }

    /**
     * Returns the link name patterns that {@link #byName(String)} accepts, LAMBDA standing for a
     * decimal number.
     *
     * @return an immutable list of name patterns
     * @since 0.1
     */
    public static List<String> names() {
        return NAMES;
    }

    /**
     * Returns the exponent lambda when the link is a member of the power family g(mu) = mu^lambda
     * (with lambda = 0 meaning the log link): identity 1, sqrt 0.5, inverse -1, inverse-squared
     * -2, log 0, power:LAMBDA its LAMBDA. Other links give an empty result.
     *
     * @param link a link
     * @return the power exponent, or empty for links outside the power family
     * @since 0.1
     */
    public static OptionalDouble powerExponent(Link link) {
        Objects.requireNonNull(link, "link");
        if (link instanceof PowerLink) {
            return OptionalDouble.of(((PowerLink) link).lambda());
        }
        if (link instanceof IdentityLink) {
            return OptionalDouble.of(1.0);
        }
        if (link instanceof LogLink) {
            return OptionalDouble.of(0.0);
        }
        return OptionalDouble.empty();
    }
}
