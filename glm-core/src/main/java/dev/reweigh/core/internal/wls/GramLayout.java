package dev.reweigh.core.internal.wls;

import java.util.Arrays;

/**
 * Where each part of a design sits in the full model matrix: a dense block of {@code d} columns
 * (model column {@code denseColumns[k]} for dense column k) and factor blocks, block f covering
 * the contiguous model columns {@code factorFirstColumns[f] .. + factorLevels[f] - 1}. Every
 * model column belongs to exactly one part. Immutable.
 */
public final class GramLayout {
    private final int columns;
    private final int[] denseColumns;
    private final int[] factorLevels;
    private final int[] factorFirstColumns;

    private GramLayout(int columns, int[] denseColumns, int[] factorLevels, int[] factorFirstColumns) {
        this.columns = columns;
        this.denseColumns = denseColumns;
        this.factorLevels = factorLevels;
        this.factorFirstColumns = factorFirstColumns;
    }

    /**
     * Creates a layout, checking that the parts cover every model column exactly once.
     *
     * @param columns p, the number of model columns
     * @param denseColumns the model column of each dense column (copied)
     * @param factorLevels the number of columns of each factor block (copied)
     * @param factorFirstColumns the first model column of each factor block (copied)
     * @return the layout
     * @throws IllegalArgumentException if a column is covered twice, not at all, or out of range
     */
    public static GramLayout of(int columns, int[] denseColumns, int[] factorLevels, int[] factorFirstColumns) {
        if (factorLevels.length != factorFirstColumns.length) {
            throw new IllegalArgumentException("factorLevels and factorFirstColumns differ in length: "
                    + factorLevels.length + " vs " + factorFirstColumns.length);
        }
        boolean[] seen = new boolean[columns];
        for (int c : denseColumns) {
            claim(seen, c, "dense column");
        }
        for (int f = 0; f < factorLevels.length; f++) {
            if (factorLevels[f] < 0) {
                throw new IllegalArgumentException("factor block " + f + " has " + factorLevels[f] + " levels");
            }
            for (int l = 0; l < factorLevels[f]; l++) {
                claim(seen, factorFirstColumns[f] + l, "factor block " + f);
            }
        }
        for (int c = 0; c < columns; c++) {
            if (!seen[c]) {
                throw new IllegalArgumentException("model column " + c + " belongs to no block");
            }
        }
        return new GramLayout(columns, denseColumns.clone(), factorLevels.clone(), factorFirstColumns.clone());
    }

    /**
     * A layout with only a dense block whose columns are the model columns in order.
     *
     * @param columns p = d
     * @return the layout
     */
    public static GramLayout dense(int columns) {
        int[] dc = new int[columns];
        for (int k = 0; k < columns; k++) {
            dc[k] = k;
        }
        return new GramLayout(columns, dc, new int[0], new int[0]);
    }

    private static void claim(boolean[] seen, int c, String who) {
        if (c < 0 || c >= seen.length) {
            throw new IllegalArgumentException(who + " maps to model column " + c + ", outside 0.." + (seen.length - 1));
        }
        if (seen[c]) {
            throw new IllegalArgumentException(who + " maps to model column " + c + ", which is already covered");
        }
        seen[c] = true;
    }

    /** @return p, the number of model columns */
    public int columns() {
        return columns;
    }

    /** @return d, the width of the dense block */
    public int denseWidth() {
        return denseColumns.length;
    }

    /**
     * @param k a dense column
     * @return its model column
     */
    public int denseColumn(int k) {
        return denseColumns[k];
    }

    /** @return the number of factor blocks */
    public int factorCount() {
        return factorLevels.length;
    }

    /**
     * @param f a factor block
     * @return its number of columns
     */
    public int factorLevels(int f) {
        return factorLevels[f];
    }

    /**
     * @param f a factor block
     * @return its first model column
     */
    public int factorFirstColumn(int f) {
        return factorFirstColumns[f];
    }

    /**
     * The number of doubles one partial sum holds; used to size row blocks so that folding
     * partials stays cheap against the work of summing them.
     *
     * @return the size of a partial
     */
    long partialSize() {
        int d = denseWidth();
        long size = (long) d * (d + 1);
        for (int f = 0; f < factorLevels.length; f++) {
            size += (long) factorLevels[f] * (d + 2);
            for (int g = f + 1; g < factorLevels.length; g++) {
                size += (long) factorLevels[f] * factorLevels[g];
            }
        }
        return size;
    }

    /**
     * The default number of rows per block. It depends only on the layout (never on the thread
     * count), which is what makes results independent of the thread count.
     *
     * @return rows per block, a multiple of 1024
     */
    public int defaultBlockRows() {
        int d = denseWidth();
        int nf = factorCount();
        long rowCost = (long) d * (d + 1) / 2 + (long) nf * (d + 2) + (long) nf * nf + 1;
        // zeroing and folding a partial touches it twice; keep that under ~10% of the block's work
        long rows = 20 * partialSize() / rowCost;
        rows = Math.max(8192, Math.min(1 << 20, rows));
        return (int) ((rows + 1023) / 1024 * 1024);
    }

    @Override
    public String toString() {
        return "GramLayout[p=" + columns + ", dense=" + Arrays.toString(denseColumns) + ", factorLevels="
                + Arrays.toString(factorLevels) + ", factorFirstColumns=" + Arrays.toString(factorFirstColumns) + "]";
    }
}
