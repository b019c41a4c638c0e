package dev.reweigh.core;

import java.util.List;

/**
 * The linear predictor of a design made only of plain numeric and factor terms, for the rows of a
 * table, computed a block of rows at a time with the term loop outside and the row loop inside.
 * Each row still sees exactly the operations of {@link CompiledDesign#eta} in the same order
 * (offset, intercept, dense columns, factor blocks, each in a compensated sum), so the results
 * are bit-identical; what goes is the per-row dispatch over term nodes and bound inputs.
 *
 * <p>Cells are not checked here: any missing or invalid value or unseen level makes its row's
 * linear predictor non-finite, and from such a row on the caller scores the block row by row,
 * which reports the first bad cell (or flags the fallback rows) exactly as always.
 */
final class PlainDesign {
    /** Rows per block: the block's running sums stay in the first-level cache. */
    static final int BLOCK = 256;

    private final CompiledDesign design;
    private final int[] denseInput;
    private final int[] denseColumn;
    private final int[] factorInput;
    private final int[] factorRef;
    private final int[] factorFirst;
    private final double[] b;
    private final double[] padded; // b, then 0 for rows hitting no column of a factor, then NaN for bad levels
    private final boolean intercept;

    PlainDesign(CompiledDesign design, List<ScoringTerm> terms) {
        this.design = design;
        int dense = 0;
        int factors = 0;
        for (ScoringTerm t : terms) {
            if (t instanceof ScoringTerm.Factor) {
                factors++;
            } else {
                dense++;
            }
        }
        denseInput = new int[dense];
        factorInput = new int[factors];
        factorRef = new int[factors];
        dense = 0;
        factors = 0;
        for (ScoringTerm t : terms) {
            if (t instanceof ScoringTerm.Factor) {
                ScoringTerm.Factor f = (ScoringTerm.Factor) t;
                factorInput[factors] = design.inputNames.indexOf(f.column);
                factorRef[factors++] = f.ref;
            } else {
                denseInput[dense++] = design.inputNames.indexOf(((ScoringTerm.Numeric) t).column);
            }
        }
        this.denseColumn = design.denseColumns();
        this.factorFirst = design.factorFirstColumns();
        this.b = design.coefficients();
        this.padded = java.util.Arrays.copyOf(b, b.length + 2);
        padded[b.length + 1] = Double.NaN;
        this.intercept = design.hasIntercept();
    }

    /** One call's columns and block storage. */
    static final class Columns {
        final double[][] numbers;
        final double[][] dense;
        final int[][] codes;
        final int[][] column;
        final double[] offset;
        final double[] logOffset;
        final double[] sum = new double[BLOCK];
        final double[] err = new double[BLOCK];

        private Columns(int inputs, int dense, int factors, double[] offset, double[] logOffset) {
            this.numbers = new double[inputs][];
            this.dense = new double[dense][];
            this.codes = new int[factors][];
            this.column = new int[factors][];
            this.offset = offset;
            this.logOffset = logOffset;
        }
    }

    /** Resolves the table's columns once: numbers to arrays, table level codes to model columns. */
    Columns bind(ScoringInputs.TableBinding t) {
        Object[] cols = t.columns;
        Columns c = new Columns(cols.length, denseInput.length, factorInput.length,
                design.offsetInput < 0 ? null : (double[]) cols[design.offsetInput],
                design.logOffsetInput < 0 ? null : (double[]) cols[design.logOffsetInput]);
        for (int i = 0; i < cols.length; i++) {
            if (!design.inputIsFactor[i]) {
                c.numbers[i] = (double[]) cols[i];
            }
        }
        for (int k = 0; k < denseInput.length; k++) {
            c.dense[k] = (double[]) cols[denseInput[k]];
        }
        for (int k = 0; k < factorInput.length; k++) {
            int input = factorInput[k];
            c.codes[k] = (int[]) cols[input];
            int[] map = t.levelMap[input];
            int[] out = new int[map.length + 1];
            int r = factorRef[k];
            out[0] = b.length + 1; // a missing level (code -1): NaN, so the row path reports it
            for (int j = 0; j < map.length; j++) {
                int lv = map[j];
                if (lv == -2) {
                    out[j + 1] = b.length + 1; // unseen: NaN, so the row path throws or falls back and flags
                } else {
                    // the same mapping as ScoringTerm.Factor's node
                    int code = r < 0 ? lv : (lv < 0 || lv == r ? -1 : (lv < r ? lv : lv - 1));
                    out[j + 1] = code < 0 ? b.length : factorFirst[k] + code; // b.length: no column
                }
            }
            c.column[k] = out;
        }
        return c;
    }

    /**
     * Computes the linear predictor of rows from .. from + len - 1 into {@code c.sum[0 .. len)}
     * without checking the cells: a row with a missing, non-finite or (for the exposure)
     * non-positive number, a missing level or an unseen level comes out non-finite (NaN or
     * infinite), because such a value propagates through every later step of the sum. The caller
     * hands non-finite rows to the row-by-row path, which checks and reports as always.
     */
    void eta(Columns c, int from, int len) {
        double[] sum = c.sum;
        double[] err = c.err;
        double[] off = c.offset;
        double[] logOff = c.logOffset;
        if (off != null && logOff != null) {
            for (int r = 0; r < len; r++) {
                double o = off[from + r];
                o += Math.log(logOff[from + r]);
                sum[r] = o;
            }
        } else if (off != null) {
            System.arraycopy(off, from, sum, 0, len);
        } else if (logOff != null) {
            for (int r = 0; r < len; r++) {
                double o = 0.0;
                o += Math.log(logOff[from + r]);
                sum[r] = o;
            }
        } else {
            java.util.Arrays.fill(sum, 0, len, 0.0);
        }
        java.util.Arrays.fill(err, 0, len, 0.0);
        if (intercept) {
            double bk = b[0];
            double p = bk;   // 1.0 * bk
            double pe = Math.fma(1.0, bk, -p);
            for (int r = 0; r < len; r++) {
                double s = sum[r];
                double t = s + p;
                double bb = t - s;
                err[r] += (s - (t - bb)) + (p - bb) + pe;
                sum[r] = t;
            }
        }
        for (int k = 0; k < denseInput.length; k++) {
            double[] x = c.dense[k];
            double bk = b[denseColumn[k]];
            for (int r = 0; r < len; r++) {
                double xv = x[from + r];
                double p = xv * bk;
                double pe = Math.fma(xv, bk, -p);
                double s = sum[r];
                double t = s + p;
                double bb = t - s;
                err[r] += (s - (t - bb)) + (p - bb) + pe;
                sum[r] = t;
            }
        }
        for (int k = 0; k < factorInput.length; k++) {
            int[] codes = c.codes[k];
            int[] column = c.column[k];
            int none = b.length;
            for (int r = 0; r < len; r++) {
                // computed for every row and kept only for rows hitting a column: no branch on the level
                int j = column[Math.max(codes[from + r], -1) + 1];
                double v = 1.0;
                double bk = padded[j];
                double p = v * bk;
                double pe = Math.fma(v, bk, -p);
                double s = sum[r];
                double e = err[r];
                double t = s + p;
                double bb = t - s;
                double e2 = e + ((s - (t - bb)) + (p - bb) + pe);
                boolean hit = j != none;
                sum[r] = hit ? t : s;
                err[r] = hit ? e2 : e;
            }
        }
        for (int r = 0; r < len; r++) {
            sum[r] += err[r];
        }
    }
}
