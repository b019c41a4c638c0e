package dev.reweigh.core.internal.wls;

import dev.reweigh.core.internal.CrossProductAccumulator;
import dev.reweigh.core.internal.DesignMatrix;
import java.util.List;
import java.util.concurrent.Executor;

/**
 * The solver's {@link CrossProductAccumulator}, backed by the blocked, level-coded, thread-count
 * independent accumulation of this package. One instance serves one fit: the layout, the row
 * view, the per-worker workspaces and the running total are built on the first call and reused
 * by every later call on the same design (nothing of size n or p^2 is allocated per iteration;
 * only the p x p output array, owned by the caller, is rewritten).
 */
public final class DesignGramAccumulator implements CrossProductAccumulator {
    private final int threads;
    private final Executor executor;
    private DesignMatrix design;
    private GramRows rows;
    private BlockedGramAccumulator blocked;
    private GramPartial total;

    /**
     * Creates an accumulator for one fit.
     *
     * @param threads the number of workers (&ge; 1); results do not depend on it
     * @param executor where extra workers run, or null to start threads per call
     */
    public DesignGramAccumulator(int threads, Executor executor) {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1, got " + threads);
        }
        this.threads = threads;
        this.executor = executor;
    }

    /**
     * The compact layout of a design.
     *
     * @param x the design
     * @return its layout
     */
    public static GramLayout layoutOf(DesignMatrix x) {
        List<DesignMatrix.FactorBlock> factors = x.factors();
        int[] levels = new int[factors.size()];
        int[] first = new int[factors.size()];
        for (int f = 0; f < levels.length; f++) {
            levels[f] = factors.get(f).levels();
            first[f] = factors.get(f).firstColumn();
        }
        return GramLayout.of(x.columns(), x.denseColumns(), levels, first);
    }

    /**
     * The rows of a design, in the given layout.
     *
     * @param layout the layout of x (from {@link #layoutOf})
     * @param x the design
     * @return a view of its arrays (not copied)
     */
    public static GramRows rowsOf(GramLayout layout, DesignMatrix x) {
        List<DesignMatrix.FactorBlock> factors = x.factors();
        int[][] codes = new int[factors.size()][];
        double[][] mult = new double[factors.size()][];
        for (int f = 0; f < codes.length; f++) {
            codes[f] = factors.get(f).codes();
            mult[f] = factors.get(f).multipliers();
        }
        return GramRows.of(layout, x.rows(), x.dense(), codes, mult);
    }

    /**
     * Tells whether a design has the column structure of a layout (same dense columns, same
     * factor blocks), so that its rows can be summed with it.
     *
     * @param layout the layout
     * @param x the design
     * @return true if they match
     */
    public static boolean matches(GramLayout layout, DesignMatrix x) {
        if (x.columns() != layout.columns() || x.denseWidth() != layout.denseWidth()
                || x.factors().size() != layout.factorCount()) {
            return false;
        }
        for (int k = 0; k < x.denseWidth(); k++) {
            if (x.denseColumns()[k] != layout.denseColumn(k)) {
                return false;
            }
        }
        for (int f = 0; f < layout.factorCount(); f++) {
            DesignMatrix.FactorBlock b = x.factors().get(f);
            if (b.levels() != layout.factorLevels(f) || b.firstColumn() != layout.factorFirstColumn(f)) {
                return false;
            }
        }
        return true;
    }

    @Override
    public void accumulate(DesignMatrix x, double[] w, double[] z, double[] gram, double[] xtwz) {
        if (x != design) {
            GramLayout layout = layoutOf(x);
            rows = rowsOf(layout, x);
            blocked = BlockedGramAccumulator.of(layout, threads, executor);
            total = new GramPartial(layout);
            design = x;
        }
        total.reset();
        blocked.accumulate(rows, w, z, total);
        total.writeTo(gram, xtwz, true);
    }
}
