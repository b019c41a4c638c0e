/**
 * Exponential-family distributions and link functions for generalized linear models.
 *
 * <p>Look families and links up by name (Families.byName,
 * Links.byName) or through their static factories.
 *
 * @since 0.1
 */
module dev.reweigh.families {
    requires commons.math3;

    exports dev.reweigh.families;
}
