/**
 * The end-to-end demo: a synthetic motor portfolio simulated from known frequency and severity
 * models, fitted, compared, checked and scored, with the true parameters printed beside the
 * estimates.
 *
 * @since 0.1
 */
package dev.reweigh.examples.demo;
