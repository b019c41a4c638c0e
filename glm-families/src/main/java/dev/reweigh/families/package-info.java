/**
 * Families (variance function, unit deviance, density) and links (g, its inverse and derivative)
 * of generalized linear models, with the library's exception hierarchy.
 *
 * <p>All types here are immutable and thread-safe. Arguments are never null; a null argument throws
 * {@link java.lang.NullPointerException}.
 *
 * <pre>{@code
 * Family gamma = Families.byName("gamma");
 * Link log = Links.byName("log");
 * double d = gamma.unitDeviance(2.0, 1.5);
 * }</pre>
 *
 * @since 0.1
 */
package dev.reweigh.families;
