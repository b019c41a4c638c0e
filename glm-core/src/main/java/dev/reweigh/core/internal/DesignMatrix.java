package dev.reweigh.core.internal;

import java.util.List;
import java.util.Objects;

/**
 * The model matrix X (n rows, p columns) in compact form, as the IRLS solver sees it.
 *
 * <p><b>Representation.</b> Model columns are numbered 0..p-1 in model order (intercept first,
 * then the terms in specification order). Every column belongs either to the dense block or to
 * exactly one factor block:
 * <ul>
 * <li><b>Dense block:</b> {@link #dense()} is one {@code double[]} of length n * d stored
 * ROW-MAJOR (entry (i, k) at {@code i * d + k}, d = {@link #denseWidth()}); dense column k is
 * model column {@link #denseColumns()}[k]. An optional second array {@link #denseLow()} of the
 * same layout holds low-order parts, so that the exact entry is {@code dense + denseLow} to about
 * 32 significant digits (raw polynomial powers and products of numeric columns, whose rounding
 * would otherwise limit the accuracy of ill-conditioned fits); it is null when every dense entry
 * is exact. Solvers that do not refine may ignore it.</li>
 * <li><b>Factor blocks:</b> a block covers the contiguous model columns
 * {@code firstColumn .. firstColumn + levels - 1}. Row i has a single non-zero entry in the block,
 * in column {@code firstColumn + codes[i]}, with value {@code multipliers[i]} (or 1 when
 * {@code multipliers} is null); {@code codes[i] == -1} means the row has no entry in the block
 * (reference level). A factor main effect has null multipliers; a factor-by-numeric
 * interaction carries the numeric values as multipliers; a factor-by-factor interaction is one
 * block over the pairs of non-reference levels.</li>
 * </ul>
 * So X'WX has dense-by-dense entries, dense-by-factor entries that are weighted sums per level,
 * and factor-by-factor entries that are weighted counts; a factor block's diagonal is diagonal.
 *
 * <p>Instances are immutable after construction (arrays are not copied; nobody writes to them).
 */
public final class DesignMatrix {

    /**
     * One factor block: see the class comment.
     */
    public static final class FactorBlock {
        private final int[] codes;
        private final double[] multipliers;
        private final int levels;
        private final int firstColumn;

        /**
         * Creates a block.
         *
         * @param codes per row, the column within the block, or -1 for none
         * @param multipliers per row, the entry's value, or null for 1
         * @param levels the number of columns in the block
         * @param firstColumn the model column of the block's first column
         */
        public FactorBlock(int[] codes, double[] multipliers, int levels, int firstColumn) {
            this.codes = Objects.requireNonNull(codes);
            this.multipliers = multipliers;
            this.levels = levels;
            this.firstColumn = firstColumn;
            if (multipliers != null && multipliers.length != codes.length) {
                throw new IllegalArgumentException("multipliers and codes differ in length");
            }
        }

        /** @return per row, the column within the block, or -1 */
        public int[] codes() {
            return codes;
        }

        /** @return per row, the entry's value, or null meaning 1 */
        public double[] multipliers() {
            return multipliers;
        }

        /** @return the number of columns in the block */
        public int levels() {
            return levels;
        }

        /** @return the model column of the block's first column */
        public int firstColumn() {
            return firstColumn;
        }

        double value(int row) {
            return multipliers == null ? 1.0 : multipliers[row];
        }
    }

    private final int rows;
    private final int columns;
    private final double[] dense;
    private final double[] denseLow;
    private final int denseWidth;
    private final int[] denseColumns;
    private final List<FactorBlock> factors;

    /**
     * Creates a design.
     *
     * @param rows n
     * @param columns p
     * @param dense the dense block, row-major n x denseColumns.length
     * @param denseLow low-order parts of the dense block, or null
     * @param denseColumns the model column of each dense column
     * @param factors the factor blocks
     */
    public DesignMatrix(int rows, int columns, double[] dense, double[] denseLow, int[] denseColumns,
            List<FactorBlock> factors) {
        this.rows = rows;
        this.columns = columns;
        this.dense = dense;
        this.denseLow = denseLow;
        this.denseWidth = denseColumns.length;
        this.denseColumns = denseColumns;
        this.factors = List.copyOf(factors);
        if (dense.length != rows * denseWidth || (denseLow != null && denseLow.length != dense.length)) {
            throw new IllegalArgumentException("dense block size does not match " + rows + " x " + denseWidth);
        }
        int covered = denseWidth;
        for (FactorBlock f : this.factors) {
            covered += f.levels;
            if (f.codes.length != rows) {
                throw new IllegalArgumentException("factor block has " + f.codes.length + " rows, expected " + rows);
            }
        }
        if (covered != columns) {
            throw new IllegalArgumentException("blocks cover " + covered + " columns, expected " + columns);
        }
    }

    /** @return n */
    public int rows() {
        return rows;
    }

    /** @return p */
    public int columns() {
        return columns;
    }

    /** @return the dense block (row-major, n x d); not a copy */
    public double[] dense() {
        return dense;
    }

    /** @return the low-order parts of the dense block, or null; not a copy */
    public double[] denseLow() {
        return denseLow;
    }

    /** @return d, the number of dense columns */
    public int denseWidth() {
        return denseWidth;
    }

    /** @return the model column of each dense column; not a copy */
    public int[] denseColumns() {
        return denseColumns;
    }

    /** @return the factor blocks */
    public List<FactorBlock> factors() {
        return factors;
    }

    /**
     * Writes row i of X into out (length p).
     *
     * @param i the row
     * @param out receives the row
     */
    public void row(int i, double[] out) {
        java.util.Arrays.fill(out, 0, columns, 0.0);
        int base = i * denseWidth;
        for (int k = 0; k < denseWidth; k++) {
            out[denseColumns[k]] = dense[base + k];
        }
        for (FactorBlock f : factors) {
            int c = f.codes[i];
            if (c >= 0) {
                out[f.firstColumn + c] = f.value(i);
            }
        }
    }

    /**
     * Computes eta = X beta + offset with a compensated (double-double) sum, using the low-order
     * parts of the dense block when present, so that heavy cancellation between terms (high
     * polynomial powers) does not lose digits. Columns whose coefficient is 0 or NaN contribute
     * nothing (aliased columns).
     *
     * @param beta the coefficients (length p)
     * @param offset the offset (length n) or null
     * @param eta receives the result (length n)
     */
    public void multiply(double[] beta, double[] offset, double[] eta) {
        multiply(beta, offset, eta, null);
    }

    /**
     * As {@link #multiply(double[], double[], double[])}, also writing the low-order part of each
     * result, so that eta + etaLow is X beta + offset to about 32 significant digits.
     *
     * @param beta the coefficients (length p)
     * @param offset the offset (length n) or null
     * @param eta receives the rounded result (length n)
     * @param etaLow receives the low-order parts (length n), or null
     */
    public void multiply(double[] beta, double[] offset, double[] eta, double[] etaLow) {
        double[] b = new double[columns];
        for (int j = 0; j < columns; j++) {
            b[j] = Double.isNaN(beta[j]) ? 0.0 : beta[j];
        }
        for (int i = 0; i < rows; i++) {
            double s = offset == null ? 0.0 : offset[i];
            double e = 0.0;
            int base = i * denseWidth;
            for (int k = 0; k < denseWidth; k++) {
                double bk = b[denseColumns[k]];
                double p = dense[base + k] * bk;
                double pe = Math.fma(dense[base + k], bk, -p);
                if (denseLow != null) {
                    pe += denseLow[base + k] * bk;
                }
                double t = s + p;
                double bb = t - s;
                e += (s - (t - bb)) + (p - bb) + pe;
                s = t;
            }
            for (FactorBlock f : factors) {
                int c = f.codes[i];
                if (c >= 0) {
                    double v = f.value(i);
                    double bk = b[f.firstColumn + c];
                    double p = v * bk;
                    double pe = Math.fma(v, bk, -p);
                    double t = s + p;
                    double bb = t - s;
                    e += (s - (t - bb)) + (p - bb) + pe;
                    s = t;
                }
            }
            double hi = s + e;
            eta[i] = hi;
            if (etaLow != null) {
                etaLow[i] = e - (hi - s);
            }
        }
    }

    /**
     * Expands X to a dense row-major n x p array (for the QR route).
     *
     * @return a new array
     */
    public double[] toDenseRowMajor() {
        return expand(dense);
    }

    /**
     * Expands the low-order parts to a dense row-major n x p array (zeros for factor columns).
     *
     * @return a new array, or null when there are no low-order parts
     */
    public double[] toDenseLowRowMajor() {
        if (denseLow == null) {
            return null;
        }
        double[] out = new double[rows * columns];
        for (int i = 0; i < rows; i++) {
            for (int k = 0; k < denseWidth; k++) {
                out[i * columns + denseColumns[k]] = denseLow[i * denseWidth + k];
            }
        }
        return out;
    }

    private double[] expand(double[] src) {
        double[] out = new double[rows * columns];
        for (int i = 0; i < rows; i++) {
            int base = i * denseWidth;
            int ob = i * columns;
            for (int k = 0; k < denseWidth; k++) {
                out[ob + denseColumns[k]] = src[base + k];
            }
            for (FactorBlock f : factors) {
                int c = f.codes[i];
                if (c >= 0) {
                    out[ob + f.firstColumn + c] = f.value(i);
                }
            }
        }
        return out;
    }
}
