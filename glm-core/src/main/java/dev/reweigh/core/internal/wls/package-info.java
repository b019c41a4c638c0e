/**
 * The fast weighted-least-squares accumulation: X'WX (upper triangle) and X'Wz gathered in one
 * pass over the rows, with a dense row-major block handled by a register- and cache-blocked
 * kernel and categorical terms handled as level codes (weighted counts, cross-tabulations and
 * per-level sums instead of dummy columns).
 *
 * <p>Reproducibility: rows are cut into blocks whose boundaries depend only on the row count and
 * the layout, never on the number of threads; each block is summed from zero in row order, and
 * block partials are added to the total strictly in block order. Every floating-point operation
 * is therefore the same for 1 or 64 threads, and results are bit-identical. No floating-point
 * reduction is left to the JIT (Java forbids reassociation and contraction; fused multiply-adds
 * are explicit {@link java.lang.Math#fma} calls, exact in every execution mode).
 *
 * <p>Not exported: nothing here is public API.
 */
package dev.reweigh.core.internal.wls;
