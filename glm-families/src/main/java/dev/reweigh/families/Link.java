package dev.reweigh.families;

/**
 * A link function g relating the mean mu of the response to the linear predictor eta = g(mu).
 *
 * <p>Implementations are immutable and thread-safe and stay accurate in the tails: the inverse
 * never overflows and never returns NaN for an eta inside {@link #isValidEta(double)}.
 *
 * <pre>{@code
 * Link logit = Links.logit();
 * double mu = logit.inverse(-700.0);      // about 9.9e-305, not 0 and not NaN
 * double slope = logit.derivative(0.0);   // 0.25
 * }</pre>
 *
 * @since 0.1
 */
public interface Link {

    /**
     * Returns the name this link is looked up by in {@link Links#byName(String)}, e.g. "log" or
     * "power:0.25" (the exponents 0, 1, 1/2, -1 and -2 have their own names).
     *
     * @return the canonical name
     * @since 0.1
     */
    String name();

    /**
     * Applies the link: eta = g(mu).
     *
     * @param mu a mean
     * @return the linear predictor
     * @since 0.1
     */
    double apply(double mu);

    /**
     * Applies the inverse link: mu = g^-1(eta).
     *
     * @param eta a linear predictor
     * @return the mean
     * @since 0.1
     */
    double inverse(double eta);

    /**
     * Returns dmu/deta at eta, the derivative of the inverse link.
     *
     * @param eta a linear predictor
     * @return the derivative of the mean with respect to eta
     * @since 0.1
     */
    double derivative(double eta);

    /**
     * Tells whether eta lies in the link's valid domain (for example eta &gt; 0 for the inverse
     * link, where the mean must be positive).
     *
     * @param eta a linear predictor
     * @return true when g^-1(eta) is defined and finite
     * @since 0.1
     */
    boolean isValidEta(double eta);

    /**
     * Describes the valid eta domain in words, for messages.
     *
     * @return e.g. "any finite number" or "a positive number"
     * @since 0.1
     */
    String etaDomain();
}
