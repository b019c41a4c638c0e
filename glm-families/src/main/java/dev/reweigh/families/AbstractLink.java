package dev.reweigh.families;

/** Shared identity of links: equal when their canonical names are equal. */
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
