package dev.reweigh.families;

/**
 * Static factories and name lookup for links.
 *
 * @since 0.1
 */
public final class Links {
    private Links() {
    }
}
