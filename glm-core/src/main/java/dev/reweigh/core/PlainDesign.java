package dev.reweigh.core;

import java.util.List;

/**
 * The linear predictor of a design made only of plain numeric and factor terms, for the rows of a
 * table, computed a block of rows at a time with the term loop outside and the row loop inside.
 * Each row still sees the operations of {@link CompiledDesign#eta} in the same order (offset,
 * intercept, dense columns, factor blocks, each through {@link CompensatedSum}), less the product
 * error terms that are exactly +0.0 (1.0 times a coefficient), so the results are bit-identical;
 * what goes is the per-row dispatch over term nodes and bound inputs.
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
        this.intercept = design.hasIntercept();
    }

    /** One call's columns and block storage. */
    static final class Columns {
        final double[][] dense;
        final int[][] codes;
        final double[][] levelCoefficient; // per factor: table level code + 1 -> what the row adds
        final double[] offset;
        final double[] logOffset;
        final double[] sum = new double[BLOCK];
        final double[] err = new double[BLOCK];
        // the block's inputs copied (numbers) or looked up (level coefficients) to index 0: every array
        // a loop touches is then indexed alike, which lets the JIT vectorize the compensated sums
        final double[] termA = new double[BLOCK];
        final double[] termB = new double[BLOCK];

        private Columns(int dense, int factors, double[] offset, double[] logOffset) {
            this.dense = new double[dense][];
            this.codes = new int[factors][];
            this.levelCoefficient = new double[factors][];
            this.offset = offset;
            this.logOffset = logOffset;
        }
    }

    /**
     * Resolves the table's columns once: numbers to arrays, and each table level straight to what
     * a row of that level adds: its coefficient; -0.0 for the reference level, since x + (-0.0)
     * == x for every x, the sign of zero included (so no branch on the level); NaN for a missing or
     * unseen level, so the row comes out non-finite and the row path reports or flags it.
     */
    Columns bind(ScoringInputs.TableBinding t) {
        Object[] cols = t.columns;
        Columns c = new Columns(denseInput.length, factorInput.length,
                design.offsetInput < 0 ? null : (double[]) cols[design.offsetInput],
                design.logOffsetInput < 0 ? null : (double[]) cols[design.logOffsetInput]);
        for (int k = 0; k < denseInput.length; k++) {
            c.dense[k] = (double[]) cols[denseInput[k]];
        }
        for (int k = 0; k < factorInput.length; k++) {
            int input = factorInput[k];
            c.codes[k] = (int[]) cols[input];
            int[] map = t.levelMap[input];
            double[] out = new double[map.length + 1];
            int r = factorRef[k];
            out[0] = Double.NaN; // a missing level (code -1)
            for (int j = 0; j < map.length; j++) {
                int lv = map[j];
                if (lv == -2) {
                    out[j + 1] = Double.NaN; // unseen
                } else {
                    // the same mapping as ScoringTerm.Factor's node
                    int code = r < 0 ? lv : (lv < 0 || lv == r ? -1 : (lv < r ? lv : lv - 1));
                    out[j + 1] = code < 0 ? -0.0 : b[factorFirst[k] + code];
                }
            }
            c.levelCoefficient[k] = out;
        }
        return c;
    }

    /**
     * Computes the linear predictor of rows from .. from + len - 1 as the compensated pairs
     * {@code c.sum[r] + c.err[r]}, r in [0, len), the caller adding the two (bit for bit the row
     * path's final {@code sum + err}), without checking the cells: a row with a missing,
     * non-finite or (for the exposure) non-positive number, a missing level or an unseen level
     * comes out non-finite (NaN or infinite), because such a value propagates through every later
     * step of the sum. The caller hands non-finite rows to the row-by-row path, which checks and
     * reports as always. Terms are taken two at a time, so a row's running pair stays in
     * registers between them; the order of the operations is the row path's.
     */
    void eta(Columns c, int from, int len) {
        double[] sum = c.sum;
        double[] err = c.err;
        double[] off = c.offset;
        double[] logOff = c.logOffset;
        // the row path starts from 0.0, sets the offset and adds the log-exposure; Math.log never
        // returns -0.0, so 0.0 + log(x) is log(x) itself
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
                sum[r] = Math.log(logOff[from + r]);
            }
        } else {
            java.util.Arrays.fill(sum, 0, len, 0.0);
        }
        if (intercept) {
            // the product 1.0 * b0 is exact, so its error term (+0.0) changes nothing and is left
            // out; 0.0 + e keeps the row path's sign of a zero error
            double p = b[0];
            for (int r = 0; r < len; r++) {
                double s = sum[r];
                double t = s + p;
                err[r] = 0.0 + CompensatedSum.error(s, p, t);
                sum[r] = t;
            }
        } else {
            java.util.Arrays.fill(err, 0, len, 0.0);
        }
        double[] qa = c.termA;
        double[] qb = c.termB;
        int nd = denseInput.length;
        int k = 0;
        for (; k + 1 < nd; k += 2) {
            System.arraycopy(c.dense[k], from, qa, 0, len);
            System.arraycopy(c.dense[k + 1], from, qb, 0, len);
            double b1 = b[denseColumn[k]];
            double b2 = b[denseColumn[k + 1]];
            for (int r = 0; r < len; r++) {
                double s = sum[r];
                double e = err[r];
                double xv = qa[r];
                double q = xv * b1;
                double qe = Math.fma(xv, b1, -q);
                double t = s + q;
                e += CompensatedSum.error(s, q, t) + qe;
                s = t;
                xv = qb[r];
                q = xv * b2;
                qe = Math.fma(xv, b2, -q);
                t = s + q;
                e += CompensatedSum.error(s, q, t) + qe;
                sum[r] = t;
                err[r] = e;
            }
        }
        if (k < nd) {
            System.arraycopy(c.dense[k], from, qa, 0, len);
            double bk = b[denseColumn[k]];
            for (int r = 0; r < len; r++) {
                double xv = qa[r];
                double q = xv * bk;
                double qe = Math.fma(xv, bk, -q);
                double s = sum[r];
                double t = s + q;
                err[r] += CompensatedSum.error(s, q, t) + qe;
                sum[r] = t;
            }
        }
        // factors: the product 1.0 * b is exact, so its error term is left out as for the intercept
        int nf = factorInput.length;
        k = 0;
        for (; k + 1 < nf; k += 2) {
            lookUp(c.codes[k], c.levelCoefficient[k], from, len, qa);
            lookUp(c.codes[k + 1], c.levelCoefficient[k + 1], from, len, qb);
            for (int r = 0; r < len; r++) {
                double s = sum[r];
                double e = err[r];
                double q = qa[r];
                double t = s + q;
                e += CompensatedSum.error(s, q, t);
                s = t;
                q = qb[r];
                t = s + q;
                e += CompensatedSum.error(s, q, t);
                sum[r] = t;
                err[r] = e;
            }
        }
        if (k < nf) {
            lookUp(c.codes[k], c.levelCoefficient[k], from, len, qa);
            for (int r = 0; r < len; r++) {
                double q = qa[r];
                double s = sum[r];
                double t = s + q;
                err[r] += CompensatedSum.error(s, q, t);
                sum[r] = t;
            }
        }
    }

    /** What each row of the block adds for one factor: its level's coefficient (-0.0, NaN: see bind). */
    private static void lookUp(int[] codes, double[] levelCoefficient, int from, int len, double[] out) {
        for (int r = 0; r < len; r++) {
            out[r] = levelCoefficient[Math.max(codes[from + r], -1) + 1];
        }
    }
}
