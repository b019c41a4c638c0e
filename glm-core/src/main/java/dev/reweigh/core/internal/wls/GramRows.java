package dev.reweigh.core.internal.wls;

/**
 * A run of rows in compact form, for one {@link GramLayout}: the dense block row-major
 * ({@code dense[i * d + k]}) and, per factor block, the level code of each row (-1: no entry)
 * and optional multipliers (null: 1). Arrays are referenced, not copied, and never written.
 */
public final class GramRows {
    private final GramLayout layout;
    private final int rows;
    private final double[] dense;
    private final int[][] codes;
    private final double[][] multipliers;

    private GramRows(GramLayout layout, int rows, double[] dense, int[][] codes, double[][] multipliers) {
        this.layout = layout;
        this.rows = rows;
        this.dense = dense;
        this.codes = codes;
        this.multipliers = multipliers;
    }

    /**
     * Wraps the arrays of a run of rows.
     *
     * @param layout the column structure
     * @param rows n
     * @param dense the dense block, row-major, at least n * d long
     * @param codes per factor block, n level codes (-1 for no entry)
     * @param multipliers per factor block, n values or null for 1
     * @return the rows
     * @throws IllegalArgumentException if an array is too short or the block count is wrong
     */
    public static GramRows of(GramLayout layout, int rows, double[] dense, int[][] codes, double[][] multipliers) {
        int d = layout.denseWidth();
        if (rows < 0 || (long) rows * d > dense.length) {
            throw new IllegalArgumentException("dense block has " + dense.length + " entries, need " + rows + " x " + d);
        }
        int nf = layout.factorCount();
        if (codes.length != nf || multipliers.length != nf) {
            throw new IllegalArgumentException("expected " + nf + " factor blocks, got " + codes.length
                    + " code arrays and " + multipliers.length + " multiplier arrays");
        }
        for (int f = 0; f < nf; f++) {
            if (codes[f].length < rows || (multipliers[f] != null && multipliers[f].length < rows)) {
                throw new IllegalArgumentException("factor block " + f + " has fewer than " + rows + " rows");
            }
        }
        return new GramRows(layout, rows, dense, codes.clone(), multipliers.clone());
    }

    /** @return the column structure */
    public GramLayout layout() {
        return layout;
    }

    /** @return n */
    public int rows() {
        return rows;
    }

    double[] dense() {
        return dense;
    }

    int[] codes(int f) {
        return codes[f];
    }

    double[] multipliers(int f) {
        return multipliers[f];
    }
}
