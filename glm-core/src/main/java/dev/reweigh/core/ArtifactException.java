package dev.reweigh.core;

import dev.reweigh.families.ReweighException;

import java.util.Objects;

/**
 * A model artifact cannot be read: it is not complete JSON, it was written by a newer major
 * format version, its content does not match its checksum, or a field is missing, of the wrong
 * type or inconsistent with the rest. The message names the field (a dotted path such as
 * {@code model.coefficients[3]}) and says what was expected; {@link #field()} returns the path.
 *
 * @since 0.1
 * @serial exclude
 */
public class ArtifactException extends ReweighException {
    private static final long serialVersionUID = 1L;

    private final String field;

    /**
     * Creates the exception.
     *
     * @param field the path of the field at fault, e.g. {@code model.family}; "document" for the
     *     whole text
     * @param problem what was wrong and what was expected
     * @since 0.1
     */
    public ArtifactException(String field, String problem) {
        super("model artifact, field '" + Objects.requireNonNull(field, "field") + "': " + problem);
        this.field = field;
    }

    /**
     * Creates the exception with a cause.
     *
     * @param field the path of the field at fault
     * @param problem what was wrong and what was expected
     * @param cause the underlying exception
     * @since 0.1
     */
    public ArtifactException(String field, String problem, Throwable cause) {
        super("model artifact, field '" + Objects.requireNonNull(field, "field") + "': " + problem, cause);
        this.field = field;
    }

    /**
     * Returns the path of the field at fault, e.g. {@code model.specification.terms[1].levels}.
     *
     * @return the field's path
     * @since 0.1
     */
    public String field() {
        return field;
    }
}
