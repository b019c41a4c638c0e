/**
 * Dispersion, tests, intervals, residuals, diagnostics and model comparison for fitted models.
 *
 * @since 0.1
 */
module dev.reweigh.inference {
    requires transitive dev.reweigh.core;
    requires commons.math3;

    exports dev.reweigh.inference;
}
