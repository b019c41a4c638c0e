package dev.reweigh.inference;

import dev.reweigh.families.ReweighException;

/**
 * Two or more fitted models cannot be compared because they differ in something a comparison
 * needs to be the same: the rows used, the response, the prior weights, the family or the link.
 * The message says which models differ, in what, and how.
 *
 * @since 0.1
 */
public class ModelMismatchException extends ReweighException {
    private static final long serialVersionUID = 1L;

    /**
     * Creates the exception.
     *
     * @param message what differs between which models
     * @since 0.1
     */
    public ModelMismatchException(String message) {
        super(message);
    }
}
