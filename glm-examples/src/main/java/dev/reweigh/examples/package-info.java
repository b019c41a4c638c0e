/**
 * The synthetic motor-portfolio demo and the command-line front end.
 *
 * @since 0.1
 */
package dev.reweigh.examples;
