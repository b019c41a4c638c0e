package dev.reweigh.families;

/**
 * A quantity that needs a likelihood was asked of a family that has none (the quasi-likelihood
 * families): a log-density, an exact log-likelihood, an information criterion.
 *
 * @since 0.1
 */
public class NoLikelihoodException extends ReweighException {
    private static final long serialVersionUID = 1L;

    /**
     * Creates the exception.
     *
     * @param familyName the family that has no density
     * @param what what was asked of it, e.g. "log-density"
     * @since 0.1
     */
    public NoLikelihoodException(String familyName, String what) {
        super("family '" + familyName + "' is a quasi-likelihood family with no density, so it has no "
                + what + "; use a family with a density (e.g. poisson, gamma, tweedie:P)");
    }
}
