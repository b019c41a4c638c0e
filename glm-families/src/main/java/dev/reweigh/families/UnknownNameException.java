package dev.reweigh.families;

import java.util.List;
import java.util.Objects;

/**
 * A name (of a family, link, column, level or term) is not known. The message lists the valid
 * names.
 *
 * @since 0.1
 * @serial exclude
 */
public class UnknownNameException extends ReweighException {
    private static final long serialVersionUID = 1L;

    private final String kind;
    private final String name;
    private final List<String> validNames;

    /**
     * Creates the exception.
     *
     * @param kind what kind of name it is, e.g. "family", "link", "column"
     * @param name the unknown name
     * @param validNames the names that would have been accepted
     * @since 0.1
     */
    public UnknownNameException(String kind, String name, List<String> validNames) {
        super("unknown " + kind + " '" + name + "'; valid " + kind + " names are: "
                + String.join(", ", validNames));
        this.kind = Objects.requireNonNull(kind, "kind");
        this.name = Objects.requireNonNull(name, "name");
        this.validNames = List.copyOf(validNames);
    }

    /**
     * Returns the kind of name, e.g. "family".
     *
     * @return the kind
     * @since 0.1
     */
    public String kind() {
        return kind;
    }

    /**
     * Returns the unknown name.
     *
     * @return the name as given
     * @since 0.1
     */
    public String name() {
        return name;
    }

    /**
     * Returns the names that would have been accepted.
     *
     * @return an immutable list of valid names
     * @since 0.1
     */
    public List<String> validNames() {
        return validNames;
    }
}
