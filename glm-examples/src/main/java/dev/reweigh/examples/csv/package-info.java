/**
 * Reading comma-separated files into {@link dev.reweigh.core.Table}s (with Commons CSV), with
 * error messages that name the file, column, row and value at fault.
 *
 * @since 0.1
 */
package dev.reweigh.examples.csv;
