package dev.reweigh.families;

/**
 * Shared identity of links (equal when their canonical names are equal) and the eta domain of the
 * links defined on the whole real line; a link with a narrower domain overrides the two eta methods.
 */
abstract class AbstractLink implements Link {
    private final String name;

    AbstractLink(String name) {
        this.name = name;
    }

    @Override
    public final String name() {
        return name;
    }

    @Override
    public boolean isValidEta(double eta) {
        return Double.isFinite(eta);
    }

    @Override
    public String etaDomain() {
        return "any finite number";
    }

    @Override
    public final boolean equals(Object other) {
        return other instanceof Link && ((Link) other).name().equals(name);
    }

    @Override
    public final int hashCode() {
        return name.hashCode();
    }

    @Override
    public final String toString() {
        return "Link[" + name + ", eta domain: " + etaDomain() + "]";
    }
}
