package dev.reweigh.core;

import dev.reweigh.core.internal.DesignMatrix;
import dev.reweigh.core.internal.NumberText;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.UnknownNameException;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The frozen encoding of a specification's terms, resolved against the fitting data (factor
 * levels and reference levels, orthogonal-polynomial recurrences), so that the same model matrix
 * can be built for new data.
 */
final class DesignRecipe {

    /** A block of model columns produced by a term: dense columns or one factor block. */
    static final class Part {
        final List<String> names;
        final double[][] hi;   // dense: one column per name
        final double[][] lo;   // dense low-order parts, or null
        final int[] codes;     // factor: column within the part, or -1
        final double[] mult;   // factor multipliers, or null

        private Part(List<String> names, double[][] hi, double[][] lo, int[] codes, double[] mult) {
            this.names = names;
            this.hi = hi;
            this.lo = lo;
            this.codes = codes;
            this.mult = mult;
        }

        static Part dense(String name, double[] hi, double[] lo) {
            return new Part(List.of(name), new double[][] {hi}, lo == null ? null : new double[][] {lo}, null, null);
        }

        static Part factor(List<String> names, int[] codes, double[] mult) {
            return new Part(List.copyOf(names), null, null, codes, mult);
        }

        boolean isFactor() {
            return codes != null;
        }
    }

    interface Encoder {
        List<Part> parts(Table t, int[] rows);
    }

    private final boolean intercept;
    private final List<Encoder> encoders;
    private final List<String> columnNames;

    private DesignRecipe(boolean intercept, List<Encoder> encoders, List<String> columnNames) {
        this.intercept = intercept;
        this.encoders = encoders;
        this.columnNames = columnNames;
    }

    List<String> columnNames() {
        return columnNames;
    }

    // read by ScoringTerm, which writes the resolved encoding into model artifacts and scorers
    boolean hasIntercept() {
        return intercept;
    }

    List<Encoder> encoders() {
        return encoders;
    }

    /**
     * The reference level of each factor, as "column=level", in model order without repeats; a
     * factor with a column for every level has none.
     */
    List<String> referenceLevels() {
        java.util.LinkedHashSet<String> out = new java.util.LinkedHashSet<>();
        for (Encoder e : encoders) {
            collectReferences(e, out);
        }
        return List.copyOf(out);
    }

    private static void collectReferences(Encoder e, java.util.Set<String> out) {
        if (e instanceof FactorEncoder) {
            FactorEncoder f = (FactorEncoder) e;
            if (f.ref >= 0) {
                out.add(f.column + "=" + f.levels.get(f.ref));
            }
        } else if (e instanceof InteractionEncoder) {
            collectReferences(((InteractionEncoder) e).a, out);
            collectReferences(((InteractionEncoder) e).b, out);
        }
    }

    /**
     * Resolves the specification's terms against the fitting rows. Without an intercept the first
     * factor main effect gets a column for every level (no reference level, whatever reference the
     * term names), so that no level's effect is lost; every other factor, and every factor inside
     * an interaction, is coded against its reference level (common practice, no source).
     */
    static DesignRecipe create(ModelSpec spec, Table data, int[] rows, double[] priorWeights) {
        List<Encoder> enc = new ArrayList<>();
        boolean fullCodingPending = !spec.hasIntercept();
        for (Term t : spec.terms()) {
            if (fullCodingPending && isFactorMainEffect(t, data)) {
                enc.add(factor(t.column(), t.referenceLevel().orElse(null), true, data, rows, priorWeights));
                fullCodingPending = false;
            } else {
                enc.add(resolve(t, data, rows, priorWeights));
            }
        }
        List<String> names = new ArrayList<>();
        if (spec.hasIntercept()) {
            names.add("intercept");
        }
        int[] none = new int[0];
        for (Encoder e : enc) {
            for (Part part : e.parts(data, none)) {
                names.addAll(part.names);
            }
        }
        java.util.Set<String> seen = new java.util.HashSet<>();
        for (String s : names) {
            if (!seen.add(s)) {
                throw new ModelSpecException("the model has two columns named '" + s
                        + "': a term appears twice in the specification");
            }
        }
        return new DesignRecipe(spec.hasIntercept(), enc, List.copyOf(names));
    }

    DesignMatrix build(Table t, int[] rows) {
        int n = rows.length;
        List<Part> parts = new ArrayList<>();
        for (Encoder e : encoders) {
            parts.addAll(e.parts(t, rows));
        }
        List<double[]> denseHi = new ArrayList<>();
        List<double[]> denseLo = new ArrayList<>();
        List<Integer> denseCol = new ArrayList<>();
        List<DesignMatrix.FactorBlock> blocks = new ArrayList<>();
        int col = 0;
        boolean anyLow = false;
        if (intercept) {
            denseHi.add(null); // the constant 1, written straight into the block below
            denseLo.add(null);
            denseCol.add(col++);
        }
        for (Part part : parts) {
            if (part.isFactor()) {
                blocks.add(new DesignMatrix.FactorBlock(part.codes, part.mult, part.names.size(), col));
                col += part.names.size();
            } else {
                for (int k = 0; k < part.hi.length; k++) {
                    denseHi.add(part.hi[k]);
                    double[] lo = part.lo == null ? null : part.lo[k];
                    denseLo.add(lo);
                    anyLow |= lo != null;
                    denseCol.add(col++);
                }
            }
        }
        int d = denseHi.size();
        double[] dense = new double[n * d];
        double[] low = anyLow ? new double[n * d] : null;
        for (int k = 0; k < d; k++) {
            double[] h = denseHi.get(k);
            double[] l = denseLo.get(k);
            if (h == null) {
                for (int i = 0; i < n; i++) {
                    dense[i * d + k] = 1.0;
                }
                continue;
            }
            for (int i = 0; i < n; i++) {
                dense[i * d + k] = h[i];
                if (l != null) {
                    low[i * d + k] = l[i];
                }
            }
        }
        int[] dc = denseCol.stream().mapToInt(Integer::intValue).toArray();
        return new DesignMatrix(n, col, dense, low, dc, blocks);
    }

    // ---------------------------------------------------------------- term resolution

    private static boolean isFactorMainEffect(Term t, Table data) {
        return t.kind() == Term.Kind.FACTOR
                || t.kind() == Term.Kind.COLUMN && data.hasColumn(t.column()) && data.isCategorical(t.column());
    }

    private static Encoder resolve(Term t, Table data, int[] rows, double[] pw) {
        switch (t.kind()) {
            case NUMERIC:
                requireNumeric(data, t.column(), "a numeric term");
                return new NumericEncoder(t.column());
            case FACTOR:
                return factor(t.column(), t.referenceLevel().orElse(null), false, data, rows, pw);
            case COLUMN:
                return data.isCategorical(t.column()) ? factor(t.column(), null, false, data, rows, pw)
                        : new NumericEncoder(t.column());
            case POLYNOMIAL:
                requireNumeric(data, t.column(), "a polynomial term");
                return t.isOrthogonal() ? OrthogonalPolynomialEncoder.create(t.column(), t.degree(), data, rows)
                        : new RawPolynomialEncoder(t.column(), t.degree());
            default:
                Encoder a = resolve(t.left(), data, rows, pw);
                Encoder b = resolve(t.right(), data, rows, pw);
                return new InteractionEncoder(a, b);
        }
    }

    private static void requireNumeric(Table data, String column, String role) {
        if (data.isCategorical(column)) {
            throw new ModelSpecException("column '" + column + "' is categorical and cannot be " + role
                    + "; use it as a factor (Term.factor(\"" + column + "\"))");
        }
    }

    /** A factor coded against its reference level, or with a column for every level when full. */
    private static Encoder factor(String column, String reference, boolean full, Table data, int[] rows,
            double[] pw) {
        if (data.isNumeric(column)) {
            throw new ModelSpecException("column '" + column + "' is numeric and cannot be a factor; to use its values"
                    + " as levels, add it to the Table as a categorical column (Table.Builder.categorical)");
        }
        List<String> levels = data.levels(column);
        int ref = 0;
        if (reference != null) {
            ref = levels.indexOf(reference);
            if (ref < 0) {
                throw new UnknownNameException("reference level of column '" + column + "'", reference, levels);
            }
        } else if (!full) {
            double[] total = new double[levels.size()];
            int[] codes = data.categorical(column).codes;
            for (int i = 0; i < rows.length; i++) {
                int c = codes[rows[i]];
                if (c >= 0) {
                    total[c] += pw[i];
                }
            }
            for (int k = 1; k < total.length; k++) {
                if (total[k] > total[ref]) {
                    ref = k;
                }
            }
        }
        return new FactorEncoder(column, levels, full ? -1 : ref);
    }

    static final class NumericEncoder implements Encoder {
        final String column;

        NumericEncoder(String column) {
            this.column = column;
        }

        @Override
        public List<Part> parts(Table t, int[] rows) {
            double[] src = t.numericViewChecked(column);
            if (rows.length == src.length) {
                // rows are increasing, so all of them means the identity: the table's own (immutable)
                // column serves, checked but not copied, which keeps an n-sized copy per column off the heap
                for (int i = 0; i < src.length; i++) {
                    finite(column, i, src[i]);
                }
                return List.of(Part.dense(column, src, null));
            }
            double[] v = new double[rows.length];
            for (int i = 0; i < rows.length; i++) {
                v[i] = finite(column, rows[i], src[rows[i]]);
            }
            return List.of(Part.dense(column, v, null));
        }
    }

    static double finite(String column, int row, double v) {
        if (!Double.isFinite(v)) {
            throw new InvalidDataException(column, row, NumberText.of(v), "a finite number");
        }
        return v;
    }

    /** A factor coded against level ref (no column), or with a column for every level when ref is -1. */
    static final class FactorEncoder implements Encoder {
        final String column;
        final List<String> levels;
        final int ref;
        private final List<String> names;
        private final Map<String, Integer> index = new HashMap<>();

        FactorEncoder(String column, List<String> levels, int ref) {
            this.column = column;
            this.levels = levels;
            this.ref = ref;
            List<String> nm = new ArrayList<>();
            for (int k = 0; k < levels.size(); k++) {
                index.put(levels.get(k), k);
                if (k != ref) {
                    nm.add(column + "=" + levels.get(k));
                }
            }
            this.names = List.copyOf(nm);
        }

        @Override
        public List<Part> parts(Table t, int[] rows) {
            if (t.isNumeric(column)) {
                throw new ModelSpecException("column '" + column + "' is numeric in the new data but was categorical"
                        + " when the model was fitted");
            }
            Table.Categorical cat = t.categorical(column);
            int[] map = new int[cat.levels.size()];
            for (int k = 0; k < map.length; k++) {
                Integer idx = index.get(cat.levels.get(k));
                map[k] = idx == null ? Integer.MIN_VALUE : idx;
            }
            int[] codes = new int[rows.length];
            for (int i = 0; i < rows.length; i++) {
                int c = cat.codes[rows[i]];
                if (c < 0) {
                    throw new InvalidDataException(column, rows[i], "NA", "one of the levels " + levels);
                }
                int k = map[c];
                if (k == Integer.MIN_VALUE) {
                    throw new UnknownNameException("level of column '" + column + "'", cat.levels.get(c), levels);
                }
                codes[i] = ref < 0 || k < ref ? k : (k == ref ? -1 : k - 1);
            }
            return List.of(Part.factor(names, codes, null));
        }
    }

    static final class RawPolynomialEncoder implements Encoder {
        final String column;
        final int degree;

        RawPolynomialEncoder(String column, int degree) {
            this.column = column;
            this.degree = degree;
        }

        @Override
        public List<Part> parts(Table t, int[] rows) {
            double[] src = t.numericViewChecked(column);
            int n = rows.length;
            double[] x = new double[n];
            for (int i = 0; i < n; i++) {
                x[i] = finite(column, rows[i], src[rows[i]]);
            }
            List<Part> out = new ArrayList<>();
            double[] ph = x.clone();
            double[] pl = new double[n];
            out.add(Part.dense(column + "^1", ph.clone(), null));
            for (int k = 2; k <= degree; k++) {
                double[] h = new double[n];
                double[] l = new double[n];
                for (int i = 0; i < n; i++) {
                    // double-double times double: the power keeps about 32 significant digits
                    double p = ph[i] * x[i];
                    double e = Math.fma(ph[i], x[i], -p) + pl[i] * x[i];
                    double s = p + e;
                    l[i] = e - (s - p);
                    h[i] = s;
                }
                ph = h;
                pl = l;
                out.add(Part.dense(column + "^" + k, h.clone(), l.clone()));
            }
            return out;
        }
    }

    static final class OrthogonalPolynomialEncoder implements Encoder {
        final String column;
        final double[] alpha;  // centre of each recurrence step
        final double[] norm2;  // squared norms of P_0 .. P_degree over the fitting rows

        private OrthogonalPolynomialEncoder(String column, double[] alpha, double[] norm2) {
            this.column = column;
            this.alpha = alpha;
            this.norm2 = norm2;
        }

        static OrthogonalPolynomialEncoder create(String column, int degree, Table data, int[] rows) {
            double[] src = data.numericViewChecked(column);
            int n = rows.length;
            double[] x = new double[n];
            for (int i = 0; i < n; i++) {
                x[i] = finite(column, rows[i], src[rows[i]]);
            }
            double[] alpha = new double[degree];
            double[] norm2 = new double[degree + 1];
            double[] prev = new double[n];
            double[] cur = new double[n];
            java.util.Arrays.fill(cur, 1.0);
            norm2[0] = n;
            for (int k = 0; k < degree; k++) {
                double sx = 0;
                for (int i = 0; i < n; i++) {
                    sx += x[i] * cur[i] * cur[i];
                }
                alpha[k] = sx / norm2[k];
                double beta = k == 0 ? 0 : norm2[k] / norm2[k - 1];
                double[] next = new double[n];
                double s = 0;
                for (int i = 0; i < n; i++) {
                    next[i] = (x[i] - alpha[k]) * cur[i] - beta * prev[i];
                    s += next[i] * next[i];
                }
                norm2[k + 1] = s;
                if (!(s > 1e-20 * norm2[k] * (1 + Math.abs(alpha[k]) * Math.abs(alpha[k])))) {
                    throw new ModelSpecException("an orthogonal polynomial of degree " + degree + " in column '" + column
                            + "' needs more distinct values than the fitting rows have");
                }
                prev = cur;
                cur = next;
            }
            return new OrthogonalPolynomialEncoder(column, alpha, norm2);
        }

        @Override
        public List<Part> parts(Table t, int[] rows) {
            double[] src = t.numericViewChecked(column);
            int n = rows.length;
            int degree = alpha.length;
            double[][] cols = new double[degree][n];
            for (int i = 0; i < n; i++) {
                double x = finite(column, rows[i], src[rows[i]]);
                double pPrev = 0;
                double pCur = 1;
                for (int k = 0; k < degree; k++) {
                    double beta = k == 0 ? 0 : norm2[k] / norm2[k - 1];
                    double next = (x - alpha[k]) * pCur - beta * pPrev;
                    pPrev = pCur;
                    pCur = next;
                    cols[k][i] = next / Math.sqrt(norm2[k + 1]);
                }
            }
            List<Part> out = new ArrayList<>();
            for (int k = 0; k < degree; k++) {
                out.add(Part.dense(column + "[" + (k + 1) + "]", cols[k], null));
            }
            return out;
        }
    }

    static final class InteractionEncoder implements Encoder {
        final Encoder a;
        final Encoder b;

        InteractionEncoder(Encoder a, Encoder b) {
            this.a = a;
            this.b = b;
        }

        @Override
        public List<Part> parts(Table t, int[] rows) {
            List<Part> out = new ArrayList<>();
            for (Part pa : a.parts(t, rows)) {
                for (Part pb : b.parts(t, rows)) {
                    out.add(product(pa, pb, rows.length));
                }
            }
            return out;
        }

        private static Part product(Part a, Part b, int n) {
            if (!a.isFactor() && !b.isFactor()) {
                double[] ah = a.hi[0];
                double[] bh = b.hi[0];
                double[] h = new double[n];
                double[] l = new double[n];
                for (int i = 0; i < n; i++) {
                    double p = ah[i] * bh[i];
                    double e = Math.fma(ah[i], bh[i], -p);
                    if (a.lo != null) {
                        e += a.lo[0][i] * bh[i];
                    }
                    if (b.lo != null) {
                        e += ah[i] * b.lo[0][i];
                    }
                    h[i] = p + e;
                    l[i] = e - (h[i] - p);
                }
                return Part.dense(a.names.get(0) + " & " + b.names.get(0), h, l);
            }
            if (a.isFactor() && !b.isFactor()) {
                return Part.factor(join(a.names, b.names), a.codes, multiply(a.mult, b.hi[0], n));
            }
            if (!a.isFactor()) {
                return Part.factor(join(a.names, b.names), b.codes, multiply(b.mult, a.hi[0], n));
            }
            int lb = b.names.size();
            int[] codes = new int[n];
            for (int i = 0; i < n; i++) {
                codes[i] = a.codes[i] >= 0 && b.codes[i] >= 0 ? a.codes[i] * lb + b.codes[i] : -1;
            }
            double[] mult = a.mult == null ? b.mult : b.mult == null ? a.mult : multiply(a.mult, b.mult, n);
            return Part.factor(join(a.names, b.names), codes, mult);
        }

        private static double[] multiply(double[] m, double[] v, int n) {
            double[] out = new double[n];
            for (int i = 0; i < n; i++) {
                out[i] = (m == null ? 1.0 : m[i]) * v[i];
            }
            return out;
        }

        private static List<String> join(List<String> a, List<String> b) {
            List<String> out = new ArrayList<>();
            for (String x : a) {
                for (String y : b) {
                    out.add(x + " & " + y);
                }
            }
            return out;
        }
    }
}
