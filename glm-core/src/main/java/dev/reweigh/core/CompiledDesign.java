package dev.reweigh.core;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A model's terms compiled for scoring one row at a time: the input columns it reads (factor
 * levels resolved through a hash map once per column), the slots each term's parts are evaluated
 * into, and the coefficients. Immutable; every call brings its own {@link Scratch}.
 *
 * <p>This is the one place where predictions compute eta: {@link FittedModel#predictLink(Table)}
 * and {@link FittedModel#predictMean(Table)} score through it as every {@link Scorer} does. It
 * sums exactly as {@code DesignMatrix.multiply} sums during the fit (offset first, then the dense
 * columns in model order, then the factor blocks in model order, each product added with its
 * rounding error in a compensated sum), so predictions on the fitting rows reproduce the fit's
 * linear predictor to the bit.
 */
final class CompiledDesign {

    /** Evaluates one term's parts for one row into the scratch slots. */
    @FunctionalInterface
    interface Node {
        void eval(RowInput in, int row, Scratch s);
    }

    /** Values of the bound input columns. */
    interface RowInput {
        /** The finite value of a numeric input (else InvalidDataException). */
        double number(int input, int row);

        /** The model's level index of a factor input, or -1 for an unseen level scored at the reference. */
        int level(int input, int row);
    }

    /** Per-call working storage. */
    static final class Scratch {
        final double[] hi;
        final double[] lo;
        final double[] mult;
        final int[] code;
        final int[] nzIndex;
        final double[] nzValue;

        Scratch(int slots, int nonZeros) {
            hi = new double[slots];
            lo = new double[slots];
            mult = new double[slots];
            code = new int[slots];
            nzIndex = new int[nonZeros];
            nzValue = new double[nonZeros];
        }
    }

    /** Input columns and slots handed out while compiling. */
    static final class Layout {
        final Map<String, Integer> inputs = new LinkedHashMap<>();
        final List<Boolean> factor = new ArrayList<>();
        final List<List<String>> levels = new ArrayList<>();
        int slotCount;
        int lastFirst;

        int numericInput(String column) {
            Integer i = inputs.get(column);
            if (i != null) {
                if (factor.get(i)) {
                    throw conflict(column);
                }
                return i;
            }
            inputs.put(column, factor.size());
            factor.add(false);
            levels.add(null);
            return factor.size() - 1;
        }

        int factorInput(String column, List<String> lv) {
            Integer i = inputs.get(column);
            if (i != null) {
                if (!factor.get(i) || !levels.get(i).equals(lv)) {
                    throw conflict(column);
                }
                return i;
            }
            inputs.put(column, factor.size());
            factor.add(true);
            levels.add(List.copyOf(lv));
            return factor.size() - 1;
        }

        private static ArtifactException conflict(String column) {
            return new ArtifactException("model.specification", "column '" + column + "' is used both as a number and"
                    + " as a factor, or as factors with different levels; expected one consistent use per column");
        }

        int slots(int n) {
            lastFirst = slotCount;
            slotCount += n;
            return lastFirst;
        }

        int lastFirstSlot() {
            return lastFirst;
        }
    }

    final List<String> inputNames;
    final boolean[] inputIsFactor;
    final List<List<String>> inputLevels;
    final List<Map<String, Integer>> levelIndex;
    final int offsetInput;    // -1 when none
    final int logOffsetInput; // -1 when none
    final int columns;
    private final Node[] nodes;
    private final int slots;
    private final int[] denseSlot;
    private final int[] denseColumn;
    private final int[] factorSlot;
    private final int[] factorFirst;
    private final boolean[] factorHasMult;
    private final boolean anyLow;
    private final boolean intercept;
    private final double[] b;
    private final PlainDesign plain;

    CompiledDesign(boolean intercept, List<ScoringTerm> terms, double[] beta, String offset, String logOffset) {
        Layout layout = new Layout();
        List<Node> ns = new ArrayList<>();
        List<Integer> ds = new ArrayList<>();
        List<Integer> dc = new ArrayList<>();
        List<Integer> fs = new ArrayList<>();
        List<Integer> ff = new ArrayList<>();
        List<Boolean> fm = new ArrayList<>();
        boolean low = false;
        boolean simple = true;
        int col = intercept ? 1 : 0;
        for (ScoringTerm t : terms) {
            simple &= t instanceof ScoringTerm.Numeric || t instanceof ScoringTerm.Factor;
            ns.add(t.compile(layout));
            int first = layout.lastFirstSlot();
            for (int k = 0; k < t.partCount(); k++) {
                if (t.isFactorPart(k)) {
                    fs.add(first + k);
                    ff.add(col);
                    fm.add(t.hasMultiplier(k));
                    col += (int) t.partWidth(k);
                } else {
                    ds.add(first + k);
                    dc.add(col++);
                    low |= t.hasLow(k);
                }
            }
        }
        this.offsetInput = offset == null ? -1 : layout.numericInput(offset);
        this.logOffsetInput = logOffset == null ? -1 : layout.numericInput(logOffset);
        this.columns = col;
        this.intercept = intercept;
        this.nodes = ns.toArray(new Node[0]);
        this.slots = layout.slotCount;
        this.denseSlot = ds.stream().mapToInt(Integer::intValue).toArray();
        this.denseColumn = dc.stream().mapToInt(Integer::intValue).toArray();
        this.factorSlot = fs.stream().mapToInt(Integer::intValue).toArray();
        this.factorFirst = ff.stream().mapToInt(Integer::intValue).toArray();
        this.factorHasMult = new boolean[fm.size()];
        for (int i = 0; i < fm.size(); i++) {
            factorHasMult[i] = fm.get(i);
        }
        this.anyLow = low;
        this.inputNames = List.copyOf(layout.inputs.keySet());
        this.inputIsFactor = new boolean[layout.factor.size()];
        List<Map<String, Integer>> idx = new ArrayList<>();
        for (int i = 0; i < inputIsFactor.length; i++) {
            inputIsFactor[i] = layout.factor.get(i);
            Map<String, Integer> m = null;
            if (inputIsFactor[i]) {
                List<String> lv = layout.levels.get(i);
                m = new HashMap<>(lv.size() * 2);
                for (int k = 0; k < lv.size(); k++) {
                    m.put(lv.get(k), k);
                }
            }
            idx.add(m);
        }
        this.inputLevels = java.util.Collections.unmodifiableList(layout.levels);
        this.levelIndex = java.util.Collections.unmodifiableList(idx);
        this.b = new double[col];
        for (int j = 0; j < col; j++) {
            b[j] = Double.isNaN(beta[j]) ? 0.0 : beta[j];
        }
        this.plain = simple && !low ? new PlainDesign(this, terms) : null;
    }

    /** The block scorer for designs of plain numbers and factors only, else null. */
    PlainDesign plain() {
        return plain;
    }

    int[] denseColumns() {
        return denseColumn;
    }

    int[] factorFirstColumns() {
        return factorFirst;
    }

    boolean hasIntercept() {
        return intercept;
    }

    double[] coefficients() {
        return b;
    }

    Scratch newScratch() {
        return new Scratch(slots, (intercept ? 1 : 0) + denseSlot.length + factorSlot.length);
    }

    /**
     * The linear predictor of one row, offset included, leaving the row's model-matrix entries in
     * the scratch for {@link #quadraticForm}.
     */
    double eta(RowInput in, int row, Scratch s) {
        for (Node n : nodes) {
            n.eval(in, row, s);
        }
        double off = 0.0;
        if (offsetInput >= 0) {
            off = in.number(offsetInput, row);
        }
        if (logOffsetInput >= 0) {
            off += Math.log(in.number(logOffsetInput, row));
        }
        double sum = off;
        double err = 0.0;
        if (intercept) {
            double bk = b[0];
            double p = bk;   // 1.0 * bk
            double pe = Math.fma(1.0, bk, -p);
            if (anyLow) {
                pe += 0.0 * bk;
            }
            double t = sum + p;
            err += CompensatedSum.error(sum, p, t) + pe;
            sum = t;
        }
        for (int k = 0; k < denseSlot.length; k++) {
            double x = s.hi[denseSlot[k]];
            double bk = b[denseColumn[k]];
            double p = x * bk;
            double pe = Math.fma(x, bk, -p);
            if (anyLow) {
                pe += s.lo[denseSlot[k]] * bk;
            }
            double t = sum + p;
            err += CompensatedSum.error(sum, p, t) + pe;
            sum = t;
        }
        for (int k = 0; k < factorSlot.length; k++) {
            int c = s.code[factorSlot[k]];
            if (c >= 0) {
                double v = factorHasMult[k] ? s.mult[factorSlot[k]] : 1.0;
                double bk = b[factorFirst[k] + c];
                double p = v * bk;
                double pe = Math.fma(v, bk, -p);
                double t = sum + p;
                err += CompensatedSum.error(sum, p, t) + pe;
                sum = t;
            }
        }
        return sum + err;
    }

    /**
     * x' C x for the row last passed to {@link #eta}, with C a p x p row-major matrix.
     */
    double quadraticForm(Scratch s, double[] c) {
        int nz = 0;
        if (intercept) {
            s.nzIndex[nz] = 0;
            s.nzValue[nz++] = 1.0;
        }
        for (int k = 0; k < denseSlot.length; k++) {
            s.nzIndex[nz] = denseColumn[k];
            s.nzValue[nz++] = s.hi[denseSlot[k]];
        }
        for (int k = 0; k < factorSlot.length; k++) {
            int code = s.code[factorSlot[k]];
            if (code >= 0) {
                s.nzIndex[nz] = factorFirst[k] + code;
                s.nzValue[nz++] = factorHasMult[k] ? s.mult[factorSlot[k]] : 1.0;
            }
        }
        double q = 0;
        for (int i = 0; i < nz; i++) {
            int base = s.nzIndex[i] * columns;
            double row = 0;
            for (int j = 0; j < nz; j++) {
                row += c[base + s.nzIndex[j]] * s.nzValue[j];
            }
            q += s.nzValue[i] * row;
        }
        return q;
    }
}
