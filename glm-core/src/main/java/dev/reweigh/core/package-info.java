/**
 * Tables, model specifications, the IRLS fit and fitted models.
 *
 * @since 0.1
 */
package dev.reweigh.core;
