package dev.reweigh.families;

/**
 * Root of every unchecked exception the library throws on purpose. Catching it catches all
 * failures that the library diagnosed itself, as opposed to bugs.
 *
 * @since 0.1
 */
public class ReweighException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /**
     * Creates an exception with a message that says what was wrong and what would be valid.
     *
     * @param message the explanation
     * @since 0.1
     */
    public ReweighException(String message) {
        super(message);
    }

    /**
     * Creates an exception with a message and the underlying cause.
     *
     * @param message the explanation
     * @param cause the underlying cause
     * @since 0.1
     */
    public ReweighException(String message, Throwable cause) {
        super(message, cause);
    }
}
