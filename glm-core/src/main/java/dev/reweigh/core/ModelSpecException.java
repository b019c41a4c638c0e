package dev.reweigh.core;

import dev.reweigh.families.ReweighException;

/**
 * A model specification cannot be used with the data: a column of the wrong kind for its role,
 * a reference level that does not exist, more parameters than rows, a trials column for a family
 * other than the binomial. The message says what was wrong and what would be valid.
 *
 * @since 0.1
 * @serial exclude
 */
public class ModelSpecException extends ReweighException {
    private static final long serialVersionUID = 1L;

    /**
     * Creates the exception.
     *
     * @param message what was wrong and what would be valid
     * @since 0.1
     */
    public ModelSpecException(String message) {
        super(message);
    }
}
