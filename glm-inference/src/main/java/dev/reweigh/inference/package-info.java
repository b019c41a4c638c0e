/**
 * Inference on fitted models: dispersion, coefficient tables, tests, residuals and comparison.
 *
 * @since 0.1
 */
package dev.reweigh.inference;
