package dev.reweigh.families;

/**
 * Static factories and name lookup for families.
 *
 * @since 0.1
 */
public final class Families {
    private Families() {
    }
}
