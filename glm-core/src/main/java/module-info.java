/**
 * Tables, model specifications, design matrices, the IRLS fit, fitted models and scoring.
 *
 * @since 0.1
 */
module dev.reweigh.core {
    requires transitive dev.reweigh.families;
    requires ejml.core;
    requires ejml.ddense;
    requires com.fasterxml.jackson.core;
    requires transitive java.sql;
    requires commons.math3;

    exports dev.reweigh.core;
}
