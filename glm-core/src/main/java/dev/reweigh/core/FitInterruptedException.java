package dev.reweigh.core;

import dev.reweigh.families.ReweighException;

/**
 * The fitting thread was interrupted. The fit checks the interrupt flag once per iteration and
 * stops promptly; the thread's interrupt status is restored before this is thrown.
 *
 * @since 0.1
 * @serial exclude
 */
public class FitInterruptedException extends ReweighException {
    private static final long serialVersionUID = 1L;

    /**
     * Creates the exception.
     *
     * @param message where the fit stopped
     * @since 0.1
     */
    public FitInterruptedException(String message) {
        super(message);
    }
}
