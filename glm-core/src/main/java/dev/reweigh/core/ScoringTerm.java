package dev.reweigh.core;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * A term as it was resolved when the model was fitted (levels and reference level of a factor,
 * the recurrence of an orthogonal polynomial): everything needed to rebuild the model columns for
 * new data. It is what a model artifact stores and what a {@link Scorer} compiles.
 *
 * <p>A term yields "parts" in a fixed order, mirroring the fitted design: a dense part is one model
 * column with a value per row (and, for powers and products, a low-order correction); a factor
 * part is a block of columns of which a row hits at most one. {@link CompiledDesign} evaluates the
 * parts with exactly the arithmetic of the fitted design, so scores are bit-identical to
 * {@link FittedModel#predictLink(Table)}.
 */
abstract class ScoringTerm {
    /** Largest number of model columns accepted from an artifact. */
    static final long MAX_COLUMNS = 1L << 24;

    /** Number of parts (blocks of model columns); most terms have one. */
    int partCount() {
        return 1;
    }

    /** Whether part k is a factor block (parts are dense columns by default). */
    boolean isFactorPart(int k) {
        return false;
    }

    /** Whether a dense part carries a low-order correction (none by default). */
    boolean hasLow(int k) {
        return false;
    }

    /** Whether a factor part carries per-row multipliers, else each entry is 1 (none by default). */
    boolean hasMultiplier(int k) {
        return false;
    }

    /** Number of model columns of part k (1 for a dense part, the default). */
    long partWidth(int k) {
        return 1;
    }

    abstract List<String> partNames(int k);

    abstract Term toTerm();

    abstract Map<String, Object> toJson();

    /** Adds the table columns read, with true for categorical ones. */
    abstract void inputs(Map<String, Boolean> out);

    abstract CompiledDesign.Node compile(CompiledDesign.Layout layout);

    long columnCount() {
        long total = 0;
        for (int k = 0; k < partCount(); k++) {
            total += partWidth(k);
            if (total > MAX_COLUMNS) {
                return MAX_COLUMNS + 1;
            }
        }
        return total;
    }

    List<String> columnNames() {
        List<String> out = new ArrayList<>();
        for (int k = 0; k < partCount(); k++) {
            out.addAll(partNames(k));
        }
        return out;
    }

    // ------------------------------------------------------------------ from a fitted recipe

    static ScoringTerm of(DesignRecipe.Encoder e) {
        if (e instanceof DesignRecipe.NumericEncoder) {
            return new Numeric(((DesignRecipe.NumericEncoder) e).column);
        }
        if (e instanceof DesignRecipe.FactorEncoder) {
            DesignRecipe.FactorEncoder f = (DesignRecipe.FactorEncoder) e;
            return new Factor(f.column, List.copyOf(f.levels), f.ref);
        }
        if (e instanceof DesignRecipe.RawPolynomialEncoder) {
            DesignRecipe.RawPolynomialEncoder r = (DesignRecipe.RawPolynomialEncoder) e;
            return new RawPolynomial(r.column, r.degree);
        }
        if (e instanceof DesignRecipe.OrthogonalPolynomialEncoder) {
            DesignRecipe.OrthogonalPolynomialEncoder o = (DesignRecipe.OrthogonalPolynomialEncoder) e;
            return new OrthogonalPolynomial(o.column, o.alpha.clone(), o.norm2.clone());
        }
        if (e instanceof DesignRecipe.InteractionEncoder) {
            DesignRecipe.InteractionEncoder i = (DesignRecipe.InteractionEncoder) e;
            return new Interaction(of(i.a), of(i.b));
        }
        throw new IllegalStateException("no scoring form for " + e.getClass().getName());
    }

    // ------------------------------------------------------------------ JSON

    static ScoringTerm fromJson(Object node, String path, int depth) {
        Map<String, Object> m = JsonFields.object(node, path);
        String kind = JsonFields.string(m, "kind", path);
        switch (kind) {
            case "numeric":
                return new Numeric(column(m, path));
            case "factor": {
                String column = column(m, path);
                List<Object> raw = JsonFields.array(m, "levels", path);
                String lp = JsonFields.child(path, "levels");
                if (raw.isEmpty()) {
                    throw new ArtifactException(lp, "expected at least one level, found none");
                }
                List<String> levels = new ArrayList<>();
                Set<String> seen = new HashSet<>();
                for (int i = 0; i < raw.size(); i++) {
                    String level = JsonFields.string(raw.get(i), JsonFields.element(lp, i));
                    if (!seen.add(level)) {
                        throw new ArtifactException(JsonFields.element(lp, i), "level '" + level
                                + "' appears twice; expected distinct levels");
                    }
                    levels.add(level);
                }
                // null: every level has a column (the first factor of a model without intercept)
                String ref = JsonFields.stringOrNull(m, "reference", path);
                int r = ref == null ? -1 : levels.indexOf(ref);
                if (ref != null && r < 0) {
                    throw new ArtifactException(JsonFields.child(path, "reference"), "reference level '" + ref
                            + "' is not one of the levels " + levels);
                }
                return new Factor(column, List.copyOf(levels), r);
            }
            case "polynomial": {
                String column = column(m, path);
                int degree = JsonFields.integer(m, "degree", path, 1, (int) MAX_COLUMNS);
                if (!JsonFields.bool(m, "orthogonal", path)) {
                    return new RawPolynomial(column, degree);
                }
                double[] centres = numbers(m, "centres", path, degree, false);
                double[] norms = numbers(m, "squaredNorms", path, degree + 1, true);
                return new OrthogonalPolynomial(column, centres, norms);
            }
            case "interaction": {
                if (depth >= JsonDoc.MAX_DEPTH) {
                    throw new ArtifactException(path, "interactions nest too deeply");
                }
                ScoringTerm left = fromJson(JsonFields.required(m, "left", path), JsonFields.child(path, "left"),
                        depth + 1);
                ScoringTerm right = fromJson(JsonFields.required(m, "right", path), JsonFields.child(path, "right"),
                        depth + 1);
                if ((long) left.partCount() * right.partCount() > MAX_COLUMNS) {
                    throw new ArtifactException(path, "the interaction has more than " + MAX_COLUMNS + " parts");
                }
                return new Interaction(left, right);
            }
            default:
                throw new ArtifactException(JsonFields.child(path, "kind"), "unknown term kind '" + kind
                        + "'; expected numeric, factor, polynomial or interaction");
        }
    }

    private static String column(Map<String, Object> m, String path) {
        String c = JsonFields.string(m, "column", path);
        if (c.isEmpty()) {
            throw new ArtifactException(JsonFields.child(path, "column"), "expected a column name, found an empty"
                    + " string");
        }
        return c;
    }

    private static double[] numbers(Map<String, Object> m, String key, String path, int length, boolean positive) {
        List<Object> raw = JsonFields.array(m, key, path);
        String p = JsonFields.child(path, key);
        if (raw.size() != length) {
            throw new ArtifactException(p, "expected " + length + " numbers, found " + raw.size());
        }
        double[] out = new double[length];
        for (int i = 0; i < length; i++) {
            out[i] = JsonFields.number(raw.get(i), JsonFields.element(p, i));
            if (positive && !(out[i] > 0)) {
                throw new ArtifactException(JsonFields.element(p, i), "value " + out[i] + " is not valid; expected a"
                        + " positive number");
            }
        }
        return out;
    }

    private static Map<String, Object> json(String kind, String column) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("kind", kind);
        if (column != null) {
            m.put("column", column);
        }
        return m;
    }

    private static List<Object> list(double[] v) {
        List<Object> out = new ArrayList<>(v.length);
        for (double d : v) {
            out.add(d);
        }
        return out;
    }

    // ------------------------------------------------------------------ kinds

    static final class Numeric extends ScoringTerm {
        final String column;

        Numeric(String column) {
            this.column = column;
        }

        @Override
        List<String> partNames(int k) {
            return List.of(column);
        }

        @Override
        Term toTerm() {
            return Term.numeric(column);
        }

        @Override
        Map<String, Object> toJson() {
            return json("numeric", column);
        }

        @Override
        void inputs(Map<String, Boolean> out) {
            out.putIfAbsent(column, false);
        }

        @Override
        CompiledDesign.Node compile(CompiledDesign.Layout layout) {
            int input = layout.numericInput(column);
            int slot = layout.slots(1);
            return (in, row, s) -> {
                s.hi[slot] = in.number(input, row);
                s.lo[slot] = 0.0;
            };
        }
    }

    /** A factor coded against a reference level, or with a column for every level when ref is -1. */
    static final class Factor extends ScoringTerm {
        final String column;
        final List<String> levels;
        final int ref;

        Factor(String column, List<String> levels, int ref) {
            this.column = column;
            this.levels = levels;
            this.ref = ref;
        }

        @Override
        boolean isFactorPart(int k) {
            return true;
        }

        @Override
        long partWidth(int k) {
            return ref < 0 ? levels.size() : levels.size() - 1L;
        }

        @Override
        List<String> partNames(int k) {
            List<String> out = new ArrayList<>();
            for (int i = 0; i < levels.size(); i++) {
                if (i != ref) {
                    out.add(column + "=" + levels.get(i));
                }
            }
            return out;
        }

        @Override
        Term toTerm() {
            return ref < 0 ? Term.factor(column) : Term.factor(column, levels.get(ref));
        }

        @Override
        Map<String, Object> toJson() {
            Map<String, Object> m = json("factor", column);
            m.put("levels", new ArrayList<Object>(levels));
            m.put("reference", ref < 0 ? null : levels.get(ref));
            return m;
        }

        @Override
        void inputs(Map<String, Boolean> out) {
            out.putIfAbsent(column, true);
        }

        @Override
        CompiledDesign.Node compile(CompiledDesign.Layout layout) {
            int input = layout.factorInput(column, levels);
            int slot = layout.slots(1);
            int r = ref;
            if (r < 0) {
                return (in, row, s) -> s.code[slot] = in.level(input, row); // -1: unseen, no column
            }
            return (in, row, s) -> {
                int k = in.level(input, row);   // -1: unseen level scored at the reference
                s.code[slot] = k < 0 || k == r ? -1 : (k < r ? k : k - 1);
            };
        }
    }

    static final class RawPolynomial extends ScoringTerm {
        final String column;
        final int degree;

        RawPolynomial(String column, int degree) {
            this.column = column;
            this.degree = degree;
        }

        @Override
        int partCount() {
            return degree;
        }

        @Override
        boolean hasLow(int k) {
            return k > 0;
        }

        @Override
        List<String> partNames(int k) {
            return List.of(column + "^" + (k + 1));
        }

        @Override
        Term toTerm() {
            return Term.polynomial(column, degree, false);
        }

        @Override
        Map<String, Object> toJson() {
            Map<String, Object> m = json("polynomial", column);
            m.put("degree", (long) degree);
            m.put("orthogonal", false);
            return m;
        }

        @Override
        void inputs(Map<String, Boolean> out) {
            out.putIfAbsent(column, false);
        }

        @Override
        CompiledDesign.Node compile(CompiledDesign.Layout layout) {
            int input = layout.numericInput(column);
            int first = layout.slots(degree);
            int d = degree;
            return (in, row, s) -> {
                double x = in.number(input, row);
                s.hi[first] = x;
                s.lo[first] = 0.0;
                double ph = x;
                double pl = 0.0;
                for (int k = 1; k < d; k++) {
                    // double-double times double, as DesignRecipe computes the powers
                    double p = ph * x;
                    double e = Math.fma(ph, x, -p) + pl * x;
                    double sum = p + e;
                    double l = e - (sum - p);
                    ph = sum;
                    pl = l;
                    s.hi[first + k] = sum;
                    s.lo[first + k] = l;
                }
            };
        }
    }

    static final class OrthogonalPolynomial extends ScoringTerm {
        final String column;
        final double[] centres;      // alpha of each recurrence step
        final double[] squaredNorms; // of P_0 .. P_degree over the fitting rows

        OrthogonalPolynomial(String column, double[] centres, double[] squaredNorms) {
            this.column = column;
            this.centres = centres;
            this.squaredNorms = squaredNorms;
        }

        @Override
        int partCount() {
            return centres.length;
        }

        @Override
        List<String> partNames(int k) {
            return List.of(column + "[" + (k + 1) + "]");
        }

        @Override
        Term toTerm() {
            return Term.polynomial(column, centres.length, true);
        }

        @Override
        Map<String, Object> toJson() {
            Map<String, Object> m = json("polynomial", column);
            m.put("degree", (long) centres.length);
            m.put("orthogonal", true);
            m.put("centres", list(centres));
            m.put("squaredNorms", list(squaredNorms));
            return m;
        }

        @Override
        void inputs(Map<String, Boolean> out) {
            out.putIfAbsent(column, false);
        }

        @Override
        CompiledDesign.Node compile(CompiledDesign.Layout layout) {
            int input = layout.numericInput(column);
            int d = centres.length;
            int first = layout.slots(d);
            double[] alpha = centres.clone();
            double[] beta = new double[d];
            double[] scale = new double[d];
            for (int k = 0; k < d; k++) {
                beta[k] = k == 0 ? 0 : squaredNorms[k] / squaredNorms[k - 1];
                scale[k] = Math.sqrt(squaredNorms[k + 1]);
            }
            return (in, row, s) -> {
                double x = in.number(input, row);
                double pPrev = 0;
                double pCur = 1;
                for (int k = 0; k < d; k++) {
                    double next = (x - alpha[k]) * pCur - beta[k] * pPrev;
                    pPrev = pCur;
                    pCur = next;
                    s.hi[first + k] = next / scale[k];
                    s.lo[first + k] = 0.0;
                }
            };
        }
    }

    static final class Interaction extends ScoringTerm {
        final ScoringTerm a;
        final ScoringTerm b;

        Interaction(ScoringTerm a, ScoringTerm b) {
            this.a = a;
            this.b = b;
        }

        @Override
        int partCount() {
            return a.partCount() * b.partCount();
        }

        @Override
        boolean isFactorPart(int k) {
            return a.isFactorPart(k / b.partCount()) || b.isFactorPart(k % b.partCount());
        }

        @Override
        boolean hasLow(int k) {
            return !isFactorPart(k);
        }

        @Override
        boolean hasMultiplier(int k) {
            int ka = k / b.partCount();
            int kb = k % b.partCount();
            boolean fa = a.isFactorPart(ka);
            boolean fb = b.isFactorPart(kb);
            if (fa && fb) {
                return a.hasMultiplier(ka) || b.hasMultiplier(kb);
            }
            return fa || fb;
        }

        @Override
        long partWidth(int k) {
            long w = a.partWidth(k / b.partCount()) * b.partWidth(k % b.partCount());
            return Math.min(w, MAX_COLUMNS + 1);
        }

        @Override
        List<String> partNames(int k) {
            List<String> out = new ArrayList<>();
            for (String x : a.partNames(k / b.partCount())) {
                for (String y : b.partNames(k % b.partCount())) {
                    out.add(x + " & " + y);
                }
            }
            return out;
        }

        @Override
        long columnCount() {
            // every column of one side times every column of the other; each count is at most MAX + 1
            return Math.min(a.columnCount() * b.columnCount(), MAX_COLUMNS + 1);
        }

        @Override
        Term toTerm() {
            return Term.interaction(a.toTerm(), b.toTerm());
        }

        @Override
        Map<String, Object> toJson() {
            Map<String, Object> m = json("interaction", null);
            m.put("left", a.toJson());
            m.put("right", b.toJson());
            return m;
        }

        @Override
        void inputs(Map<String, Boolean> out) {
            a.inputs(out);
            b.inputs(out);
        }

        @Override
        CompiledDesign.Node compile(CompiledDesign.Layout layout) {
            CompiledDesign.Node na = a.compile(layout);
            int firstA = layout.lastFirstSlot();
            CompiledDesign.Node nb = b.compile(layout);
            int firstB = layout.lastFirstSlot();
            int pa = a.partCount();
            int pb = b.partCount();
            int first = layout.slots(pa * pb);
            boolean[] fa = new boolean[pa];
            boolean[] la = new boolean[pa];
            boolean[] ma = new boolean[pa];
            for (int k = 0; k < pa; k++) {
                fa[k] = a.isFactorPart(k);
                la[k] = a.hasLow(k);
                ma[k] = a.hasMultiplier(k);
            }
            boolean[] fb = new boolean[pb];
            boolean[] lb = new boolean[pb];
            boolean[] mb = new boolean[pb];
            int[] wb = new int[pb];
            for (int k = 0; k < pb; k++) {
                fb[k] = b.isFactorPart(k);
                lb[k] = b.hasLow(k);
                mb[k] = b.hasMultiplier(k);
                wb[k] = (int) b.partWidth(k);
            }
            return (in, row, s) -> {
                na.eval(in, row, s);
                nb.eval(in, row, s);
                for (int ka = 0; ka < pa; ka++) {
                    int sa = firstA + ka;
                    for (int kb = 0; kb < pb; kb++) {
                        int sb = firstB + kb;
                        int out = first + ka * pb + kb;
                        // the same products, in the same order, as DesignRecipe's interaction
                        if (!fa[ka] && !fb[kb]) {
                            double ah = s.hi[sa];
                            double bh = s.hi[sb];
                            double p = ah * bh;
                            double e = Math.fma(ah, bh, -p);
                            if (la[ka]) {
                                e += s.lo[sa] * bh;
                            }
                            if (lb[kb]) {
                                e += ah * s.lo[sb];
                            }
                            double h = p + e;
                            s.hi[out] = h;
                            s.lo[out] = e - (h - p);
                        } else if (fa[ka] && !fb[kb]) {
                            s.code[out] = s.code[sa];
                            s.mult[out] = (ma[ka] ? s.mult[sa] : 1.0) * s.hi[sb];
                        } else if (!fa[ka]) {
                            s.code[out] = s.code[sb];
                            s.mult[out] = (mb[kb] ? s.mult[sb] : 1.0) * s.hi[sa];
                        } else {
                            int ca = s.code[sa];
                            int cb = s.code[sb];
                            s.code[out] = ca >= 0 && cb >= 0 ? ca * wb[kb] + cb : -1;
                            if (!ma[ka]) {
                                s.mult[out] = s.mult[sb];
                            } else if (!mb[kb]) {
                                s.mult[out] = s.mult[sa];
                            } else {
                                s.mult[out] = s.mult[sa] * s.mult[sb];
                            }
                        }
                    }
                }
            };
        }
    }
}
